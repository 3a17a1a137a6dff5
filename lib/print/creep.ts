/**
 * Creep (push-out): in a saddle-stitched booklet the inner sheets stick out further at the
 * fore-edge than the outer ones, so after trimming their outside margins shrink (About.com
 * Desktop Publishing glossary, "creep"). Shingling compensates by moving each sheet's content
 * toward the spine (PrintWiki, "Shingling").
 *
 * Two models, neither from a handbook:
 * - "linear" (common practice, no source): sheet k sticks out by the calipers of the sheets
 *   outside it, (k−1)·t for one stock; the innermost by (S−1)·t.
 * - "round-fold" (derived geometry): concentric semicircular folds lose π/2 per unit of
 *   radius, giving (π/2)·Σ outer calipers, ≈ 1.571·(S−1)·t for one stock.
 */
import { locatePage, type SheetHalf, type SheetSide } from "./imposition";
import { defaultCaliperMm } from "./paper";

export type CreepModel = "linear" | "round-fold";

/** Push-out of every sheet, outermost first, relative to the outermost; one caliper or one per sheet. */
export function creepPerSheetMm(
  sheets: number,
  caliperMm: number | readonly number[],
  model: CreepModel = "linear",
): number[] {
  if (!Number.isInteger(sheets) || sheets < 1)
    throw new RangeError(`sheets must be at least 1, got ${sheets}`);
  const calipers =
    typeof caliperMm === "number"
      ? Array.from({ length: sheets }, () => caliperMm)
      : [...caliperMm];
  if (calipers.length !== sheets)
    throw new RangeError(`expected ${sheets} calipers, got ${calipers.length}`);
  const factor = model === "linear" ? 1 : Math.PI / 2;
  const out: number[] = [];
  let outside = 0;
  for (let k = 0; k < sheets; k++) {
    out.push(factor * outside);
    outside += calipers[k] ?? 0;
  }
  return out;
}

/** Calipers per sheet for a booklet whose outer sheet may be a separate cover stock. */
export function sheetCalipersMm(
  sheets: number,
  textCaliperMm: number,
  coverCaliperMm?: number,
): number[] {
  return Array.from({ length: sheets }, (_, i) =>
    i === 0 && coverCaliperMm !== undefined ? coverCaliperMm : textCaliperMm,
  );
}

/** The stock an anthology's booklet is made of, as far as creep is concerned. */
export interface BookletStock {
  /** The text paper's caliper, measured or defaulted from its weight. */
  paperCaliperMm: number;
  coverStock: "self" | "separate";
  /** A separate cover's weight; its caliper is defaulted from it (lib/print/paper.ts). */
  coverPaperGsm: number | null;
}

/** The model Quireline uses for creep: linear push-out (see the module comment). */
export const BOOKLET_CREEP_MODEL: CreepModel = "linear";

/**
 * Which caliper each sheet uses, outermost first: the text paper's, except the outer sheet when
 * the cover is a separate stock (its caliper from its weight at the default density).
 */
export function bookletCalipersMm(sheets: number, stock: BookletStock): number[] {
  const coverCaliper =
    stock.coverStock === "separate" && stock.coverPaperGsm
      ? defaultCaliperMm(stock.coverPaperGsm)
      : undefined;
  return sheetCalipersMm(sheets, stock.paperCaliperMm, coverCaliper);
}

/** Push-out of every sheet of the booklet, outermost first, with its calipers and Quireline's model. */
export function bookletCreepMm(sheets: number, stock: BookletStock): number[] {
  return creepPerSheetMm(sheets, bookletCalipersMm(sheets, stock), BOOKLET_CREEP_MODEL);
}

/** Thickness of the closed booklet at the fore-edge: two leaves per sheet. */
export function closedThicknessMm(calipersMm: readonly number[]): number {
  return 2 * calipersMm.reduce((a, b) => a + b, 0);
}

export interface PageShift {
  page: number;
  sheet: number;
  side: SheetSide;
  half: SheetHalf;
  /** How far the content moves toward the spine, mm. */
  towardSpineMm: number;
  /**
   * Horizontal move in the page's own reading frame: right-hand (odd) pages move left
   * (negative), left-hand (even) pages move right (positive).
   */
  shiftXMm: number;
}

/** The shift to apply to every page of an N-page booklet when imposing, from the per-sheet push-out. */
export function pageShifts(
  pages: number,
  caliperMm: number | readonly number[],
  model: CreepModel = "linear",
): PageShift[] {
  const sheets = pages / 4;
  const perSheet = creepPerSheetMm(sheets, caliperMm, model);
  const out: PageShift[] = [];
  for (let page = 1; page <= pages; page++) {
    const pos = locatePage(page, pages);
    const towardSpineMm = perSheet[pos.sheet - 1] ?? 0;
    const shift = page % 2 === 1 ? -towardSpineMm : towardSpineMm;
    out.push({ page, ...pos, towardSpineMm, shiftXMm: shift === 0 ? 0 : shift });
  }
  return out;
}
