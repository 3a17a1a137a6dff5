"use client";

import { keepPreviousData, useQuery, useQueryClient } from "@tanstack/react-query";
import {
  flexRender,
  getCoreRowModel,
  useReactTable,
  type ColumnDef,
  type RowSelectionState,
  type VisibilityState,
} from "@tanstack/react-table";
import Link from "next/link";
import { useEffect, useMemo, useRef, useState, type KeyboardEvent } from "react";
import { PieceStatusBadge } from "@/components/piece-status-badge";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { VerdictBadge } from "@/components/verdict-badge";
import { PIECE_KIND_LABELS, PIECE_STATUS_LABELS, PIECE_STATUSES } from "@/lib/domain";
import { PIECE_VERDICT_LABELS, PIECE_VERDICTS } from "@/lib/pieces/verdict";
import { PAGE_SIZES, type SubmissionSort } from "@/lib/validations/review";
import { fetchJson } from "@/components/api/fetch-json";
import type { SubmissionRow, SubmissionsPage } from "@/lib/wire/review";
import { BulkStatusBar } from "./bulk-status-bar";
import { CheckboxMenu } from "./filter-menu";
import { useListQuery } from "./use-list-query";

const COLUMN_LABELS: Record<SubmissionSort, string> = {
  contributor: "Contributor",
  title: "Title",
  kind: "Kind",
  pages: "Pages",
  inks: "Inks",
  verdict: "Spec check",
  status: "Status",
  updated: "Last change",
};
/** Columns that open newest or worst first on their first click. */
const FIRST_CLICK_DESC: SubmissionSort[] = ["updated", "verdict", "pages"];
const HIDEABLE: SubmissionSort[] = [
  "contributor",
  "kind",
  "pages",
  "inks",
  "verdict",
  "status",
  "updated",
];
const COLUMNS_KEY = "quireline.submissions.hidden-columns";

const when = new Intl.DateTimeFormat(undefined, { dateStyle: "medium", timeStyle: "short" });

/** The editors' submissions table: server-side paging, sorting, search and filters, with bulk moves. */
export function SubmissionsTable({ slug }: { slug: string }) {
  const { query, setQuery, understood, filtered, apiSearch } = useListQuery();
  const queryClient = useQueryClient();
  const queryKey = ["submissions", slug, apiSearch] as const;
  const result = useQuery({
    queryKey,
    queryFn: ({ signal }) =>
      fetchJson<SubmissionsPage>(`/api/anthologies/${slug}/submissions?${apiSearch}`, { signal }),
    placeholderData: keepPreviousData,
  });
  const data = result.data;
  const rows = useMemo(() => data?.rows ?? [], [data]);

  const [rowSelection, setRowSelection] = useState<RowSelectionState>({});
  // A different page or filter shows different rows: a selection there would be invisible.
  useEffect(() => setRowSelection({}), [apiSearch]);

  const [columnVisibility, setColumnVisibility] = useState<VisibilityState>({});
  useEffect(() => {
    try {
      const hidden = JSON.parse(localStorage.getItem(COLUMNS_KEY) ?? "[]") as string[];
      setColumnVisibility(Object.fromEntries(hidden.map((id) => [id, false])));
    } catch {
      // A damaged setting just shows every column.
    }
  }, []);
  const toggleColumn = (id: string, on: boolean) => {
    setColumnVisibility((current) => {
      const next = { ...current, [id]: on };
      const hidden = Object.entries(next)
        .filter(([, visible]) => !visible)
        .map(([key]) => key);
      localStorage.setItem(COLUMNS_KEY, JSON.stringify(hidden));
      return next;
    });
  };

  const columns = useMemo<ColumnDef<SubmissionRow>[]>(
    () => [
      {
        id: "select",
        enableHiding: false,
        header: ({ table }) => (
          <input
            type="checkbox"
            className="h-4 w-4 accent-teal"
            aria-label="Select every piece on this page"
            checked={table.getIsAllPageRowsSelected()}
            ref={(el) => {
              if (el) el.indeterminate = table.getIsSomePageRowsSelected();
            }}
            onChange={table.getToggleAllPageRowsSelectedHandler()}
          />
        ),
        cell: ({ row }) => (
          <input
            type="checkbox"
            className="h-4 w-4 accent-teal"
            aria-label={`Select "${row.original.title}"`}
            checked={row.getIsSelected()}
            onChange={row.getToggleSelectedHandler()}
          />
        ),
      },
      {
        id: "contributor",
        cell: ({ row }) =>
          row.original.contributor.name ?? row.original.contributor.email ?? "Unknown",
      },
      {
        id: "title",
        enableHiding: false,
        cell: ({ row }) => (
          <Link
            href={`/studio/${slug}/submissions/${row.original.id}`}
            className="font-semibold"
            data-testid="piece-link"
          >
            {row.original.title}
          </Link>
        ),
      },
      { id: "kind", cell: ({ row }) => PIECE_KIND_LABELS[row.original.kind] },
      {
        id: "pages",
        cell: ({ row }) => <span className="font-mono">{row.original.pageCount}</span>,
      },
      { id: "inks", cell: ({ row }) => row.original.inks.join(", ") },
      { id: "verdict", cell: ({ row }) => <VerdictBadge verdict={row.original.verdict} /> },
      { id: "status", cell: ({ row }) => <PieceStatusBadge status={row.original.status} /> },
      {
        id: "updated",
        cell: ({ row }) => (
          <time dateTime={row.original.updatedAt} className="whitespace-nowrap text-ink-soft">
            {when.format(new Date(row.original.updatedAt))}
          </time>
        ),
      },
    ],
    [slug],
  );

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

  const visibleColumnCount = table.getVisibleLeafColumns().length;
  const firstLoad = result.isPending;
  const lastPage = data ? Math.max(1, Math.ceil(data.total / query.pageSize)) : 1;

  return (
    <div className="flex flex-col gap-4">
      {!understood ? (
        <Notice tone="warn" testId="query-reset">
          Part of this address was not understood, so the table shows every submission in the
          default order.
        </Notice>
      ) : null}

      <div className="flex flex-wrap items-end gap-3" role="search" aria-label="Find submissions">
        <SearchBox value={query.q} onSearch={(q) => setQuery({ q }, { replace: true })} />
        <CheckboxMenu
          id="filter-status"
          label="Status"
          legend="Show pieces with these statuses"
          options={PIECE_STATUSES.map((s) => ({ value: s, label: PIECE_STATUS_LABELS[s] }))}
          checked={query.status}
          onToggle={(value, on) =>
            setQuery({
              status: on ? [...query.status, value] : query.status.filter((s) => s !== value),
            })
          }
          onClear={() => setQuery({ status: [] })}
        />
        <CheckboxMenu
          id="filter-verdict"
          label="Spec check"
          legend="Show pieces whose spec check says"
          options={PIECE_VERDICTS.map((v) => ({ value: v, label: PIECE_VERDICT_LABELS[v] }))}
          checked={query.verdict}
          onToggle={(value, on) =>
            setQuery({
              verdict: on ? [...query.verdict, value] : query.verdict.filter((v) => v !== value),
            })
          }
          onClear={() => setQuery({ verdict: [] })}
        />
        {filtered ? (
          <Button type="button" variant="quiet" onClick={clearFilters}>
            Clear filters
          </Button>
        ) : null}
        <div className="ml-auto">
          <CheckboxMenu
            id="column-menu"
            label="Columns"
            legend="Columns to show"
            options={HIDEABLE.map((id) => ({ value: id, label: COLUMN_LABELS[id] }))}
            checked={HIDEABLE.filter((id) => columnVisibility[id] !== false)}
            onToggle={toggleColumn}
          />
        </div>
      </div>

      <BulkStatusBar
        slug={slug}
        selected={selected}
        onDone={(changedIds) => {
          setRowSelection((current) =>
            Object.fromEntries(
              Object.entries(current).filter(([id]) => !changedIds.includes(Number(id))),
            ),
          );
          void queryClient.invalidateQueries({ queryKey: ["submissions", slug] });
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

      <div className="overflow-x-auto rounded-md border border-ink/15 bg-white/40">
        <table
          className="w-full border-collapse text-left text-sm"
          data-testid="submissions-table"
          aria-busy={result.isFetching || undefined}
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
                        onClick={() => sortBy(sortId)}
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
          <tbody>
            {firstLoad ? (
              <SkeletonRows columns={visibleColumnCount} />
            ) : (
              table.getRowModel().rows.map((row) => (
                <tr
                  key={row.id}
                  className={`border-t border-ink/10 ${row.getIsSelected() ? "bg-teal-light/40" : "hover:bg-paper-deep/40"}`}
                  data-testid="submission-row"
                  data-piece-id={row.original.id}
                >
                  {row.getVisibleCells().map((cell) => (
                    <td
                      key={cell.id}
                      className="px-3 py-2 align-middle"
                      data-column={cell.column.id}
                    >
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ))}
                </tr>
              ))
            )}
          </tbody>
        </table>
        {data && data.rows.length === 0 ? (
          <EmptyState
            total={data.total}
            filtered={filtered}
            onClear={clearFilters}
            onFirstPage={() => setQuery({ page: 1 })}
          />
        ) : null}
      </div>

      <div className="flex flex-wrap items-center justify-between gap-3 text-sm">
        <p id="table-keys" className="text-xs text-ink-faint">
          Tab reaches each control; the up and down arrow keys move to the same control in the row
          above or below.
        </p>
        {data && data.total > 0 ? (
          <nav aria-label="Pages of submissions" className="flex items-center gap-3">
            <span data-testid="page-summary" aria-live="polite">
              {data.rows.length
                ? `${(query.page - 1) * query.pageSize + 1}–${(query.page - 1) * query.pageSize + data.rows.length}`
                : "0"}{" "}
              of {data.total}
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
        ) : null}
      </div>
    </div>
  );
}

/** Arrow keys move focus to the same column's control in the next or previous row. */
function moveBetweenRows(event: KeyboardEvent<HTMLTableElement>) {
  if (event.key !== "ArrowDown" && event.key !== "ArrowUp") return;
  const target = event.target as HTMLElement;
  if (target.tagName === "SELECT" || target.tagName === "TEXTAREA") return;
  const cell = target.closest("td, th");
  const row = cell?.parentElement as HTMLTableRowElement | null;
  if (!cell || !row) return;
  const rows = Array.from(event.currentTarget.querySelectorAll<HTMLTableRowElement>("tr"));
  const next = rows[rows.indexOf(row) + (event.key === "ArrowDown" ? 1 : -1)];
  const column = Array.from(row.children).indexOf(cell);
  const focusable = next?.children[column]?.querySelector<HTMLElement>("a, button, input");
  if (focusable) {
    event.preventDefault();
    focusable.focus();
  }
}

function SearchBox({ value, onSearch }: { value: string; onSearch: (q: string) => void }) {
  const [text, setText] = useState(value);
  const latest = useRef(onSearch);
  latest.current = onSearch;
  // Follow the address when it changes from outside (clear filters, back button).
  useEffect(() => setText(value), [value]);
  useEffect(() => {
    if (text.trim() === value) return;
    const timer = setTimeout(() => latest.current(text.trim()), 300);
    return () => clearTimeout(timer);
  }, [text, value]);
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor="submissions-search" className="text-sm font-semibold">
        Search
      </label>
      <input
        id="submissions-search"
        type="search"
        value={text}
        onChange={(event) => setText(event.target.value)}
        onKeyDown={(event) => {
          if (event.key === "Enter") latest.current(text.trim());
        }}
        placeholder="Title, contributor or credit line"
        maxLength={200}
        className={`${inputClass} w-72`}
      />
    </div>
  );
}

function SkeletonRows({ columns }: { columns: number }) {
  return (
    <>
      {Array.from({ length: 6 }, (_, i) => (
        <tr
          key={i}
          className="border-t border-ink/10"
          data-testid="submissions-loading"
          aria-hidden="true"
        >
          {Array.from({ length: columns }, (_, j) => (
            <td key={j} className="px-3 py-3">
              <span
                className="block h-3 animate-pulse rounded bg-ink/10"
                style={{ width: j === 0 ? 16 : `${50 + ((i * 7 + j * 13) % 40)}%` }}
              />
            </td>
          ))}
        </tr>
      ))}
    </>
  );
}

function EmptyState({
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
