/**
 * Paper: grammage (g/m², ISO 536) and US basis weight (lb per 500-sheet ream of the grade's
 * basic size), default caliper by weight, sheet weight, and when a stock should be scored.
 */
import { inToMm, mmToIn } from "./units";
import type { SizeMm } from "./sizes";

/** US paper grades, each with its own basic sheet size. */
export type PaperGrade = "bond" | "text" | "cover" | "index" | "bristol" | "tag";

/** Grams in one avoirdupois pound, exact (International Yard and Pound Agreement, 1959). */
export const GRAMS_PER_POUND = 453.59237;
/** Sheets in a ream (Wikipedia "Units of paper quantity"). */
export const SHEETS_PER_REAM = 500;

/**
 * Basic sheet sizes in inches (PrintWiki "Basic Size"; sizes.com; Rowlett "Basis size for
 * paper"): bond 17 x 22, text/book 25 x 38, cover 20 x 26, index 25.5 x 30.5,
 * bristol 22.5 x 28.5, tag 24 x 36.
 */
export const BASIC_SHEET_SIZE_IN: Readonly<Record<PaperGrade, { width: number; height: number }>> =
  {
    bond: { width: 17, height: 22 },
    text: { width: 25, height: 38 },
    cover: { width: 20, height: 26 },
    index: { width: 25.5, height: 30.5 },
    bristol: { width: 22.5, height: 28.5 },
    tag: { width: 24, height: 36 },
  };

/** Area of one basic sheet of a grade in square metres. */
export function basicSheetAreaM2(grade: PaperGrade): number {
  const s = BASIC_SHEET_SIZE_IN[grade];
  return (inToMm(s.width) / 1000) * (inToMm(s.height) / 1000);
}

/** Basis weight (lb per ream of the basic sheet) to grammage: lb × 453.59237 / (500 × area m²). */
export function basisWeightToGsm(pounds: number, grade: PaperGrade): number {
  return (pounds * GRAMS_PER_POUND) / (SHEETS_PER_REAM * basicSheetAreaM2(grade));
}

/** Grammage to basis weight of a grade, the inverse of basisWeightToGsm. */
export function gsmToBasisWeight(gsm: number, grade: PaperGrade): number {
  return (gsm * SHEETS_PER_REAM * basicSheetAreaM2(grade)) / GRAMS_PER_POUND;
}

/**
 * Apparent density used for default calipers of uncoated stock, g/cm³. Derived from two
 * sourced measurements: 75 g/m² at 0.103 mm (Physics Factbook: 0.728 g/cm³) and 80 g/m² at
 * 0.004 in (prepressure.com: 0.787 g/cm³). Coated and bulky stocks differ: let the editor
 * enter the measured caliper (ISO 534) whenever they have it.
 */
export const DEFAULT_APPARENT_DENSITY_G_PER_CM3 = 0.75;

/** Default caliper (single-sheet thickness) in mm for a grammage: gsm ÷ (density × 1000). */
export function defaultCaliperMm(
  gsm: number,
  densityGPerCm3 = DEFAULT_APPARENT_DENSITY_G_PER_CM3,
): number {
  return gsm / (densityGPerCm3 * 1000);
}

/** Caliper in points (thousandths of an inch), the US trade unit (prepressure.com "caliper"). */
export function caliperMmToPoints(caliperMm: number): number {
  return mmToIn(caliperMm) * 1000;
}

/** Caliper points (thousandths of an inch) to millimetres. */
export function caliperPointsToMm(points: number): number {
  return inToMm(points / 1000);
}

/** Weight of one sheet in grams. */
export function sheetWeightG(sheet: SizeMm, gsm: number): number {
  return (sheet.widthMm / 1000) * (sheet.heightMm / 1000) * gsm;
}

/**
 * Scoring threshold: "scoring is recommended for all paper weights upwards of 150 g/m²"
 * (Condat paper mill, user guide "Scoring").
 */
export const SCORE_FROM_GSM = 150;

/** True when a stock this heavy should be scored before folding so it does not crack. */
export function shouldScore(gsm: number): boolean {
  return gsm >= SCORE_FROM_GSM;
}

/** A paper described either way, resolved to grammage. */
export type PaperWeight = { gsm: number } | { pounds: number; grade: PaperGrade };

/** Grammage of a paper given in g/m² or as a US basis weight. */
export function gsmOf(weight: PaperWeight): number {
  return "gsm" in weight ? weight.gsm : basisWeightToGsm(weight.pounds, weight.grade);
}
