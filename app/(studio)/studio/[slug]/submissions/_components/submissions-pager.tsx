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
    // One line at phone width (390 px): short labels below the sm breakpoint, full words above.
    <nav
      aria-label="Pages of submissions"
      data-testid="pager"
      className="flex flex-nowrap items-center gap-1.5 whitespace-nowrap sm:gap-3"
    >
      <span data-testid="page-summary" aria-live="polite">
        {shown ? `${first}–${first + shown - 1}` : "0"} of {total}
      </span>
      <label className="flex items-center gap-1">
        <span className="sr-only text-ink-soft sm:not-sr-only">Per page</span>
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
        <span aria-hidden="true" className="sm:hidden">
          ‹ Prev
        </span>
        <span className="sr-only sm:not-sr-only">Previous</span>
      </Button>
      <span data-testid="page-of">
        <span aria-hidden="true" className="sm:hidden">
          {query.page}/{lastPage}
        </span>
        <span className="sr-only sm:not-sr-only">
          Page {query.page} of {lastPage}
        </span>
      </span>
      <Button
        type="button"
        variant="quiet"
        disabled={query.page >= lastPage}
        onClick={() => setQuery({ page: query.page + 1 })}
      >
        <span aria-hidden="true" className="sm:hidden">
          Next ›
        </span>
        <span className="sr-only sm:not-sr-only">Next</span>
      </Button>
    </nav>
  );
}
