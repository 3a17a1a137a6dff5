"use client";

import { useQueryClient } from "@tanstack/react-query";
import { getCoreRowModel, useReactTable, type RowSelectionState } from "@tanstack/react-table";
import { useEffect, useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import type { SubmissionSort } from "@/lib/validations/review";
import { BulkStatusBar } from "./bulk-status-bar";
import { ScrollCue } from "./scroll-cue";
import { useSubmissionColumns } from "./submission-columns";
import { SubmissionsEmpty } from "./submissions-empty";
import { SubmissionsGrid } from "./submissions-grid";
import { SubmissionsPager } from "./submissions-pager";
import { SubmissionsToolbar } from "./submissions-toolbar";
import { useHiddenColumns } from "./use-hidden-columns";
import { useListQuery } from "./use-list-query";
import { submissionsKey, useSubmissionsPage } from "./use-submissions-page";

/** Columns that open newest or worst first on their first click. */
const FIRST_CLICK_DESC: SubmissionSort[] = ["updated", "verdict", "pages"];

/** The editors' submissions table: server-side paging, sorting, search and filters, with bulk moves. */
export function SubmissionsTable({ slug }: { slug: string }) {
  const { query, setQuery, understood, filtered, apiSearch } = useListQuery();
  const queryClient = useQueryClient();
  const result = useSubmissionsPage(slug, apiSearch);
  const data = result.data;
  const rows = useMemo(() => data?.rows ?? [], [data]);

  const [rowSelection, setRowSelection] = useState<RowSelectionState>({});
  // A different page or filter shows different rows: a selection there would be invisible.
  useEffect(() => setRowSelection({}), [apiSearch]);

  const { columnVisibility, setColumnVisibility, toggleColumn } = useHiddenColumns();
  const columns = useSubmissionColumns(slug);

  const table = useReactTable({
    data: rows,
    columns,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (row) => String(row.id),
    manualPagination: true,
    manualSorting: true,
    manualFiltering: true,
    rowCount: data?.total ?? 0,
    state: { rowSelection, columnVisibility },
    onRowSelectionChange: setRowSelection,
    onColumnVisibilityChange: setColumnVisibility,
    enableRowSelection: true,
  });

  const selected = rows.filter((r) => rowSelection[String(r.id)]);

  const sortBy = (id: SubmissionSort) => {
    if (query.sort === id) setQuery({ sort: id, dir: query.dir === "asc" ? "desc" : "asc" });
    else setQuery({ sort: id, dir: FIRST_CLICK_DESC.includes(id) ? "desc" : "asc" });
  };

  const clearFilters = () => setQuery({ q: "", status: [], verdict: [] });

  return (
    <div className="flex flex-col gap-4">
      {!understood ? (
        <Notice tone="warn" testId="query-reset">
          Part of this address was not understood, so the table shows every submission in the
          default order.
        </Notice>
      ) : null}

      <SubmissionsToolbar
        query={query}
        setQuery={setQuery}
        filtered={filtered}
        onClearFilters={clearFilters}
        columnVisibility={columnVisibility}
        onToggleColumn={toggleColumn}
      />

      <BulkStatusBar
        slug={slug}
        selected={selected}
        onDone={(changedIds) => {
          setRowSelection((current) =>
            Object.fromEntries(
              Object.entries(current).filter(([id]) => !changedIds.includes(Number(id))),
            ),
          );
          void queryClient.invalidateQueries({ queryKey: submissionsKey(slug) });
        }}
      />

      {result.isError ? (
        <Notice tone="error" testId="submissions-error" title="The submissions could not be loaded">
          <p>{result.error.message}</p>
          <Button
            type="button"
            variant="quiet"
            className="mt-2"
            onClick={() => void result.refetch()}
            busy={result.isFetching}
          >
            Try again
          </Button>
        </Notice>
      ) : null}

      {/* Always in the page, so screen readers hear the change; empty while nothing is fetched. */}
      <p
        role="status"
        className="min-h-5 text-sm text-ink-soft"
        data-testid="submissions-refreshing"
      >
        {result.isFetching && !result.isPending ? "Updating the list…" : ""}
      </p>

      <ScrollCue className="rounded-md border border-ink/15 bg-white/40">
        <SubmissionsGrid
          table={table}
          query={query}
          onSort={sortBy}
          loading={result.isPending}
          busy={result.isFetching}
        />
        {data && data.rows.length === 0 ? (
          <SubmissionsEmpty
            total={data.total}
            filtered={filtered}
            onClear={clearFilters}
            onFirstPage={() => setQuery({ page: 1 })}
          />
        ) : null}
      </ScrollCue>

      <div className="flex flex-wrap items-center justify-between gap-3 text-sm">
        <p id="table-keys" className="text-xs text-ink-faint">
          Tab reaches each control; the up and down arrow keys move to the same control in the row
          above or below.
        </p>
        {data && data.total > 0 ? (
          <SubmissionsPager
            total={data.total}
            shown={data.rows.length}
            query={query}
            setQuery={setQuery}
          />
        ) : null}
      </div>
    </div>
  );
}
