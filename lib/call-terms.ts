/** The terms of an open call in plain words, for contributors. Pure. */
import { formatCents } from "@/lib/money";
import { SHARE_SPLIT_LABELS, type ShareSplit } from "@/lib/domain";
import type { CallTerms } from "@/lib/validations/call";

export const FEE_KIND_LABELS = {
  none: "No fee",
  "per-piece": "Flat fee per piece",
  "per-page": "Flat fee per page",
} as const;

/** "$25.00 per piece", "€8.00 per page" or "No fee". */
export function feeText(terms: Pick<CallTerms, "feeKind" | "feeCents">, currency: string): string {
  if (terms.feeKind === "none" || terms.feeCents === 0) return "No fee";
  return `${formatCents(terms.feeCents, currency)} ${terms.feeKind === "per-page" ? "per page" : "per piece"}`;
}

/**
 * "10 % of net sales, shared among the contributors" or "No share of sales"; with a split rule,
 * "10 % of net sales, shared among the contributors by pages in the book".
 */
export function salesShareText(basisPoints: number, split?: ShareSplit): string {
  if (basisPoints === 0) return "No share of sales";
  return `${basisPoints / 100} % of net sales, shared among the contributors${split ? ` ${SHARE_SPLIT_LABELS[split].replace(/^equally among the contributors$/, "equally")}` : ""}`;
}

/** "2 copies of the printed book", "1 copy …" or "No contributor copies". */
export function copiesText(copies: number): string {
  if (copies === 0) return "No contributor copies";
  return `${copies} ${copies === 1 ? "copy" : "copies"} of the printed book`;
}
