import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { readDeclaredDensity } from "@/lib/print/check";
import { jfifSegment, makePng, makeTiff, physData, withJfif } from "./fixtures";

describe("PNG pHYs density table (ISO/IEC 15948:2003 = PNG (W3C, 2nd ed.) §11.3.5.3 pHYs; PNG 1.2: 1 in = 0.0254 m exactly)", () => {
  it.each([
    [72, 2835, 72.009],
    [96, 3780, 96.012],
    [150, 5906, 150.0124],
    [300, 11811, 299.9994],
    [600, 23622, 599.9988],
    [1200, 47244, 1199.9976],
  ])("%i ppi is stored as %i px/m and reads back as %f ppi", (ppi, stored, back) => {
    // ppm = ppi ÷ 0.0254, stored rounded
    expect(Math.round(ppi / 0.0254)).toBe(stored);
    const png = makePng(4, 4, undefined, { phys: physData(stored, stored, 1) });
    const d = readDeclaredDensity(png, "png");
    expect(d?.unit).toBe("metre");
    expect(d?.xPpi).toBeCloseTo(back, 4);
    expect(d?.yPpi).toBeCloseTo(back, 4);
  });

  it("sharp rounds the same pHYs to a whole 300 (sharp docs: density in DPI), which is why we read it ourselves", async () => {
    const png = makePng(4, 4, undefined, { phys: physData(11811, 11811, 1) });
    expect((await sharp(png).metadata()).density).toBe(300);
    expect(readDeclaredDensity(png, "png")?.xPpi).not.toBe(300);
  });

  it("unit 0 gives an aspect ratio only, no density; no pHYs gives null", () => {
    const aspect = makePng(4, 4, undefined, { phys: physData(2, 1, 0) });
    expect(readDeclaredDensity(aspect, "png")).toEqual({
      xPpi: null,
      yPpi: null,
      source: "png-phys",
      unit: "none",
    });
    expect(readDeclaredDensity(makePng(4, 4), "png")).toBeNull();
  });
});

describe("JFIF APP0 density (JFIF 1.02 p. 5: units 0 none, 1 dpi, 2 dots/cm)", () => {
  const base = async () =>
    sharp({ create: { width: 8, height: 8, channels: 3, background: "#808080" } })
      .jpeg()
      .toBuffer();

  it("units 1, 300 x 300 → 300 ppi", async () => {
    const d = readDeclaredDensity(withJfif(await base(), jfifSegment(1, 300, 300)), "jpeg");
    expect(d).toEqual({ xPpi: 300, yPpi: 300, source: "jfif", unit: "inch" });
  });

  it("units 2, 118 dots/cm → 299.72 ppi (JFIF 1.02, E. Hamilton 1992, p. 5: units 2 = dots per cm; x 2.54)", async () => {
    const d = readDeclaredDensity(withJfif(await base(), jfifSegment(2, 118, 118)), "jpeg");
    expect(d?.xPpi).toBeCloseTo(299.72, 2);
    expect(d?.unit).toBe("cm");
  });

  it("units 0 → aspect ratio only", async () => {
    const d = readDeclaredDensity(withJfif(await base(), jfifSegment(0, 1, 1)), "jpeg");
    expect(d?.xPpi).toBeNull();
  });
});

describe("TIFF resolution tags 282/283/296 (TIFF 6.0; libtiff tiff.h)", () => {
  it("unit 2 = inch: 300/1 → 300 ppi", () => {
    expect(readDeclaredDensity(makeTiff(4, 4, { num: 300, den: 1, unit: 2 }), "tiff")).toEqual({
      xPpi: 300,
      yPpi: 300,
      source: "tiff",
      unit: "inch",
    });
  });

  it("unit 3 = centimetre: 11811/100 px/cm → 299.9994 ppi", () => {
    const d = readDeclaredDensity(makeTiff(4, 4, { num: 11811, den: 100, unit: 3 }), "tiff");
    expect(d?.xPpi).toBeCloseTo(299.9994, 4);
    expect(d?.unit).toBe("cm");
  });

  it("unit 1 = no absolute unit", () => {
    expect(
      readDeclaredDensity(makeTiff(4, 4, { num: 1, den: 1, unit: 1 }), "tiff")?.xPpi,
    ).toBeNull();
  });

  it("agrees with sharp on a hand-written TIFF", async () => {
    const tiff = makeTiff(4, 4, { num: 300, den: 1, unit: 2 });
    const meta = await sharp(tiff).metadata();
    expect(meta.width).toBe(4);
    expect(meta.density).toBe(300);
  });
});
