"use client";

import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { PAGE_SIZES, type SubmissionsQuery } from "@/lib/validations/review";
import type { SetListQuery } from "./use-list-query";

/** Which rows of how many are shown, the page size, and the previous and next pages. */
export function SubmissionsPager({
  total,
  shown,
  query,
  setQuery,
}: {
  total: number;
  /** Rows on this page. */
  shown: number;
  query: SubmissionsQuery;
  setQuery: SetListQuery;
}) {
  const lastPage = Math.max(1, Math.ceil(total / query.pageSize));
  const first = (query.page - 1) * query.pageSize + 1;
  return (
    <nav aria-label="Pages of submissions" className="flex items-center gap-3">
      <span data-testid="page-summary" aria-live="polite">
        {shown ? `${first}–${first + shown - 1}` : "0"} of {total}
      </span>
      <label className="flex items-center gap-1">
        <span className="text-ink-soft">Per page</span>
        <select
          value={query.pageSize}
          onChange={(event) => setQuery({ pageSize: Number(event.target.value) })}
          className={`${inputClass} bg-white py-1`}
        >
          {PAGE_SIZES.map((size) => (
            <option key={size} value={size}>
              {size}
            </option>
          ))}
        </select>
      </label>
      <Button
        type="button"
        variant="quiet"
        disabled={query.page <= 1}
        onClick={() => setQuery({ page: query.page - 1 })}
      >
        Previous
      </Button>
      <span>
        Page {query.page} of {lastPage}
      </span>
      <Button
        type="button"
        variant="quiet"
        disabled={query.page >= lastPage}
        onClick={() => setQuery({ page: query.page + 1 })}
      >
        Next
      </Button>
    </nav>
  );
}
