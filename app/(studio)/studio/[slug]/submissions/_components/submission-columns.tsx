"use client";

import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { useMemo } from "react";
import { PieceStatusBadge } from "@/components/piece-status-badge";
import { VerdictBadge } from "@/components/verdict-badge";
import { formatDateTime } from "@/lib/dates";
import { PIECE_KIND_LABELS } from "@/lib/domain";
import type { SubmissionSort } from "@/lib/validations/review";
import type { SubmissionRow } from "@/lib/wire/review";

/** Each sortable column's heading; the column ids are the server's sort keys. */
export const COLUMN_LABELS: Record<SubmissionSort, string> = {
  contributor: "Contributor",
  title: "Title",
  kind: "Kind",
  pages: "Pages",
  inks: "Inks",
  verdict: "Spec check",
  status: "Status",
  updated: "Last change",
};

/** Columns a person may hide; the title (the row's link) and the checkbox always show. */
export const HIDEABLE_COLUMNS: SubmissionSort[] = [
  "contributor",
  "kind",
  "pages",
  "inks",
  "verdict",
  "status",
  "updated",
];

/** The table's columns: a selection checkbox, then one per sort key, the title linking to the piece. */
export function useSubmissionColumns(slug: string): ColumnDef<SubmissionRow>[] {
  return useMemo<ColumnDef<SubmissionRow>[]>(
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
            {formatDateTime(new Date(row.original.updatedAt))}
          </time>
        ),
      },
    ],
    [slug],
  );
}
