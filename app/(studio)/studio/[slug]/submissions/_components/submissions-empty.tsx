"use client";

import { Button } from "@/components/ui/button";

/** What an empty page says: past the last page, nothing matches the filters, or nothing sent yet. */
export function SubmissionsEmpty({
  total,
  filtered,
  onClear,
  onFirstPage,
}: {
  total: number;
  filtered: boolean;
  onClear: () => void;
  onFirstPage: () => void;
}) {
  if (total > 0) {
    return (
      <div className="px-6 py-10 text-center" data-testid="submissions-past-end">
        <p className="font-semibold">This page is past the last one.</p>
        <Button type="button" variant="quiet" className="mt-3" onClick={onFirstPage}>
          Go to the first page
        </Button>
      </div>
    );
  }
  if (filtered) {
    return (
      <div className="px-6 py-10 text-center" data-testid="submissions-no-match">
        <p className="font-display text-xl font-semibold">Nothing matches these filters</p>
        <p className="mt-1 text-ink-soft">Try fewer filters or another search.</p>
        <Button type="button" variant="quiet" className="mt-3" onClick={onClear}>
          Clear filters
        </Button>
      </div>
    );
  }
  return (
    <div className="px-6 py-10 text-center" data-testid="submissions-empty">
      <p className="font-display text-xl font-semibold">No submissions yet</p>
      <p className="mt-1 text-ink-soft">Pieces appear here as contributors answer the open call.</p>
    </div>
  );
}
