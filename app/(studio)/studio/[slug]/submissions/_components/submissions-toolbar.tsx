"use client";

import type { VisibilityState } from "@tanstack/react-table";
import { Button } from "@/components/ui/button";
import { PIECE_STATUS_LABELS, PIECE_STATUSES } from "@/lib/domain";
import { PIECE_VERDICT_LABELS, PIECE_VERDICTS } from "@/lib/pieces/verdict";
import type { SubmissionsQuery } from "@/lib/validations/review";
import { CheckboxMenu } from "./filter-menu";
import { SearchBox } from "./search-box";
import { COLUMN_LABELS, HIDEABLE_COLUMNS } from "./submission-columns";
import type { SetListQuery } from "./use-list-query";

/** Search, the status and spec-check filters, clearing them, and the choice of columns. */
export function SubmissionsToolbar({
  query,
  setQuery,
  filtered,
  onClearFilters,
  columnVisibility,
  onToggleColumn,
}: {
  query: SubmissionsQuery;
  setQuery: SetListQuery;
  filtered: boolean;
  onClearFilters: () => void;
  columnVisibility: VisibilityState;
  onToggleColumn: (id: string, on: boolean) => void;
}) {
  return (
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
        <Button type="button" variant="quiet" onClick={onClearFilters}>
          Clear filters
        </Button>
      ) : null}
      <div className="ml-auto">
        <CheckboxMenu
          id="column-menu"
          label="Columns"
          legend="Columns to show"
          options={HIDEABLE_COLUMNS.map((id) => ({ value: id, label: COLUMN_LABELS[id] }))}
          checked={HIDEABLE_COLUMNS.filter((id) => columnVisibility[id] !== false)}
          onToggle={onToggleColumn}
        />
      </div>
    </div>
  );
}
