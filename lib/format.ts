/** Display helpers shared by pages; pure. */
import { findPreset } from "@/lib/print/sizes";
import { mmToIn } from "@/lib/print/units";

/** "Half letter (5.5 x 8.5 in)" for a preset, "120 x 170 mm" for a custom size. */
export function formatTrim(a: {
  trimPreset: string;
  trimWidthMm: number;
  trimHeightMm: number;
}): string {
  const preset = findPreset(a.trimPreset);
  const round = (n: number) => Number(n.toFixed(2));
  const size = `${round(a.trimWidthMm)} x ${round(a.trimHeightMm)} mm`;
  if (!preset) return size;
  return preset.inches ? `${preset.label}` : `${preset.label} (${size})`;
}

/** A length in both units, e.g. "3.18 mm (0.125 in)". */
export function formatLength(mm: number): string {
  return `${Number(mm.toFixed(2))} mm (${Number(mmToIn(mm).toFixed(3))} in)`;
}
