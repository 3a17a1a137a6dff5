import { describe, expect, it } from "vitest";
import {
  effectivePpi,
  inToMm,
  MM_PER_INCH,
  mmToIn,
  mmToPt,
  POINTS_PER_INCH,
  ppiToPpm,
  ppmToPpi,
  ptToMm,
} from "@/lib/print/units";

describe("exact unit conversions", () => {
  it("1 in = 25.4 mm exactly", () => {
    // NBS Circular 572 addendum (1960): "1 inch equals 25.4 millimeters"
    expect(MM_PER_INCH).toBe(25.4);
    expect(inToMm(1)).toBe(25.4);
    expect(mmToIn(25.4)).toBe(1);
  });

  it("1 PDF point = 1/72 in", () => {
    // ISO 32000-1:2008 Table 30, UserUnit default: "user space unit is 1/72 inch"
    expect(POINTS_PER_INCH).toBe(72);
    expect(ptToMm(72)).toBe(25.4);
    expect(ptToMm(1)).toBeCloseTo(0.352777778, 9);
  });

  it("bleeds in points (derived: 1 in = 25.4 mm, NBS Circular 572 Addendum; 1 pt = 1/72 in, ISO 32000-1 Table 30)", () => {
    expect(mmToPt(3)).toBeCloseTo(8.50394, 5);
    expect(mmToPt(5)).toBeCloseTo(14.17323, 5);
    expect(mmToPt(inToMm(0.125))).toBeCloseTo(9, 12); // 0.125 in = 9 pt exactly
    expect(inToMm(0.125)).toBe(3.175);
  });

  it("letter is 612 x 792 pt", () => {
    // CSS Paged Media: letter = 8.5 in x 11 in; x72 = 612 x 792 pt
    expect(mmToPt(inToMm(8.5))).toBeCloseTo(612, 9);
    expect(mmToPt(inToMm(11))).toBeCloseTo(792, 9);
  });

  it("PNG pHYs: ppi = ppm x 0.0254", () => {
    // PNG 1.2: "One inch is equal to exactly 0.0254 meters"
    expect(ppmToPpi(11811)).toBeCloseTo(299.9994, 4);
    expect(ppiToPpm(300)).toBeCloseTo(11811.0236, 4);
  });

  it("effective ppi = pixels / printed inches", () => {
    // Haematologica image advisor: "900 pixels / 300ppi = 3 inches wide"
    expect(effectivePpi(900, inToMm(3))).toBeCloseTo(300, 9);
    // Derived by the same rule: 1200 px across 5 in = 240 ppi; 1748 px across 148 mm = 299.995 ppi
    expect(effectivePpi(1200, inToMm(5))).toBeCloseTo(240, 9);
    expect(effectivePpi(1748, 148)).toBeCloseTo(299.995, 3);
    expect(effectivePpi(2480, inToMm(8.5))).toBeCloseTo(291.76, 2);
  });
});
