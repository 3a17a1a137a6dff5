import { z } from "zod";
import { findPreset } from "@/lib/print/sizes";
import type { AnthologySpec } from "@/lib/print/spec-change";
import { mmToIn, roundTo } from "@/lib/print/units";
import { refineSpec, specFields, TRIM_CHOICES, type TrimChoice } from "./anthology";

/**
 * What the spec screen sends: the new-anthology form's spec fields with the same rules, and
 * `confirm` once the editor has read the warnings the change brings.
 */
export const specEditSchema = specFields
  .extend({ confirm: z.boolean().optional().default(false) })
  .superRefine(refineSpec);

export type SpecEditInput = z.input<typeof specEditSchema>;
export type SpecEditParsed = z.output<typeof specEditSchema>;

/** Whether a length is a whole number of 64ths of an inch, the way inch lengths are given. */
const inInches = (mm: number) => {
  const parts = mmToIn(mm) * 64;
  return Math.abs(parts - Math.round(parts)) < 1e-6;
};

/**
 * The form's values for a stored spec: the preset when it is one the form offers (otherwise the
 * size as a custom trim), turned the way the page is, with lengths in inches when the trim is an
 * inch trim and every length is a plain fraction of an inch, and in millimetres otherwise, so
 * what the form shows is what was typed.
 */
export function specInputFromAnthology(spec: AnthologySpec): SpecEditInput {
  const offered = (TRIM_CHOICES as readonly string[]).includes(spec.trimPreset);
  const trimChoice = (offered ? spec.trimPreset : "custom") as TrimChoice;
  const custom = trimChoice === "custom";
  const inchTrim = custom
    ? inInches(spec.trimWidthMm) && inInches(spec.trimHeightMm)
    : findPreset(trimChoice)?.inches !== undefined;
  const unit: "in" | "mm" =
    inchTrim && inInches(spec.bleedMm) && inInches(spec.safeMarginMm) ? "in" : "mm";
  const length = (mm: number) => (unit === "in" ? roundTo(mmToIn(mm), 6) : roundTo(mm, 3));
  return {
    trimChoice,
    orientation: spec.trimWidthMm > spec.trimHeightMm ? "landscape" : "portrait",
    unit,
    ...(custom
      ? { customWidth: length(spec.trimWidthMm), customHeight: length(spec.trimHeightMm) }
      : {}),
    bleed: length(spec.bleedMm),
    safeMargin: length(spec.safeMarginMm),
    binding: spec.binding,
    pageCountTarget: spec.pageCountTarget,
    maxPages: spec.maxPages,
    coverStock: spec.coverStock,
    ...(spec.coverPaperGsm !== null ? { coverPaperGsm: spec.coverPaperGsm } : {}),
    paperGsm: spec.paperGsm,
    paperCaliperMm: spec.paperCaliperMm,
    printMethod: spec.printMethod,
    inks: [...spec.inks],
    inksPerPass: spec.inksPerPass,
    minPpi: spec.minPpi,
  };
}
