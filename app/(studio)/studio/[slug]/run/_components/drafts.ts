/** Form text for prices and tiers, and its conversion to the engine's cents through the shared schemas. */
import { fieldErrorsOf } from "./field-errors";
import { amountToCents, centsToAmount } from "@/lib/validations/call";
import type { PriceList, QuoteTier } from "@/lib/run/prices";
import { pricesSchema, shopQuoteSchema } from "@/lib/validations/run";

export const PACK_KEYS = [
  "insidePaper",
  "coverPaper",
  "copyShopSide",
  "inkPass",
  "master",
  "staples",
] as const;
export type PackKey = (typeof PACK_KEYS)[number];

export const PACK_LABELS: Record<PackKey, { label: string; per: string }> = {
  insidePaper: { label: "Text paper", per: "sheets a pack" },
  coverPaper: { label: "Cover stock", per: "sheets a pack" },
  copyShopSide: { label: "Copy shop, per printed side", per: "sides" },
  inkPass: { label: "Ink or toner per pass", per: "passes" },
  master: { label: "Masters", per: "masters" },
  staples: { label: "Staples", per: "staples a box" },
};

export type PricesDraft = Record<PackKey, { price: string; per: string }> & {
  rate: string;
  spoilage: string;
};

export const EMPTY_PRICES: PriceList = {
  insidePaper: { priceCents: 0, perQuantity: 500 },
  coverPaper: { priceCents: 0, perQuantity: 100 },
  copyShopSide: { priceCents: 0, perQuantity: 1 },
  inkPass: { priceCents: 0, perQuantity: 100 },
  master: { priceCents: 0, perQuantity: 1 },
  staples: { priceCents: 0, perQuantity: 1000 },
  finishingCentsPerHour: 0,
  spoilageBasisPoints: 0,
};

export function pricesToDraft(p: PriceList): PricesDraft {
  const draft = {} as PricesDraft;
  for (const k of PACK_KEYS)
    draft[k] = { price: centsToAmount(p[k].priceCents), per: String(p[k].perQuantity) };
  draft.rate = centsToAmount(p.finishingCentsPerHour);
  draft.spoilage = String(p.spoilageBasisPoints / 100);
  return draft;
}

/** A number typed as text: NaN when it is not one, so the schema reports it. */
const num = (text: string) => (text.trim() === "" ? Number.NaN : Number(text));

/** "5" or "2.5" percent → basis points; NaN when it is not a percentage with at most two decimals. */
function percentToBp(text: string): number {
  const m = /^(-)?(\d{1,3})(?:\.(\d{1,2}))?$/.exec(text.trim());
  if (!m) return Number.NaN;
  const bp = Number(m[2]) * 100 + Number((m[3] ?? "").padEnd(2, "0"));
  return m[1] ? -bp : bp;
}

function cents(text: string): number {
  const c = amountToCents(text);
  return c === undefined ? Number.NaN : c;
}

export function draftToPrices(
  d: PricesDraft,
): { ok: true; prices: PriceList } | { ok: false; errors: Record<string, string> } {
  const raw: Record<string, unknown> = {};
  for (const k of PACK_KEYS) raw[k] = { priceCents: cents(d[k].price), perQuantity: num(d[k].per) };
  raw.finishingCentsPerHour = cents(d.rate);
  raw.spoilageBasisPoints = percentToBp(d.spoilage);
  const parsed = pricesSchema.safeParse(raw);
  if (parsed.success) return { ok: true, prices: parsed.data };
  return { ok: false, errors: fieldErrorsOf(parsed.error) };
}

export type TierDraft = { copies: string; total: string };

export function tiersToDraft(tiers: readonly QuoteTier[]): TierDraft[] {
  return tiers.map((t) => ({ copies: String(t.copies), total: centsToAmount(t.totalCents) }));
}

export function draftToQuote(
  shopName: string,
  tiers: readonly TierDraft[],
  turnaround: string,
):
  | { ok: true; quote: { shopName: string; tiers: QuoteTier[]; turnaroundDays: number } }
  | { ok: false; errors: Record<string, string> } {
  const parsed = shopQuoteSchema.safeParse({
    shopName,
    tiers: tiers.map((t) => ({ copies: num(t.copies), totalCents: cents(t.total) })),
    turnaroundDays: num(turnaround),
  });
  if (parsed.success) return { ok: true, quote: parsed.data };
  return { ok: false, errors: fieldErrorsOf(parsed.error) };
}
