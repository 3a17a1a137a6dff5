/**
 * Lengths inside the print engine are millimetres; inches, PDF points and pixels are
 * converted only at the edges. Both constants are exact by definition:
 * 1 in = 25.4 mm (international yard, 1959; NBS Circular 572 addendum) and
 * 1 PDF point = 1/72 in (ISO 32000-1:2008 Table 30, UserUnit default).
 */

/** Millimetres in one inch, exact. */
export const MM_PER_INCH = 25.4;
/** PDF user-space units (points) in one inch, exact. */
export const POINTS_PER_INCH = 72;
/** Metres in one inch, exact (0.0254; PNG 1.2 states it for pHYs conversions). */
export const METRES_PER_INCH = MM_PER_INCH / 1000;
/** Centimetres in one inch, exact (2.54). */
export const CM_PER_INCH = MM_PER_INCH / 10;

/** Inches to millimetres. */
export function inToMm(inches: number): number {
  return inches * MM_PER_INCH;
}

/** Millimetres to inches. */
export function mmToIn(mm: number): number {
  return mm / MM_PER_INCH;
}

/** Millimetres to PDF points (multiply first so whole-point sizes come out whole). */
export function mmToPt(mm: number): number {
  return (mm * POINTS_PER_INCH) / MM_PER_INCH;
}

/** PDF points to millimetres. */
export function ptToMm(pt: number): number {
  return (pt * MM_PER_INCH) / POINTS_PER_INCH;
}

/** Pixels per metre (PNG pHYs unit 1) to pixels per inch. */
export function ppmToPpi(pixelsPerMetre: number): number {
  return pixelsPerMetre * METRES_PER_INCH;
}

/** Pixels per inch to pixels per metre, unrounded (PNG stores the rounded integer). */
export function ppiToPpm(ppi: number): number {
  return ppi / METRES_PER_INCH;
}

/** Pixels per centimetre (JFIF unit 2, TIFF unit 3) to pixels per inch. */
export function ppcmToPpi(pixelsPerCm: number): number {
  return pixelsPerCm * CM_PER_INCH;
}

/** Pixels needed to cover a length at a resolution, unrounded. */
export function mmToPx(mm: number, ppi: number): number {
  return (mm / MM_PER_INCH) * ppi;
}

/** Printed length of a pixel run at a resolution. */
export function pxToMm(px: number, ppi: number): number {
  return (px / ppi) * MM_PER_INCH;
}

/** Effective resolution of a pixel run printed across a length: pixels ÷ inches. */
export function effectivePpi(px: number, printedMm: number): number {
  return px / mmToIn(printedMm);
}

/** Rounds to a number of decimals for display and stable comparisons. */
export function roundTo(value: number, decimals: number): number {
  const factor = 10 ** decimals;
  return Math.round(value * factor) / factor;
}

/** Formats a length in inches the way the trade writes it: 0.125, 5.5, 8.5. */
export function formatInches(mm: number, decimals = 3): string {
  return String(roundTo(mmToIn(mm), decimals));
}

/** Formats a length in millimetres with at most one decimal. */
export function formatMm(mm: number, decimals = 1): string {
  return String(roundTo(mm, decimals));
}
