import { describe, expect, it } from "vitest";
import { formatTrim, sizeInBothUnits } from "@/lib/format";

// 1 in = 25.4 mm exactly (International Yard and Pound Agreement, 1959).
describe("formatTrim", () => {
  it("shows a custom trim typed in inches in both units, so the inches read back", () => {
    // 5 x 7 in = 127 x 177.8 mm
    expect(formatTrim({ trimPreset: "custom", trimWidthMm: 127, trimHeightMm: 177.8 })).toBe(
      "127 x 177.8 mm (5 x 7 in)",
    );
  });

  it("shows a custom trim typed in millimetres in both units", () => {
    // 120 / 25.4 = 4.7244 in; 170 / 25.4 = 6.6929 in
    expect(formatTrim({ trimPreset: "custom", trimWidthMm: 120, trimHeightMm: 170 })).toBe(
      "120 x 170 mm (4.724 x 6.693 in)",
    );
  });

  it("names a preset by its label, with the metric size for a metric preset", () => {
    // ANSI half letter = 5.5 x 8.5 in = 139.7 x 215.9 mm; ISO 216: A5 = 148 x 210 mm
    expect(formatTrim({ trimPreset: "half-letter", trimWidthMm: 139.7, trimHeightMm: 215.9 })).toBe(
      "Half letter (5.5 x 8.5 in)",
    );
    expect(formatTrim({ trimPreset: "a5", trimWidthMm: 148, trimHeightMm: 210 })).toContain(
      "148 x 210 mm",
    );
  });
});

describe("sizeInBothUnits", () => {
  it("puts either unit first", () => {
    // 1/8 in bleed on half letter: 5.75 x 8.75 in = 146.05 x 222.25 mm
    expect(sizeInBothUnits(146.05, 222.25, true)).toBe("5.75 x 8.75 in (146.05 x 222.25 mm)");
    expect(sizeInBothUnits(146.05, 222.25)).toBe("146.05 x 222.25 mm (5.75 x 8.75 in)");
  });
});
