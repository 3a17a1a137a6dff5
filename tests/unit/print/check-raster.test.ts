import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { checkArtwork, checkArtworkHeader, type SpecReport } from "@/lib/print/check";
import type { PrintSpec } from "@/lib/print/spec";
import { inToMm } from "@/lib/print/units";
import { framed, jfifSegment, makePng, makeTiff, physData, withJfif, type Paint } from "./fixtures";

// Half letter, 5.5 x 8.5 in (PWG na_invoice_5.5x8.5in), with the usual US bleed of 1/8 in
// (Wikipedia "Bleed (printing)") and a 1/4 in safe margin (common practice, no source).
const halfLetter = (over: Partial<PrintSpec> = {}): PrintSpec => ({
  trimWidthMm: inToMm(5.5),
  trimHeightMm: inToMm(8.5),
  bleedMm: inToMm(0.125),
  safeMarginMm: inToMm(0.25),
  minPpi: 300,
  printMethod: "duplicator",
  inks: ["black"],
  ...over,
});

// Smaller files for most tests: the same page at 100 ppi is 575 x 875 px with bleed (derived).
const at100 = (over: Partial<PrintSpec> = {}) => halfLetter({ minPpi: 100, ...over });
const PPM_100 = Math.round(100 / 0.0254); // 3937 px/m
const grey = (v: number): [number, number, number, number] => [v, v, v, 255];
const solid =
  (v: number): Paint =>
  () =>
    grey(v);
const greyPng = (w: number, h: number, paint: Paint, ppm = PPM_100) =>
  makePng(w, h, paint, { colorType: 0, phys: physData(ppm, ppm, 1) });

const codes = (r: SpecReport) => r.findings.map((f) => f.code);
const find = (r: SpecReport, code: string) => r.findings.find((f) => f.code === code);

describe("size against trim and bleed", () => {
  it("1650 x 2550 px is half letter at 300 ppi without bleed: the fix asks for 1725 x 2625 px (pixels = inches x ppi, Haematologica 'Image resolution' advisor)", async () => {
    const png = greyPng(1650, 2550, solid(60), 11811);
    const report = await checkArtwork(png, halfLetter(), { filename: "page.png" });
    expect(report.measured.sizeMatch).toBe("trim-only");
    expect(report.measured.effectivePpi).toBeCloseTo(300, 6);
    const f = find(report, "no-bleed");
    expect(f?.severity).toBe("blocker"); // artwork runs to every edge
    expect(f?.message).toContain(
      "Your image is 1650 x 2550 px: that is the trim size without bleed",
    );
    expect(f?.fix).toBe("Extend the artwork by 0.125 in on every side: 1725 x 2625 px at 300 ppi.");
    // 11811 px/m = 299.9994 ppi must not trip a 300 ppi minimum (ISO/IEC 15948:2003 §11.3.5.3 pHYs counts
    // pixels per metre; PNG 1.2: "One inch is equal to exactly 0.0254 meters")
    expect(codes(report)).not.toContain("resolution-low");
    expect(codes(report)).not.toContain("declared-density-differs");
  });

  it("the header check flags the missing bleed as a warning, not knowing the edges", async () => {
    const report = await checkArtworkHeader(greyPng(550, 850, solid(60)), at100());
    expect(find(report, "no-bleed")?.severity).toBe("warning");
    expect(report.measured.edges).toBeUndefined();
  });

  it("trim-size art with blank edges can print without bleed: a note", async () => {
    const report = await checkArtwork(greyPng(550, 850, framed(550, 850, 40)), at100());
    expect(find(report, "no-bleed")?.severity).toBe("note");
    expect(report.verdict).toBe("note");
  });

  it("trim + bleed at the right resolution with full-bleed art passes", async () => {
    const report = await checkArtwork(greyPng(575, 875, solid(60)), at100());
    expect(report.measured.sizeMatch).toBe("trim-and-bleed");
    expect(report.findings).toEqual([]);
    expect(report.verdict).toBe("pass");
  });

  it("A5 at 300 ppi: 1748 x 2480 px (299.995 ppi) passes a 300 ppi minimum (1748 px ÷ (148 mm ÷ 25.4), derived)", async () => {
    const a5: PrintSpec = {
      trimWidthMm: 148,
      trimHeightMm: 210,
      bleedMm: 0,
      safeMarginMm: 3,
      minPpi: 300,
      printMethod: "laser-black",
      inks: [],
    };
    const report = await checkArtworkHeader(greyPng(1748, 2480, solid(255), 11811), a5);
    expect(report.measured.effectivePpi).toBeCloseTo(299.96, 2);
    expect(codes(report)).not.toContain("resolution-low");
  });

  it("a landscape image for a portrait page is the wrong way round", async () => {
    const report = await checkArtworkHeader(greyPng(875, 575, solid(60)), at100());
    const f = find(report, "wrong-orientation");
    expect(f?.severity).toBe("blocker");
    expect(f?.message).toContain("landscape (875 x 575 px)");
    expect(f?.fix).toContain("575 x 875 px");
  });

  it("a square image: wrong proportions, with how much would be cut off", async () => {
    // Scaled to cover 5.75 x 8.75 in, an 875 px square is 8.75 x 8.75 in: 3 in of width cut, 1.5 in a side
    const report = await checkArtworkHeader(greyPng(875, 875, solid(60)), at100());
    const f = find(report, "wrong-aspect");
    expect(f?.severity).toBe("blocker");
    expect(f?.message).toContain("3 in of its width would be cut off (1.5 in on each side)");
  });

  it("slightly wrong proportions, cut within the safe margin: a warning", async () => {
    // 575 x 885 px: covering 5.75 in wide gives 8.85 in tall, 0.1 in over, 0.05 in a side < 0.25 in safe margin
    const report = await checkArtworkHeader(greyPng(575, 885, solid(60)), at100());
    expect(find(report, "wrong-aspect")?.severity).toBe("warning");
  });
});

describe("resolution", () => {
  it("87 ppi against a 100 ppi minimum is a warning; 52 ppi is a blocker (0.75 rule: 1.5x vs 2x screen ruling)", async () => {
    const low = await checkArtworkHeader(greyPng(500, 761, solid(60)), at100());
    expect(find(low, "resolution-low")?.severity).toBe("warning");
    expect(find(low, "resolution-low")?.message).toContain("87 ppi");
    const tooLow = await checkArtworkHeader(greyPng(300, 457, solid(60)), at100());
    expect(find(tooLow, "resolution-too-low")?.severity).toBe("blocker");
    expect(find(tooLow, "resolution-too-low")?.fix).toContain("575 x 875 px");
  });

  it("what the file declares does not count, only the printed size: a note", async () => {
    const png = greyPng(575, 875, solid(60), 2835); // 72 ppi declared
    const report = await checkArtworkHeader(png, at100());
    expect(report.measured.declaredDensity?.xPpi).toBeCloseTo(72.009, 3);
    expect(report.measured.effectivePpi).toBeCloseTo(100, 6);
    expect(find(report, "declared-density-differs")?.message).toContain("The file says 72 ppi");
    expect(report.verdict).toBe("note");
  });

  it("JFIF 72 dpi JPEG and a hand-written TIFF are measured the same way", async () => {
    const raw = await sharp({
      create: { width: 575, height: 875, channels: 3, background: "#555555" },
    })
      .jpeg()
      .toBuffer();
    const jpeg = withJfif(raw, jfifSegment(1, 72, 72));
    const jr = await checkArtwork(jpeg, at100({ printMethod: "laser-colour" }));
    expect(jr.format).toBe("jpeg");
    expect(jr.measured.declaredDensity).toMatchObject({ xPpi: 72, source: "jfif" });
    expect(codes(jr)).toContain("declared-density-differs");
    const tiff = makeTiff(575, 875, { num: 100, den: 1, unit: 2 });
    const tr = await checkArtworkHeader(tiff, at100());
    expect(tr.format).toBe("tiff");
    expect(tr.measured.colourSpace).toBe("greyscale");
    expect(tr.measured.effectivePpi).toBeCloseTo(100, 6);
    expect(codes(tr)).not.toContain("declared-density-differs");
  });
});

describe("edges: bleed and safe margin", () => {
  it("art that stops at the trim with a white bleed band", async () => {
    // bleed at 100 ppi is 12.5 px: a white frame of 13 px leaves the bleed blank and inks right up to the trim
    const report = await checkArtwork(greyPng(575, 875, framed(575, 875, 13)), at100());
    const f = find(report, "art-stops-at-trim");
    expect(f?.severity).toBe("warning");
    expect(f?.where).toBe("top, right, bottom and left edges");
    expect(codes(report)).not.toContain("content-in-safe-band");
  });

  it("a mark 0.15 in inside the trim at the top left sits in the safe band: a note with where", async () => {
    // trim at 12.5 px, safe margin ends at 37.5 px; a 10 px mark from 28 px in
    const paint: Paint = (x, y) => (x >= 28 && x < 38 && y >= 28 && y < 38 ? grey(0) : grey(255));
    const report = await checkArtwork(greyPng(575, 875, paint), at100());
    const f = find(report, "content-in-safe-band");
    expect(f?.severity).toBe("note");
    expect(f?.where).toBe("top and left edges");
  });

  it("a full-bleed background with a centred picture raises nothing", async () => {
    const paint: Paint = (x, y) => (x > 200 && x < 375 && y > 300 && y < 575 ? grey(0) : grey(120));
    const report = await checkArtwork(greyPng(575, 875, paint), at100());
    expect(report.findings).toEqual([]);
    expect(report.measured.edges?.sides.every((s) => s.outerInk === 1)).toBe(true);
  });
});

describe("colour against the print method", () => {
  const colourful = makePng(575, 875, (x) => (x < 287 ? [220, 30, 40, 255] : [20, 40, 200, 255]));

  it("duplicator with two inks needs one greyscale file per ink: a blocker", async () => {
    const report = await checkArtwork(colourful, at100({ inks: ["black", "red"] }));
    const f = find(report, "colour-for-duplicator");
    expect(f?.severity).toBe("blocker");
    expect(f?.message).toContain("2 inks (black, red)");
  });

  it("duplicator with one ink: a warning to convert to greyscale", async () => {
    expect(find(await checkArtwork(colourful, at100()), "colour-for-duplicator")?.severity).toBe(
      "warning",
    );
  });

  it("an RGB file holding only greys is fine for the duplicator", async () => {
    const report = await checkArtwork(makePng(575, 875, solid(90)), at100());
    expect(codes(report)).toContain("grey-in-colour-file");
    expect(report.verdict).toBe("note");
  });

  it("laser black: colour becomes grey (note); laser colour: no profile (note)", async () => {
    expect(
      find(
        await checkArtwork(colourful, at100({ printMethod: "laser-black", inks: [] })),
        "colour-for-black-printing",
      )?.severity,
    ).toBe("note");
    expect(
      codes(await checkArtwork(colourful, at100({ printMethod: "laser-colour", inks: [] }))),
    ).toEqual(["no-colour-profile"]);
  });

  it("a CMYK JPEG for an inkjet gets a note (sharp reports space cmyk, 4 channels)", async () => {
    const cmyk = await sharp({
      create: { width: 575, height: 875, channels: 3, background: "#cc3344" },
    })
      .toColourspace("cmyk")
      .jpeg()
      .toBuffer();
    const report = await checkArtwork(cmyk, at100({ printMethod: "inkjet", inks: [] }));
    expect(report.measured.colourSpace).toBe("cmyk");
    expect(report.measured.channels).toBe(4);
    expect(codes(report)).toContain("cmyk-for-desktop-printer");
  });

  it("transparent pixels are a warning; an unused alpha channel only a note", async () => {
    const holes = makePng(575, 875, (x) => (x < 100 ? [0, 0, 0, 0] : [70, 70, 70, 255]), {
      colorType: 6,
    });
    const r1 = await checkArtwork(holes, at100());
    expect(r1.measured.hasAlpha).toBe(true);
    expect(find(r1, "transparency")?.severity).toBe("warning");
    // 100 of 575 columns clear: 17.4% of the pixels, average opacity 475/575 = 82.6%
    expect(find(r1, "transparency")?.message).toContain(
      "17% of the pixels are fully or mostly transparent; average opacity is 83%.",
    );
    const opaque = makePng(575, 875, solid(70), { colorType: 6 });
    expect(find(await checkArtwork(opaque, at100()), "alpha-channel")?.severity).toBe("note");
  });
  it("16 bits per channel is a note", async () => {
    const deep = await sharp({
      create: { width: 575, height: 875, channels: 3, background: "#777777" },
    })
      .toColourspace("rgb16")
      .png()
      .toBuffer();
    const report = await checkArtworkHeader(deep, at100({ printMethod: "laser-colour", inks: [] }));
    expect(report.measured.bitDepth).toBe(16);
    expect(codes(report)).toContain("high-bit-depth");
  });
});

describe("transparency in words", () => {
  // PNG spec (W3C), alpha channel: 0 is fully transparent, 2^bitdepth - 1 (255 at 8 bits) fully
  // opaque. A pixel under 50% opacity (alpha below 128) counts as mostly transparent.
  const W = 575;
  const H = 875;
  const withAlpha = (alpha: (y: number) => number) =>
    makePng(W, H, (_x, y) => [40, 40, 40, alpha(y)], { colorType: 6 });

  it("an opacity ramp from 0 to 255 by row is half mostly transparent and 50% opaque on average", async () => {
    // Row y has alpha round(255 y / 874): rows 0-436 are below 128, so 437 of 875 rows (49.9%);
    // the rows pair up to 255 around the middle one (127.5 -> 128), so the mean is 50.0%.
    // Only rows 0 and 1 are fully clear, rows 873 and 874 fully opaque: counting every pixel
    // short of opaque as transparent would say "about 100%".
    const report = await checkArtwork(
      withAlpha((y) => Math.round((255 * y) / (H - 1))),
      at100(),
    );
    const f = find(report, "transparency");
    expect(f?.severity).toBe("warning");
    expect(f?.message).toContain(
      "50% of the pixels are fully or mostly transparent; average opacity is 50%.",
    );
    expect(f?.message).not.toMatch(/100%/);
    const stats = report.measured.edges?.transparency;
    expect(stats?.mostlyTransparentShare).toBeCloseTo(437 / 875, 9);
    expect(stats?.meanOpacity).toBeCloseTo(0.5, 3);
    expect(stats?.notOpaqueShare).toBeCloseTo(873 / 875, 9);
  });

  it("a fully transparent image would print as bare paper", async () => {
    const report = await checkArtwork(
      withAlpha(() => 0),
      at100(),
    );
    expect(find(report, "transparency")?.message).toBe(
      "Every pixel is fully transparent: the page would print as bare paper.",
    );
    expect(report.measured.edges?.transparency).toEqual({
      notOpaqueShare: 1,
      mostlyTransparentShare: 1,
      meanOpacity: 0,
    });
  });

  it("a fully opaque image with an alpha channel is only a note", async () => {
    const report = await checkArtwork(
      withAlpha(() => 255),
      at100(),
    );
    expect(codes(report)).not.toContain("transparency");
    expect(find(report, "alpha-channel")?.message).toBe(
      "The file has a transparency (alpha) channel, but every pixel is opaque.",
    );
    expect(report.measured.edges?.transparency).toEqual({
      notOpaqueShare: 0,
      mostlyTransparentShare: 0,
      meanOpacity: 1,
    });
  });
});

describe("large files are analysed from a reduced decode", () => {
  // Half letter with 1/8 in bleed at 400 ppi: 5.75 x 8.75 in = 2300 x 3500 px (derived). The
  // analysis reads a copy 1200 px on the long side: 2300 x 1200 / 3500 = 788.6, so 789 px.
  const at400 = (over: Partial<PrintSpec> = {}) => halfLetter({ minPpi: 400, ...over });

  it("a framed page keeps its white bleed band when reduced: the art stops at the trim", async () => {
    // 1/8 in at 400 ppi is 50 px; a 52 px white frame leaves the bleed blank on every side
    const big = greyPng(2300, 3500, framed(2300, 3500, 52), Math.round(400 / 0.0254));
    const report = await checkArtwork(big, at400());
    expect(report.measured.edges?.analysedWidthPx).toBe(789);
    expect(report.measured.edges?.analysedHeightPx).toBe(1200);
    expect(find(report, "art-stops-at-trim")?.where).toBe("top, right, bottom and left edges");
  });

  it("a CMYK TIFF is reduced in CMYK, then read as colour: colour findings as for the full file", async () => {
    // TIFF 6.0 Section 16 (CMYK images, PhotometricInterpretation 5 = separated); sharp writes it
    const cmyk = await sharp({
      create: { width: 2300, height: 3500, channels: 3, background: "#cc3344" },
    })
      .toColourspace("cmyk")
      .tiff({ compression: "lzw" })
      .toBuffer();
    const inkjet = await checkArtwork(cmyk, at400({ printMethod: "inkjet", inks: [] }));
    expect(inkjet.format).toBe("tiff");
    expect(inkjet.measured.colourSpace).toBe("cmyk");
    expect(codes(inkjet)).toContain("cmyk-for-desktop-printer");
    expect(inkjet.measured.edges?.sides.every((side) => side.outerInk === 1)).toBe(true);
    // Still colourful after the reduction: a one-ink duplicator job is told to convert to grey
    const duplicator = await checkArtwork(cmyk, at400());
    expect(find(duplicator, "colour-for-duplicator")?.severity).toBe("warning");
    expect(codes(duplicator)).not.toContain("grey-in-colour-file");
  });
});
