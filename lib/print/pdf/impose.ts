/**
 * The imposed print file of a saddle-stitched booklet: one PDF page per printed side, two pages
 * side by side with the fold between them, centred on the press sheet, with crop marks, fold
 * marks and a slug line outside the bleed. Page boxes follow ISO 32000-1 §14.11.2: the MediaBox
 * is the press sheet, the TrimBox the finished spread, the BleedBox the spread grown by the bleed
 * on its outer edges, all inside the MediaBox.
 */
import { PDFDocument, grayscale, type PDFPage } from "pdf-lib";
import { formatMm, mmToPt } from "../units";
import {
  DEFAULT_SAFE_MARGIN_MM,
  drawContent,
  embedFonts,
  fitLine,
  winAnsiSafe,
  type Fonts,
  type PageFrame,
} from "./draw";
import type { ImposeInput, ProducedPdf, SideInput } from "./types";

/** Crop and fold marks start this far from the trim corner. Common practice, no source. */
export const MARK_GAP_MM = 3;
/** Marks never start closer to the bleed edge than this, so they stay outside the art. */
export const MARK_CLEARANCE_MM = 1;
/** Length of each mark. Common practice, no source. */
export const MARK_LENGTH_MM = 5;
/** Width of every mark line, points. Common practice, no source. */
export const MARK_LINE_PT = 0.25;
/** Slug line type size, points, and its gap from the marks. */
export const SLUG_SIZE_PT = 6;
const SLUG_MIN_SIZE_PT = 4;
export const SLUG_GAP_MM = 2;

/** Where everything goes on the sheet, in millimetres from the sheet's lower-left corner. */
export interface ImposedSheetLayout {
  /** The sheet as laid: portrait as given, or turned landscape for the spread. */
  sheetWidthMm: number;
  sheetHeightMm: number;
  rotated: boolean;
  /** Lower-left corner of the spread's trim. */
  trimXMm: number;
  trimYMm: number;
  spreadWidthMm: number;
  spreadHeightMm: number;
  /** The fold, a vertical line at this x. */
  foldXMm: number;
  /** Distance from the trim edge to the near end of each mark (0 when marks are off). */
  markOffsetMm: number;
  marks: boolean;
}

type LayoutInput = Pick<
  ImposeInput,
  "trimWidthMm" | "trimHeightMm" | "bleedMm" | "sheet" | "marks"
>;

const fits = (need: { w: number; h: number }, w: number, h: number) =>
  need.w <= w + 1e-9 && need.h <= h + 1e-9;

/**
 * Lays the two-up spread on the press sheet: the orientation that matches the spread first, the
 * other if only that fits. Refuses, naming the sizes, when the spread with its bleed and marks does
 * not fit either way round.
 */
export function layoutSheet(input: LayoutInput): ImposedSheetLayout {
  const { trimWidthMm: w, trimHeightMm: h, bleedMm: b, sheet } = input;
  if (!(w > 0) || !(h > 0)) throw new RangeError("The trim size must be greater than zero.");
  if (!(b >= 0)) throw new RangeError("The bleed cannot be negative.");
  if (!(sheet.widthMm > 0) || !(sheet.heightMm > 0))
    throw new RangeError(`The press sheet ${sheet.name} has no size.`);
  const marks = input.marks ?? true;
  const markOffsetMm = marks ? Math.max(MARK_GAP_MM, b + MARK_CLEARANCE_MM) : 0;
  const slugMm = (SLUG_SIZE_PT * 25.4) / 72;
  const marginX = marks ? markOffsetMm + MARK_LENGTH_MM : b;
  const marginY = marks ? markOffsetMm + MARK_LENGTH_MM + SLUG_GAP_MM + slugMm : b;
  const need = { w: 2 * w + 2 * marginX, h: h + 2 * marginY };
  const short = Math.min(sheet.widthMm, sheet.heightMm);
  const long = Math.max(sheet.widthMm, sheet.heightMm);
  const spreadLandscape = 2 * w > h;
  const tries: Array<[number, number]> = spreadLandscape
    ? [
        [long, short],
        [short, long],
      ]
    : [
        [short, long],
        [long, short],
      ];
  const chosen = tries.find(([sw, sh]) => fits(need, sw, sh));
  if (!chosen) {
    const what = marks
      ? `${formatMm(b, 3)} mm bleed and printer's marks`
      : `${formatMm(b, 3)} mm bleed`;
    // A minimum, so rounded up to the tenth of a millimetre shown.
    const up = (v: number) => String(Math.ceil(v * 10 - 1e-6) / 10);
    throw new RangeError(
      `The spread of two ${formatMm(w)} x ${formatMm(h)} mm pages with ${what} needs a sheet of at least ` +
        `${up(need.w)} x ${up(need.h)} mm; the ${sheet.name} sheet (${formatMm(sheet.widthMm)} x ` +
        `${formatMm(sheet.heightMm)} mm) is too small either way round.`,
    );
  }
  const [sheetWidthMm, sheetHeightMm] = chosen;
  const trimXMm = (sheetWidthMm - 2 * w) / 2;
  const trimYMm = (sheetHeightMm - h) / 2;
  return {
    sheetWidthMm,
    sheetHeightMm,
    rotated: sheetWidthMm !== sheet.widthMm,
    trimXMm,
    trimYMm,
    spreadWidthMm: 2 * w,
    spreadHeightMm: h,
    foldXMm: trimXMm + w,
    markOffsetMm,
    marks,
  };
}

function checkSides(input: ImposeInput): number {
  if (input.sides.length === 0) throw new RangeError("There are no sheet sides to impose.");
  let sheets = 0;
  for (const side of input.sides) {
    if (side.pages.length !== 2)
      throw new RangeError(
        `Sheet ${side.sheet} ${side.side} has ${side.pages.length} page(s); a booklet side carries two, left and right of the fold.`,
      );
    if (!Number.isInteger(side.sheet) || side.sheet < 1)
      throw new RangeError(`Sheet numbers start at 1, got ${side.sheet}.`);
    const creep = input.creepMm[side.sheet - 1];
    if (creep === undefined || !Number.isFinite(creep) || creep < 0)
      throw new RangeError(
        `No creep figure for sheet ${side.sheet}: creepMm has ${input.creepMm.length} figure(s), one per sheet, outermost first.`,
      );
    if (creep > input.bleedMm + input.trimWidthMm / 2)
      throw new RangeError(
        `A creep of ${formatMm(creep, 2)} mm on sheet ${side.sheet} is more than the page can take.`,
      );
    sheets = Math.max(sheets, side.sheet);
  }
  return sheets;
}

/** The slug line's words: title, sheet N of M, side, ink, stock note and the pages on the side. */
export function slugText(input: ImposeInput, side: SideInput, sheets: number): string {
  const parts = [
    input.title,
    `sheet ${side.sheet} of ${sheets}`,
    side.side,
    input.ink ? `ink: ${input.ink}` : "composite",
  ];
  if (side.stockNote) parts.push(side.stockNote);
  parts.push(`pages ${side.pages.map((p) => p.page).join(" | ")}`);
  return parts.join(" - ");
}

function drawMarks(page: PDFPage, layout: ImposedSheetLayout, slug: string, fonts: Fonts): void {
  const p = mmToPt;
  const color = grayscale(0); // registration: black on a composite, full ink on a separation master
  const line = (x1: number, y1: number, x2: number, y2: number, dash?: number[]) =>
    page.drawLine({
      start: { x: p(x1), y: p(y1) },
      end: { x: p(x2), y: p(y2) },
      thickness: MARK_LINE_PT,
      color,
      ...(dash ? { dashArray: dash.map(p) } : {}),
    });
  const { trimXMm: left, trimYMm: bottom, markOffsetMm: o } = layout;
  const right = left + layout.spreadWidthMm;
  const top = bottom + layout.spreadHeightMm;
  const len = MARK_LENGTH_MM;
  // Crop marks: at each outer corner one line on the trim's horizontal, one on its vertical.
  for (const [x, dx] of [
    [left, -1],
    [right, 1],
  ] as const) {
    for (const [y, dy] of [
      [bottom, -1],
      [top, 1],
    ] as const) {
      line(x + dx * o, y, x + dx * (o + len), y);
      line(x, y + dy * o, x, y + dy * (o + len));
    }
  }
  // Fold marks, dashed so they are not taken for a cut: above and below the fold.
  const f = layout.foldXMm;
  line(f, top + o, f, top + o + len, [1, 0.75]);
  line(f, bottom - o, f, bottom - o - len, [1, 0.75]);
  // Slug line below the bottom marks, shrunk (then shortened) to the spread's width.
  const text = winAnsiSafe(slug, fonts.regular);
  const width = p(layout.spreadWidthMm);
  let size = SLUG_SIZE_PT;
  while (size > SLUG_MIN_SIZE_PT && fonts.regular.widthOfTextAtSize(text, size) > width)
    size -= 0.5;
  const shown = fitLine(text, fonts.regular, size, width);
  const baseline =
    p(bottom - o - len - SLUG_GAP_MM) - fonts.regular.heightAtSize(size, { descender: false });
  page.drawText(shown, { x: p(left), y: baseline, size, font: fonts.regular, color });
}

/** The frame of the left (index 0) or right (index 1) page of a side, with its creep. */
function frameOf(
  layout: ImposedSheetLayout,
  input: ImposeInput,
  half: 0 | 1,
  creepMm: number,
  safeMarginMm: number,
): PageFrame {
  const p = mmToPt;
  const w = input.trimWidthMm;
  const b = input.bleedMm;
  const trimX = layout.trimXMm + half * w;
  // The fold is not a trim edge: bleed only on the three outer edges.
  const clipX = half === 0 ? trimX - b : trimX;
  return {
    trim: { x: p(trimX), y: p(layout.trimYMm), width: p(w), height: p(input.trimHeightMm) },
    bleedPt: p(b),
    clip: {
      x: p(clipX),
      y: p(layout.trimYMm - b),
      width: p(w + b),
      height: p(input.trimHeightMm + 2 * b),
    },
    // lib/print/creep.ts pageShifts: toward the spine, so the left page moves right, the right page left.
    shiftXPt: p(half === 0 ? creepMm : -creepMm),
    safeMarginPt: p(safeMarginMm),
  };
}

/** Builds the imposed print PDF, one page per side in the order given, loading one page's art at a time. */
export async function imposeBooklet(input: ImposeInput): Promise<ProducedPdf> {
  const layout = layoutSheet(input);
  const sheets = checkSides(input);
  const safeMarginMm = input.safeMarginMm ?? DEFAULT_SAFE_MARGIN_MM;
  const doc = await PDFDocument.create();
  doc.setTitle(`${input.title} - print file`);
  doc.setProducer("Quireline");
  doc.setCreator("Quireline");
  const fonts = await embedFonts(doc);
  const p = mmToPt;
  const total = input.sides.reduce((n, s) => n + s.pages.length, 0);
  let done = 0;
  for (const side of input.sides) {
    const page = doc.addPage([p(layout.sheetWidthMm), p(layout.sheetHeightMm)]);
    const b = input.bleedMm;
    page.setTrimBox(
      p(layout.trimXMm),
      p(layout.trimYMm),
      p(layout.spreadWidthMm),
      p(layout.spreadHeightMm),
    );
    page.setBleedBox(
      p(layout.trimXMm - b),
      p(layout.trimYMm - b),
      p(layout.spreadWidthMm + 2 * b),
      p(layout.spreadHeightMm + 2 * b),
    );
    const creep = input.creepMm[side.sheet - 1] ?? 0;
    for (const half of [0, 1] as const) {
      const placed = side.pages[half];
      if (!placed) continue;
      await drawContent(
        doc,
        page,
        placed.content,
        frameOf(layout, input, half, creep, safeMarginMm),
        fonts,
        placed.page,
      );
      done++;
      await input.onProgress?.(done, total);
    }
    if (layout.marks) drawMarks(page, layout, slugText(input, side, sheets), fonts);
  }
  const bytes = await doc.save();
  return { bytes, pageCount: doc.getPageCount() };
}
