import { describe, expect, it } from "vitest";
import { anthologyInputSchema, anthologySpecFromInput, slugify } from "@/lib/validations/anthology";

const base = {
  title: "Salt and Static",
  trimChoice: "half-letter",
  orientation: "portrait",
  unit: "in",
  bleed: 0.125,
  safeMargin: 0.25,
  binding: "saddle-stitch",
  pageCountTarget: 24,
  maxPages: 48,
  coverStock: "self",
  paperGsm: 90,
  printMethod: "duplicator",
  inks: ["black", "teal"],
  minPpi: 300,
};

const parse = (patch: Record<string, unknown>) =>
  anthologyInputSchema.safeParse({ ...base, ...patch });
const messages = (patch: Record<string, unknown>) => {
  const result = parse(patch);
  return result.success
    ? {}
    : Object.fromEntries(result.error.issues.map((i) => [i.path.join("."), i.message]));
};

describe("anthology spec input", () => {
  it("stores half letter as 5.5 x 8.5 in in millimetres", () => {
    const result = parse({});
    expect(result.success).toBe(true);
    const spec = anthologySpecFromInput(result.data!);
    // ANSI/ASME Y14.1 and CSS Paged Media: letter = 8.5 x 11 in; folded once = 5.5 x 8.5 in (common practice, no source)
    expect(spec.trimWidthMm).toBeCloseTo(139.7, 6);
    expect(spec.trimHeightMm).toBeCloseTo(215.9, 6);
    // NBS Circular 572: 1 in = 25.4 mm exactly, so 0.125 in = 3.175 mm
    expect(spec.bleedMm).toBeCloseTo(3.175, 9);
    expect(spec.safeMarginMm).toBeCloseTo(6.35, 9);
  });

  it("takes A5 from ISO 216 and turns it for landscape", () => {
    const result = parse({
      trimChoice: "a5",
      orientation: "landscape",
      unit: "mm",
      bleed: 3,
      safeMargin: 5,
    });
    const spec = anthologySpecFromInput(result.data!);
    // ISO 216: A5 = 148 x 210 mm
    expect([spec.trimWidthMm, spec.trimHeightMm]).toEqual([210, 148]);
    expect(spec.bleedMm).toBe(3);
  });

  it("accepts a custom 4 x 6 in trim (common practice, no source: a usual zine size)", () => {
    const result = parse({ trimChoice: "custom", customWidth: 4, customHeight: 6 });
    const spec = anthologySpecFromInput(result.data!);
    expect(spec.trimWidthMm).toBeCloseTo(101.6, 9);
    expect(spec.trimHeightMm).toBeCloseTo(152.4, 9);
  });

  it("asks for the size of a custom trim", () => {
    expect(messages({ trimChoice: "custom" })).toMatchObject({
      customWidth: "Enter the custom size",
      customHeight: "Enter the custom size",
    });
  });

  it("wants a multiple of 4 pages for saddle stitch, suggesting the neighbours", () => {
    // A sheet folded once carries 4 pages (common practice, no source).
    expect(messages({ pageCountTarget: 22 }).pageCountTarget).toBe(
      "A saddle-stitched booklet has a multiple of 4 pages: try 20 or 24",
    );
    expect(parse({ binding: "fold-only", pageCountTarget: 6, maxPages: 8 }).success).toBe(true);
  });

  it("refuses more pages than the binding allows, and a separate cover without its weight", () => {
    expect(messages({ pageCountTarget: 52 }).maxPages).toBeDefined();
    expect(messages({ coverStock: "separate" }).coverPaperGsm).toBe(
      "Give the cover stock's weight in gsm",
    );
  });

  it("estimates the caliper from the weight when none is given", () => {
    const spec = anthologySpecFromInput(parse({}).data!);
    expect(spec.paperCaliperMm).toBeGreaterThan(0.05);
    expect(spec.paperCaliperMm).toBeLessThan(0.2);
    expect(anthologySpecFromInput(parse({ paperCaliperMm: 0.104 }).data!).paperCaliperMm).toBe(
      0.104,
    );
  });

  it("refuses duplicate inks and an empty ink list", () => {
    expect(messages({ inks: ["black", "Black"] }).inks).toBe("Each ink once");
    expect(messages({ inks: [] }).inks).toBe("Name at least one ink");
  });

  it("judges bleed in millimetres after converting the unit: 24 in is refused, naming both units", () => {
    // NBS Circular 572: 1 in = 25.4 mm exactly, so 24 in = 609.6 mm, far past a 25 mm bleed
    expect(messages({ unit: "in", bleed: 24 }).bleed).toBe(
      "A bleed of 24 in (609.6 mm) is over 25 mm, which is unusual: check the unit",
    );
    // 1 in = 25.4 mm is just over too; 24 mm typed in millimetres is not
    expect(messages({ unit: "in", bleed: 1 }).bleed).toBe(
      "A bleed of 1 in (25.4 mm) is over 25 mm, which is unusual: check the unit",
    );
    expect(parse({ unit: "mm", trimChoice: "a5", bleed: 24, safeMargin: 5 }).success).toBe(true);
    expect(messages({ unit: "mm", trimChoice: "a5", bleed: 30, safeMargin: 5 }).bleed).toBe(
      "A bleed of 30 mm is over 25 mm, which is unusual: check the unit",
    );
  });

  it("accepts the usual 1/8 in bleed and stores it as 3.175 mm", () => {
    // Wikipedia "Bleed (printing)": 1/8 in is the usual US bleed; 0.125 x 25.4 = 3.175 mm
    const result = parse({ unit: "in", bleed: 0.125 });
    expect(result.success).toBe(true);
    expect(anthologySpecFromInput(result.data!).bleedMm).toBeCloseTo(3.175, 9);
  });

  it("judges safe margins in millimetres too: 2.5 in is over 50 mm", () => {
    // 2.5 in = 63.5 mm (NBS Circular 572); 2 in = 50.8 mm
    expect(messages({ unit: "in", safeMargin: 2.5 }).safeMargin).toBe(
      "A safe margin of 2.5 in (63.5 mm) is over 50 mm, which is unusual: check the unit",
    );
  });

  it("refuses safe margins that leave no room on the page when the anthology is created", () => {
    // 3.5 x 4.5 in trim (common practice, no source): 1.75 in margins each side use the whole 3.5 in width
    const cramped = messages({ trimChoice: "3.5x4.5in", unit: "in", safeMargin: 1.75 });
    expect(cramped.safeMargin).toBe(
      "Safe margins of 1.75 in (44.45 mm) on each side leave no room on the page, whose short side is 3.5 in (88.9 mm).",
    );
    // Turned landscape, the short side is still 3.5 in
    expect(
      messages({
        trimChoice: "3.5x4.5in",
        orientation: "landscape",
        unit: "in",
        safeMargin: 1.75,
      }).safeMargin,
    ).toMatch(/leave no room on the page/);
    // A custom 60 x 90 mm card with 30 mm margins: nothing left across its 60 mm width
    expect(
      messages({
        trimChoice: "custom",
        unit: "mm",
        customWidth: 60,
        customHeight: 90,
        bleed: 3,
        safeMargin: 30,
      }).safeMargin,
    ).toBe(
      "Safe margins of 30 mm on each side leave no room on the page, whose short side is 60 mm.",
    );
    expect(parse({ trimChoice: "3.5x4.5in", unit: "in", safeMargin: 0.25 }).success).toBe(true);
  });

  it("refuses a negative bleed or safe margin in either unit", () => {
    expect(messages({ unit: "in", bleed: -0.125 }).bleed).toBe("The bleed cannot be negative.");
    expect(messages({ unit: "mm", trimChoice: "a5", bleed: 3, safeMargin: -1 }).safeMargin).toBe(
      "The safe margin cannot be negative.",
    );
  });

  it("keeps the collective's currency, USD unless another is chosen", () => {
    const euro = parse({ currency: "EUR" });
    expect(euro.success && euro.data.currency).toBe("EUR");
    const none = parse({});
    expect(none.success && none.data.currency).toBe("USD");
  });

  it("refuses a currency outside the list, or not as ISO 4217 writes it", () => {
    // ISO 4217: JPY has no minor unit, so it cannot be kept in cents; codes are upper case.
    for (const currency of ["JPY", "eur", "XYZ", "€"]) {
      const result = parse({ currency });
      expect(result.success, currency).toBe(false);
      if (!result.success)
        expect(result.error.issues[0]?.message).toBe("Choose a currency from the list");
    }
  });

  it("makes slugs from titles", () => {
    expect(slugify("Low Tide Almanac #3: Mudflats!")).toBe("low-tide-almanac-3-mudflats");
    expect(slugify("Écume & Sel")).toBe("ecume-sel");
    expect(slugify("!!!")).toBe("anthology");
  });
});

describe("lengths shown to people", () => {
  it("shows 1/8 in bleed as 3.175 mm, not a float-rounded 3.17", async () => {
    const { formatLength, mmText } = await import("@/lib/format");
    // NBS Circular 572: 1 in = 25.4 mm exactly, so 0.125 in = 3.175 mm and 8.5 in = 215.9 mm
    expect(formatLength(inToMmForTest(0.125))).toBe("3.175 mm (0.125 in)");
    expect(mmText(inToMmForTest(8.5))).toBe("215.9");
    // ISO 216: A5 = 148 x 210 mm
    expect(mmText(148)).toBe("148");
  });
});

function inToMmForTest(inches: number): number {
  return inches * 25.4;
}
