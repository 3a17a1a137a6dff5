/**
 * CSV exports of the ledger and of sales (RFC 4180 quoting by csv-stringify). Amounts are written
 * as decimal strings from integer cents ("12.34", "-0.50"), never through a float.
 */
import { stringify } from "csv-stringify/sync";
import type { LedgerLineWire, PersonLedger, SaleWire } from "@/lib/wire/payouts";

/** 1234 → "12.34", -50 → "-0.50". */
export function centsToDecimal(cents: number): string {
  const sign = cents < 0 ? "-" : "";
  const abs = Math.abs(cents);
  return `${sign}${Math.floor(abs / 100)}.${String(abs % 100).padStart(2, "0")}`;
}

/** A cell a spreadsheet would run as a formula (=, +, -, @ first) is kept as text with a leading '. */
function cell(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

export const LEDGER_COLUMNS = [
  "line",
  "contributor",
  "period",
  "kind",
  "source",
  "amount",
  "currency",
  "settles_line",
  "reverses_line",
  "reference",
  "working",
  "recorded_at",
] as const;

export function ledgerCsv(people: readonly PersonLedger[]): string {
  const rows = people.flatMap((p) =>
    p.lines.map((l: LedgerLineWire) => [
      String(l.id),
      cell(p.label),
      cell(l.periodLabel ?? ""),
      l.kind,
      l.source,
      centsToDecimal(l.amountCents),
      l.currency,
      l.settlesEntryId ? String(l.settlesEntryId) : "",
      l.reversesEntryId ? String(l.reversesEntryId) : "",
      cell(l.reference ?? ""),
      cell(l.working.join(" | ")),
      l.createdAt,
    ]),
  );
  rows.sort((a, b) => Number(a[0]) - Number(b[0]));
  return stringify([[...LEDGER_COLUMNS], ...rows], { record_delimiter: "windows" });
}

export const SALES_COLUMNS = [
  "sale",
  "sold_on",
  "channel",
  "where",
  "copies",
  "unit_price",
  "gross",
  "discounts",
  "channel_fees",
  "recovered_costs",
  "net",
  "currency",
  "note",
] as const;

export function salesCsv(sales: readonly SaleWire[], currency: string): string {
  return stringify(
    [
      [...SALES_COLUMNS],
      ...sales.map((s) => [
        String(s.id),
        s.soldOn,
        s.channel,
        cell(s.label),
        String(s.copies),
        centsToDecimal(s.unitPriceCents),
        centsToDecimal(s.grossCents),
        centsToDecimal(s.discountCents),
        centsToDecimal(s.channelFeesCents),
        centsToDecimal(s.recoverableCostsCents),
        centsToDecimal(s.netCents),
        currency,
        cell(s.note ?? ""),
      ]),
    ],
    { record_delimiter: "windows" },
  );
}
