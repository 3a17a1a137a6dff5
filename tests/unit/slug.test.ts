import { describe, expect, it } from "vitest";
import { isSlug, SLUG_MAX_LENGTH } from "@/lib/slug";
import { slugify } from "@/lib/validations/anthology";

describe("isSlug", () => {
  it("takes the slugs the app makes", () => {
    for (const title of ["Low Tide Almanac #3: Mudflats!", "Écume & Sel", "!!!", "x".repeat(90)])
      expect(isSlug(slugify(title))).toBe(true);
    // A taken slug gets a counter.
    expect(isSlug("low-tide-almanac-2")).toBe(true);
  });

  it("refuses other cases, padding, control characters and stray hyphens", () => {
    for (const value of [
      "",
      "LOW-TIDE-ALMANAC",
      "Low-tide-almanac",
      "low-tide-almanac ",
      " low-tide-almanac",
      "low-tide-almanac\0",
      "low-tide-almanac\t",
      "low-tide-almanac\n",
      "low tide almanac",
      "low--tide",
      "-low-tide",
      "low-tide-",
      "low_tide",
      "low-tide%20",
      "ｌｏｗ-tide", // fullwidth letters a case-insensitive collation may fold
      "café",
    ])
      expect(isSlug(value), JSON.stringify(value)).toBe(false);
  });

  it("refuses a slug longer than the column", () => {
    expect(isSlug("a".repeat(SLUG_MAX_LENGTH))).toBe(true);
    expect(isSlug("a".repeat(SLUG_MAX_LENGTH + 1))).toBe(false);
  });
});
