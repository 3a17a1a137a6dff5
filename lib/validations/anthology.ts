import { z } from "zod";
import { BINDINGS, COVER_STOCKS, PRINT_METHODS } from "@/lib/domain";
import { lengthInUnit } from "@/lib/format";
import { CURRENCIES, DEFAULT_CURRENCY } from "@/lib/money";
import { defaultCaliperMm } from "@/lib/print/paper";
import { findPreset } from "@/lib/print/sizes";
import { specFieldProblems, type SpecField } from "@/lib/print/spec";
import { inToMm } from "@/lib/print/units";
import { emailSchema } from "./account";
import { INK_NAME_MAX, INKS_MAX, LENGTH, TEXT_CAP } from "./limits";
import { multiLineText, singleLineText } from "./text";

/** Trim choices the new-anthology form offers, in the order shown; "custom" takes a size. */
export const TRIM_CHOICES = [
  "a5",
  "a6",
  "half-letter",
  "quarter-letter",
  "letter",
  "4x6in",
  "5x5in",
  "5x6in",
  "3.5x4.5in",
  "4.5x6in",
  "custom",
] as const;
export type TrimChoice = (typeof TRIM_CHOICES)[number];

const optionalNumber = z.preprocess(
  (v) => (v === "" || v === null ? undefined : v),
  z.coerce.number().optional(),
);

/**
 * Bleed beyond this is a slip of the unit rather than a bleed (1/8 in and 3 mm are the usual
 * bleeds; common practice, no source). Judged in millimetres, whatever unit the editor typed.
 */
export const USUAL_MAX_BLEED_MM = 25;
/** Safe margins beyond this are a slip of the unit too (common practice, no source). */
export const USUAL_MAX_SAFE_MARGIN_MM = 50;

/** The form's fields; lengths in the unit the editor chose. */
const anthologyFields = z.object({
  title: singleLineText(LENGTH.anthologyTitle).min(2, "Give the anthology a title"),
  pressName: singleLineText(LENGTH.pressName).optional().default(""),
  summary: multiLineText(TEXT_CAP.anthologySummary).optional().default(""),
  // The currency fees and payouts are kept in (ISO 4217); chosen once, at creation.
  currency: z
    .enum(CURRENCIES, { error: "Choose a currency from the list" })
    .default(DEFAULT_CURRENCY),
  trimChoice: z.enum(TRIM_CHOICES, { error: "Choose a trim size" }),
  orientation: z.enum(["portrait", "landscape"]).default("portrait"),
  unit: z.enum(["mm", "in"]).default("mm"),
  customWidth: optionalNumber,
  customHeight: optionalNumber,
  // Bounds on bleed and safe margin depend on the unit: they are judged in millimetres below.
  bleed: z.coerce.number({ error: "Bleed must be a number" }),
  safeMargin: z.coerce.number({ error: "Safe margin must be a number" }),
  binding: z.enum(BINDINGS),
  pageCountTarget: z.coerce
    .number()
    .int("Whole pages only")
    .min(4, "At least 4 pages")
    .max(400, "At most 400 pages"),
  maxPages: z.coerce.number().int("Whole pages only").min(4).max(400, "At most 400 pages"),
  coverStock: z.enum(COVER_STOCKS),
  coverPaperGsm: optionalNumber.pipe(z.number().int().min(60).max(500).optional()),
  paperGsm: z.coerce
    .number()
    .int("Whole grams only")
    .min(35, "Paper under 35 gsm is tissue")
    .max(400, "Over 400 gsm is board"),
  paperCaliperMm: optionalNumber.pipe(
    z.number().min(0.03, "Caliper under 0.03 mm: check the unit").max(1).optional(),
  ),
  printMethod: z.enum(PRINT_METHODS),
  inks: z
    .array(singleLineText(INK_NAME_MAX).min(1))
    .min(1, "Name at least one ink")
    .max(INKS_MAX, `At most ${INKS_MAX} inks`),
  inksPerPass: z.coerce.number().int().min(1).max(8).default(1),
  minPpi: z.coerce.number().int().min(72, "Below 72 ppi nothing prints well").max(2400),
});
type AnthologyFields = z.output<typeof anthologyFields>;

/**
 * The form inputs a spec problem is shown beside. Only the lengths: resolution and inks have
 * stricter rules of their own in the fields above (at least 72 ppi, at least one ink).
 */
const SPEC_FIELD_INPUTS: Partial<Record<SpecField, keyof AnthologyFields>> = {
  bleedMm: "bleed",
  safeMarginMm: "safeMargin",
};

/** The print spec's fields: all but the title, press name and summary (the spec screen edits these). */
export const specFields = anthologyFields.omit({
  title: true,
  pressName: true,
  summary: true,
  currency: true,
});
type SpecFieldValues = z.output<typeof specFields>;
export type SpecFieldsInput = z.input<typeof specFields>;

/** The spec's rules across fields, shared by the new-anthology form and the spec screen. */
export function refineSpec(v: SpecFieldValues, ctx: z.RefinementCtx): void {
  if (v.trimChoice === "custom") {
    const max = v.unit === "mm" ? 1200 : 48;
    for (const key of ["customWidth", "customHeight"] as const) {
      const value = v[key];
      if (value === undefined || !(value > 0)) {
        ctx.addIssue({ code: "custom", path: [key], message: "Enter the custom size" });
      } else if (value > max) {
        ctx.addIssue({ code: "custom", path: [key], message: `At most ${max} ${v.unit}` });
      }
    }
  }
  if (v.binding === "saddle-stitch" && v.pageCountTarget % 4 !== 0) {
    const down = Math.max(4, v.pageCountTarget - (v.pageCountTarget % 4));
    ctx.addIssue({
      code: "custom",
      path: ["pageCountTarget"],
      // common practice, no source: every folded sheet carries 4 pages.
      message: `A saddle-stitched booklet has a multiple of 4 pages: try ${down} or ${down + 4}`,
    });
  }
  if (v.pageCountTarget > v.maxPages) {
    ctx.addIssue({
      code: "custom",
      path: ["maxPages"],
      message: "The most pages must be at least the page count",
    });
  }
  if (v.coverStock === "separate" && v.coverPaperGsm === undefined) {
    ctx.addIssue({
      code: "custom",
      path: ["coverPaperGsm"],
      message: "Give the cover stock's weight in gsm",
    });
  }
  if (new Set(v.inks.map((i) => i.toLowerCase())).size !== v.inks.length) {
    ctx.addIssue({ code: "custom", path: ["inks"], message: "Each ink once" });
  }
  const lengths = lengthsInMm(v);
  if (!lengths) return;
  // In millimetres after conversion, written back in the editor's unit with the millimetres.
  const length = (mm: number) => lengthInUnit(mm, v.unit);
  if (lengths.bleedMm > USUAL_MAX_BLEED_MM)
    ctx.addIssue({
      code: "custom",
      path: ["bleed"],
      message: `A bleed of ${length(lengths.bleedMm)} is over ${USUAL_MAX_BLEED_MM} mm, which is unusual: check the unit`,
    });
  if (lengths.safeMarginMm > USUAL_MAX_SAFE_MARGIN_MM)
    ctx.addIssue({
      code: "custom",
      path: ["safeMargin"],
      message: `A safe margin of ${length(lengths.safeMarginMm)} is over ${USUAL_MAX_SAFE_MARGIN_MM} mm, which is unusual: check the unit`,
    });
  // The rules a sound spec follows (lib/print/spec), so a call that cannot open is never created.
  const spec = { ...lengths, minPpi: v.minPpi, printMethod: v.printMethod, inks: v.inks };
  for (const problem of specFieldProblems(spec, length)) {
    const input = SPEC_FIELD_INPUTS[problem.field];
    if (input) ctx.addIssue({ code: "custom", path: [input], message: problem.message });
  }
}

/** What the new-anthology form sends and the route handler accepts; lengths in the chosen unit. */
export const anthologyInputSchema = anthologyFields.superRefine(refineSpec);

export type AnthologyInput = z.input<typeof anthologyInputSchema>;
export type AnthologyParsed = z.output<typeof anthologyInputSchema>;

/**
 * Trim (turned to the orientation), bleed and safe margin in millimetres; null while a custom
 * size is missing or not above zero.
 */
function lengthsInMm(
  v: Pick<
    AnthologyFields,
    "trimChoice" | "orientation" | "unit" | "customWidth" | "customHeight" | "bleed" | "safeMargin"
  >,
): { trimWidthMm: number; trimHeightMm: number; bleedMm: number; safeMarginMm: number } | null {
  const toMm = (value: number) => (v.unit === "in" ? inToMm(value) : value);
  let widthMm: number;
  let heightMm: number;
  if (v.trimChoice === "custom") {
    const { customWidth: w, customHeight: h } = v;
    if (w === undefined || h === undefined || !(w > 0) || !(h > 0)) return null;
    widthMm = toMm(w);
    heightMm = toMm(h);
  } else {
    const preset = findPreset(v.trimChoice);
    if (!preset) throw new Error(`unknown trim preset ${v.trimChoice}`);
    widthMm = preset.widthMm;
    heightMm = preset.heightMm;
  }
  const [shortMm, longMm] = widthMm <= heightMm ? [widthMm, heightMm] : [heightMm, widthMm];
  const landscape = v.orientation === "landscape";
  return {
    trimWidthMm: landscape ? longMm : shortMm,
    trimHeightMm: landscape ? shortMm : longMm,
    bleedMm: toMm(v.bleed),
    safeMarginMm: toMm(v.safeMargin),
  };
}

/** The spec columns of an anthology, in millimetres, from validated form input. */
export function anthologySpecFromInput(v: SpecFieldValues) {
  const lengths = lengthsInMm(v);
  if (!lengths) throw new Error("a custom trim needs a width and a height above zero");
  return {
    trimPreset: v.trimChoice,
    ...lengths,
    binding: v.binding,
    pageCountTarget: v.pageCountTarget,
    maxPages: v.maxPages,
    coverStock: v.coverStock,
    coverPaperGsm: v.coverStock === "separate" ? (v.coverPaperGsm ?? null) : null,
    paperGsm: v.paperGsm,
    paperCaliperMm: v.paperCaliperMm ?? Number(defaultCaliperMm(v.paperGsm).toFixed(3)),
    printMethod: v.printMethod,
    inks: v.inks,
    inksPerPass: v.inksPerPass,
    minPpi: v.minPpi,
  };
}

/** A URL-safe slug from a title: lowercase words joined by hyphens. */
export function slugify(title: string): string {
  const slug = title
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 60);
  return slug || "anthology";
}

export const inviteSchema = z.object({
  email: emailSchema,
  role: z.enum(["lead", "editor", "finisher", "contributor"], { error: "Choose a role" }),
});
