import { describe, expect, it } from "vitest";
import { keepUnchangedLengths, type AnthologySpec } from "@/lib/print/spec-change";
import { inToMm } from "@/lib/print/units";
import { anthologySpecFromInput } from "@/lib/validations/anthology";
import { specEditSchema, specInputFromAnthology } from "@/lib/validations/spec-edit";

const base: Omit<AnthologySpec, "trimPreset" | "trimWidthMm" | "trimHeightMm"> = {
  bleedMm: 3,
  safeMarginMm: 5,
  minPpi: 300,
  printMethod: "duplicator",
  inks: ["black", "teal"],
  inksPerPass: 1,
  binding: "saddle-stitch",
  pageCountTarget: 16,
  maxPages: 32,
  paperGsm: 90,
  paperCaliperMm: 0.11,
  coverStock: "self",
  coverPaperGsm: null,
};

/** The stored spec, shown in the form, sent back untouched: what the server would save. */
function roundTrip(spec: AnthologySpec) {
  const input = specInputFromAnthology(spec);
  const parsed = specEditSchema.parse(input);
  return { input, saved: keepUnchangedLengths(spec, anthologySpecFromInput(parsed)) };
}

describe("the spec screen starts from the spec as stored", () => {
  it("a half-letter booklet shows in inches and comes back unchanged", () => {
    const halfLetter: AnthologySpec = {
      ...base,
      trimPreset: "half-letter",
      // Half letter is 5.5 x 8.5 in; 1/8 in bleed and 1/4 in safe margin.
      trimWidthMm: inToMm(5.5),
      trimHeightMm: inToMm(8.5),
      bleedMm: inToMm(0.125),
      safeMarginMm: inToMm(0.25),
    };
    const { input, saved } = roundTrip(halfLetter);
    expect(input).toMatchObject({
      trimChoice: "half-letter",
      unit: "in",
      orientation: "portrait",
      bleed: 0.125,
      safeMargin: 0.25,
    });
    expect(saved).toEqual(halfLetter);
  });

  it("an A5 booklet shows in millimetres, a landscape one turned", () => {
    // ISO 216: A5 = 148 x 210 mm.
    const a5: AnthologySpec = { ...base, trimPreset: "a5", trimWidthMm: 210, trimHeightMm: 148 };
    const { input, saved } = roundTrip(a5);
    expect(input).toMatchObject({
      trimChoice: "a5",
      unit: "mm",
      orientation: "landscape",
      bleed: 3,
    });
    expect(saved).toEqual(a5);
  });

  it("a custom size comes back as typed, in the unit it was typed in", () => {
    const mm: AnthologySpec = {
      ...base,
      trimPreset: "custom",
      trimWidthMm: 120,
      trimHeightMm: 170,
    };
    expect(roundTrip(mm).input).toMatchObject({ unit: "mm", customWidth: 120, customHeight: 170 });
    expect(roundTrip(mm).saved).toEqual(mm);
    // 7 x 9 in with 1/8 in bleed and 1/4 in safe margin: all in inches.
    const inches: AnthologySpec = {
      ...base,
      trimPreset: "custom",
      trimWidthMm: inToMm(7),
      trimHeightMm: inToMm(9),
      bleedMm: inToMm(0.125),
      safeMarginMm: inToMm(0.25),
    };
    expect(roundTrip(inches).input).toMatchObject({
      unit: "in",
      customWidth: 7,
      customHeight: 9,
      bleed: 0.125,
    });
    expect(roundTrip(inches).saved).toEqual(inches);
    // The same trim with a 3 mm bleed reads in millimetres: 7 x 9 in = 177.8 x 228.6 mm.
    const mixed: AnthologySpec = { ...inches, bleedMm: 3, safeMarginMm: 5 };
    expect(roundTrip(mixed).input).toMatchObject({
      unit: "mm",
      customWidth: 177.8,
      customHeight: 228.6,
      bleed: 3,
    });
    expect(roundTrip(mixed).saved).toEqual(mixed);
  });

  it("a separate cover keeps its weight", () => {
    const covered: AnthologySpec = {
      ...base,
      trimPreset: "a5",
      trimWidthMm: 148,
      trimHeightMm: 210,
      coverStock: "separate",
      coverPaperGsm: 250,
    };
    expect(roundTrip(covered).saved).toEqual(covered);
  });
});

describe("the spec screen's schema is the new-anthology form's", () => {
  const valid = specInputFromAnthology({
    ...base,
    trimPreset: "a5",
    trimWidthMm: 148,
    trimHeightMm: 210,
  });

  it("confirm is optional and false unless sent", () => {
    expect(specEditSchema.parse(valid).confirm).toBe(false);
    expect(specEditSchema.parse({ ...valid, confirm: true }).confirm).toBe(true);
  });

  it("keeps the cross-field rules: pages in fours for a saddle stitch, no more than the most", () => {
    // common practice, no source: every folded sheet carries 4 pages.
    const odd = specEditSchema.safeParse({ ...valid, pageCountTarget: 18 });
    expect(odd.success).toBe(false);
    expect(odd.error?.issues[0]?.path).toEqual(["pageCountTarget"]);
    const over = specEditSchema.safeParse({ ...valid, pageCountTarget: 40, maxPages: 32 });
    expect(over.error?.issues.map((i) => i.path[0])).toContain("maxPages");
  });
});
