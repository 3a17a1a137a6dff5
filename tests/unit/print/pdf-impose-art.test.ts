/**
 * What the imposed print file draws, read back with poppler and from the content stream: the art's
 * creep shift, the clip at the fold, crop and fold marks found by rendering, a JPEG carried byte for
 * byte, blank and text pages, and one page loaded at a time.
 *
 * Layout used throughout: A5 (ISO 216, 148 x 210 mm) with 3 mm bleed on A3 (297 x 420 mm) laid
 * landscape, so the 296 x 210 mm spread's trim starts at x = (420 − 296)/2 = 62 mm, y = (297 − 210)/2
 * = 43.5 mm, the fold is at x = 210 mm and the BleedBox runs 59..361 x 40.5..256.5 mm.
 */
import { afterAll, describe, expect, it } from "vitest";
import { imposeBooklet, MARK_LENGTH_MM } from "@/lib/print/pdf/impose";
import type { ImposeInput, PageContent } from "@/lib/print/pdf/types";
import { ptToMm } from "@/lib/print/units";
import {
  bookletSides,
  cleanUp,
  greyJpeg,
  labelledArt,
  labelledArtPdf,
  labelsOn,
  pdfimagesJpegs,
  pdfimagesList,
  pdftotext,
  placedArtMatrices,
  render,
  tempFile,
  wordBoxes,
} from "./pdf-poppler";

afterAll(cleanUp);

const SHEET_W = 420;
const SHEET_H = 297;
const TRIM_X = 62;
const TRIM_Y = 43.5;
const FOLD_X = 210;
const BLEED = 3;
const PT_PER_MM = 72 / 25.4; // 72 pt per inch (ISO 32000-1 Table 30), 25.4 mm per inch

function a5OnA3(
  sides: ImposeInput["sides"],
  creepMm: number[],
  extra: Partial<ImposeInput> = {},
): ImposeInput {
  return {
    title: "Tidewater",
    trimWidthMm: 148,
    trimHeightMm: 210,
    bleedMm: BLEED,
    sheet: { name: "A3", widthMm: 297, heightMm: 420 },
    sides,
    creepMm,
    ink: null,
    ...extra,
  };
}

const jpegPage =
  (bytes: Uint8Array): ((page: number) => PageContent) =>
  (page) => ({
    kind: "art",
    title: `Piece ${page}`,
    credit: "by Ines Marlow",
    load: () => Promise.resolve({ format: "jpeg", bytes }),
  });

describe("creep: each sheet's art moves toward the spine by its figure (lib/print/creep.ts pageShifts)", () => {
  it("16 pages at 0, 0.1, 0.2, 0.3 mm (REFERENCE §7 linear worked example, t = 0.1 mm): the placed cm, exactly", async () => {
    const creep = [0, 0.1, 0.2, 0.3];
    const jpeg = await greyJpeg(154, 216);
    const out = await imposeBooklet(a5OnA3(bookletSides(16, jpegPage(jpeg)), creep));
    const matrices = await placedArtMatrices(out.bytes);
    expect(matrices).toHaveLength(8);
    matrices.forEach((side, i) => {
      const sheet = Math.floor(i / 2) + 1;
      const expected = creep[sheet - 1] ?? NaN;
      expect(side).toHaveLength(2);
      const [left, right] = side as [number[], number[]];
      // An image fills the unit square (ISO 32000-1 §8.9.4): scaled to trim + bleed, 154 x 216 mm.
      expect(ptToMm(left[0] ?? 0)).toBeCloseTo(154, 6);
      expect(ptToMm(left[3] ?? 0)).toBeCloseTo(216, 6);
      expect(ptToMm(left[5] ?? 0)).toBeCloseTo(TRIM_Y - BLEED, 6);
      // Left page: its bleed edge at 62 − 3 = 59 mm, moved right (toward the fold) by the creep.
      expect(Math.abs(ptToMm(left[4] ?? 0) - (TRIM_X - BLEED) - expected)).toBeLessThan(0.01);
      // Right page: its spine-side bleed edge at 210 − 3 = 207 mm, moved left by the creep.
      expect(Math.abs(FOLD_X - BLEED - ptToMm(right[4] ?? 0) - expected)).toBeLessThan(0.01);
    });
  });

  it("vector page art (TrimBox set) is moved the same way: the TrimBox lands on the trim plus the shift", async () => {
    const out = await imposeBooklet(
      a5OnA3(bookletSides(16, labelledArt(148, 210, BLEED)), [0, 0.1, 0.2, 0.3]),
    );
    const matrices = await placedArtMatrices(out.bytes);
    const innermost = matrices[6] as [number[], number[]]; // sheet 4 front: [10 | 7]
    expect(innermost[0]?.slice(0, 4)).toEqual([1, 0, 0, 1]); // same size, kept as vectors
    expect(Math.abs(ptToMm(innermost[0]?.[4] ?? 0) - (TRIM_X - BLEED) - 0.3)).toBeLessThan(0.01);
    expect(Math.abs(FOLD_X - BLEED - ptToMm(innermost[1]?.[4] ?? 0) - 0.3)).toBeLessThan(0.01);
    expect(labelsOn(tempFile(out.bytes), 7)).toEqual([10, 7]);
  });

  it("rendered at 300 dpi: a 1.5 mm creep moves the art's outer edges 1.5 mm in; the clip stays at the fold", async () => {
    const dark = await greyJpeg(154, 216, 90);
    const light = await greyJpeg(154, 216, 200);
    // Left-hand halves carry even pages (REFERENCE §6.2), dark here; right-hand halves light.
    const content = (page: number) => jpegPage(page % 2 === 0 ? dark : light)(page);
    const out = await imposeBooklet(a5OnA3(bookletSides(8, content), [0, 1.5]));
    const path = tempFile(out.bytes);
    const dpi = 300;
    const px = (mm: number) => (mm * dpi) / 25.4;
    const row = Math.round(px(SHEET_H - (TRIM_Y + 30)));
    for (const [pdfPage, creep] of [
      [1, 0],
      [3, 1.5],
    ] as const) {
      const img = render(path, pdfPage, dpi, { x: 0, y: row, w: px(SHEET_W), h: 1 });
      const values = Array.from({ length: img.width }, (_, x) => img.at(x, 0));
      const firstInk = values.findIndex((v) => v < 230);
      const lastInk = values.length - 1 - [...values].reverse().findIndex((v) => v < 230);
      expect(Math.abs(firstInk - px(TRIM_X - BLEED + creep))).toBeLessThanOrEqual(1.5);
      expect(Math.abs(lastInk + 1 - px(SHEET_W - TRIM_X + BLEED - creep))).toBeLessThanOrEqual(1.5);
      // Either side of the fold each page shows its own art: nothing crosses it.
      expect(values[Math.round(px(FOLD_X)) - 3]).toBeLessThan(130);
      expect(values[Math.round(px(FOLD_X)) + 3]).toBeGreaterThan(170);
    }
  });
});

describe("crop and fold marks, rendered with pdftoppm at 300 dpi", () => {
  it("dark along each mark outside the bleed, white in the gap between bleed edge and mark", async () => {
    const out = await imposeBooklet(a5OnA3(bookletSides(4, labelledArt(148, 210, BLEED)), [0]));
    const dpi = 300;
    // Thin lines drawn without anti-aliasing, so a 0.25 pt line is a solid pixel row.
    const img = render(tempFile(out.bytes), 1, dpi, undefined, false);
    const px = (mm: number) => Math.round((mm * dpi) / 25.4);
    const at = (xMm: number, yMm: number) => {
      // Darkest pixel within ±2 px across the line (the line is about 1 px wide at 300 dpi).
      let min = 255;
      for (let d = -2; d <= 2; d++)
        for (let e = -2; e <= 2; e++)
          min = Math.min(min, img.at(px(xMm) + d, px(SHEET_H - yMm) + e));
      return min;
    };
    const offset = 4; // marks start max(3 mm, bleed + 1 mm) = 4 mm from the trim
    const right = TRIM_X + 296;
    const top = TRIM_Y + 210;
    for (const [cx, dx] of [
      [TRIM_X, -1],
      [right, 1],
    ] as const) {
      for (const [cy, dy] of [
        [TRIM_Y, -1],
        [top, 1],
      ] as const) {
        for (const along of [offset + 0.5, offset + 2.5, offset + MARK_LENGTH_MM - 0.5]) {
          expect(at(cx + dx * along, cy)).toBeLessThan(100); // the horizontal stroke
          expect(at(cx, cy + dy * along)).toBeLessThan(100); // the vertical stroke
        }
        // Between the bleed edge (3 mm) and the mark (4 mm): paper.
        expect(at(cx + dx * 3.5, cy)).toBeGreaterThan(245);
        expect(at(cx, cy + dy * 3.5)).toBeGreaterThan(245);
        // Past the mark's end: paper.
        expect(at(cx + dx * (offset + MARK_LENGTH_MM + 0.7), cy)).toBeGreaterThan(245);
        // Inside the bleed, the art's grey reaches the bleed edge.
        const grey = at(cx + dx * 2.5, cy + dy * 2.5);
        expect(grey).toBeGreaterThan(150);
        expect(grey).toBeLessThan(240);
      }
    }
    // Fold marks on the fold line above and below, dashed: partly dark along their 5 mm.
    for (const [y0, dy] of [
      [top, 1],
      [TRIM_Y, -1],
    ] as const) {
      expect(at(FOLD_X, y0 + dy * 3.5)).toBeGreaterThan(245);
      let darkPx = 0;
      const from = px(SHEET_H - (y0 + dy * offset));
      const to = px(SHEET_H - (y0 + dy * (offset + MARK_LENGTH_MM)));
      const [a, b] = from < to ? [from, to] : [to, from];
      for (let y = a; y <= b; y++)
        if (
          Math.min(img.at(px(FOLD_X) - 1, y), img.at(px(FOLD_X), y), img.at(px(FOLD_X) + 1, y)) <
          100
        )
          darkPx++;
      const share = darkPx / (b - a + 1);
      expect(share).toBeGreaterThan(0.3);
      expect(share).toBeLessThan(0.85);
    }
  });

  it("the slug line sits below the marks, outside the bleed", async () => {
    const out = await imposeBooklet(a5OnA3(bookletSides(4, labelledArt(148, 210, BLEED)), [0]));
    const words = wordBoxes(tempFile(out.bytes), 1).filter((w) => !/^P\d+$/.test(w.word));
    expect(words.map((w) => w.word).join(" ")).toBe(
      "Tidewater - sheet 1 of 1 - front - composite - pages 4 | 1",
    );
    // pdftotext -bbox measures from the top: the bleed's bottom edge is 297 − 40.5 mm down.
    const marksEndPt = (SHEET_H - (TRIM_Y - 4 - MARK_LENGTH_MM)) * PT_PER_MM;
    for (const w of words) expect(w.yMin).toBeGreaterThan(marksEndPt);
  });
});

describe("art formats", () => {
  it("a JPEG is embedded byte for byte (pdfimages -j writes the DCT stream as stored); PNG as an image; PDF art stays vector", async () => {
    const jpeg = await greyJpeg(300, 420, 120);
    const sharp = (await import("sharp")).default;
    const png = await sharp({
      create: { width: 200, height: 280, channels: 3, background: "#777777" },
    })
      .png()
      .toBuffer();
    const content = (page: number): PageContent =>
      page === 1
        ? {
            kind: "art",
            title: "Photo",
            credit: null,
            load: async () => ({ format: "jpeg", bytes: jpeg }),
          }
        : page === 4
          ? {
              kind: "art",
              title: "Drawing",
              credit: null,
              load: async () => ({ format: "png", bytes: png }),
            }
          : {
              kind: "art",
              title: "Poem",
              credit: null,
              load: async () => ({
                format: "pdf",
                bytes: await labelledArtPdf(page, 148, 210, BLEED),
              }),
            };
    const out = await imposeBooklet(a5OnA3(bookletSides(4, content), [0]));
    const path = tempFile(out.bytes);
    const images = pdfimagesList(path);
    // Sheet 1 front is [4 | 1]: the PNG (flate-coded "image") and the JPEG; the back [2 | 3] has no images.
    expect(images.map((i) => [i.page, i.enc, i.width, i.height])).toEqual([
      [1, "image", 200, 280],
      [1, "jpeg", 300, 420],
    ]);
    const [extracted] = pdfimagesJpegs(path, 1);
    expect(extracted && Buffer.compare(extracted, jpeg)).toBe(0);
    expect(labelsOn(path, 2)).toEqual([2, 3]);
  });

  it("an unreadable file names its page", async () => {
    const bad: PageContent = {
      kind: "art",
      title: "Broken",
      credit: null,
      load: async () => ({ format: "jpeg", bytes: new Uint8Array([1, 2, 3, 4]) }),
    };
    const sides = bookletSides(4, (p) => (p === 3 ? bad : { kind: "blank" }));
    await expect(imposeBooklet(a5OnA3(sides, [0]))).rejects.toThrow(
      /The art of page 3 is not a readable JPEG file/,
    );
  });
});

describe("blank and text pages", () => {
  it("a blank page is left empty, and the art beside it is cut at the fold even when crept", async () => {
    const content = (page: number): PageContent =>
      page === 3 ? { kind: "blank" } : labelledArt(148, 210, BLEED)(page);
    const out = await imposeBooklet(a5OnA3(bookletSides(8, content), [0, 1.5]));
    const path = tempFile(out.bytes);
    expect(labelsOn(path, 3)).toEqual([6]); // sheet 2 front is [6 | 3]
    const dpi = 72;
    const img = render(path, 3, dpi);
    const px = (mm: number) => Math.round((mm * dpi) / 25.4);
    // Everything from just right of the fold to the right page's bleed edge is paper.
    let inked = 0;
    for (let x = px(FOLD_X) + 1; x < px(SHEET_W - TRIM_X + BLEED); x++)
      for (let y = px(SHEET_H - TRIM_Y - 210 - BLEED); y < px(SHEET_H - TRIM_Y + BLEED); y++)
        if (img.at(x, y) < 250) inked++;
    expect(inked).toBe(0);
    expect(img.at(px(FOLD_X) - 2, px(SHEET_H / 2))).toBeLessThan(230); // the page beside it is there
  });

  it("a text page is set inside the safe area, long lines wrapped, text Helvetica cannot encode replaced", async () => {
    const long =
      "Thanks to everyone who sent work to the open call this winter, to the volunteers who folded and stapled every copy, and to the library on Quay Street for the loan of its long-arm stapler and its back room";
    const content = (page: number): PageContent =>
      page === 1
        ? {
            kind: "text",
            heading: "With thanks",
            lines: ["Cover by Ada Wren", long, "", "Zoë in Łódź 🌸"],
          }
        : { kind: "blank" };
    const out = await imposeBooklet(a5OnA3(bookletSides(4, content), [0], { safeMarginMm: 10 }));
    const path = tempFile(out.bytes);
    const text = pdftotext(path, 1);
    expect(text).toContain("With thanks");
    expect(text).toContain("Cover by Ada Wren");
    expect(text).toContain("Zoë in ?ódz ?");
    // Words above the trim's bottom edge (the slug line is below it); -bbox measures from the top.
    const textWords = wordBoxes(path, 1).filter((w) => w.yMax < (SHEET_H - TRIM_Y) * PT_PER_MM);
    expect(textWords.length).toBeGreaterThan(40);
    const first = textWords.find((w) => w.word === "Thanks");
    const last = textWords.find((w) => w.word === "room");
    expect(first && last && last.yMin > first.yMin + 5).toBe(true); // wrapped over several lines
    // Page 1 is the right half (sheet 1 front [4 | 1]): safe area 210 + 10 .. 358 − 10 mm across.
    for (const w of textWords) {
      expect(w.xMin).toBeGreaterThanOrEqual((FOLD_X + 10) * PT_PER_MM - 0.5);
      expect(w.xMax).toBeLessThanOrEqual((TRIM_X + 296 - 10) * PT_PER_MM + 0.5);
      expect(w.yMin).toBeGreaterThanOrEqual((SHEET_H - TRIM_Y - 210 + 10) * PT_PER_MM - 0.5);
    }
  });

  it("a text page too long for its safe area is refused, naming the page", async () => {
    const lines = Array.from({ length: 200 }, (_, i) => `Contributor number ${i + 1}`);
    const sides = bookletSides(4, (p) =>
      p === 2 ? { kind: "text", heading: "Contributors", lines } : { kind: "blank" },
    );
    await expect(imposeBooklet(a5OnA3(sides, [0]))).rejects.toThrow(
      /The text of page 2 \("Contributors"\) does not fit inside its safe area even at 6 pt/,
    );
  });
});

describe("one page at a time", () => {
  it("loads each page's art only when it is placed, and reports progress after each page", async () => {
    const events: string[] = [];
    const content = (page: number): PageContent => ({
      kind: "art",
      title: `Piece ${page}`,
      credit: null,
      load: async () => {
        events.push(`load ${page}`);
        return { format: "pdf", bytes: await labelledArtPdf(page, 148, 210, BLEED) };
      },
    });
    await imposeBooklet(
      a5OnA3(bookletSides(8, content), [0, 0.1], {
        onProgress: (done, total) => {
          events.push(`${done}/${total}`);
        },
      }),
    );
    expect(events).toEqual([
      "load 8",
      "1/8",
      "load 1",
      "2/8",
      "load 2",
      "3/8",
      "load 7",
      "4/8",
      "load 6",
      "5/8",
      "load 3",
      "6/8",
      "load 4",
      "7/8",
      "load 5",
      "8/8",
    ]);
  });
});
