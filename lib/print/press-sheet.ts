/**
 * The press sheet a print file is imposed on: which named sheets suit a trim, the default one,
 * and whether a custom sheet holds the flat layout (the pages side by side) with its bleed and
 * crop marks. Millimetres; sheets are given portrait.
 */
import { foldFormatFor } from "@/lib/map/layout";
import type { Binding } from "@/lib/domain";
import { layoutSheet } from "./pdf/impose";
import { findPreset, type SizeMm } from "./sizes";

/**
 * Room each edge needs past the bleed for crop marks and their offset. Common practice, no
 * source: marks about 5 mm long set about 3 mm off the trim, so 8 mm past the bleed covers them.
 */
export const MARKS_ALLOWANCE_MM = 8;

/**
 * The named sheet each trim is printed on, folded once: two pages side by side along the spine.
 * Letter folded = half letter and tabloid folded = letter (REFERENCE.md, ANSI sheets); A4 folded
 * = A5 and A3 folded = A4 (ISO 216). It comes first; larger named sheets that hold the pages
 * with their bleed and marks follow.
 */
export const SHEETS_FOR_TRIM: Readonly<Record<string, readonly string[]>> = {
  "half-letter": ["letter"],
  a5: ["a4"],
  letter: ["tabloid"],
  a4: ["a3"],
};

/** Named sheets offered for any other trim when the layout fits them, smallest first. */
export const OTHER_PRESET_SHEETS = ["letter", "a4", "legal", "tabloid", "a3"] as const;

export interface SheetLayoutInput {
  trimPreset: string | null;
  trimWidthMm: number;
  trimHeightMm: number;
  bleedMm: number;
  binding: Binding;
  /** Reader pages of the map (picks the fold of a fold-only sheet). */
  pageCount: number;
}

/** Pages across and down on one printed side: 2 x 1 for a saddle stitch, the fold's grid otherwise. */
export function flatGrid(input: SheetLayoutInput): { columns: number; rows: number } {
  const fold = input.binding === "fold-only" ? foldFormatFor(input.pageCount) : null;
  return fold ? { columns: fold.columns, rows: fold.rows } : { columns: 2, rows: 1 };
}

/**
 * The smallest sheet the layout needs: the pages edge to edge (the spine carries no bleed), the
 * bleed round the outside, and room for the marks past it.
 */
export function neededSheetMm(input: SheetLayoutInput): SizeMm {
  const { columns, rows } = flatGrid(input);
  const edge = 2 * (input.bleedMm + MARKS_ALLOWANCE_MM);
  return {
    widthMm: columns * input.trimWidthMm + edge,
    heightMm: rows * input.trimHeightMm + edge,
  };
}

/** True when the sheet holds the needed size one way or the other (it may be laid landscape). */
export function sheetHolds(sheet: SizeMm, needed: SizeMm): boolean {
  const e = 1e-6;
  const fits = (w: number, h: number) => w + e >= needed.widthMm && h + e >= needed.heightMm;
  return fits(sheet.widthMm, sheet.heightMm) || fits(sheet.heightMm, sheet.widthMm);
}

export interface PressSheetChoice {
  id: string;
  name: string;
  widthMm: number;
  heightMm: number;
  /** What this sheet leaves out (bleed, marks), when it cannot hold them; null when it holds all. */
  layoutNote?: string | null;
}

/** How a saddle-stitched spread goes on a sheet: with its bleed, with the marks, or neither. */
export interface SheetMarks {
  bleedMm: number;
  marks: boolean;
  /** Plain words for the editor when something is left out; null when the sheet holds it all. */
  note: string | null;
}

/**
 * The most a sheet holds of bleed and printer's marks around the two pages: both; the bleed
 * without marks; or, when the sheet is the spread itself (half letter on letter, A5 on A4:
 * ANSI and ISO 216 sizes), the pages edge to edge with neither, cut at the trim. Null when the
 * pages alone do not fit.
 */
export function sheetMarksFor(
  spec: { trimWidthMm: number; trimHeightMm: number; bleedMm: number },
  sheet: { name: string; widthMm: number; heightMm: number },
): SheetMarks | null {
  const tryLayout = (bleedMm: number, marks: boolean) => {
    try {
      layoutSheet({ ...spec, bleedMm, sheet, marks });
      return true;
    } catch {
      return false;
    }
  };
  if (tryLayout(spec.bleedMm, true)) return { bleedMm: spec.bleedMm, marks: true, note: null };
  if (spec.bleedMm > 0 && tryLayout(spec.bleedMm, false))
    return {
      bleedMm: spec.bleedMm,
      marks: false,
      note: `${sheet.name} holds the pages with their bleed but no crop or fold marks: measure the trim by hand.`,
    };
  if (tryLayout(0, false))
    return {
      bleedMm: 0,
      marks: false,
      note:
        `${sheet.name} is exactly two pages wide: no room for bleed or crop marks, so art is cut at ` +
        `the trim and most desktop printers leave a few millimetres unprinted at the edge. ` +
        `Choose a larger sheet to keep the bleed and marks.`,
    };
  return null;
}

function presetSheet(id: string): PressSheetChoice | null {
  const p = findPreset(id);
  return p ? { id: p.id, name: p.label, widthMm: p.widthMm, heightMm: p.heightMm } : null;
}

/** The named sheets this trim may be printed on; the first is the default. */
export function presetSheetsFor(input: SheetLayoutInput): PressSheetChoice[] {
  const paired = input.trimPreset ? SHEETS_FOR_TRIM[input.trimPreset] : undefined;
  if (input.binding === "saddle-stitch") {
    const ids = [...new Set([...(paired ?? []), ...OTHER_PRESET_SHEETS])];
    return ids
      .map(presetSheet)
      .filter((s): s is PressSheetChoice => s !== null)
      .flatMap((s) => {
        const fit = sheetMarksFor(input, s);
        return fit ? [{ ...s, layoutNote: fit.note }] : [];
      });
  }
  const needed = neededSheetMm(input);
  return OTHER_PRESET_SHEETS.map(presetSheet).filter(
    (s): s is PressSheetChoice => s !== null && sheetHolds(s, needed),
  );
}

/** The sheet the picker starts on, or null when no named sheet suits (a custom one is needed). */
export function defaultSheetFor(input: SheetLayoutInput): PressSheetChoice | null {
  return presetSheetsFor(input)[0] ?? null;
}

export type SheetRequest = string | { widthMm: number; heightMm: number };

export type SheetResolution =
  { ok: true; sheet: PressSheetChoice } | { ok: false; message: string };

const mm = (v: number) => `${Math.round(v * 10) / 10} mm`;

/** Checks the requested sheet against the trim: a named sheet that suits it, or a custom one it fits. */
export function resolveSheet(input: SheetLayoutInput, request: SheetRequest): SheetResolution {
  if (typeof request === "string") {
    const offered = presetSheetsFor(input);
    const found = offered.find((s) => s.id === request);
    if (found) return { ok: true, sheet: found };
    const known = presetSheet(request);
    const names = offered.map((s) => s.name).join(" or ");
    return {
      ok: false,
      message: known
        ? `${known.name} does not suit this trim${names ? `: use ${names}` : ""}, or give a custom sheet size.`
        : `There is no sheet called "${request}"${names ? `: use ${names}` : ""}, or give a custom sheet size.`,
    };
  }
  const needed = neededSheetMm(input);
  const portrait = {
    widthMm: Math.min(request.widthMm, request.heightMm),
    heightMm: Math.max(request.widthMm, request.heightMm),
  };
  if (!sheetHolds(portrait, needed))
    return {
      ok: false,
      message:
        `A ${mm(portrait.widthMm)} x ${mm(portrait.heightMm)} sheet is too small: the pages side by side with ` +
        `${mm(input.bleedMm)} bleed and room for crop marks need ${mm(needed.widthMm)} x ${mm(needed.heightMm)}.`,
    };
  return {
    ok: true,
    sheet: {
      id: "custom",
      name: `Custom ${mm(portrait.widthMm)} x ${mm(portrait.heightMm)}`,
      ...portrait,
    },
  };
}
