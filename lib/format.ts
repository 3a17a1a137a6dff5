/** Display helpers shared by pages; pure. */
import { findPreset } from "@/lib/print/sizes";
import { mmToIn, roundTo } from "@/lib/print/units";

/** "Half letter (5.5 x 8.5 in)" for a preset, "120 x 170 mm" for a custom size. */
export function formatTrim(a: {
  trimPreset: string;
  trimWidthMm: number;
  trimHeightMm: number;
}): string {
  const preset = findPreset(a.trimPreset);
  const size = `${mmText(a.trimWidthMm)} x ${mmText(a.trimHeightMm)} mm`;
  if (!preset) return size;
  return preset.inches ? `${preset.label}` : `${preset.label} (${size})`;
}

/** A length in both units, e.g. "3.175 mm (0.125 in)". */
export function formatLength(mm: number): string {
  return `${mmText(mm)} mm (${roundTo(mmToIn(mm), 3)} in)`;
}

/**
 * Millimetres to at most three decimals, so inch-based values read exactly (1/8 in = 3.175 mm);
 * rounding the binary value to two decimals would show 3.17.
 */
export function mmText(mm: number): string {
  return String(roundTo(mm, 3));
}

/**
 * A length in the unit the editor typed it in, with millimetres beside inches since the spec is
 * stored in millimetres: "24 in (609.6 mm)", "3 mm".
 */
export function lengthInUnit(mm: number, unit: "mm" | "in"): string {
  return unit === "in" ? `${roundTo(mmToIn(mm), 3)} in (${mmText(mm)} mm)` : `${mmText(mm)} mm`;
}
