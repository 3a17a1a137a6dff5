import { describe, expect, it } from "vitest";
import {
  basicSheetAreaM2,
  basisWeightToGsm,
  caliperMmToPoints,
  defaultCaliperMm,
  GRAMS_PER_POUND,
  gsmOf,
  gsmToBasisWeight,
  sheetWeightG,
  shouldScore,
} from "@/lib/print/paper";
import { findPreset } from "@/lib/print/sizes";

describe("grammage and US basis weight", () => {
  it("1 lb = 453.59237 g exactly", () => {
    // International Yard and Pound Agreement (1959)
    expect(GRAMS_PER_POUND).toBe(453.59237);
  });

  it.each([
    // Factors match PrintWiki "Grammage" (printwiki.org/Grammage: 3.760, 2.704, 1.627, 1.480) and
    // sizes.com "Paper: Printing, US" (sizes.com/materials/paperPrintingUS.htm)
    ["bond", 3.75973],
    ["text", 1.48015],
    ["cover", 2.70411],
    ["index", 1.80796],
    ["bristol", 2.19281],
    ["tag", 1.62748],
  ] as const)("%s: 1 lb = %f g/m²", (grade, factor) => {
    expect(basisWeightToGsm(1, grade)).toBeCloseTo(factor, 5);
  });

  it("basic sheet areas: bond 17 x 22 in = 0.241290 m², text 25 x 38 in = 0.612902 m²", () => {
    // PrintWiki "Basic Size"; Rowlett "Basis size for paper"
    expect(basicSheetAreaM2("bond")).toBeCloseTo(0.24129, 6);
    expect(basicSheetAreaM2("text")).toBeCloseTo(0.612902, 6);
    expect(basicSheetAreaM2("cover")).toBeCloseTo(0.335483, 6);
  });

  it("20 lb bond ≈ 75 g/m² (paperspecs.com), 24 lb bond ≈ 90 g/m²", () => {
    expect(basisWeightToGsm(20, "bond")).toBeCloseTo(75.19, 2);
    expect(basisWeightToGsm(24, "bond")).toBeCloseTo(90.23, 2);
  });

  it("24# bond ≈ 60# text ≈ 33# cover (HP LaserJet media guide), within 2 g/m²", () => {
    const bond = basisWeightToGsm(24, "bond");
    expect(Math.abs(bond - basisWeightToGsm(60, "text"))).toBeLessThan(2);
    expect(Math.abs(bond - basisWeightToGsm(33, "cover"))).toBeLessThan(2);
  });

  it('50 lb offset equals 20 lb bond (metaglossary "basis weight"), a trade equivalence good to 2 % (74.01 vs 75.19 g/m²)', () => {
    const ratio = basisWeightToGsm(50, "text") / basisWeightToGsm(20, "bond");
    expect(Math.abs(ratio - 1)).toBeLessThan(0.02);
  });

  it.each([
    // Derived: g/m² = lb x 453.59237 / (500 x W x H x 0.00064516), W x H the grade's basis size in inches
    // (PrintWiki "Basic Size", printwiki.org/Basic_Size)
    [80, "text", 118.41],
    [100, "text", 148.01],
    [65, "cover", 175.77],
    [80, "cover", 216.33],
    [100, "cover", 270.41],
    [90, "index", 162.72],
    [110, "index", 198.88],
  ] as const)("%i lb %s = %f g/m²", (lb, grade, gsm) => {
    expect(basisWeightToGsm(lb, grade)).toBeCloseTo(gsm, 2);
  });

  it("80 g/m² = 21.28 lb bond = 54.05 lb text, and the conversion round-trips", () => {
    expect(gsmToBasisWeight(80, "bond")).toBeCloseTo(21.28, 2);
    expect(gsmToBasisWeight(80, "text")).toBeCloseTo(54.05, 2);
    expect(basisWeightToGsm(gsmToBasisWeight(137, "cover"), "cover")).toBeCloseTo(137, 10);
    expect(gsmOf({ pounds: 65, grade: "cover" })).toBeCloseTo(175.77, 2);
    expect(gsmOf({ gsm: 90 })).toBe(90);
  });
});

describe("sheet weight", () => {
  it("an 80 g/m² A4 sheet weighs about 5 g (Wikipedia 'Grammage')", () => {
    const a4 = findPreset("a4");
    if (!a4) throw new Error("no A4");
    expect(sheetWeightG(a4, 80)).toBeCloseTo(4.99, 2);
  });

  it("a ream of 20 lb bond letter weighs exactly 5 lb, since 17 x 22 in is four letter sheets", () => {
    // Derived: one 17 x 22 in bond basis sheet is exactly four 8.5 x 11 in letter sheets
    const letter = findPreset("letter");
    if (!letter) throw new Error("no letter");
    const gsm = basisWeightToGsm(20, "bond");
    expect(sheetWeightG(letter, gsm)).toBeCloseTo(4.5359, 4);
    expect((500 * sheetWeightG(letter, gsm)) / GRAMS_PER_POUND).toBeCloseTo(5, 10);
  });
});

describe("caliper", () => {
  it("75 g/m² copy paper defaults near the measured 0.103 mm (Physics Factbook), within 5 %", () => {
    expect(Math.abs(defaultCaliperMm(75) / 0.103 - 1)).toBeLessThan(0.05);
  });

  it("80 g/m² writing paper defaults near 4 points = 0.004 in (prepressure.com 'caliper'), within 6 %", () => {
    expect(Math.abs(caliperMmToPoints(defaultCaliperMm(80)) / 4 - 1)).toBeLessThan(0.06);
  });

  it("heavier stock is thicker", () => {
    expect(defaultCaliperMm(216)).toBeGreaterThan(defaultCaliperMm(80));
  });
});

describe("scoring", () => {
  it("score from 150 g/m² (Condat: 'scoring is recommended for all paper weights upwards of 150 g/m²')", () => {
    expect(shouldScore(150)).toBe(true);
    expect(shouldScore(149)).toBe(false);
    expect(shouldScore(80)).toBe(false);
  });

  it("65 lb cover (175.77 g/m²) should be scored; 80 lb text (118.41 g/m²) need not", () => {
    // common practice, no source: heavy cover stock is scored before folding so it does not crack
    expect(shouldScore(basisWeightToGsm(65, "cover"))).toBe(true);
    expect(shouldScore(basisWeightToGsm(80, "text"))).toBe(false);
  });
});
