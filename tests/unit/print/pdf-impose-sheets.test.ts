/**
 * The imposed print file, read back with poppler: page count, page boxes in points, the page
 * order on each side for the worked examples, the slug line, and the sheets that are refused.
 */
import { afterAll, describe, expect, it } from "vitest";
import { imposeBooklet, layoutSheet } from "@/lib/print/pdf/impose";
import type { ImposeInput, PressSheet } from "@/lib/print/pdf/types";
import {
  bookletSides,
  cleanUp,
  labelledArt,
  labelsOn,
  pdfinfoBoxes,
  pdfinfoPages,
  pdftotext,
  tempFile,
  type Box,
} from "./pdf-poppler";

afterAll(cleanUp);

// 1 in = 72 pt, the PDF default user-space unit (ISO 32000-1:2008 Table 30, UserUnit; the
// PostScript point); 1 in = 25.4 mm exactly. Poppler prints boxes to 0.01 pt.
const PT_PER_MM = 72 / 25.4;
const expectBox = (actual: Box | undefined, expected: Box) => {
  expect(actual).toBeDefined();
  actual?.forEach((v, i) => expect(Math.abs(v - (expected[i] ?? NaN))).toBeLessThanOrEqual(0.0051));
};

// ANSI/ASME Y14.1: letter (ANSI A) 8.5 x 11 in, tabloid (ANSI B) 11 x 17 in; half letter 5.5 x 8.5 in.
const HALF_LETTER = { w: 5.5 * 25.4, h: 8.5 * 25.4 };
const LETTER: PressSheet = { name: "letter", widthMm: 8.5 * 25.4, heightMm: 11 * 25.4 };
const TABLOID: PressSheet = { name: "tabloid", widthMm: 11 * 25.4, heightMm: 17 * 25.4 };
// ISO 216: A5 148 x 210 mm, A4 210 x 297 mm, A3 297 x 420 mm.
const A5 = { w: 148, h: 210 };
const A4: PressSheet = { name: "A4", widthMm: 210, heightMm: 297 };
const A3: PressSheet = { name: "A3", widthMm: 297, heightMm: 420 };

function input(
  pages: number,
  trim: { w: number; h: number },
  bleedMm: number,
  sheet: PressSheet,
  extra: Partial<ImposeInput> = {},
): ImposeInput {
  return {
    title: "Harbour Lights",
    trimWidthMm: trim.w,
    trimHeightMm: trim.h,
    bleedMm,
    sheet,
    sides: bookletSides(pages, labelledArt(trim.w, trim.h, bleedMm)),
    creepMm: Array.from({ length: pages / 4 }, () => 0),
    ink: null,
    ...extra,
  };
}

describe("page boxes (ISO 32000-1 §14.11.2; MediaBox = press sheet)", () => {
  it("half letter with 0.125 in bleed on tabloid: sheet laid landscape, spread centred", async () => {
    const out = await imposeBooklet(input(8, HALF_LETTER, 0.125 * 25.4, TABLOID));
    const path = tempFile(out.bytes);
    expect(out.pageCount).toBe(4);
    expect(pdfinfoPages(path)).toBe(4);
    // Tabloid landscape 17 x 11 in = 1224 x 792 pt; the spread 11 x 8.5 in = 792 x 612 pt centred:
    // (1224 − 792) / 2 = 216, (792 − 612) / 2 = 90; bleed 0.125 in = 9 pt on every outer side.
    for (const boxes of pdfinfoBoxes(path, 4)) {
      expectBox(boxes.MediaBox, [0, 0, 1224, 792]);
      expectBox(boxes.TrimBox, [216, 90, 1008, 702]);
      expectBox(boxes.BleedBox, [207, 81, 1017, 711]);
    }
  });

  it("A5 with 3 mm bleed on A3: landscape 420 x 297 mm, trim 296 x 210 mm at (62, 43.5) mm", async () => {
    const out = await imposeBooklet(input(8, A5, 3, A3));
    const path = tempFile(out.bytes);
    const mm = (v: number) => v * PT_PER_MM;
    for (const boxes of pdfinfoBoxes(path, 4)) {
      expectBox(boxes.MediaBox, [0, 0, mm(420), mm(297)]); // 1190.55 x 841.89 pt
      expectBox(boxes.TrimBox, [mm(62), mm(43.5), mm(62 + 296), mm(43.5 + 210)]);
      expectBox(boxes.BleedBox, [mm(59), mm(40.5), mm(361), mm(256.5)]);
      // §14.11.2.1: the boxes lie within the MediaBox.
      expect(boxes.BleedBox[0]).toBeGreaterThanOrEqual(0);
      expect(boxes.BleedBox[2]).toBeLessThanOrEqual(boxes.MediaBox[2]);
    }
  });

  it("half letter on letter without marks or bleed fills the sheet exactly: all boxes 792 x 612 pt", async () => {
    const out = await imposeBooklet(input(4, HALF_LETTER, 0, LETTER, { marks: false }));
    const [boxes] = pdfinfoBoxes(tempFile(out.bytes), 1);
    expectBox(boxes?.MediaBox, [0, 0, 792, 612]);
    expectBox(boxes?.TrimBox, [0, 0, 792, 612]);
    expectBox(boxes?.BleedBox, [0, 0, 792, 612]);
  });

  it("A5 on A4 without marks or bleed: A4 landscape 841.89 x 595.28 pt, 0.5 mm each side of the 296 mm spread", async () => {
    const out = await imposeBooklet(input(4, A5, 0, A4, { marks: false }));
    const [boxes] = pdfinfoBoxes(tempFile(out.bytes), 1);
    expectBox(boxes?.MediaBox, [0, 0, 297 * PT_PER_MM, 210 * PT_PER_MM]);
    expectBox(boxes?.TrimBox, [0.5 * PT_PER_MM, 0, 296.5 * PT_PER_MM, 210 * PT_PER_MM]);
  });
});

describe("too small a sheet is refused, naming the sizes", () => {
  it("A5 + 3 mm bleed + marks on A4: needs 296 + 2 × (4 + 5) = 314 by 210 + 2 × (4 + 5 + 2 + 6 pt) = 236.3 mm (rounded up)", async () => {
    await expect(imposeBooklet(input(8, A5, 3, A4))).rejects.toThrow(
      "The spread of two 148 x 210 mm pages with 3 mm bleed and printer's marks needs a sheet of at least 314 x 236.3 mm; the A4 sheet (210 x 297 mm) is too small either way round.",
    );
  });

  it("half letter + 0.125 in bleed on letter, even without marks: 11.25 x 8.75 in does not fit 11 x 8.5 in", () => {
    expect(() =>
      layoutSheet({
        trimWidthMm: HALF_LETTER.w,
        trimHeightMm: HALF_LETTER.h,
        bleedMm: 3.175,
        sheet: LETTER,
        marks: false,
      }),
    ).toThrow(
      /3\.175 mm bleed needs a sheet of at least 285\.8 x 222\.3 mm; the letter sheet \(215\.9 x 279\.4 mm\)/,
    );
  });

  it("a side with three pages and a sheet without a creep figure are refused before any art loads", async () => {
    const loads: number[] = [];
    const three = input(4, A5, 3, A3);
    three.sides = bookletSides(4, labelledArt(148, 210, 3, loads));
    three.sides[0]?.pages.push({ page: 5, content: { kind: "blank" } });
    await expect(imposeBooklet(three)).rejects.toThrow(/Sheet 1 front has 3 page\(s\)/);
    const noCreep = input(8, A5, 3, A3, { creepMm: [0] });
    await expect(imposeBooklet(noCreep)).rejects.toThrow(/No creep figure for sheet 2/);
    expect(loads).toEqual([]);
  });
});

describe("page order on each side (pages sharing a side sum to N + 1; GeeksforGeeks Puzzle 28)", () => {
  it("8 pages: [8|1], [2|7], [6|3], [4|5] (REFERENCE §6.3 worked example)", async () => {
    const out = await imposeBooklet(input(8, A5, 3, A3));
    const path = tempFile(out.bytes);
    const sides = [1, 2, 3, 4].map((p) => labelsOn(path, p));
    expect(sides).toEqual([
      [8, 1],
      [2, 7],
      [6, 3],
      [4, 5],
    ]);
    for (const side of sides) expect((side[0] ?? 0) + (side[1] ?? 0)).toBe(9);
  });

  it("16 pages: [16|1], [2|15], [14|3], [4|13], [12|5], [6|11], [10|7], [8|9] (REFERENCE §6.4)", async () => {
    const out = await imposeBooklet(input(16, HALF_LETTER, 3.175, TABLOID));
    const path = tempFile(out.bytes);
    const sides = Array.from({ length: 8 }, (_, i) => labelsOn(path, i + 1));
    expect(sides).toEqual([
      [16, 1],
      [2, 15],
      [14, 3],
      [4, 13],
      [12, 5],
      [6, 11],
      [10, 7],
      [8, 9],
    ]);
    for (const side of sides) expect((side[0] ?? 0) + (side[1] ?? 0)).toBe(17);
  });

  it("24 pages make 6 sheets, 12 sides (common practice, no source: N/4 folded sheets)", async () => {
    const out = await imposeBooklet(input(24, A5, 3, A3));
    const path = tempFile(out.bytes);
    expect(pdfinfoPages(path)).toBe(12);
    expect(pdftotext(path, 12)).toContain("sheet 6 of 6 - back");
    expect(labelsOn(path, 12)).toEqual([12, 13]);
  });
});

describe("slug line", () => {
  it("names the title, sheet N of M, the side, the ink and the stock, outside the bleed", async () => {
    const sides = bookletSides(8, labelledArt(148, 210, 3), (s) =>
      s === 1 ? "cover stock 250 gsm" : null,
    );
    const out = await imposeBooklet(
      input(8, A5, 3, A3, { sides, ink: "fluorescent pink", title: "Café Łódź 🌸" }),
    );
    const path = tempFile(out.bytes);
    // Ł and the emoji have no WinAnsi glyph in Helvetica; é does; ź loses its accent.
    expect(pdftotext(path, 1)).toContain(
      "Café ?ódz ? - sheet 1 of 2 - front - ink: fluorescent pink - cover stock 250 gsm - pages 8 | 1",
    );
    expect(pdftotext(path, 4)).toContain(
      "Café ?ódz ? - sheet 2 of 2 - back - ink: fluorescent pink - pages 4 | 5",
    );
    const composite = await imposeBooklet(input(8, A5, 3, A3));
    expect(pdftotext(tempFile(composite.bytes), 2)).toContain(
      "Harbour Lights - sheet 1 of 2 - back - composite - pages 2 | 7",
    );
  });
});
