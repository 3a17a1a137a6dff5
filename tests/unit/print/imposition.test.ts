import { describe, expect, it } from "vitest";
import {
  FOLD_FORMATS,
  foldPanelSize,
  locatePage,
  maxSaddleStitchPages,
  padToMultipleOf4,
  planSaddleStitch,
  printerSpreadOrder,
  readerSpreads,
  saddleStitchSheets,
  sheetLayout,
  bookletPageOf,
} from "@/lib/print/imposition";
import { findPreset } from "@/lib/print/sizes";
import { inToMm } from "@/lib/print/units";

describe("padding to a multiple of 4", () => {
  it.each([
    // 4·⌈n/4⌉, a booklet having a multiple of 4 pages (IWPCUG Prize Puzzle, June 2009, "Pages of a booklet", iwpcug.org/davidbro/puz0906.htm):
    // 10 → 12 (2 blanks), 13 → 16 (3 blanks), 17 → 20 (3 blanks)
    [10, 12, 2],
    [13, 16, 3],
    [17, 20, 3],
    [16, 16, 0],
    [1, 4, 3],
  ])("%i content pages → %i pages, %i blanks", (n, pages, blanks) => {
    expect(padToMultipleOf4(n)).toEqual({ pages, blanks });
  });

  it("a 24-page booklet needs 6 double-sided sheets", () => {
    // common practice, no source: a sheet folded once carries 4 pages, so 24 pages need 6 sheets
    expect(planSaddleStitch({ contentPages: 24, cover: "self" }).sheetsPerCopy).toBe(6);
  });

  it("13 content pages: padded to 16, 4 sheets, blanks before the back cover by default", () => {
    // 13 content pages → 16 (3 blanks) → 4 sheets per copy (a sheet folded once carries 4 pages,
    // Jack Lynch, Guide to Literary and Rhetorical Terms, "sheet", andromeda.rutgers.edu/~jlynch/Terms/sheet.html)
    const plan = planSaddleStitch({ contentPages: 13, cover: "self" });
    expect(plan.pages).toBe(16);
    expect(plan.sheetsPerCopy).toBe(4);
    expect(plan.blankPages).toEqual([13, 14, 15]);
    expect(bookletPageOf(13, plan)).toBe(16);
    expect(bookletPageOf(12, plan)).toBe(12);
    const atEnd = planSaddleStitch({ contentPages: 13, cover: "self", blanks: "end" });
    expect(atEnd.blankPages).toEqual([14, 15, 16]);
  });
});

describe("8-page example worked from the N + 1 rule (GeeksforGeeks 'Puzzle 28 (Newspaper Puzzle)')", () => {
  it("sheet 1: front 8|1, back 2|7; sheet 2: front 6|3, back 4|5", () => {
    expect(saddleStitchSheets(8)).toEqual([
      { sheet: 1, front: { left: 8, right: 1 }, back: { left: 2, right: 7 } },
      { sheet: 2, front: { left: 6, right: 3 }, back: { left: 4, right: 5 } },
    ]);
  });

  it("2-up duplex side order [8,1], [2,7], [6,3], [4,5]", () => {
    expect(printerSpreadOrder(8)).toEqual([
      [8, 1],
      [2, 7],
      [6, 3],
      [4, 5],
    ]);
  });

  it.each([
    [1, 1, "front", "right"],
    [2, 1, "back", "left"],
    [3, 2, "front", "right"],
    [4, 2, "back", "left"],
    [5, 2, "back", "right"],
    [6, 2, "front", "left"],
    [7, 1, "back", "right"],
    [8, 1, "front", "left"],
  ] as const)("page %i prints on sheet %i, %s, %s half", (p, sheet, side, half) => {
    expect(locatePage(p, 8)).toEqual({ sheet, side, half });
  });
});

describe("16-page example worked from the N + 1 rule", () => {
  it("front and back of each of the 4 sheets", () => {
    expect(
      saddleStitchSheets(16).map((s) => [s.front.left, s.front.right, s.back.left, s.back.right]),
    ).toEqual([
      [16, 1, 2, 15],
      [14, 3, 4, 13],
      [12, 5, 6, 11],
      [10, 7, 8, 9],
    ]);
  });

  it("2-up duplex side order", () => {
    expect(printerSpreadOrder(16)).toEqual([
      [16, 1],
      [2, 15],
      [14, 3],
      [4, 13],
      [12, 5],
      [6, 11],
      [10, 7],
      [8, 9],
    ]);
  });
});

describe("rules that hold for every booklet", () => {
  it("pages sharing a side sum to N + 1 (GeeksforGeeks 'Newspaper Puzzle'; IWPCUG 'Pages of a booklet')", () => {
    for (const n of [4, 8, 12, 32, 64, 96]) {
      for (const s of saddleStitchSheets(n)) {
        expect(s.front.left + s.front.right).toBe(n + 1);
        expect(s.back.left + s.back.right).toBe(n + 1);
      }
    }
  });

  it("N = 64: page p's partner is 65 − p (GeeksforGeeks 'Puzzle 28')", () => {
    for (let p = 1; p <= 64; p++) {
      const pos = locatePage(p, 64);
      const side = sheetLayout(64, pos.sheet)[pos.side];
      expect(side.left + side.right - p).toBe(65 - p);
    }
  });

  it("the back of an odd page p ≤ N/2 is p + 1 (Maths Is Fun 'Newspaper Caper', N = 32)", () => {
    for (let p = 1; p <= 16; p += 2) {
      const front = locatePage(p, 32);
      const back = locatePage(p + 1, 32);
      expect(back.sheet).toBe(front.sheet);
      expect(front.side).toBe("front");
      expect(back.side).toBe("back");
    }
  });

  it("reverse lookup agrees with the layout for every page of a 96-page booklet", () => {
    const sheets = saddleStitchSheets(96);
    for (let p = 1; p <= 96; p++) {
      const { sheet, side, half } = locatePage(p, 96);
      expect(sheets[sheet - 1]?.[side][half]).toBe(p);
    }
  });

  it("refuses page counts that are not a multiple of 4", () => {
    expect(() => saddleStitchSheets(10)).toThrow(RangeError);
    expect(() => locatePage(9, 8)).toThrow(RangeError);
  });
});

describe("reader spreads", () => {
  it("cover, 2–3, 4–5, 6–7, back cover for 8 pages; even pages on the left (CSS Paged Media, 'Facing Pages')", () => {
    expect(readerSpreads(8)).toEqual([
      { kind: "front-cover", pages: [1] },
      { kind: "spread", pages: [2, 3] },
      { kind: "spread", pages: [4, 5] },
      { kind: "spread", pages: [6, 7] },
      { kind: "back-cover", pages: [8] },
    ]);
  });

  it("the centre spread is on one side of the innermost sheet", () => {
    const spreads = readerSpreads(16);
    const centre = spreads[Math.floor(spreads.length / 2)];
    expect(centre?.pages).toEqual([8, 9]);
    expect(locatePage(8, 16)).toEqual({ sheet: 4, side: "back", half: "left" });
    expect(locatePage(9, 16)).toEqual({ sheet: 4, side: "back", half: "right" });
  });
});

describe("cover stock", () => {
  it("separate cover: 1 cover sheet + (N − 4)/4 text sheets (4 pages a folded sheet, Jack Lynch 'sheet'; cover convention common practice, no source)", () => {
    const plan = planSaddleStitch({ contentPages: 8, cover: "separate" });
    expect(plan.coverSheetsPerCopy).toBe(1);
    expect(plan.textSheetsPerCopy).toBe(1);
    expect(plan.sheets[0]?.stock).toBe("cover");
    expect(plan.sheets[1]?.stock).toBe("text");
    expect(plan.sheets[0]?.front).toEqual({ left: 8, right: 1 });
    const self = planSaddleStitch({ contentPages: 16, cover: "self" });
    expect(self.coverSheetsPerCopy).toBe(0);
    expect(self.textSheetsPerCopy).toBe(4);
    expect(self.sidesPerCopy).toBe(8);
  });
});

describe("most pages a binding allows", () => {
  it("from a configured limit, rounded down to a multiple of 4", () => {
    expect(maxSaddleStitchPages({ maxPages: 50 })).toBe(48);
    expect(maxSaddleStitchPages({ maxSheets: 12 })).toBe(48);
    expect(maxSaddleStitchPages({ maxPages: 64, maxSheets: 10 })).toBe(40);
  });

  it("from caliper: a 2 mm staple capacity on 0.1 mm paper takes 20 sheets = 80 pages", () => {
    // derived: sheets nested at the fold = capacity ÷ caliper
    expect(maxSaddleStitchPages({ staplerCapacityMm: 2, caliperMm: 0.1 })).toBe(80);
    // with a 0.3 mm separate cover: 1 cover + floor(1.7 / 0.1) = 17 text sheets → 72 pages
    expect(
      maxSaddleStitchPages({
        staplerCapacityMm: 2,
        caliperMm: 0.1,
        cover: "separate",
        coverCaliperMm: 0.3,
      }),
    ).toBe(72);
  });

  it("needs a limit", () => {
    expect(() => maxSaddleStitchPages({})).toThrow(RangeError);
  });
});

describe("fold-only single-sheet formats (common practice, no source)", () => {
  it("folded once is sheet 1 of a 4-page booklet", () => {
    const f = FOLD_FORMATS["half-fold"];
    const front = f.panels.filter((p) => p.side === "front").map((p) => p.page);
    const back = f.panels.filter((p) => p.side === "back").map((p) => p.page);
    const sheet = sheetLayout(4, 1);
    expect(front).toEqual([sheet.front.left, sheet.front.right]);
    expect(back).toEqual([sheet.back.left, sheet.back.right]);
  });

  it("one-sheet eight-page fold: every page once, top row upside down, one side printed", () => {
    const f = FOLD_FORMATS["one-sheet-eight"];
    expect(f.panels.map((p) => p.page).sort((a, b) => a - b)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    expect(f.panels.filter((p) => p.upsideDown).every((p) => p.row === 0)).toBe(true);
    expect(f.printedSides).toBe(1);
    // derived: letter landscape (11 x 8.5 in) in 4 x 2 panels gives 2.75 x 4.25 in pages
    const letter = findPreset("letter");
    if (!letter) throw new Error("no letter");
    const panel = foldPanelSize(f, { widthMm: letter.heightMm, heightMm: letter.widthMm });
    expect(panel.widthMm).toBeCloseTo(inToMm(2.75), 9);
    expect(panel.heightMm).toBeCloseTo(inToMm(4.25), 9);
  });

  it("tri-fold has six panels, three per side", () => {
    const f = FOLD_FORMATS["tri-fold"];
    expect(f.panels.filter((p) => p.side === "front")).toHaveLength(3);
    expect(new Set(f.panels.map((p) => p.page)).size).toBe(6);
  });
});
