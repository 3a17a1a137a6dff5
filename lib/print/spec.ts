/** The print spec an anthology sets, and the sizes and pixel counts derived from it. */
import { mmToPx } from "./units";
import type { SizeMm } from "./sizes";
import { withBleed } from "./sizes";

/** How the booklet will be printed. Duplicator printing runs each sheet once per ink. */
export type PrintMethod = "duplicator" | "laser-colour" | "laser-black" | "inkjet";

export const PRINT_METHODS: readonly PrintMethod[] = [
  "duplicator",
  "laser-colour",
  "laser-black",
  "inkjet",
];

/** What the database stores per anthology; lengths in millimetres. */
export interface PrintSpec {
  trimWidthMm: number;
  trimHeightMm: number;
  bleedMm: number;
  safeMarginMm: number;
  minPpi: number;
  pagesExpected?: number;
  printMethod: PrintMethod;
  /** Ink names in printing order, e.g. ["black", "fluorescent pink"]; empty for process colour. */
  inks: string[];
}

/** The finished page size. */
export function trimOf(spec: PrintSpec): SizeMm {
  return { widthMm: spec.trimWidthMm, heightMm: spec.trimHeightMm };
}

/** The page size including bleed on every side. */
export function bleedBoxOf(spec: PrintSpec): SizeMm {
  return withBleed(trimOf(spec), spec.bleedMm);
}

/** The area inside the safe margin, where text and faces belong. */
export function safeAreaOf(spec: PrintSpec): SizeMm {
  return {
    widthMm: spec.trimWidthMm - 2 * spec.safeMarginMm,
    heightMm: spec.trimHeightMm - 2 * spec.safeMarginMm,
  };
}

/** Whole pixels that cover a size at a resolution (rounded up, ignoring float dust). */
export function pixelsFor(size: SizeMm, ppi: number): { widthPx: number; heightPx: number } {
  const up = (v: number) => Math.ceil(v - 1e-6);
  return { widthPx: up(mmToPx(size.widthMm, ppi)), heightPx: up(mmToPx(size.heightMm, ppi)) };
}

/** Problems that make a spec unusable, in plain words; empty when it is sound. */
export function specProblems(spec: PrintSpec): string[] {
  const problems: string[] = [];
  if (!(spec.trimWidthMm > 0) || !(spec.trimHeightMm > 0))
    problems.push("The trim size must be greater than zero.");
  if (!(spec.bleedMm >= 0)) problems.push("The bleed cannot be negative.");
  if (!(spec.safeMarginMm >= 0)) problems.push("The safe margin cannot be negative.");
  if (2 * spec.safeMarginMm >= Math.min(spec.trimWidthMm, spec.trimHeightMm))
    problems.push("The safe margins leave no room on the page.");
  if (!(spec.minPpi > 0)) problems.push("The minimum resolution must be greater than zero.");
  if (
    spec.pagesExpected !== undefined &&
    !(Number.isInteger(spec.pagesExpected) && spec.pagesExpected > 0)
  )
    problems.push("Pages expected must be a whole number above zero.");
  if (spec.printMethod === "duplicator" && spec.inks.length === 0)
    problems.push("Duplicator printing needs at least one ink.");
  return problems;
}
