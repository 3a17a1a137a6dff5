import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { fetchJson } from "@/components/api/fetch-json";
import type { SubmissionsPage } from "@/lib/wire/review";

/** Every cached page of an anthology's submissions starts with this key (for invalidating them all). */
export const submissionsKey = (slug: string) => ["submissions", slug] as const;

/** One page of submissions for the query in `apiSearch`; the last page stays shown while the next loads. */
export function useSubmissionsPage(slug: string, apiSearch: string) {
  return useQuery({
    queryKey: [...submissionsKey(slug), apiSearch],
    queryFn: ({ signal }) =>
      fetchJson<SubmissionsPage>(`/api/anthologies/${slug}/submissions?${apiSearch}`, { signal }),
    placeholderData: keepPreviousData,
  });
}
