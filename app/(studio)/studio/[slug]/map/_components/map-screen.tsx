"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useEffect } from "react";
import type { MapPayload } from "@/lib/map-edits/payload";
import { MapWorkspace } from "./map-workspace";
import { mapKey } from "./use-map";

/** The interactive page map; the server hands it the first copy of the map. */
export function MapScreen({ slug, initial }: { slug: string; initial: MapPayload }) {
  const queryClient = useQueryClient();
  // The studio's cache outlives this screen: forget the map on leaving, so the next visit starts
  // from the copy its page was drawn with rather than an older cached one.
  useEffect(
    () => () => queryClient.removeQueries({ queryKey: mapKey(slug), exact: true }),
    [queryClient, slug],
  );
  return <MapWorkspace slug={slug} initial={initial} />;
}
