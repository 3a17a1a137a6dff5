import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useCallback, useRef, useState } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { checkMap } from "@/lib/map/check";
import { countPasses } from "@/lib/map/passes";
import { checkedChange } from "@/lib/map-edits/apply";
import type { MapChangeAnswer, MapPayload, MapRefusalAnswer } from "@/lib/map-edits/payload";
import type { MapChange } from "@/lib/validations/page-map";

export type Feedback = { tone: "info" | "error" | "warn"; text: string; pages?: number[] } | null;

export const mapKey = (slug: string) => ["page-map", slug] as const;

/** The map from the server (seeded with the server-rendered copy). */
export function useMapQuery(slug: string, initial: MapPayload) {
  return useQuery({
    queryKey: mapKey(slug),
    initialData: initial,
    queryFn: ({ signal }) =>
      fetchJson<MapPayload>(`/api/anthologies/${slug}/map`, {
        cache: "no-store",
        signal,
        failure: (status) => `The map could not be loaded (${status}).`,
      }),
    refetchOnWindowFocus: true,
    staleTime: 5_000,
  });
}

/**
 * Sends changes one after another. Each is checked at once with the same engine the server uses
 * (a refusal shows instantly and nothing is sent) and shown optimistically; the server's answer
 * then replaces it: the saved map, or on 409 the fresh map with the reason, or on 422 the reason.
 */
export function useMapChanges(slug: string) {
  const queryClient = useQueryClient();
  const [feedback, setFeedback] = useState<Feedback>(null);
  const [saving, setSaving] = useState(0);
  const queue = useRef<Promise<unknown>>(Promise.resolve());
  const confirmed = useRef<MapPayload | null>(null);
  const pending = useRef(0);

  const current = () => queryClient.getQueryData<MapPayload>(mapKey(slug));

  const send = useCallback(
    (change: MapChange, opts: { quiet?: boolean } = {}): Promise<boolean> => {
      const map = current();
      if (!map) return Promise.resolve(false);
      const local = checkedChange(map.state, change);
      if (!local.ok) {
        setFeedback({ tone: "error", text: local.reason, pages: local.pages });
        return Promise.resolve(false);
      }
      // With nothing in flight the cache is what the server last said.
      if (pending.current === 0) confirmed.current = map;
      pending.current++;
      queryClient.setQueryData<MapPayload>(mapKey(slug), {
        ...map,
        state: local.state,
        check: checkMap(local.state),
        passes: countPasses(local.state, map.passes.copies),
      });
      setSaving((n) => n + 1);
      const run = async (): Promise<boolean> => {
        try {
          const body = await fetchJson<MapChangeAnswer>(`/api/anthologies/${slug}/map`, {
            method: "POST",
            json: { version: (confirmed.current ?? map).version, change },
            failure: (status) => `The change was not saved (${status}).`,
            unreachable: "the server did not answer",
          });
          confirmed.current = body;
          queryClient.setQueryData<MapPayload>(mapKey(slug), body);
          if (!opts.quiet)
            setFeedback({
              tone: "info",
              text: body.changed ? `Saved. ${body.summary}` : body.summary,
            });
          return true;
        } catch (error) {
          if (error instanceof ApiError && error.status >= 400) {
            // Refused: the server's fresh map on 409, otherwise what it last saved.
            const refusal = error.body as Partial<MapRefusalAnswer>;
            const fallback = refusal.map ?? confirmed.current ?? map;
            confirmed.current = fallback;
            queryClient.setQueryData<MapPayload>(mapKey(slug), fallback);
            setFeedback({
              tone: error.status === 409 ? "warn" : "error",
              text: error.message,
              pages: refusal.pages,
            });
            return false;
          }
          queryClient.setQueryData<MapPayload>(mapKey(slug), confirmed.current ?? map);
          setFeedback({
            tone: "error",
            text: `The change was not saved: ${error instanceof Error ? error.message.replace(/\.$/, "") : "the server did not answer"}. The map shows what is saved; try again.`,
          });
          return false;
        } finally {
          pending.current--;
          setSaving((n) => n - 1);
        }
      };
      const next = queue.current.then(run, run);
      queue.current = next;
      return next;
    },
    [slug],
  );

  return { send, feedback, setFeedback, saving: saving > 0 };
}
