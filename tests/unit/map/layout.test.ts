import { describe, expect, it } from "vitest";
import { readerSpreads, sheetSides } from "@/lib/map";

describe("reader spreads", () => {
  it("8 pages: cover alone, 2–3, 4–5, 6–7, back cover alone (W3C CSS Paged Media Module Level 3, 'Facing Pages')", () => {
    expect(readerSpreads(8)).toEqual([
      { kind: "front-cover", pages: [1] },
      { kind: "spread", pages: [2, 3] },
      { kind: "spread", pages: [4, 5] },
      { kind: "spread", pages: [6, 7] },
      { kind: "back-cover", pages: [8] },
    ]);
  });

  it("an odd count leaves the last page unpaired (hand-worked: 7 pages)", () => {
    expect(readerSpreads(7)).toEqual([
      { kind: "front-cover", pages: [1] },
      { kind: "spread", pages: [2, 3] },
      { kind: "spread", pages: [4, 5] },
      { kind: "spread", pages: [6, 7] },
    ]);
    expect(readerSpreads(6).map((s) => s.pages)).toEqual([[1], [2, 3], [4, 5], [6]]);
    expect(readerSpreads(1)).toEqual([{ kind: "front-cover", pages: [1] }]);
  });

  it("every page appears exactly once for 1..40 pages", () => {
    for (let n = 1; n <= 40; n++) {
      const pages = readerSpreads(n).flatMap((s) => s.pages);
      expect(pages).toEqual(Array.from({ length: n }, (_, i) => i + 1));
    }
  });
});

describe("sheet sides", () => {
  it("8 pages by the N + 1 rule (GeeksforGeeks 'Puzzle 28 (Newspaper Puzzle)'): sheet 1 front 8|1 back 2|7, sheet 2 front 6|3 back 4|5 (centre)", () => {
    const plan = sheetSides(8, "saddle-stitch");
    expect(plan.sheets.map((s) => [s.front.pages, s.back.pages, s.centre])).toEqual([
      [[8, 1], [2, 7], false],
      [[6, 3], [4, 5], true],
    ]);
    expect(plan.centreSheet).toBe(2);
    expect(plan.centreSpread).toEqual([4, 5]);
    expect(plan.paddingPages).toEqual([]);
  });

  it("16 pages by the N + 1 rule, side order [16,1] [2,15] [14,3] [4,13] [12,5] [6,11] [10,7] [8,9]", () => {
    const plan = sheetSides(16, "saddle-stitch");
    expect(plan.sheets.flatMap((s) => [s.front.pages, s.back.pages])).toEqual([
      [16, 1],
      [2, 15],
      [14, 3],
      [4, 13],
      [12, 5],
      [6, 11],
      [10, 7],
      [8, 9],
    ]);
    expect(plan.centreSheet).toBe(4);
    expect(plan.centreSpread).toEqual([8, 9]);
  });

  it("pages sharing a side sum to N+1 (GeeksforGeeks 'Puzzle 28 (Newspaper Puzzle)'; Maths Is Fun 'Newspaper Caper') for every multiple of 4 up to 96", () => {
    for (let n = 4; n <= 96; n += 4) {
      const plan = sheetSides(n, "saddle-stitch");
      expect(plan.sheets).toHaveLength(n / 4);
      for (const s of plan.sheets)
        for (const side of [s.front, s.back])
          expect((side.pages[0] ?? 0) + (side.pages[1] ?? 0)).toBe(n + 1);
    }
  });

  it("10 pages are laid out as 12 with pages 11 and 12 as padding (a booklet has a multiple of 4 pages, IWPCUG puzzle 'Pages of a booklet': 10 → 12, 2 blanks)", () => {
    const plan = sheetSides(10, "saddle-stitch");
    expect(plan.laidOutPages).toBe(12);
    expect(plan.paddingPages).toEqual([11, 12]);
    expect(plan.sheets).toHaveLength(3);
  });

  it("fold-only uses one sheet: 4 pages outside 4|1, inside 2|3 (common practice, no source)", () => {
    const plan = sheetSides(4, "fold-only");
    expect(plan.sheets).toHaveLength(1);
    expect(plan.sheets[0]?.front.pages).toEqual([4, 1]);
    expect(plan.sheets[0]?.back.pages).toEqual([2, 3]);
    expect(plan.foldFormat).toBe("half-fold");
    // Eight pages on one side of one sheet: 5 4 3 2 over 6 7 8 1 (common practice, no source).
    const eight = sheetSides(8, "fold-only");
    expect(eight.sheets[0]?.front.pages).toEqual([5, 4, 3, 2, 6, 7, 8, 1]);
    expect(eight.sheets[0]?.back.pages).toEqual([]);
  });
});
