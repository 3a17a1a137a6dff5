"use client";

import { flexRender, type Table } from "@tanstack/react-table";
import type { SubmissionSort, SubmissionsQuery } from "@/lib/validations/review";
import type { SubmissionRow } from "@/lib/wire/review";
import { moveBetweenRows } from "./move-between-rows";
import { SkeletonRows } from "./skeleton-rows";
import { COLUMN_LABELS } from "./submission-columns";

/** The rows themselves under headings that sort by their column; arrow keys move between rows. */
export function SubmissionsGrid({
  table,
  query,
  onSort,
  loading,
  busy,
}: {
  table: Table<SubmissionRow>;
  query: SubmissionsQuery;
  onSort: (id: SubmissionSort) => void;
  /** The first page is still on its way: placeholder rows stand in. */
  loading: boolean;
  /** A page is being fetched (the rows shown may be the previous page's). */
  busy: boolean;
}) {
  return (
    <table
      className="w-full border-collapse text-left text-sm"
      data-testid="submissions-table"
      aria-busy={busy || undefined}
      aria-describedby="table-keys"
      onKeyDown={moveBetweenRows}
    >
      <caption className="sr-only">
        Submissions, sorted by {COLUMN_LABELS[query.sort].toLowerCase()},{" "}
        {query.dir === "asc" ? "ascending" : "descending"}
      </caption>
      <thead className="bg-paper-deep/70 text-xs uppercase tracking-wide text-ink-soft">
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => {
              const id = header.column.id;
              if (id === "select") {
                return (
                  <th key={id} scope="col" className="w-10 px-3 py-2">
                    {flexRender(header.column.columnDef.header, header.getContext())}
                  </th>
                );
              }
              const sortId = id as SubmissionSort;
              const active = query.sort === sortId;
              return (
                <th
                  key={id}
                  scope="col"
                  className="px-3 py-2 font-semibold"
                  aria-sort={
                    active ? (query.dir === "asc" ? "ascending" : "descending") : undefined
                  }
                >
                  <button
                    type="button"
                    onClick={() => onSort(sortId)}
                    className="inline-flex items-center gap-1 uppercase hover:text-ink"
                    data-testid={`sort-${sortId}`}
                  >
                    {COLUMN_LABELS[sortId]}
                    <span aria-hidden="true" className={active ? "text-ink" : "text-ink/25"}>
                      {active && query.dir === "asc" ? "▲" : "▼"}
                    </span>
                  </button>
                </th>
              );
            })}
          </tr>
        ))}
      </thead>
      {/* Stale rows are dimmed while the next page is fetched, so a new sort or filter is not
          mistaken for its result; the status line above the table says the same in words. */}
      <tbody
        className={busy && !loading ? "opacity-50 transition-opacity" : undefined}
        data-stale={busy && !loading ? "true" : undefined}
      >
        {loading ? (
          <SkeletonRows columns={table.getVisibleLeafColumns().length} />
        ) : (
          table.getRowModel().rows.map((row) => (
            <tr
              key={row.id}
              className={`border-t border-ink/10 ${row.getIsSelected() ? "bg-teal-light/40" : "hover:bg-paper-deep/40"}`}
              data-testid="submission-row"
              data-piece-id={row.original.id}
            >
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className="px-3 py-2 align-middle" data-column={cell.column.id}>
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))
        )}
      </tbody>
    </table>
  );
}
