import { usePathname, useSearchParams } from "next/navigation";
import { useCallback, useMemo, useState } from "react";
import {
  queryToSearchParams,
  searchParamsToQueryInput,
  submissionsQuerySchema,
  type SubmissionsQuery,
} from "@/lib/validations/review";

const DEFAULT_QUERY = submissionsQuerySchema.parse({});

/** Changes part of the table's query; `replace` rewrites the current history entry (typing a search). */
export type SetListQuery = (
  patch: Partial<SubmissionsQuery>,
  options?: { replace?: boolean },
) => void;

/**
 * The table's query (filters, search, sort, page) lives in the address bar, so a reload or a
 * shared link shows the same view, and Back undoes a filter. An address the schema rejects falls
 * back to the defaults.
 */
export function useListQuery() {
  const searchParams = useSearchParams();
  const pathname = usePathname();
  const raw = searchParams.toString();

  // What the person just chose, shown at once while the address catches up.
  const [chosen, setChosen] = useState<{ query: SubmissionsQuery; from: string } | null>(null);

  const fromAddress = useMemo(() => {
    const parsed = submissionsQuerySchema.safeParse(
      searchParamsToQueryInput(new URLSearchParams(raw)),
    );
    return parsed.success
      ? { query: parsed.data, understood: true }
      : { query: DEFAULT_QUERY, understood: false };
  }, [raw]);
  const pending = chosen && chosen.from === raw ? chosen.query : null;
  const query = pending ?? fromAddress.query;

  /**
   * Changes part of the query; anything but a page change goes back to page 1. The native
   * history API updates the address without asking the server to render the page again.
   */
  const setQuery = useCallback<SetListQuery>(
    (patch, options = {}) => {
      const next = { ...query, ...patch, page: patch.page ?? 1 };
      const search = queryToSearchParams(next).toString();
      setChosen({ query: next, from: raw });
      const url = search ? `${pathname}?${search}` : pathname;
      if (options.replace) window.history.replaceState(null, "", url);
      else window.history.pushState(null, "", url);
    },
    [query, raw, pathname],
  );

  const filtered = query.q !== "" || query.status.length > 0 || query.verdict.length > 0;
  return {
    query,
    setQuery,
    understood: pending ? true : fromAddress.understood,
    filtered,
    apiSearch: queryToSearchParams(query).toString(),
  };
}
