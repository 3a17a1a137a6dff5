/**
 * The run planner: for each quantity an editor weighs, what one run takes (sheets, cover sheets,
 * printed sides or drum passes, masters, staples, spoilage, finishing time) and what it costs in
 * three ways: print and finish it ourselves, loose sheets from a copy shop finished ourselves, or
 * printed and finished by a print shop. Then where the cheapest way changes (the break-even
 * quantities) and a sentence that says so. All money is integer cents, every count exact.
 */
import { divideCents, type Cents } from "@/lib/money";
import { runCost, shopPrice, type HomeRunInputs, type RunCost } from "@/lib/print/costs";
import type { FinishingStep } from "@/lib/print/finishing";
import type { PriceList, ShopQuote } from "./prices";

/** What one copy of the booklet takes, counted from the page map and the print method. */
export interface CopyCounts {
  /** Sheets per copy on text paper. */
  insideSheets: number;
  /** Sheets per copy on cover stock (0 for a self cover). */
  coverSheets: number;
  /** Sheet sides that carry a page, per copy: what a copy shop charges for. */
  printedSides: number;
  /** Passes through our own machine per copy: one per ink per side on a duplicator, one per side otherwise. */
  passes: number;
  /** Stencil masters for one print run (duplicator only), whatever the quantity. */
  mastersPerRun: number;
  staples: number;
  /** True when the anthology prints on a stencil duplicator. */
  duplicator: boolean;
}

export const OPTION_IDS = ["home", "copy-shop", "shop"] as const;
export type OptionId = (typeof OPTION_IDS)[number];

export const OPTION_LABELS: Record<OptionId, string> = {
  home: "Print and finish ourselves",
  "copy-shop": "Copy-shop sheets, finished ourselves",
  shop: "Printed and finished by the shop",
};

/** How the summary sentence names each option. */
const OPTION_WORDS: Record<OptionId, string> = {
  home: "printing and finishing it yourselves",
  "copy-shop": "copy-shop sheets finished yourselves",
  shop: "the shop",
};

export interface PlanInputs {
  counts: CopyCounts;
  prices: PriceList;
  /** Finishing steps with minutes (from the checklist and the editor's timings). */
  steps: readonly FinishingStep[];
  /** Absent when there is no shop quote: only the two ways we finish ourselves are compared. */
  quote?: ShopQuote | null;
  /** Printing runs: 1 prints all sheets at once; more means new masters for every run. */
  printRuns?: number;
}

function spoilageRate(prices: PriceList): number {
  return prices.spoilageBasisPoints / 10_000;
}

/** Our own press: paper, cover stock, ink per pass, masters per print run, staples and finishing time. */
export function homeInputs(input: PlanInputs): HomeRunInputs {
  const { counts, prices } = input;
  return {
    insideSheetsPerCopy: counts.insideSheets,
    coverSheetsPerCopy: counts.coverSheets,
    passesPerCopy: counts.passes,
    mastersPerRun: counts.mastersPerRun * Math.max(1, input.printRuns ?? 1),
    insidePaper: prices.insidePaper,
    coverPaper: prices.coverPaper,
    perPass: prices.inkPass,
    perMaster: prices.master,
    staplesPerCopy: counts.staples,
    staples: prices.staples,
    spoilageRate: spoilageRate(prices),
    labour: { steps: input.steps, centsPerHour: prices.finishingCentsPerHour },
  };
}

/**
 * A copy shop prints every side at its price, its own text paper included; the cover is printed
 * there too, on cover stock priced from our list. We staple and finish.
 */
export function copyShopInputs(input: PlanInputs): HomeRunInputs {
  const { counts, prices } = input;
  return {
    insideSheetsPerCopy: counts.insideSheets,
    coverSheetsPerCopy: counts.coverSheets,
    printedSidesPerCopy: counts.printedSides,
    coverPaper: prices.coverPaper,
    perSide: prices.copyShopSide,
    staplesPerCopy: counts.staples,
    staples: prices.staples,
    spoilageRate: spoilageRate(prices),
    labour: { steps: input.steps, centsPerHour: prices.finishingCentsPerHour },
  };
}

export interface OptionRow {
  option: OptionId;
  run: RunCost | null;
  totalCents: Cents;
  perCopyCents: Cents;
}

export interface QuantityRow {
  copies: number;
  /** Extra text sheets printed over the count for spoilage (our own press). */
  spoilageSheets: number;
  options: OptionRow[];
  cheapest: OptionId[];
}

/** The options compared: the shop only when there is a quote with tiers. */
export function optionsOf(input: PlanInputs): OptionId[] {
  return input.quote && input.quote.tiers.length > 0 ? [...OPTION_IDS] : ["home", "copy-shop"];
}

/** Total cents of one option for a number of copies. */
export function optionTotal(input: PlanInputs, option: OptionId, copies: number): Cents {
  if (option === "home") return runCost(homeInputs(input), copies).totalCents;
  if (option === "copy-shop") return runCost(copyShopInputs(input), copies).totalCents;
  if (!input.quote) throw new RangeError("no shop quote to price");
  return shopPrice(input.quote.tiers, copies);
}

/** Every option for one quantity, with the run's counts where we do the work. */
export function quantityRow(input: PlanInputs, copies: number): QuantityRow {
  const options = optionsOf(input).map((option): OptionRow => {
    const run =
      option === "home"
        ? runCost(homeInputs(input), copies)
        : option === "copy-shop"
          ? runCost(copyShopInputs(input), copies)
          : null;
    const totalCents = run ? run.totalCents : optionTotal(input, option, copies);
    return { option, run, totalCents, perCopyCents: divideCents(totalCents, copies) };
  });
  const least = Math.min(...options.map((o) => o.totalCents));
  const home = options[0]?.run;
  return {
    copies,
    spoilageSheets: home ? home.insideSheets - input.counts.insideSheets * copies : 0,
    options,
    cheapest: options.filter((o) => o.totalCents === least).map((o) => o.option),
  };
}

/** A run of quantities over which one option stays cheapest. */
export interface Segment {
  option: OptionId;
  from: number;
  /** Last quantity of the run; equals the search limit when it runs to the end. */
  to: number;
}

export interface Comparison {
  options: OptionId[];
  maxCopies: number;
  segments: Segment[];
  /** Quantities from which another option is cheapest (the first copy of each later segment). */
  breakEvens: Array<{ copies: number; from: OptionId; to: OptionId }>;
  summary: string;
}

/**
 * The cheapest option at every quantity from 1 to maxCopies, searched copy by copy (exact: a shop's
 * tiers and a pack's rounding make the curves step, so no formula is trusted). A tie keeps the
 * option that was already cheapest; a tie at the first copy goes to the earlier option.
 */
export function compareOptions(input: PlanInputs, maxCopies: number): Comparison {
  if (!Number.isInteger(maxCopies) || maxCopies < 1)
    throw new RangeError(`maxCopies must be a whole number of at least 1, got ${maxCopies}`);
  const options = optionsOf(input);
  const segments: Segment[] = [];
  let current: Segment | null = null;
  for (let copies = 1; copies <= maxCopies; copies++) {
    const totals = options.map((o) => optionTotal(input, o, copies));
    const least = Math.min(...totals);
    const tied = options.filter((_, i) => totals[i] === least);
    const winner: OptionId = current && tied.includes(current.option) ? current.option : tied[0]!;
    if (current && current.option === winner) current.to = copies;
    else {
      current = { option: winner, from: copies, to: copies };
      segments.push(current);
    }
  }
  const breakEvens = segments.slice(1).map((s, i) => ({
    copies: s.from,
    from: segments[i]!.option,
    to: s.option,
  }));
  return {
    options,
    maxCopies,
    segments,
    breakEvens,
    summary: summarise(segments, options, maxCopies),
  };
}

function copiesWord(n: number): string {
  return `${n.toLocaleString("en-US")} ${n === 1 ? "copy" : "copies"}`;
}

/**
 * In words: "Up to 140 copies, printing and finishing it yourselves is cheaper; above that, the
 * shop." With three options "cheapest"; with no change up to the limit, "never" in plain words.
 */
export function summarise(
  segments: readonly Segment[],
  options: readonly OptionId[],
  maxCopies: number,
): string {
  const degree = options.length > 2 ? "cheapest" : "cheaper";
  const first = segments[0];
  if (!first) return "";
  if (segments.length === 1)
    return `At every quantity from 1 to ${copiesWord(maxCopies)}, ${OPTION_WORDS[first.option]} is ${degree}: the others never catch up in that range.`;
  const parts = [`Up to ${copiesWord(first.to)}, ${OPTION_WORDS[first.option]} is ${degree}`];
  for (let i = 1; i < segments.length; i++) {
    const s = segments[i]!;
    const last = i === segments.length - 1;
    parts.push(
      last
        ? `above that, ${OPTION_WORDS[s.option]}`
        : `from ${s.from.toLocaleString("en-US")} to ${copiesWord(s.to)}, ${OPTION_WORDS[s.option]}`,
    );
  }
  const text = `${parts.join("; ")}.`;
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** The quantities the chart is drawn at: the editor's, each break-even and the copy before it, tier steps, and a spread between. */
export function chartQuantities(
  maxCopies: number,
  extra: readonly number[],
  targetPoints = 60,
): number[] {
  const set = new Set<number>([1, maxCopies]);
  const step = Math.max(1, Math.round(maxCopies / targetPoints));
  for (let q = step; q < maxCopies; q += step) set.add(q);
  for (const q of extra) {
    for (const n of [q - 1, q]) if (Number.isInteger(n) && n >= 1 && n <= maxCopies) set.add(n);
  }
  return [...set].sort((a, b) => a - b);
}

export interface ChartPoint {
  copies: number;
  /** Per-copy cents by option; absent for options not compared. */
  home: Cents;
  "copy-shop": Cents;
  shop?: Cents;
}

/** Cost per copy against quantity for each option, at the given quantities. */
export function chartPoints(input: PlanInputs, quantities: readonly number[]): ChartPoint[] {
  const options = optionsOf(input);
  return quantities.map((copies) => {
    const point: ChartPoint = { copies, home: 0, "copy-shop": 0 };
    for (const o of options) point[o] = divideCents(optionTotal(input, o, copies), copies);
    return point;
  });
}

/** How far the chart and the search run: past the largest quantity asked and the largest tier, at most 5,000. */
export function searchLimit(quantities: readonly number[], quote?: ShopQuote | null): number {
  const largest = Math.max(1, ...quantities, ...(quote?.tiers.map((t) => t.copies) ?? []));
  return Math.min(5000, Math.max(10, Math.ceil((largest * 1.25) / 10) * 10));
}

/** Everything the planner screen shows, computed at once so the table and the chart agree. */
export function planRun(input: PlanInputs, quantities: readonly number[]) {
  const maxCopies = searchLimit(quantities, input.quote);
  const comparison = compareOptions(input, maxCopies);
  const marks = [
    ...quantities,
    ...comparison.breakEvens.map((b) => b.copies),
    ...(input.quote?.tiers.map((t) => t.copies) ?? []),
  ];
  return {
    rows: quantities.map((q) => quantityRow(input, q)),
    comparison,
    chart: chartPoints(input, chartQuantities(maxCopies, marks)),
  };
}
export type RunPlan = ReturnType<typeof planRun>;
