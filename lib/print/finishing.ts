/**
 * Finishing time from per-step minutes, and a plan in batches: finish enough copies for a
 * first date, the rest later. The minutes are the editor's own timings; no defaults are
 * invented here. Step order follows the job: trim the printed sheets, score heavy cover stock,
 * fold, collate, staple, trim the fore-edge.
 */
import { shouldScore } from "./paper";

export interface FinishingStep {
  id: string;
  label: string;
  /** Once per batch: clearing the table, setting the guillotine stop. */
  setupMinutes?: number;
  minutesPerCopy?: number;
  /** For steps done sheet by sheet (folding each sheet before nesting). */
  minutesPerSheet?: number;
}

/** The usual steps for a saddle-stitched booklet printed as loose sheets; score only heavy covers. */
export function standardFinishingSteps(options: {
  coverGsm?: number;
  trimSheets?: boolean;
  trimForeEdge?: boolean;
}): Array<Pick<FinishingStep, "id" | "label">> {
  const steps: Array<Pick<FinishingStep, "id" | "label">> = [];
  if (options.trimSheets ?? true)
    steps.push({ id: "trim-sheets", label: "Trim the printed sheets" });
  if (options.coverGsm !== undefined && shouldScore(options.coverGsm))
    steps.push({ id: "score-cover", label: "Score the cover" });
  steps.push(
    { id: "fold", label: "Fold" },
    { id: "collate", label: "Collate" },
    { id: "staple", label: "Staple" },
  );
  if (options.trimForeEdge ?? true)
    steps.push({ id: "trim-fore-edge", label: "Trim the fore-edge" });
  return steps;
}

export interface FinishingTime {
  copies: number;
  perStep: Array<{ id: string; label: string; minutes: number }>;
  totalMinutes: number;
}

/** Minutes to finish a number of copies in one session. */
export function finishingTime(
  steps: readonly FinishingStep[],
  copies: number,
  sheetsPerCopy: number,
): FinishingTime {
  if (!Number.isInteger(copies) || copies < 0)
    throw new RangeError(`copies must be a whole number, got ${copies}`);
  const perStep = steps.map((s) => ({
    id: s.id,
    label: s.label,
    minutes:
      copies === 0
        ? 0
        : (s.setupMinutes ?? 0) +
          copies * ((s.minutesPerCopy ?? 0) + sheetsPerCopy * (s.minutesPerSheet ?? 0)),
  }));
  return { copies, perStep, totalMinutes: perStep.reduce((n, s) => n + s.minutes, 0) };
}

/** Most copies one session can finish within the minutes available. */
export function copiesWithin(
  steps: readonly FinishingStep[],
  minutes: number,
  sheetsPerCopy: number,
): number {
  const setup = steps.reduce((n, s) => n + (s.setupMinutes ?? 0), 0);
  const perCopy = steps.reduce(
    (n, s) => n + (s.minutesPerCopy ?? 0) + sheetsPerCopy * (s.minutesPerSheet ?? 0),
    0,
  );
  if (minutes < setup) return 0;
  if (perCopy <= 0) return Number.POSITIVE_INFINITY;
  return Math.floor((minutes - setup) / perCopy + 1e-9);
}

export interface Batch {
  index: number;
  copies: number;
  minutes: number;
  /** A label such as "for the launch on 2025-06-14" or "later". */
  due?: string;
}

export interface BatchPlan {
  batches: Batch[];
  totalMinutes: number;
  /** Copies wanted for the first date that the time available cannot cover. */
  firstDateShortfall: number;
}

/**
 * Copies to finish for a first date (as many as wanted, capped by the minutes available before
 * it), then the rest in later batches of a chosen size. Sheets are printed in one run; only
 * finishing is split, which is why each batch pays the setup minutes again.
 */
export function planBatches(input: {
  totalCopies: number;
  sheetsPerCopy: number;
  steps: readonly FinishingStep[];
  first: { copies: number; minutesAvailable?: number; due?: string };
  laterBatchSize?: number;
}): BatchPlan {
  const { totalCopies, sheetsPerCopy, steps } = input;
  let firstCopies = Math.min(input.first.copies, totalCopies);
  if (input.first.minutesAvailable !== undefined)
    firstCopies = Math.min(
      firstCopies,
      copiesWithin(steps, input.first.minutesAvailable, sheetsPerCopy),
    );
  const batches: Batch[] = [];
  if (firstCopies > 0)
    batches.push({
      index: 1,
      copies: firstCopies,
      minutes: finishingTime(steps, firstCopies, sheetsPerCopy).totalMinutes,
      due: input.first.due,
    });
  let rest = totalCopies - firstCopies;
  const size = input.laterBatchSize && input.laterBatchSize > 0 ? input.laterBatchSize : rest;
  while (rest > 0) {
    const copies = Math.min(size, rest);
    batches.push({
      index: batches.length + 1,
      copies,
      minutes: finishingTime(steps, copies, sheetsPerCopy).totalMinutes,
      due: "later",
    });
    rest -= copies;
  }
  return {
    batches,
    totalMinutes: batches.reduce((n, b) => n + b.minutes, 0),
    firstDateShortfall: Math.max(0, Math.min(input.first.copies, totalCopies) - firstCopies),
  };
}
