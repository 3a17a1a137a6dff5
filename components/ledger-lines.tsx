import type { ReactNode } from "react";
import { formatDate } from "@/lib/dates";
import { LEDGER_KIND_LABELS } from "@/lib/domain";
import { formatCents } from "@/lib/money";
import type { LedgerLineWire } from "@/lib/wire/payouts";

const SOURCE_LABELS: Record<LedgerLineWire["source"], string> = {
  fee: "Flat fee",
  share: "Share of sales",
  transfer: "Transfer",
  "by-hand": "By hand",
  correction: "Correction",
};
const STATUS_LABELS: Record<NonNullable<LedgerLineWire["status"]>, string> = {
  open: "To pay",
  sending: "Transfer on its way",
  paid: "Paid",
  cancelled: "Cancelled",
};

/** One person's ledger lines, each with how it was worked out; `actions` adds controls to a line. */
export function LedgerLines({
  lines,
  currency,
  actions,
}: {
  lines: LedgerLineWire[];
  currency: string;
  actions?: (line: LedgerLineWire) => ReactNode;
}) {
  if (lines.length === 0) return <p className="text-sm text-ink-soft">No lines yet.</p>;
  return (
    <ol className="flex flex-col gap-2" data-testid="ledger-lines">
      {lines.map((l) => (
        <li key={l.id} className="rounded-md border border-ink/10 bg-white/50 px-3 py-2 text-sm">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <span>
              <span className="font-semibold">{LEDGER_KIND_LABELS[l.kind]}</span> ·{" "}
              {SOURCE_LABELS[l.source]}
              {l.periodLabel ? ` · ${l.periodLabel}` : ""} · line {l.id}
              {l.status ? (
                <span className="ml-2 rounded bg-paper-deep px-1.5 py-0.5 text-xs">
                  {STATUS_LABELS[l.status]}
                </span>
              ) : null}
            </span>
            <span className="font-mono">{formatCents(l.amountCents, currency)}</span>
          </div>
          <p className="text-xs text-ink-faint">
            {formatDate(new Date(l.createdAt))}
            {l.reference ? ` · ${l.reference}` : ""}
          </p>
          {l.working.length > 0 ? (
            <details className="mt-1">
              <summary className="cursor-pointer text-xs font-semibold">
                How this was worked out
              </summary>
              <ul className="mt-1 list-none text-xs text-ink-soft">
                {l.working.map((w, i) => (
                  <li key={i}>{w}</li>
                ))}
              </ul>
            </details>
          ) : null}
          {actions ? <div className="mt-2 flex flex-wrap gap-3">{actions(l)}</div> : null}
        </li>
      ))}
    </ol>
  );
}
