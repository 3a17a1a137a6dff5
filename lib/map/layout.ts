/**
 * Where reader pages fall: reader spreads (as the booklet is read) and sheet sides (as it is
 * printed). Saddle stitch uses the closed-form imposition of lib/print/imposition; fold-only
 * uses the single-sheet fold formats there.
 */
import {
  FOLD_FORMATS,
  padToMultipleOf4,
  saddleStitchSheets,
  type FoldFormat,
} from "@/lib/print/imposition";
import type { Binding, MapReaderSpread, MapSheet, MapSheetSide, SheetPlan } from "./types";

function assertPageCount(pageCount: number): void {
  if (!Number.isInteger(pageCount) || pageCount < 1)
    throw new RangeError(`pageCount must be a whole number of at least 1, got ${pageCount}`);
}

/**
 * Reader spreads: the front cover alone, then (2,3), (4,5), …, the back cover alone. The even
 * page is on the left (CSS Paged Media, "Facing Pages"). When the count is odd the last page has
 * no partner and is reported as "unpaired" (the check asks for padding).
 */
export function readerSpreads(pageCount: number): MapReaderSpread[] {
  assertPageCount(pageCount);
  const out: MapReaderSpread[] = [{ kind: "front-cover", pages: [1] }];
  if (pageCount === 1) return out;
  const even = pageCount % 2 === 0;
  // With an even count the last page is the back cover; pairs run 2..N−1.
  const lastPaired = even ? pageCount - 1 : pageCount;
  let left = 2;
  for (; left + 1 <= lastPaired; left += 2) out.push({ kind: "spread", pages: [left, left + 1] });
  if (left <= lastPaired) out.push({ kind: "unpaired", pages: [left] });
  if (even) out.push({ kind: "back-cover", pages: [pageCount] });
  return out;
}

/** The single-sheet fold for a fold-only map: 4 → folded once, 6 → thirds, 8 → one sheet slit and folded. */
export function foldFormatFor(pageCount: number): FoldFormat | null {
  if (pageCount === 4) return FOLD_FORMATS["half-fold"];
  if (pageCount === 6) return FOLD_FORMATS["tri-fold"];
  if (pageCount === 8) return FOLD_FORMATS["one-sheet-eight"];
  return null;
}

function side(sheet: number, name: "front" | "back", pages: number[]): MapSheetSide {
  return { sheet, side: name, key: `${sheet}-${name}`, pages };
}

/**
 * Sheets and the pages on each side. Saddle stitch: sheet k front (N−2(k−1) | 2k−1), back
 * (2k | N−2k+1), the innermost sheet is the centre and its back carries N/2 | N/2+1; a count
 * that is not a multiple of 4 is laid out as if padded (the padding pages are listed).
 * Fold-only: one sheet in the fold format for 4, 6 or 8 pages; another count has no fold-only
 * format and is laid out as a saddle stitch would be, so the map can still be drawn.
 */
export function sheetSides(pageCount: number, binding: Binding): SheetPlan {
  assertPageCount(pageCount);
  const fold = binding === "fold-only" ? foldFormatFor(pageCount) : null;
  if (fold) {
    const panels = (s: "front" | "back") =>
      fold.panels
        .filter((p) => p.side === s)
        .sort((a, b) => a.row - b.row || a.column - b.column)
        .map((p) => p.page);
    // Reading the flat sheet row by row; the eight-page sheet has every page on the front.
    const sheet: MapSheet = {
      sheet: 1,
      front: side(1, "front", panels("front")),
      back: side(1, "back", panels("back")),
      centre: true,
    };
    const back = sheet.back.pages;
    const centreSpread =
      back.length >= 2 && fold.id === "half-fold" ? ([2, 3] as [number, number]) : null;
    return {
      binding,
      pageCount,
      laidOutPages: pageCount,
      paddingPages: [],
      sheets: [sheet],
      centreSheet: 1,
      centreSpread,
      foldFormat: fold.id,
    };
  }
  const { pages } = padToMultipleOf4(pageCount);
  const sheets = saddleStitchSheets(pages).map((s): MapSheet => ({
    sheet: s.sheet,
    front: side(s.sheet, "front", [s.front.left, s.front.right]),
    back: side(s.sheet, "back", [s.back.left, s.back.right]),
    centre: s.sheet === pages / 4,
  }));
  const paddingPages: number[] = [];
  for (let p = pageCount + 1; p <= pages; p++) paddingPages.push(p);
  return {
    binding,
    pageCount,
    laidOutPages: pages,
    paddingPages,
    sheets,
    centreSheet: pages / 4,
    centreSpread: [pages / 2, pages / 2 + 1],
  };
}

/** Every printed side in print order (sheet 1 front, sheet 1 back, sheet 2 front, …). */
export function allSides(plan: SheetPlan): MapSheetSide[] {
  return plan.sheets.flatMap((s) => [s.front, s.back]);
}

/**
 * For each reader page 1..laidOutPages, the index into allSides(plan) of the side it prints on
 * (index 0 unused). Pages not on any side get −1.
 */
export function sideIndexByPage(plan: SheetPlan): Int32Array {
  const out = new Int32Array(plan.laidOutPages + 1).fill(-1);
  allSides(plan).forEach((s, i) => {
    for (const p of s.pages) if (p >= 1 && p <= plan.laidOutPages) out[p] = i;
  });
  return out;
}

/** Sheet number each page prints on (index 0 unused). */
export function sheetByPage(plan: SheetPlan): Int32Array {
  const out = new Int32Array(plan.laidOutPages + 1).fill(-1);
  for (const s of plan.sheets)
    for (const p of [...s.front.pages, ...s.back.pages])
      if (p <= plan.laidOutPages) out[p] = s.sheet;
  return out;
}

/** The page count a new map starts with: the target, padded to whole sheets for a saddle stitch. */
export function startingPageCount(anthology: {
  binding: Binding;
  pageCountTarget: number;
}): number {
  return anthology.binding === "saddle-stitch"
    ? padToMultipleOf4(anthology.pageCountTarget).pages
    : anthology.pageCountTarget;
}
