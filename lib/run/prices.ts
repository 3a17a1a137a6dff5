/**
 * A collective's price list and a print shop's quote, as the run planner reads them. Prices are
 * integer cents for a pack of a quantity (899 cents per 500 sheets), so a fraction of a cent per
 * sheet or per pass stays exact until a line is rounded once (lib/print/costs.ts).
 */
import type { Cents } from "@/lib/money";
import type { PackPrice, QuoteTier } from "@/lib/print/costs";

export type { PackPrice, QuoteTier };

export interface PriceList {
  /** Text paper, by the pack (a ream of 500 sheets). */
  insidePaper: PackPrice;
  /** Cover stock, by the pack. */
  coverPaper: PackPrice;
  /** A copy shop's price per printed side, its own text paper included. */
  copyShopSide: PackPrice;
  /** Ink or toner per pass: one sheet side through the machine once, per ink on a duplicator. */
  inkPass: PackPrice;
  /** Stencil masters for a duplicator, one per ink per sheet side. */
  master: PackPrice;
  /** Staples, by the box. */
  staples: PackPrice;
  /** What an hour of finishing time is worth to the collective; zero counts time as free. */
  finishingCentsPerHour: Cents;
  /**
   * Extra sheets printed over the count for misfeeds and bad copies, in basis points
   * (500 = 5 %). Common practice, no source: set it from your own runs.
   */
  spoilageBasisPoints: number;
}

export interface ShopQuote {
  shopName: string;
  /** Finished copies for a total, ascending by copies; the smallest is the minimum order. */
  tiers: QuoteTier[];
  /** Days from sending the files to collecting the finished copies. */
  turnaroundDays: number;
}

/** Minutes a finishing step takes: once per batch, and for every copy. */
export interface StepTiming {
  setupMinutes: number;
  minutesPerCopy: number;
}

export type StepTimings = Record<string, StepTiming>;
