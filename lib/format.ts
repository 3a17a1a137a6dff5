/** Display helpers shared by pages; pure. */
import { findPreset } from "@/lib/print/sizes";
import { mmToIn, roundTo } from "@/lib/print/units";

/**
 * "Half letter (5.5 x 8.5 in)" for a preset; a custom size in both units, "120 x 170 mm
 * (4.724 x 6.693 in)", since the unit the editor typed it in is not stored.
 */
export function formatTrim(a: {
  trimPreset: string;
  trimWidthMm: number;
  trimHeightMm: number;
}): string {
  const preset = findPreset(a.trimPreset);
  if (!preset) return sizeInBothUnits(a.trimWidthMm, a.trimHeightMm);
  const size = `${mmText(a.trimWidthMm)} x ${mmText(a.trimHeightMm)} mm`;
  return preset.inches ? `${preset.label}` : `${preset.label} (${size})`;
}

/** A width x height in millimetres and inches, either first: "127 x 177.8 mm (5 x 7 in)". */
export function sizeInBothUnits(widthMm: number, heightMm: number, inchesFirst = false): string {
  const mm = `${mmText(widthMm)} x ${mmText(heightMm)} mm`;
  const inches = `${roundTo(mmToIn(widthMm), 3)} x ${roundTo(mmToIn(heightMm), 3)} in`;
  return inchesFirst ? `${inches} (${mm})` : `${mm} (${inches})`;
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

/** A file size for people: bytes below 1 KB, then KB and MB (1 KB = 1024 bytes, as MAX_UPLOAD_MB counts). */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} bytes`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(bytes < 10 * 1024 ? 1 : 0)} KB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}
