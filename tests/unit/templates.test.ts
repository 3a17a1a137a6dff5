import { PDFDocument } from "pdf-lib";
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { inToMm } from "@/lib/print/units";
import {
  MAX_TEMPLATE_MEGAPIXELS,
  pdfBoxes,
  pngLayout,
  renderTemplatePdf,
  renderTemplatePng,
  templateFileName,
  type TemplateSpec,
} from "@/lib/templates";

const halfLetter: TemplateSpec = {
  trimWidthMm: inToMm(5.5),
  trimHeightMm: inToMm(8.5),
  bleedMm: inToMm(0.125),
  safeMarginMm: inToMm(0.25),
  minPpi: 300,
  title: "Low Tide Almanac",
  colourMode: "One greyscale file per ink (black, teal), dark where that ink prints",
  inchesFirst: true,
};
const a5: TemplateSpec = {
  trimWidthMm: 148,
  trimHeightMm: 210,
  bleedMm: 3,
  safeMarginMm: 5,
  minPpi: 300,
  title: "Heron Street Comics Jam",
};

/** The RGB of one pixel of a PNG. */
async function pixelAt(png: Buffer, x: number, y: number): Promise<[number, number, number]> {
  const { data, info } = await sharp(png).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  const i = (Math.round(y) * info.width + Math.round(x)) * info.channels;
  return [data[i]!, data[i + 1]!, data[i + 2]!];
}

const near = (
  actual: [number, number, number],
  expected: [number, number, number],
  tolerance = 40,
) => actual.every((v, i) => Math.abs(v - expected[i]!) <= tolerance);

describe("PNG template", () => {
  it("is 1725 x 2625 px for half letter with 0.125 in bleed at 300 ppi, and says 300 ppi (pixels = inches x ppi, Haematologica 'Image resolution' advisor)", async () => {
    const png = await renderTemplatePng(halfLetter);
    const meta = await sharp(png).metadata();
    expect(meta.format).toBe("png");
    expect([meta.width, meta.height]).toEqual([1725, 2625]);
    // pHYs 11811 px/m reads back as 300 ppi (PNG (W3C, 2nd ed.) = ISO/IEC 15948:2003 §11.3.5.3 pHYs, unit 1 =
    // metre; PNG 1.2: "One inch is equal to exactly 0.0254 meters", so 11811 x 0.0254 = 299.9994).
    expect(meta.density).toBe(300);
  });

  it("rounds A5 with 3 mm bleed up to whole pixels: 1818.90 x 2551.18 → 1819 x 2552 (ISO 216 A5 + 2 x 3 mm = 154 x 216 mm, ÷ 25.4 x 300 ppi)", () => {
    expect(pngLayout(a5)).toMatchObject({ widthPx: 1819, heightPx: 2552, ppi: 300 });
  });

  it("draws the bleed band, the trim line and the dashed safe line where the spec puts them", async () => {
    const png = await renderTemplatePng(halfLetter);
    const layout = pngLayout(halfLetter);
    // 0.125 in at 300 ppi = 37.5 px of bleed; the trim line sits there.
    expect(layout.trim.x).toBeCloseTo(37.5, 6);
    expect(layout.safe.x).toBeCloseTo(37.5 + 75, 6);
    const midY = layout.heightPx / 2 + 200;
    expect(near(await pixelAt(png, 20, midY), [0xe3, 0xf0, 0xee], 6), "tinted bleed band").toBe(
      true,
    );
    expect(
      near(await pixelAt(png, layout.trim.x, midY), [0xc8, 0x55, 0x3d]),
      "trim line in the trim colour",
    ).toBe(true);
    expect(
      near(await pixelAt(png, layout.trim.x + 20, midY), [255, 255, 255], 2),
      "white page inside the trim",
    ).toBe(true);
    const safeColours = await Promise.all(
      [0, 10, 20, 30].map((dy) => pixelAt(png, layout.safe.x, midY + dy)),
    );
    expect(
      safeColours.some((c) => near(c, [0xd9, 0xa4, 0x41])),
      "safe line in the safe colour",
    ).toBe(true);
    expect(
      safeColours.some((c) => near(c, [255, 255, 255], 2)),
      "safe line is dashed",
    ).toBe(true);
  });

  it("draws huge trims at a lower resolution instead of running out of memory", () => {
    const poster = { ...a5, trimWidthMm: 297, trimHeightMm: 420, minPpi: 1200 };
    const layout = pngLayout(poster);
    expect(layout.ppi).toBeLessThan(1200);
    expect((layout.widthPx * layout.heightPx) / 1e6).toBeLessThanOrEqual(MAX_TEMPLATE_MEGAPIXELS);
  });
});

describe("PDF template", () => {
  it("sets MediaBox = BleedBox = A5 + 3 mm and the TrimBox 3 mm in (ISO 216 A5; boxes per ISO 32000-1:2008 Table 30)", async () => {
    const doc = await PDFDocument.load(await renderTemplatePdf(a5));
    expect(doc.getPageCount()).toBe(1);
    const page = doc.getPage(0);
    const media = page.getMediaBox();
    const bleed = page.getBleedBox();
    const trim = page.getTrimBox();
    for (const box of [media, bleed]) {
      expect(box.x).toBeCloseTo(0, 5);
      expect(box.y).toBeCloseTo(0, 5);
      expect(box.width).toBeCloseTo(436.535433, 5);
      expect(box.height).toBeCloseTo(612.283465, 5);
    }
    expect(trim.x).toBeCloseTo(8.503937, 5);
    expect(trim.y).toBeCloseTo(8.503937, 5);
    expect(trim.width).toBeCloseTo(419.527559, 5);
    expect(trim.height).toBeCloseTo(595.275591, 5);
  });

  it("is 414 x 630 pt for half letter + 0.125 in, trim 396 x 612 pt at 9 pt in (half letter 5.5 x 8.5 in, PWG 5101.1 na_invoice_5.5x8.5in; 1 pt = 1/72 in, ISO 32000-1 Table 30)", async () => {
    expect(pdfBoxes(halfLetter).media.width).toBeCloseTo(414, 9);
    const page = (await PDFDocument.load(await renderTemplatePdf(halfLetter))).getPage(0);
    expect(page.getMediaBox().width).toBeCloseTo(414, 6);
    expect(page.getMediaBox().height).toBeCloseTo(630, 6);
    expect(page.getTrimBox()).toEqual({
      x: expect.closeTo(9, 6),
      y: expect.closeTo(9, 6),
      width: expect.closeTo(396, 6),
      height: expect.closeTo(612, 6),
    });
  });

  it("writes titles the standard font cannot draw without failing", async () => {
    const bytes = await renderTemplatePdf({ ...a5, title: "Zine № 7: 潮 and Łódź" });
    expect((await PDFDocument.load(bytes)).getTitle()).toBe("Zine № 7: 潮 and Łódź: page template");
  });
});

describe("template file names", () => {
  it("say the size", () => {
    expect(templateFileName("low-tide-almanac", halfLetter, "png")).toBe(
      "low-tide-almanac-page-template-1725x2625px-300ppi.png",
    );
    expect(templateFileName("heron-street-comics-jam", a5, "pdf")).toBe(
      "heron-street-comics-jam-page-template-154x216mm.pdf",
    );
  });
});
