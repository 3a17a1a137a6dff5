"use client";

import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { useState } from "react";
import type { MapPayload } from "@/lib/map-edits/payload";
import { MapWorkspace } from "./map-workspace";

/** The interactive page map; the server hands it the first copy of the map. */
export function MapScreen({ slug, initial }: { slug: string; initial: MapPayload }) {
  const [client] = useState(() => new QueryClient({ defaultOptions: { queries: { retry: 1 } } }));
  return (
    <QueryClientProvider client={client}>
      <MapWorkspace slug={slug} initial={initial} />
    </QueryClientProvider>
  );
}
