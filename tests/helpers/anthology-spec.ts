import type { anthologies } from "@/db/schema";
import { inToMm } from "@/lib/print/units";

type SpecColumns = Omit<typeof anthologies.$inferInsert, "slug" | "title" | "createdBy">;

/**
 * The spec columns of a 16-page half-letter booklet (5.5 x 8.5 in, 1/8 in bleed, 1/4 in safe
 * margin) printed in black and teal on a stencil duplicator: the anthology most tests need.
 */
export const halfLetterDuplicatorSpec: SpecColumns = {
  trimPreset: "half-letter",
  trimWidthMm: inToMm(5.5),
  trimHeightMm: inToMm(8.5),
  bleedMm: inToMm(0.125),
  safeMarginMm: inToMm(0.25),
  binding: "saddle-stitch",
  pageCountTarget: 16,
  maxPages: 32,
  coverStock: "self",
  paperGsm: 90,
  paperCaliperMm: 0.11,
  printMethod: "duplicator",
  inks: ["black", "teal"],
  minPpi: 300,
};
