"use client";

import { useState } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { formatDate } from "@/lib/dates";
import { pageReference } from "@/lib/print/credits";
import { LENGTH } from "@/lib/validations/limits";
import type { CreditLineSavedAnswer, CreditRowView } from "@/lib/wire/credits";

function stateText(row: CreditRowView): string {
  if (row.state === "approved" && row.approvedAt)
    return `Approved on ${formatDate(new Date(row.approvedAt))}`;
  if (row.state === "asked" && row.requestedAt)
    return `Asked on ${formatDate(new Date(row.requestedAt))}, outstanding`;
  return "Not asked yet";
}

/** One piece's credit: the line, where it stands, ask (again), and change the line. */
export function CreditRow({
  slug,
  row,
  busy,
  onAsk,
  onChanged,
}: {
  slug: string;
  row: CreditRowView;
  busy: boolean;
  onAsk: () => void;
  onChanged: (message: string) => Promise<void>;
}) {
  const [editing, setEditing] = useState(false);
  const [value, setValue] = useState(row.creditLine);
  const [saving, setSaving] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const inputId = `credit-${row.pieceId}`;

  async function save() {
    setSaving(true);
    setError(null);
    try {
      const answer = await fetchJson<CreditLineSavedAnswer>(
        `/api/anthologies/${slug}/credits/${row.pieceId}`,
        {
          method: "PATCH",
          json: { creditLine: value },
          failure: (status) => `Not saved (error ${status}).`,
        },
      );
      setEditing(false);
      await onChanged(
        !answer.changed
          ? "The line is unchanged."
          : answer.asked
            ? `Saved. The contributor of “${row.title}” was asked to approve the new line.`
            : `Saved. “${row.title}” needs approval: ask its contributor when ready.`,
      );
    } catch (e) {
      setError(e instanceof ApiError ? (e.fieldMessage("creditLine") ?? e.message) : "Not saved.");
    } finally {
      setSaving(false);
    }
  }

  return (
    <li
      className="flex flex-col gap-2 rounded-md border border-ink/15 bg-white/60 p-3 sm:flex-row sm:items-start sm:justify-between"
      data-testid={`credit-row-${row.pieceId}`}
      data-state={row.state}
    >
      <div className="flex min-w-0 flex-col gap-1">
        <p className="font-semibold">
          {row.title}{" "}
          <span className="font-normal text-ink-soft">
            · {row.contributorName}
            {row.pages.length ? ` · ${pageReference(row.pages)}` : " · not on the map yet"}
          </span>
        </p>
        {editing ? (
          <div className="flex flex-col gap-1">
            <label htmlFor={inputId} className="text-sm font-semibold">
              Credit line for “{row.title}”
            </label>
            <input
              id={inputId}
              className={inputClass}
              value={value}
              maxLength={LENGTH.creditLine}
              onChange={(e) => setValue(e.target.value)}
              aria-describedby={error ? `${inputId}-error` : undefined}
              aria-invalid={error ? true : undefined}
            />
            {error ? (
              <p id={`${inputId}-error`} className="text-xs text-persimmon-dark">
                {error}
              </p>
            ) : null}
            <p className="text-xs text-ink-soft">
              Saving a different line clears any approval; the contributor is asked again.
            </p>
            <div className="flex gap-2">
              <Button variant="quiet" busy={saving} onClick={save}>
                Save line
              </Button>
              <Button
                variant="quiet"
                onClick={() => {
                  setEditing(false);
                  setValue(row.creditLine);
                  setError(null);
                }}
              >
                Cancel
              </Button>
            </div>
          </div>
        ) : (
          <p className="break-words" data-testid={`credit-line-${row.pieceId}`}>
            “{row.creditLine}”
          </p>
        )}
        <p className="text-sm" data-testid={`credit-state-${row.pieceId}`}>
          {stateText(row)}
          {!row.hasAddress ? " · no e-mail address on file" : ""}
        </p>
      </div>
      <div className="flex shrink-0 flex-wrap gap-2">
        {row.state !== "approved" ? (
          <Button
            variant="quiet"
            busy={busy}
            disabled={!row.hasAddress}
            onClick={onAsk}
            aria-label={`${row.state === "asked" ? "Ask again" : "Ask"} about “${row.title}”`}
            data-testid={`ask-${row.pieceId}`}
          >
            {row.state === "asked" ? "Ask again" : "Ask"}
          </Button>
        ) : null}
        {!editing ? (
          <Button
            variant="quiet"
            onClick={() => setEditing(true)}
            aria-label={`Change line of “${row.title}”`}
          >
            Change line
          </Button>
        ) : null}
      </div>
    </li>
  );
}
