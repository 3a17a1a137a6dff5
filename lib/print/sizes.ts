/**
 * Trim sizes: the ISO 216 A and B series, North American sizes, the small trims zines use,
 * orientation helpers, the parent sheet a saddle-stitched booklet prints on, and n-up fitting
 * of a trim on a press sheet with bleed and a gripper margin.
 */
import { bleedBoxOf } from "./spec";
import { inToMm } from "./units";

/** A width and height in millimetres, as seen when reading the page. */
export interface SizeMm {
  widthMm: number;
  heightMm: number;
}

export type Orientation = "portrait" | "landscape" | "square";

export type PresetFamily = "iso-a" | "iso-b" | "north-american" | "small-trim";

/** A named size in portrait orientation. */
export interface TrimPreset extends SizeMm {
  id: string;
  label: string;
  family: PresetFamily;
  /** Size in inches when the size is defined in inches. */
  inches?: { width: number; height: number };
}

// ISO 216 (Kuhn; Wikipedia "ISO 216"; CUPS pwg-media.c): A0 = 841 x 1189 mm, B0 = 1000 x 1414 mm.
const ISO_A_MM: ReadonlyArray<readonly [number, number]> = [
  [841, 1189],
  [594, 841],
  [420, 594],
  [297, 420],
  [210, 297],
  [148, 210],
  [105, 148],
  [74, 105],
  [52, 74],
  [37, 52],
  [26, 37],
];
const ISO_B_MM: ReadonlyArray<readonly [number, number]> = [
  [1000, 1414],
  [707, 1000],
  [500, 707],
  [353, 500],
  [250, 353],
  [176, 250],
  [125, 176],
  [88, 125],
  [62, 88],
  [44, 62],
  [31, 44],
];

function inchPreset(
  id: string,
  label: string,
  family: PresetFamily,
  width: number,
  height: number,
): TrimPreset {
  return {
    id,
    label,
    family,
    widthMm: inToMm(width),
    heightMm: inToMm(height),
    inches: { width, height },
  };
}

/** Every named trim, portrait. Ids are stable and stored in the database. */
export const TRIM_PRESETS: readonly TrimPreset[] = [
  ...ISO_A_MM.map(([w, h], n) => ({
    id: `a${n}`,
    label: `A${n}`,
    family: "iso-a" as const,
    widthMm: w,
    heightMm: h,
  })),
  ...ISO_B_MM.map(([w, h], n) => ({
    id: `b${n}`,
    label: `B${n}`,
    family: "iso-b" as const,
    widthMm: w,
    heightMm: h,
  })),
  inchPreset("letter", "Letter (8.5 x 11 in)", "north-american", 8.5, 11),
  inchPreset("legal", "Legal (8.5 x 14 in)", "north-american", 8.5, 14),
  inchPreset("tabloid", "Tabloid (11 x 17 in)", "north-american", 11, 17),
  inchPreset("half-letter", "Half letter (5.5 x 8.5 in)", "north-american", 5.5, 8.5),
  inchPreset("quarter-letter", "Quarter letter (4.25 x 5.5 in)", "north-american", 4.25, 5.5),
  // Common practice, no source: small custom trims seen in zines.
  inchPreset("4x6in", "4 x 6 in", "small-trim", 4, 6),
  inchPreset("5x5in", "5 x 5 in", "small-trim", 5, 5),
  inchPreset("5x6in", "5 x 6 in", "small-trim", 5, 6),
  inchPreset("3.5x4.5in", "3.5 x 4.5 in", "small-trim", 3.5, 4.5),
  inchPreset("4.5x6in", "4.5 x 6 in", "small-trim", 4.5, 6),
];

/** The preset with this id, or undefined. */
export function findPreset(id: string): TrimPreset | undefined {
  return TRIM_PRESETS.find((p) => p.id === id.toLowerCase());
}

/** ISO 216 dimensional tolerance: ±1.5 mm up to 150 mm, ±2 mm to 600 mm, ±3 mm above. */
export function iso216ToleranceMm(dimensionMm: number): number {
  if (dimensionMm <= 150) return 1.5;
  if (dimensionMm <= 600) return 2;
  return 3;
}

/** Portrait, landscape or square. */
export function orientationOf(size: SizeMm): Orientation {
  if (size.widthMm === size.heightMm) return "square";
  return size.widthMm < size.heightMm ? "portrait" : "landscape";
}

/** Width and height swapped. */
export function rotateSize(size: SizeMm): SizeMm {
  return { widthMm: size.heightMm, heightMm: size.widthMm };
}

/** The same size turned to the wanted orientation (a square stays as it is). */
export function withOrientation(size: SizeMm, orientation: "portrait" | "landscape"): SizeMm {
  const short = Math.min(size.widthMm, size.heightMm);
  const long = Math.max(size.widthMm, size.heightMm);
  return orientation === "portrait"
    ? { widthMm: short, heightMm: long }
    : { widthMm: long, heightMm: short };
}

/** True when two sizes agree within a tolerance, in the same orientation. */
export function sameSize(a: SizeMm, b: SizeMm, toleranceMm = 0.01): boolean {
  return (
    Math.abs(a.widthMm - b.widthMm) <= toleranceMm &&
    Math.abs(a.heightMm - b.heightMm) <= toleranceMm
  );
}

/**
 * The preset matching a size in either orientation, within the ISO 216 tolerance for ISO
 * sizes and 0.5 mm for inch sizes (which are exact by definition).
 */
export function matchPreset(size: SizeMm): TrimPreset | undefined {
  const portrait = withOrientation(size, "portrait");
  return TRIM_PRESETS.find((p) => {
    const iso = p.family === "iso-a" || p.family === "iso-b";
    const tolW = iso ? iso216ToleranceMm(p.widthMm) : 0.5;
    const tolH = iso ? iso216ToleranceMm(p.heightMm) : 0.5;
    return (
      Math.abs(p.widthMm - portrait.widthMm) <= tolW &&
      Math.abs(p.heightMm - portrait.heightMm) <= tolH
    );
  });
}

/** A sheet folded once across its long side, exact halves (A4 gives 148.5 x 210 mm). */
export function foldInHalf(size: SizeMm): SizeMm {
  const long = Math.max(size.widthMm, size.heightMm);
  const short = Math.min(size.widthMm, size.heightMm);
  return withOrientation({ widthMm: long / 2, heightMm: short }, "portrait");
}

/** The flat sheet a saddle-stitched booklet prints on, and a named sheet it corresponds to. */
export interface ParentSheet {
  /** The open spread: two pages side by side, landscape for a portrait trim. */
  spread: SizeMm;
  /** A named sheet equal to the spread (ISO sizes within ISO 216 tolerance), if there is one. */
  preset?: TrimPreset;
  /** When no sheet matches: the smallest common sheet the spread fits on, and how many up. */
  smallestCommonSheet?: { preset: TrimPreset; up: number };
}

/** Sheets a home or copy-shop printer takes, smallest first. Common practice, no source. */
export const COMMON_PRINTER_SHEET_IDS = [
  "half-letter",
  "a5",
  "letter",
  "a4",
  "legal",
  "tabloid",
  "a3",
] as const;

/**
 * The sheet a saddle-stitched booklet of this trim prints on, folded once parallel to its
 * short side: two trims side by side along the spine (A5 → A4, half letter → letter).
 */
export function parentSheetFor(trim: SizeMm): ParentSheet {
  const spread = { widthMm: 2 * trim.widthMm, heightMm: trim.heightMm };
  const preset = matchPreset(spread);
  if (preset) return { spread, preset };
  for (const id of COMMON_PRINTER_SHEET_IDS) {
    const sheet = findPreset(id);
    if (!sheet) continue;
    const fit = fitOnSheet(spread, sheet, { bleedMm: 0, gripperMm: 0 });
    if (fit.up > 0) return { spread, smallestCommonSheet: { preset: sheet, up: fit.up } };
  }
  return { spread };
}

export interface FitOptions {
  /** Bleed added to every side of each piece; each piece is cut out with its own bleed. */
  bleedMm: number;
  /** Strip along the sheet's top edge (as given) that the press or printer cannot print. */
  gripperMm: number;
  /** Unprintable margin on the other three edges; defaults to 0. */
  marginMm?: number;
}

/** One straight guillotine cut across the whole sheet. */
export interface Cut {
  /** "vertical" cuts are at a distance from the left edge, "horizontal" from the top edge. */
  direction: "vertical" | "horizontal";
  atMm: number;
}

export interface SheetFit {
  up: number;
  columns: number;
  rows: number;
  /** Orientation of the trim as placed on the sheet. */
  placed: "as-given" | "rotated";
  pieceOrientation: Orientation;
  /** Each piece with its bleed, as placed. */
  piece: SizeMm;
  /** Top-left corner of each trimmed piece, in mm from the sheet's top-left. */
  trimOrigins: Array<{ xMm: number; yMm: number }>;
  /** Guillotine cuts along trim lines, vertical then horizontal, each sorted. */
  cuts: Cut[];
  /** Fraction of the sheet area that is not finished trim. */
  wasteFraction: number;
}

function gridFit(
  trim: SizeMm,
  sheet: SizeMm,
  options: FitOptions,
  placed: "as-given" | "rotated",
): SheetFit {
  const margin = options.marginMm ?? 0;
  const b = options.bleedMm;
  const piece = bleedBoxOf({ trimWidthMm: trim.widthMm, trimHeightMm: trim.heightMm, bleedMm: b });
  const pieceW = piece.widthMm;
  const pieceH = piece.heightMm;
  const usableW = sheet.widthMm - 2 * margin;
  const usableH = sheet.heightMm - options.gripperMm - margin;
  const eps = 1e-9;
  const columns = usableW > 0 ? Math.floor(usableW / pieceW + eps) : 0;
  const rows = usableH > 0 ? Math.floor(usableH / pieceH + eps) : 0;
  const up = columns * rows;
  // Centre the block in the printable area so waste falls evenly on both sides.
  const x0 = margin + (usableW - columns * pieceW) / 2;
  const y0 = options.gripperMm + (usableH - rows * pieceH) / 2;
  const trimOrigins: Array<{ xMm: number; yMm: number }> = [];
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < columns; c++)
      trimOrigins.push({ xMm: x0 + c * pieceW + b, yMm: y0 + r * pieceH + b });
  }
  const xs = new Set<number>();
  const ys = new Set<number>();
  for (let c = 0; c < columns; c++) {
    xs.add(round6(x0 + c * pieceW + b));
    xs.add(round6(x0 + c * pieceW + b + trim.widthMm));
  }
  for (let r = 0; r < rows; r++) {
    ys.add(round6(y0 + r * pieceH + b));
    ys.add(round6(y0 + r * pieceH + b + trim.heightMm));
  }
  const cuts: Cut[] = [
    ...[...xs].sort((a, z) => a - z).map((atMm) => ({ direction: "vertical" as const, atMm })),
    ...[...ys].sort((a, z) => a - z).map((atMm) => ({ direction: "horizontal" as const, atMm })),
  ];
  const sheetArea = sheet.widthMm * sheet.heightMm;
  return {
    up,
    columns,
    rows,
    placed,
    pieceOrientation: orientationOf(trim),
    piece,
    trimOrigins,
    cuts: up > 0 ? cuts : [],
    wasteFraction: sheetArea > 0 ? 1 - (up * trim.widthMm * trim.heightMm) / sheetArea : 1,
  };
}

function round6(v: number): number {
  return Math.round(v * 1e6) / 1e6;
}

/**
 * How many trims fit on a sheet in a straight grid, trying the trim as given and turned
 * 90°, keeping the one with more pieces (fewer cuts on a tie). Every piece carries its own
 * bleed, so with bleed there are two cuts between neighbours and one without.
 */
export function fitOnSheet(trim: SizeMm, sheet: SizeMm, options: FitOptions): SheetFit {
  const asGiven = gridFit(trim, sheet, options, "as-given");
  const rotated = gridFit(rotateSize(trim), sheet, options, "rotated");
  if (rotated.up > asGiven.up) return rotated;
  if (rotated.up === asGiven.up && rotated.up > 0 && rotated.cuts.length < asGiven.cuts.length)
    return rotated;
  return asGiven;
}
