/**
 * Costs of a run printed at home or in a studio, per copy and per run for a list of quantities,
 * in integer cents; a print shop's quote table compared with it, and the break-even quantity.
 * Each price is a pack price (899 cents per 500 sheets) applied once per line, so a line is
 * rounded once and the total is the exact sum of its lines.
 */
import { divideCents, priceOf, sumCents, type Cents } from "../money";
import { finishingTime, type FinishingStep } from "./finishing";

export { finishingTime, planBatches, copiesWithin, standardFinishingSteps } from "./finishing";
export type { FinishingStep, FinishingTime, Batch, BatchPlan } from "./finishing";

/** A price for a pack of a quantity: a ream, a box of staples, one side, one master. */
export interface PackPrice {
  priceCents: Cents;
  perQuantity: number;
}

export interface HomeRunInputs {
  insideSheetsPerCopy: number;
  coverSheetsPerCopy: number;
  /** Printed sides per copy (laser, inkjet); usually 2 per sheet. */
  printedSidesPerCopy?: number;
  /** Drum passes per copy for duplicator printing (planInkPasses). */
  passesPerCopy?: number;
  /** Masters per run for duplicator printing, made once whatever the quantity. */
  mastersPerRun?: number;
  insidePaper?: PackPrice;
  coverPaper?: PackPrice;
  /** Toner, ink or a copy shop's charge per printed side. */
  perSide?: PackPrice;
  /** Duplicator ink per pass. */
  perPass?: PackPrice;
  perMaster?: PackPrice;
  staplesPerCopy?: number;
  staples?: PackPrice;
  /**
   * Extra printed over the count to cover misfeeds and bad copies, as a fraction (0.05 = 5 %).
   * Common practice, no source: set it from experience.
   */
  spoilageRate?: number;
  /** One-off costs of the run (a tube of ink, a new blade). */
  fixed?: Array<{ label: string; cents: Cents }>;
  /** Value home finishing time: per-step minutes and an hourly rate. */
  labour?: { steps: readonly FinishingStep[]; centsPerHour: Cents };
}

export type CostItem =
  | "inside-paper"
  | "cover-paper"
  | "printed-sides"
  | "passes"
  | "masters"
  | "staples"
  | "labour"
  | "fixed";

export interface CostLine {
  item: CostItem;
  label: string;
  quantity: number;
  cents: Cents;
}

export interface RunCost {
  copies: number;
  insideSheets: number;
  coverSheets: number;
  printedSides: number;
  passes: number;
  masters: number;
  staples: number;
  finishingMinutes: number;
  lines: CostLine[];
  totalCents: Cents;
  perCopyCents: Cents;
}

function withSpoilage(quantity: number, rate: number): number {
  return Math.ceil(quantity * (1 + rate) - 1e-9);
}

/** Materials, printing and (optionally) labour for one run of a number of copies. */
export function runCost(inputs: HomeRunInputs, copies: number): RunCost {
  if (!Number.isInteger(copies) || copies < 1)
    throw new RangeError(`copies must be a whole number of at least 1, got ${copies}`);
  const rate = inputs.spoilageRate ?? 0;
  if (!(rate >= 0)) throw new RangeError(`spoilageRate cannot be negative, got ${rate}`);
  const insideSheets = withSpoilage(inputs.insideSheetsPerCopy * copies, rate);
  const coverSheets = withSpoilage(inputs.coverSheetsPerCopy * copies, rate);
  const printedSides = withSpoilage((inputs.printedSidesPerCopy ?? 0) * copies, rate);
  const passes = withSpoilage((inputs.passesPerCopy ?? 0) * copies, rate);
  const masters = inputs.mastersPerRun ?? 0;
  const staples = (inputs.staplesPerCopy ?? 2) * copies;
  const lines: CostLine[] = [];
  const add = (item: CostItem, label: string, quantity: number, price?: PackPrice) => {
    if (price && quantity > 0)
      lines.push({
        item,
        label,
        quantity,
        cents: priceOf(quantity, price.priceCents, price.perQuantity),
      });
  };
  add("inside-paper", "Inside paper", insideSheets, inputs.insidePaper);
  add("cover-paper", "Cover paper", coverSheets, inputs.coverPaper);
  add("printed-sides", "Printed sides", printedSides, inputs.perSide);
  add("passes", "Drum passes", passes, inputs.perPass);
  add("masters", "Masters", masters, inputs.perMaster);
  add("staples", "Staples", staples, inputs.staples);
  let finishingMinutes = 0;
  if (inputs.labour) {
    const sheets = inputs.insideSheetsPerCopy + inputs.coverSheetsPerCopy;
    finishingMinutes = finishingTime(inputs.labour.steps, copies, sheets).totalMinutes;
    lines.push({
      item: "labour",
      label: "Finishing time",
      quantity: finishingMinutes,
      cents: priceOf(finishingMinutes, inputs.labour.centsPerHour, 60),
    });
  }
  for (const f of inputs.fixed ?? [])
    lines.push({ item: "fixed", label: f.label, quantity: 1, cents: f.cents });
  const totalCents = sumCents(lines.map((l) => l.cents));
  return {
    copies,
    insideSheets,
    coverSheets,
    printedSides,
    passes,
    masters,
    staples,
    finishingMinutes,
    lines,
    totalCents,
    perCopyCents: divideCents(totalCents, copies),
  };
}

/** Run costs for each quantity in a list. */
export function costTable(inputs: HomeRunInputs, quantities: readonly number[]): RunCost[] {
  return quantities.map((q) => runCost(inputs, q));
}

/** One row of a print shop's quote: this many finished copies for this total. */
export interface QuoteTier {
  copies: number;
  totalCents: Cents;
}

/**
 * A shop's price for any quantity from its quote table: the per-copy rate of the largest tier
 * at or below the quantity; below the smallest tier, that tier's total (a minimum order).
 */
export function shopPrice(quotes: readonly QuoteTier[], copies: number): Cents {
  const tiers = [...quotes].sort((a, b) => a.copies - b.copies);
  const first = tiers[0];
  if (!first) throw new RangeError("the quote table is empty");
  if (copies <= first.copies) return first.totalCents;
  let tier = first;
  for (const t of tiers) if (t.copies <= copies) tier = t;
  return priceOf(copies, tier.totalCents, tier.copies);
}

export interface Comparison {
  copies: number;
  homeCents: Cents;
  shopCents: Cents;
  homePerCopyCents: Cents;
  shopPerCopyCents: Cents;
  cheaper: "home" | "shop" | "same";
  /** How much the cheaper option saves over the other. */
  savingCents: Cents;
}

/** Home-finished cost beside the shop's price for each quantity. */
export function compareWithShop(
  inputs: HomeRunInputs,
  quotes: readonly QuoteTier[],
  quantities: readonly number[],
): Comparison[] {
  return quantities.map((copies) => {
    const homeCents = runCost(inputs, copies).totalCents;
    const shopCents = shopPrice(quotes, copies);
    return {
      copies,
      homeCents,
      shopCents,
      homePerCopyCents: divideCents(homeCents, copies),
      shopPerCopyCents: divideCents(shopCents, copies),
      cheaper: homeCents < shopCents ? "home" : shopCents < homeCents ? "shop" : "same",
      savingCents: Math.abs(homeCents - shopCents),
    };
  });
}

export interface BreakEven {
  /** Cheaper option for a single copy. */
  cheaperAtOne: "home" | "shop" | "same";
  /** First quantity where the other option costs the same or less; null if none up to the search limit. */
  copies: number | null;
}

/** First quantity where the cheaper option changes, searched copy by copy up to a limit. */
export function breakEven(
  inputs: HomeRunInputs,
  quotes: readonly QuoteTier[],
  maxCopies = 5000,
): BreakEven {
  const at = (copies: number) => runCost(inputs, copies).totalCents - shopPrice(quotes, copies);
  const d1 = at(1);
  const cheaperAtOne = d1 < 0 ? "home" : d1 > 0 ? "shop" : "same";
  if (cheaperAtOne === "same") return { cheaperAtOne, copies: 1 };
  for (let copies = 2; copies <= maxCopies; copies++) {
    const d = at(copies);
    if (cheaperAtOne === "home" ? d >= 0 : d <= 0) return { cheaperAtOne, copies };
  }
  return { cheaperAtOne, copies: null };
}
