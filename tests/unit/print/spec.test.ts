import { describe, expect, it } from "vitest";
import { meetsPpi } from "@/lib/print/check";
import * as api from "@/lib/print";
import * as checkApi from "@/lib/print/check";
import {
  bleedBoxOf,
  pixelsFor,
  PRINT_METHODS,
  safeAreaOf,
  specFieldProblems,
  specOf,
  specProblems,
  trimOf,
  type PrintSpec,
} from "@/lib/print/spec";
import { PRINT_METHODS as DOMAIN_PRINT_METHODS } from "@/lib/domain";
import { effectivePpi, inToMm } from "@/lib/print/units";

const halfLetter: PrintSpec = {
  trimWidthMm: inToMm(5.5),
  trimHeightMm: inToMm(8.5),
  bleedMm: inToMm(0.125),
  safeMarginMm: inToMm(0.25),
  minPpi: 300,
  printMethod: "duplicator",
  inks: ["black"],
};

describe("pixel sizes from the spec (pixels = inches x ppi, Haematologica 'Image resolution' advisor)", () => {
  it("half letter @300: 1650 x 2550 trim, 1725 x 2625 with 1/8 in bleed", () => {
    expect(pixelsFor(trimOf(halfLetter), 300)).toEqual({ widthPx: 1650, heightPx: 2550 });
    expect(pixelsFor(bleedBoxOf(halfLetter), 300)).toEqual({ widthPx: 1725, heightPx: 2625 });
  });

  it("letter @300: 2550 x 3300; with bleed 2625 x 3375", () => {
    const letter = { ...halfLetter, trimWidthMm: inToMm(8.5), trimHeightMm: inToMm(11) };
    expect(pixelsFor(trimOf(letter), 300)).toEqual({ widthPx: 2550, heightPx: 3300 });
    expect(pixelsFor(bleedBoxOf(letter), 300)).toEqual({ widthPx: 2625, heightPx: 3375 });
  });

  it("A5 + 3 mm @300 is 1818.90 x 2551.18 px, so 1819 x 2552 covers it", () => {
    const a5 = { ...halfLetter, trimWidthMm: 148, trimHeightMm: 210, bleedMm: 3 };
    expect(pixelsFor(bleedBoxOf(a5), 300)).toEqual({ widthPx: 1819, heightPx: 2552 });
  });

  it("A4 @300 is 2480.31 x 3507.87 px: we ask for 2481 x 3508, and the usual 2480 x 3508 still passes", () => {
    // gist tojibon/133621d6014a1e13fa1b4aaafa7d79ad: A4 = 2480 x 3508 px at 300 dpi
    expect(pixelsFor({ widthMm: 210, heightMm: 297 }, 300)).toEqual({
      widthPx: 2481,
      heightPx: 3508,
    });
    expect(meetsPpi(effectivePpi(2480, 210), 300)).toBe(true);
    // 2480 px across 8.5 in is 291.76 ppi and fails a 300 ppi check (ppi = pixels ÷ inches,
    // Haematologica "Image resolution" advisor, submit.haematologica.org/image_analysis/advisor/image_resolution.html)
    expect(meetsPpi(effectivePpi(2480, inToMm(8.5)), 300)).toBe(false);
  });

  it("safe area is the trim less the margin on each side", () => {
    const safe = safeAreaOf(halfLetter);
    expect(safe.widthMm).toBeCloseTo(inToMm(5), 9);
    expect(safe.heightMm).toBeCloseTo(inToMm(8), 9);
  });
});

describe("spec sanity", () => {
  it("a sound spec has no problems", () => {
    expect(specProblems(halfLetter)).toEqual([]);
  });

  it("names each problem", () => {
    expect(specProblems({ ...halfLetter, bleedMm: -1, minPpi: 0, inks: [] })).toEqual([
      "The bleed cannot be negative.",
      "The minimum resolution must be greater than zero.",
      "Duplicator printing needs at least one ink.",
    ]);
    // 2 x 80 mm of margin is more than the 139.7 mm width of half letter (5.5 in x 25.4)
    expect(specProblems({ ...halfLetter, safeMarginMm: 80 })).toContain(
      "Safe margins of 80 mm on each side leave no room on the page, whose short side is 139.7 mm.",
    );
  });

  it("margins that exactly meet leave no room; writes lengths in the unit it is given", () => {
    // 2 x 2.75 in = 5.5 in, the whole width of half letter
    const problems = specFieldProblems(
      { ...halfLetter, safeMarginMm: inToMm(2.75) },
      (mm) => `${(mm / 25.4).toFixed(2)} in`,
    );
    expect(problems).toEqual([
      {
        field: "safeMarginMm",
        message:
          "Safe margins of 2.75 in on each side leave no room on the page, whose short side is 5.50 in.",
      },
    ]);
    expect(specProblems({ ...halfLetter, safeMarginMm: inToMm(2.7) })).toEqual([]);
  });
});

describe("specOf: the one spec shape, from an anthology's columns", () => {
  // An anthology row as the database returns it: spec columns among many others.
  const row = {
    id: 12,
    slug: "low-tide-almanac",
    title: "Low Tide Almanac",
    stage: "call-open",
    trimPreset: "half-letter",
    trimWidthMm: inToMm(5.5),
    trimHeightMm: inToMm(8.5),
    bleedMm: inToMm(0.125),
    safeMarginMm: inToMm(0.25),
    binding: "saddle-stitch",
    pageCountTarget: 24,
    minPpi: 300,
    printMethod: "duplicator" as const,
    inks: ["black", "teal"],
    inksPerPass: 1,
    paperCaliperMm: 0.1,
  };

  it("copies the spec columns and nothing else", () => {
    expect(specOf(row)).toEqual({
      trimPreset: "half-letter",
      trimWidthMm: inToMm(5.5),
      trimHeightMm: inToMm(8.5),
      bleedMm: inToMm(0.125),
      safeMarginMm: inToMm(0.25),
      minPpi: 300,
      printMethod: "duplicator",
      inks: ["black", "teal"],
    });
  });

  it("narrows the inks to a piece's or a call's, keeping the anthology's when none are named", () => {
    expect(specOf(row, { inks: ["teal"] }).inks).toEqual(["teal"]);
    expect(specOf(row, { inks: [] }).inks).toEqual(["black", "teal"]);
    expect(specOf(row, { inks: null }).inks).toEqual(["black", "teal"]);
    // A copy: changing the spec's inks leaves the row alone.
    specOf(row).inks.push("red");
    expect(row.inks).toEqual(["black", "teal"]);
  });

  it("a page file holds one page", () => {
    expect(specOf(row, { pagesExpected: 1 }).pagesExpected).toBe(1);
    expect(specOf(row)).not.toHaveProperty("pagesExpected");
  });

  it("gives the same bleed box and pixel size as the worked half-letter values", () => {
    expect(pixelsFor(bleedBoxOf(specOf(row)), 300)).toEqual({ widthPx: 1725, heightPx: 2625 });
  });
});

describe("print methods are listed once", () => {
  it("lib/domain re-exports the engine's list", () => {
    expect(DOMAIN_PRINT_METHODS).toBe(PRINT_METHODS);
  });
});

describe("public API", () => {
  it("index re-exports the names the app relies on", () => {
    for (const name of [
      "MM_PER_INCH",
      "POINTS_PER_INCH",
      "mmToPt",
      "ptToMm",
      "inToMm",
      "mmToIn",
      "TRIM_PRESETS",
      "findPreset",
      "parentSheetFor",
      "fitOnSheet",
      "basisWeightToGsm",
      "gsmToBasisWeight",
      "defaultCaliperMm",
      "shouldScore",
      "planSaddleStitch",
      "locatePage",
      "readerSpreads",
      "creepPerSheetMm",
      "pageShifts",
      "planInkPasses",
      "costTable",
      "compareWithShop",
      "breakEven",
      "finishingTime",
      "planBatches",
    ]) {
      expect(api, name).toHaveProperty(name);
    }
    // The check (sharp, server only) has its own entry point so client bundles never pull it in.
    expect(checkApi).toHaveProperty("checkArtwork");
    expect(checkApi).toHaveProperty("checkArtworkHeader");
    expect(api).not.toHaveProperty("checkArtwork");
  });
});
