/**
 * What each contributor is owed, worked out from the call's terms and the recorded sales. Pure:
 * plain data in, plain data out, integer cents throughout. Every amount comes with its working in
 * words so the editor can show a contributor how it was reached.
 *
 * The share is split with the largest-remainder method (Hamilton's apportionment method, with the
 * pool in cents as the "seats" and each person's pieces or pages as the "votes"): the parts always
 * add up to the pool exactly.
 */
import type { FeeKind, LedgerKind, LedgerSource, ShareSplit } from "@/lib/domain";
import { assertCents, formatCents, priceOf, splitCents, type Cents } from "@/lib/money";

/** The call's money terms, as open_call stores them. */
export type PayoutTerms = {
  feeKind: FeeKind;
  feeCents: Cents;
  salesShareBasisPoints: number;
  shareSplit: ShareSplit;
};

export type SaleFigures = {
  copies: number;
  unitPriceCents: Cents;
  discountCents: Cents;
  channelFeesCents: Cents;
  recoverableCostsCents: Cents;
};

/** What one contributor has in the book. */
export type ContributorWork = { contributorId: string; pieces: number; pages: number };

/** How a ledger line was reached: the terms, the inputs and the working, kept with the line. */
export type LedgerComputation = {
  terms?: PayoutTerms;
  inputs: Record<string, number | string>;
  working: string[];
};

/** Gross, deductions and net of one sale row. */
export function saleNet(sale: SaleFigures): {
  grossCents: Cents;
  deductionsCents: Cents;
  netCents: Cents;
} {
  const grossCents = priceOf(sale.copies, sale.unitPriceCents);
  const deductionsCents = assertCents(
    sale.discountCents + sale.channelFeesCents + sale.recoverableCostsCents,
  );
  return { grossCents, deductionsCents, netCents: grossCents - deductionsCents };
}

export type PeriodSales = {
  copies: number;
  grossCents: Cents;
  discountCents: Cents;
  channelFeesCents: Cents;
  recoverableCostsCents: Cents;
  /** Gross less every deduction; may be below zero when costs outran sales. */
  netCents: Cents;
  /** What the share is taken from: the net, or zero when the net is below zero. */
  shareBaseCents: Cents;
};

/**
 * Net sales of a period: gross minus discounts, channel fees and the costs the terms let the press
 * recover. A loss is not passed on to contributors: the share is taken from zero then.
 */
export function periodSales(sales: readonly SaleFigures[]): PeriodSales {
  let copies = 0;
  let grossCents = 0;
  let discountCents = 0;
  let channelFeesCents = 0;
  let recoverableCostsCents = 0;
  for (const sale of sales) {
    copies += sale.copies;
    grossCents += saleNet(sale).grossCents;
    discountCents += sale.discountCents;
    channelFeesCents += sale.channelFeesCents;
    recoverableCostsCents += sale.recoverableCostsCents;
  }
  const netCents = assertCents(
    grossCents - discountCents - channelFeesCents - recoverableCostsCents,
  );
  return {
    copies,
    grossCents,
    discountCents,
    channelFeesCents,
    recoverableCostsCents,
    netCents,
    shareBaseCents: Math.max(0, netCents),
  };
}

/** The contributors' pool: net × basis points ÷ 10,000, rounded half away from zero, once. */
export function sharePool(shareBaseCents: Cents, basisPoints: number): Cents {
  if (!Number.isInteger(basisPoints) || basisPoints < 0 || basisPoints > 10_000)
    throw new RangeError(`a share must be 0-10000 basis points, got ${basisPoints}`);
  return priceOf(shareBaseCents, basisPoints, 10_000);
}

/** The weight a person carries under a split rule. */
export function splitWeight(work: ContributorWork, rule: ShareSplit): number {
  if (rule === "per-page") return work.pages;
  if (rule === "per-piece") return work.pieces;
  return 1;
}

export type SharePart = {
  contributorId: string;
  weight: number;
  /** Pool × weight, in cents, before rounding down. */
  floorCents: Cents;
  /** 1 when a leftover cent went to this person for a large remainder. */
  extraCents: Cents;
  cents: Cents;
};

/**
 * Splits the pool among the people with work in the book by the call's rule, largest remainder
 * (ties to the earlier person, so pass them in a stable order). Parts sum to the pool.
 */
export function splitShare(
  poolCents: Cents,
  work: readonly ContributorWork[],
  rule: ShareSplit,
): SharePart[] {
  const counted = work.filter((w) => splitWeight(w, rule) > 0);
  if (counted.length === 0) return [];
  const weights = counted.map((w) => splitWeight(w, rule));
  const parts = splitCents(poolCents, weights);
  const totalWeight = weights.reduce((a, b) => a + b, 0);
  return counted.map((w, i) => {
    const floorCents = Math.floor((poolCents * weights[i]!) / totalWeight);
    const cents = parts[i]!;
    return {
      contributorId: w.contributorId,
      weight: weights[i]!,
      floorCents,
      extraCents: cents - floorCents,
      cents,
    };
  });
}

/** A flat fee: per piece or per page of the person's accepted work. */
export function feeOwed(terms: Pick<PayoutTerms, "feeKind" | "feeCents">, work: ContributorWork) {
  if (terms.feeKind === "none" || terms.feeCents === 0) return 0;
  const count = terms.feeKind === "per-page" ? work.pages : work.pieces;
  return priceOf(count, terms.feeCents);
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

function weightWords(weight: number, rule: ShareSplit): string {
  if (rule === "per-page") return plural(weight, "page", "pages");
  if (rule === "per-piece") return plural(weight, "piece", "pieces");
  return "an equal part";
}

/** The working of a fee line in words. */
export function feeComputation(
  terms: PayoutTerms,
  work: ContributorWork,
  currency: string,
): LedgerComputation {
  const count = terms.feeKind === "per-page" ? work.pages : work.pieces;
  const unit = terms.feeKind === "per-page" ? "page" : "piece";
  const owed = feeOwed(terms, work);
  return {
    terms,
    inputs: { pieces: work.pieces, pages: work.pages, feeCents: terms.feeCents },
    working: [
      `Flat fee of ${formatCents(terms.feeCents, currency)} per ${unit} × ${plural(count, unit, `${unit}s`)} = ${formatCents(owed, currency)}`,
    ],
  };
}

/** The working of a share line in words: the period's net, the pool, this person's part. */
export function shareComputation(
  terms: PayoutTerms,
  sales: PeriodSales,
  poolCents: Cents,
  part: SharePart,
  totalWeight: number,
  currency: string,
): LedgerComputation {
  const money = (c: Cents) => formatCents(c, currency);
  const working = [
    `Sales: ${plural(sales.copies, "copy", "copies")}, ${money(sales.grossCents)} gross`,
    `Less discounts ${money(sales.discountCents)}, channel fees ${money(sales.channelFeesCents)} and recovered costs ${money(sales.recoverableCostsCents)} = ${money(sales.netCents)} net`,
  ];
  if (sales.netCents < 0) working.push("Costs outran sales, so the share is taken from nothing.");
  working.push(
    `Contributors’ share: ${terms.salesShareBasisPoints / 100} % of ${money(sales.shareBaseCents)} = ${money(poolCents)}`,
    terms.shareSplit === "equal"
      ? `Split equally among ${plural(totalWeight, "contributor", "contributors")}: ${money(part.floorCents)} each before rounding`
      : `Your part: ${weightWords(part.weight, terms.shareSplit)} of ${totalWeight} → ${money(part.floorCents)} rounded down`,
  );
  if (part.extraCents > 0)
    working.push(
      `Plus ${plural(part.extraCents, "cent", "cents")} left over after rounding, given to the largest remainders so the parts add up to the pool`,
    );
  working.push(`= ${money(part.cents)}`);
  return {
    terms,
    inputs: {
      netCents: sales.netCents,
      poolCents,
      weight: part.weight,
      totalWeight,
      copies: sales.copies,
    },
    working,
  };
}

/** What closing a period owes each person: a share line, and a fee line for those not yet paid one. */
export type PeriodLine = {
  contributorId: string;
  source: Extract<LedgerSource, "fee" | "share">;
  amountCents: Cents;
  computation: LedgerComputation;
};

export function closePeriod(input: {
  terms: PayoutTerms;
  currency: string;
  sales: readonly SaleFigures[];
  work: readonly ContributorWork[];
  /** People whose fee is already in the ledger (fees are owed once, not each period). */
  feeAlreadyOwed: ReadonlySet<string>;
}): { sales: PeriodSales; poolCents: Cents; lines: PeriodLine[] } {
  const { terms, currency } = input;
  const sales = periodSales(input.sales);
  const poolCents = sharePool(sales.shareBaseCents, terms.salesShareBasisPoints);
  const lines: PeriodLine[] = [];
  for (const w of input.work) {
    if (input.feeAlreadyOwed.has(w.contributorId)) continue;
    const fee = feeOwed(terms, w);
    if (fee > 0)
      lines.push({
        contributorId: w.contributorId,
        source: "fee",
        amountCents: fee,
        computation: feeComputation(terms, w, currency),
      });
  }
  const parts = splitShare(poolCents, input.work, terms.shareSplit);
  const totalWeight = parts.reduce((a, p) => a + p.weight, 0);
  for (const part of parts) {
    if (part.cents === 0) continue;
    lines.push({
      contributorId: part.contributorId,
      source: "share",
      amountCents: part.cents,
      computation: shareComputation(terms, sales, poolCents, part, totalWeight, currency),
    });
  }
  return { sales, poolCents, lines };
}

export type LedgerLine = {
  id: number;
  kind: LedgerKind;
  amountCents: Cents;
  settlesEntryId: number | null;
  reversesEntryId: number | null;
};

/** A balance is the sum of the lines: owed minus paid, with reversals cancelling what they name. */
export function ledgerBalance(lines: readonly Pick<LedgerLine, "amountCents">[]): Cents {
  return lines.reduce((sum, l) => assertCents(sum + l.amountCents), 0);
}

/** The signed amount a new line carries: owed adds, paid takes away, scheduled is only a note. */
export function signedAmount(kind: LedgerKind, cents: Cents, reversedAmount = 0): Cents {
  assertCents(cents);
  if (kind === "owed") return cents;
  if (kind === "paid") return -cents;
  if (kind === "reversed") return -reversedAmount;
  return 0;
}

/** Paid, owed and outstanding totals for a person's lines (a reversal lowers what it reverses). */
export function ledgerTotals(lines: readonly LedgerLine[]) {
  const byId = new Map(lines.map((l) => [l.id, l]));
  let owedCents = 0;
  let paidCents = 0;
  for (const l of lines) {
    if (l.kind === "owed") owedCents += l.amountCents;
    if (l.kind === "paid") paidCents -= l.amountCents;
    if (l.kind === "reversed") {
      const target = l.reversesEntryId ? byId.get(l.reversesEntryId) : undefined;
      if (target?.kind === "paid") paidCents -= -l.amountCents;
      else owedCents += l.amountCents;
    }
  }
  return { owedCents, paidCents, outstandingCents: ledgerBalance(lines) };
}

/** Owed lines not yet settled by a paid line (and not reversed). */
export function openOwedLines<T extends LedgerLine>(lines: readonly T[]): T[] {
  const settled = new Set<number>();
  const reversed = new Set<number>();
  for (const l of lines) {
    if (l.kind === "reversed" && l.reversesEntryId) reversed.add(l.reversesEntryId);
  }
  for (const l of lines) {
    if (l.kind === "paid" && l.settlesEntryId && !reversed.has(l.id)) settled.add(l.settlesEntryId);
  }
  return lines.filter((l) => l.kind === "owed" && !settled.has(l.id) && !reversed.has(l.id));
}

/** The usual note on every payouts screen, statement and export. */
export const RECORDS_NOTE =
  "These are the collective’s own records of what it owes and has paid. They are not tax, accounting or legal advice; check local rules for what you must report.";
