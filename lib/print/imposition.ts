/**
 * Saddle-stitch imposition: padding to a multiple of 4, sheets per copy, which pages share
 * each side of each sheet (closed form), where a page prints, reader spreads, fold-only
 * single-sheet formats and the most pages a binding allows.
 *
 * Conventions: left-to-right reading; sheet 1 is the outermost; the front of a sheet is its
 * outside when folded; each side is (left half | right half) with the fold vertical, seen
 * from that side.
 */

/** A sheet folded once carries 4 pages (folio): Lynch, "sheet"; Adelaide Library. */
export const PAGES_PER_FOLDED_SHEET = 4;

export type SheetSide = "front" | "back";
export type SheetHalf = "left" | "right";

/** Pages on one side of a sheet, as seen from that side. */
export interface SidePair {
  left: number;
  right: number;
}

export interface ImposedSheet {
  /** 1 = outermost. */
  sheet: number;
  front: SidePair;
  back: SidePair;
}

export interface PagePosition {
  sheet: number;
  side: SheetSide;
  half: SheetHalf;
}

/** Pages to print (multiple of 4) and the blanks that padding adds: 13 → 16 with 3 blanks. */
export function padToMultipleOf4(contentPages: number): { pages: number; blanks: number } {
  assertCount(contentPages, "contentPages");
  const pages = Math.max(PAGES_PER_FOLDED_SHEET, Math.ceil(contentPages / 4) * 4);
  return { pages, blanks: pages - contentPages };
}

function assertCount(n: number, name: string): void {
  if (!Number.isInteger(n) || n < 1)
    throw new RangeError(`${name} must be a whole number of at least 1, got ${n}`);
}

function assertBookletPages(pages: number): void {
  if (!Number.isInteger(pages) || pages < 4 || pages % 4 !== 0)
    throw new RangeError(`a saddle-stitched booklet has a multiple of 4 pages, got ${pages}`);
}

/**
 * Pages on the front and back of sheet k of an N-page booklet, in closed form: pages sharing a side
 * sum to N + 1 (GeeksforGeeks "Puzzle 28 (Newspaper Puzzle)", geeksforgeeks.org/puzzle-28-newspaper-puzzle/).
 */
export function sheetLayout(pages: number, sheet: number): ImposedSheet {
  assertBookletPages(pages);
  const k = sheet;
  if (!Number.isInteger(k) || k < 1 || k > pages / 4)
    throw new RangeError(`sheet ${k} is outside 1..${pages / 4}`);
  return {
    sheet: k,
    front: { left: pages - 2 * (k - 1), right: 2 * k - 1 },
    back: { left: 2 * k, right: pages - 2 * k + 1 },
  };
}

/** Every sheet of an N-page booklet, outermost first. */
export function saddleStitchSheets(pages: number): ImposedSheet[] {
  assertBookletPages(pages);
  return Array.from({ length: pages / 4 }, (_, i) => sheetLayout(pages, i + 1));
}

/** Where page p of an N-page booklet prints: q = min(p, N+1−p), sheet ⌈q/2⌉, front if q is odd. */
export function locatePage(page: number, pages: number): PagePosition {
  assertBookletPages(pages);
  if (!Number.isInteger(page) || page < 1 || page > pages)
    throw new RangeError(`page ${page} is outside 1..${pages}`);
  const q = Math.min(page, pages + 1 - page);
  const sheet = Math.ceil(q / 2);
  const side: SheetSide = q % 2 === 1 ? "front" : "back";
  const layout = sheetLayout(pages, sheet);
  const half: SheetHalf = layout[side].left === page ? "left" : "right";
  return { sheet, side, half };
}

/** Sides in the order a 2-up duplex print file carries them: [8,1], [2,7], [6,3], [4,5]. */
export function printerSpreadOrder(pages: number): Array<[number, number]> {
  return saddleStitchSheets(pages).flatMap((s) => [
    [s.front.left, s.front.right] as [number, number],
    [s.back.left, s.back.right] as [number, number],
  ]);
}

export type ReaderSpreadKind = "front-cover" | "spread" | "back-cover";

/** What a reader sees on opening the booklet: cover, 2–3, 4–5, …, back cover. */
export interface ReaderSpread {
  kind: ReaderSpreadKind;
  /** One page for a cover, [left, right] for an open spread. */
  pages: number[];
}

/** Reader spreads of an N-page booklet; the even page is on the left (CSS Paged Media, "Facing Pages"). */
export function readerSpreads(pages: number): ReaderSpread[] {
  assertBookletPages(pages);
  const spreads: ReaderSpread[] = [{ kind: "front-cover", pages: [1] }];
  for (let left = 2; left < pages; left += 2)
    spreads.push({ kind: "spread", pages: [left, left + 1] });
  spreads.push({ kind: "back-cover", pages: [pages] });
  return spreads;
}

export type CoverStock = "self" | "separate";
export type BlankPlacement = "end" | "before-back-cover";

export interface SaddleStitchInput {
  /** Pages with content, covers included. */
  contentPages: number;
  /** Self cover prints the cover on the text stock; a separate cover is the outer sheet on its own stock. */
  cover: CoverStock;
  /** Where padding blanks go; before the back cover keeps the back cover last (default). */
  blanks?: BlankPlacement;
}

export interface SaddleStitchPlan {
  contentPages: number;
  pages: number;
  blankPages: number[];
  sheetsPerCopy: number;
  coverSheetsPerCopy: number;
  textSheetsPerCopy: number;
  /** Printed sides per copy, both sides of every sheet. */
  sidesPerCopy: number;
  sheets: Array<ImposedSheet & { stock: "cover" | "text" }>;
}

/**
 * Page count, blanks, sheets and stock of a saddle-stitched booklet. With a separate cover the
 * cover pages (1, 2, N−1, N) are counted in N and the outermost sheet is the cover sheet.
 */
export function planSaddleStitch(input: SaddleStitchInput): SaddleStitchPlan {
  const { pages, blanks } = padToMultipleOf4(input.contentPages);
  const placement = input.blanks ?? "before-back-cover";
  const blankPages: number[] = [];
  if (blanks > 0) {
    // Before the back cover: content 1..n−1, blanks, then the last content page on page N.
    const firstBlank =
      placement === "end" || input.contentPages === 1 ? input.contentPages + 1 : input.contentPages;
    for (let i = 0; i < blanks; i++) blankPages.push(firstBlank + i);
  }
  const sheets = saddleStitchSheets(pages).map((s) => ({
    ...s,
    stock: (input.cover === "separate" && s.sheet === 1 ? "cover" : "text") as "cover" | "text",
  }));
  const coverSheetsPerCopy = input.cover === "separate" ? 1 : 0;
  return {
    contentPages: input.contentPages,
    pages,
    blankPages,
    sheetsPerCopy: sheets.length,
    coverSheetsPerCopy,
    textSheetsPerCopy: sheets.length - coverSheetsPerCopy,
    sidesPerCopy: sheets.length * 2,
    sheets,
  };
}

/**
 * Maps content page numbers to booklet page numbers when blanks were inserted before the back
 * cover (content page n lands on page N); identity otherwise.
 */
export function bookletPageOf(contentPage: number, plan: SaddleStitchPlan): number {
  if (
    contentPage === plan.contentPages &&
    plan.blankPages.length > 0 &&
    plan.blankPages[0] === plan.contentPages
  )
    return plan.pages;
  return contentPage;
}

export interface PageLimitInput {
  /** A configured ceiling on folded sheets per copy (e.g. from the stapler's rating). */
  maxSheets?: number;
  /** A configured ceiling on pages. */
  maxPages?: number;
  /** Thickness a stapler drives through at the fold, mm (a stack of nested sheets). */
  staplerCapacityMm?: number;
  caliperMm?: number;
  coverCaliperMm?: number;
  cover?: CoverStock;
}

/**
 * Most pages a saddle stitch allows, as a multiple of 4: the smallest of a configured page
 * limit, a sheet limit, and what fits in the stapler's capacity (at the fold the staple crosses
 * each nested sheet once, so sheets × caliper must not exceed it).
 */
export function maxSaddleStitchPages(input: PageLimitInput): number {
  const limits: number[] = [];
  if (input.maxPages !== undefined) limits.push(Math.floor(input.maxPages / 4) * 4);
  if (input.maxSheets !== undefined) limits.push(Math.floor(input.maxSheets) * 4);
  if (input.staplerCapacityMm !== undefined) {
    if (input.caliperMm === undefined || !(input.caliperMm > 0))
      throw new RangeError("a stapler capacity needs the paper caliper");
    const separate = input.cover === "separate";
    const coverMm = separate ? (input.coverCaliperMm ?? input.caliperMm) : 0;
    const room = input.staplerCapacityMm - coverMm;
    const textSheets = room > 0 ? Math.floor(room / input.caliperMm + 1e-9) : 0;
    const sheets = separate ? (room >= 0 ? textSheets + 1 : 0) : textSheets;
    limits.push(sheets * 4);
  }
  if (limits.length === 0)
    throw new RangeError("give at least one limit: maxPages, maxSheets or staplerCapacityMm");
  return Math.max(0, Math.min(...limits));
}

/** Fold-only formats printed on one sheet with no staples. Common practice, no source. */
export type FoldFormatId = "half-fold" | "tri-fold" | "one-sheet-eight";

/** One panel of a fold-only sheet, as seen with the sheet flat in front of you. */
export interface FoldPanel {
  page: number;
  side: SheetSide;
  row: number;
  column: number;
  /** Turned upside down on the flat sheet so it reads upright once folded. */
  upsideDown: boolean;
}

export interface FoldFormat {
  id: FoldFormatId;
  label: string;
  pages: number;
  /** Panels across and down the flat sheet, per printed side. */
  columns: number;
  rows: number;
  printedSides: 1 | 2;
  /** Cuts besides trimming; the eight-page sheet is slit along half its centre fold. */
  slit: boolean;
  panels: FoldPanel[];
}

/** Common practice, no source: the usual panel layouts of single-sheet folds. */
export const FOLD_FORMATS: Readonly<Record<FoldFormatId, FoldFormat>> = {
  // One fold: outside [4 | 1], inside [2 | 3], as sheet 1 of a 4-page booklet.
  "half-fold": {
    id: "half-fold",
    label: "Folded once, 4 pages",
    pages: 4,
    columns: 2,
    rows: 1,
    printedSides: 2,
    slit: false,
    panels: [
      { page: 4, side: "front", row: 0, column: 0, upsideDown: false },
      { page: 1, side: "front", row: 0, column: 1, upsideDown: false },
      { page: 2, side: "back", row: 0, column: 0, upsideDown: false },
      { page: 3, side: "back", row: 0, column: 1, upsideDown: false },
    ],
  },
  // Two parallel folds wrapping inward: outside [5 | 6 | 1], inside [2 | 3 | 4].
  "tri-fold": {
    id: "tri-fold",
    label: "Folded in thirds, 6 panels",
    pages: 6,
    columns: 3,
    rows: 1,
    printedSides: 2,
    slit: false,
    panels: [
      { page: 5, side: "front", row: 0, column: 0, upsideDown: false },
      { page: 6, side: "front", row: 0, column: 1, upsideDown: false },
      { page: 1, side: "front", row: 0, column: 2, upsideDown: false },
      { page: 2, side: "back", row: 0, column: 0, upsideDown: false },
      { page: 3, side: "back", row: 0, column: 1, upsideDown: false },
      { page: 4, side: "back", row: 0, column: 2, upsideDown: false },
    ],
  },
  // One side printed, 4 x 2 panels: top row upside down [5 4 3 2], bottom row [6 7 8 1].
  "one-sheet-eight": {
    id: "one-sheet-eight",
    label: "One sheet, 8 pages, slit and folded",
    pages: 8,
    columns: 4,
    rows: 2,
    printedSides: 1,
    slit: true,
    panels: [
      ...[5, 4, 3, 2].map((page, column) => ({
        page,
        side: "front" as const,
        row: 0,
        column,
        upsideDown: true,
      })),
      ...[6, 7, 8, 1].map((page, column) => ({
        page,
        side: "front" as const,
        row: 1,
        column,
        upsideDown: false,
      })),
    ],
  },
};

/** Page size of a fold-only format on a flat sheet: the sheet divided into its panels. */
export function foldPanelSize(
  format: FoldFormat,
  sheet: { widthMm: number; heightMm: number },
): {
  widthMm: number;
  heightMm: number;
} {
  return { widthMm: sheet.widthMm / format.columns, heightMm: sheet.heightMm / format.rows };
}
