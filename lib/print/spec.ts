/** The print spec an anthology sets, and the sizes and pixel counts derived from it. */
import { mmToPx, roundTo } from "./units";
import type { SizeMm } from "./sizes";

/** How the booklet will be printed, the one list; lib/domain.ts re-exports it beside its labels. */
export const PRINT_METHODS = ["duplicator", "laser-colour", "laser-black", "inkjet"] as const;
/** Duplicator printing runs each sheet once per ink. */
export type PrintMethod = (typeof PRINT_METHODS)[number];

/** The one shape of a print spec; lengths in millimetres. Build it from an anthology with `specOf`. */
export interface PrintSpec {
  /** The named trim the size came from ("a5", "half-letter"; "custom" for a size typed in), when known. */
  trimPreset?: string;
  trimWidthMm: number;
  trimHeightMm: number;
  bleedMm: number;
  safeMarginMm: number;
  minPpi: number;
  /** Pages one file should hold (1 for a page file); absent when any count will do. */
  pagesExpected?: number;
  /**
   * For one page of a two-page spread, the side of the file that lies on the fold (the spine):
   * the right side of the left page, the left side of the right page. The fold is not a trim
   * edge, so art may run across it; the edge checks look at the other three sides only.
   */
  foldSide?: "left" | "right";
  printMethod: PrintMethod;
  /** Ink names in printing order, e.g. ["black", "fluorescent pink"]; empty for process colour. */
  inks: string[];
  /**
   * Set when the file is one ink's separation (a duplicator master): the ink it is for. The
   * report names it, and colour in the file is a finding of its own.
   */
  separationInk?: string;
}

/** The anthology columns a spec is drawn from; a whole anthology row will do. */
export interface SpecColumns {
  trimPreset?: string | null;
  trimWidthMm: number;
  trimHeightMm: number;
  bleedMm: number;
  safeMarginMm: number;
  minPpi: number;
  printMethod: PrintMethod;
  inks: readonly string[];
}

export interface SpecOptions {
  /** Pages one file should hold, e.g. 1 for a piece's page file. */
  pagesExpected?: number;
  /** Narrows the inks (a piece's or a call's); an empty or missing list keeps the anthology's. */
  inks?: readonly string[] | null;
  /** The fold side of a spread's page file (see PrintSpec.foldSide). */
  foldSide?: "left" | "right";
}

/**
 * The print spec of an anthology, from its columns: every caller that checks, draws or
 * describes a spec builds it here, so the fields and the ink rule live in one place.
 */
export function specOf(anthology: SpecColumns, options: SpecOptions = {}): PrintSpec {
  const inks = options.inks && options.inks.length > 0 ? options.inks : anthology.inks;
  const spec: PrintSpec = {
    trimWidthMm: anthology.trimWidthMm,
    trimHeightMm: anthology.trimHeightMm,
    bleedMm: anthology.bleedMm,
    safeMarginMm: anthology.safeMarginMm,
    minPpi: anthology.minPpi,
    printMethod: anthology.printMethod,
    inks: [...inks],
  };
  if (anthology.trimPreset) spec.trimPreset = anthology.trimPreset;
  if (options.pagesExpected !== undefined) spec.pagesExpected = options.pagesExpected;
  if (options.foldSide) spec.foldSide = options.foldSide;
  return spec;
}

/** The finished page size. */
export function trimOf(spec: Pick<PrintSpec, "trimWidthMm" | "trimHeightMm">): SizeMm {
  return { widthMm: spec.trimWidthMm, heightMm: spec.trimHeightMm };
}

/**
 * The page size including bleed on every side (BleedBox = TrimBox grown by the bleed,
 * ISO 32000-1:2008 §14.11.2): the one place trim plus bleed is computed.
 */
export function bleedBoxOf(
  spec: Pick<PrintSpec, "trimWidthMm" | "trimHeightMm" | "bleedMm">,
): SizeMm {
  return {
    widthMm: spec.trimWidthMm + 2 * spec.bleedMm,
    heightMm: spec.trimHeightMm + 2 * spec.bleedMm,
  };
}

/** The area inside the safe margin, where text and faces belong. */
export function safeAreaOf(
  spec: Pick<PrintSpec, "trimWidthMm" | "trimHeightMm" | "safeMarginMm">,
): SizeMm {
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

/** A spec field a problem is about, so a form can show it beside the right input. */
export type SpecField = "trim" | "bleedMm" | "safeMarginMm" | "minPpi" | "pagesExpected" | "inks";

export interface SpecProblem {
  field: SpecField;
  message: string;
}

/** A length for a message; specs are in millimetres, so by default "3.175 mm". */
export type LengthText = (mm: number) => string;
const millimetres: LengthText = (mm) => `${roundTo(mm, 3)} mm`;

/**
 * Problems that make a spec unusable, each with the field it is about; empty when it is sound.
 * `length` writes lengths in the reader's unit (a form passes one for the unit the editor chose).
 */
export function specFieldProblems(
  spec: PrintSpec,
  length: LengthText = millimetres,
): SpecProblem[] {
  const problems: SpecProblem[] = [];
  const add = (field: SpecField, message: string) => problems.push({ field, message });
  if (!(spec.trimWidthMm > 0) || !(spec.trimHeightMm > 0))
    add("trim", "The trim size must be greater than zero.");
  if (!(spec.bleedMm >= 0)) add("bleedMm", "The bleed cannot be negative.");
  if (!(spec.safeMarginMm >= 0)) add("safeMarginMm", "The safe margin cannot be negative.");
  const shortSideMm = Math.min(spec.trimWidthMm, spec.trimHeightMm);
  if (2 * spec.safeMarginMm >= shortSideMm)
    add(
      "safeMarginMm",
      `Safe margins of ${length(spec.safeMarginMm)} on each side leave no room on the page, whose short side is ${length(shortSideMm)}.`,
    );
  if (!(spec.minPpi > 0)) add("minPpi", "The minimum resolution must be greater than zero.");
  if (
    spec.pagesExpected !== undefined &&
    !(Number.isInteger(spec.pagesExpected) && spec.pagesExpected > 0)
  )
    add("pagesExpected", "Pages expected must be a whole number above zero.");
  if (spec.printMethod === "duplicator" && spec.inks.length === 0)
    add("inks", "Duplicator printing needs at least one ink.");
  return problems;
}

/** Problems that make a spec unusable, in plain words; empty when it is sound. */
export function specProblems(spec: PrintSpec, length?: LengthText): string[] {
  return specFieldProblems(spec, length).map((p) => p.message);
}
