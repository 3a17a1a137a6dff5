import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { countPasses, sheetSides } from "@/lib/map";
import type { MapPiece, MapState } from "@/lib/map";
import { fileForInk, masterCount, mastersFor } from "@/lib/print/masters";
import { map, single, spread, withPlaced } from "../map/fixtures";

/*
 * The hand-worked 8-page example of tests/unit/map/passes.test.ts (pages sharing a side sum to
 * N + 1 = 9, GeeksforGeeks "Puzzle 28 (Newspaper Puzzle)"):
 *   sheet 1 front (8|1): p8 teal (2), p1 black (1)
 *   sheet 1 back  (2|7): p2 black (3, page 1 of the spread), p7 teal (6)
 *   sheet 2 front (6|3): p6 black (5), p3 black (3, page 2)
 *   sheet 2 back  (4|5): p4–5 teal (4)
 * One master per ink per side (Fancyclopedia, "Mimeography": "each copy sheet is run thru the
 * mimeo as many times as there are colors"): black on 1-front, 1-back, 2-front; teal on 1-front,
 * 1-back, 2-back; six masters, the six passes per copy the sheet view counts.
 */
const worked = withPlaced(
  map(
    8,
    [
      single(1, ["black"]),
      single(2, ["teal"]),
      spread(3, ["black"]),
      spread(4, ["teal"]),
      single(5, ["black"]),
      single(6, ["teal"]),
    ],
    { pressInks: ["black", "teal"] },
  ),
  [
    [1, [1]],
    [2, [8]],
    [3, [2, 3]],
    [4, [4, 5]],
    [5, [6]],
    [6, [7]],
  ],
);

describe("masters per ink, hand-worked 8-page example", () => {
  const masters = mastersFor(worked, sheetSides(8, "saddle-stitch"));

  it("lists the inks in press order, each with the sides that carry it", () => {
    expect(masters.map((m) => m.ink)).toEqual(["black", "teal"]);
    expect(masters[0]!.sides.map((s) => s.key)).toEqual(["1-front", "1-back", "2-front"]);
    expect(masters[1]!.sides.map((s) => s.key)).toEqual(["1-front", "1-back", "2-back"]);
  });

  it("draws a page only on the masters of its piece's ink; the rest of the side is blank", () => {
    const [black, teal] = masters;
    expect(black!.sides[0]!.pages).toEqual([
      { page: 8, kind: "blank" },
      { page: 1, kind: "piece", pieceId: 1, piecePageIndex: 1 },
    ]);
    expect(teal!.sides[0]!.pages).toEqual([
      { page: 8, kind: "piece", pieceId: 2, piecePageIndex: 1 },
      { page: 1, kind: "blank" },
    ]);
    expect(black!.sides[2]!.pages).toEqual([
      { page: 6, kind: "piece", pieceId: 5, piecePageIndex: 1 },
      { page: 3, kind: "piece", pieceId: 3, piecePageIndex: 2 },
    ]);
  });

  it("makes as many masters as the sheet view counts passes", () => {
    expect(masterCount(masters)).toBe(6);
    expect(countPasses(worked).passesPerCopy).toBe(6);
  });

  it("puts a two-ink piece's page on both inks' masters", () => {
    const twoInk = withPlaced(
      map(4, [single(7, ["teal", "black"])], { pressInks: ["black", "teal"] }),
      [[7, [1]]],
    );
    const m = mastersFor(twoInk);
    expect(m.map((x) => [x.ink, x.sides.map((s) => s.key)])).toEqual([
      ["black", ["1-front"]],
      ["teal", ["1-front"]],
    ]);
    // Sheet 1 front of 4 pages is 4|1 (lib/print/imposition.ts).
    expect(m[1]!.sides[0]!.pages).toEqual([
      { page: 4, kind: "blank" },
      { page: 1, kind: "piece", pieceId: 7, piecePageIndex: 1 },
    ]);
  });

  it("lists an ink the press lacks after the press's own, marked as not on the press", () => {
    const gold = withPlaced(map(4, [single(8, ["gold"]), single(9, ["black"])]), [
      [8, [2]],
      [9, [1]],
    ]);
    expect(mastersFor(gold).map((m) => [m.ink, m.onPress])).toEqual([
      ["black", true],
      ["gold", false],
    ]);
  });

  it("has no masters for an empty map", () => {
    expect(mastersFor(map(8, []))).toEqual([]);
  });
});

describe("which file supplies a page on an ink's master", () => {
  const duplicator = { printMethod: "duplicator" as const };
  it("a one-ink piece's page file is its master; a two-ink piece sends one separation per ink", () => {
    expect(fileForInk(duplicator, { inks: ["teal"] }, "teal")).toEqual({ kind: "composite" });
    expect(fileForInk(duplicator, { inks: ["black", "teal"] }, "teal")).toEqual({
      kind: "separation",
      ink: "teal",
    });
  });
  it("a piece that does not print in the ink supplies nothing: its page is blank there", () => {
    expect(fileForInk(duplicator, { inks: ["black"] }, "teal")).toBeNull();
    expect(fileForInk(duplicator, { inks: ["black", "teal"] }, "red")).toBeNull();
  });
});

/** Random maps: pieces of one to three pages in random inks (some not on the press), placed where they fit. */
const INKS = ["black", "teal", "red", "gold"];
const arbitraryMap = fc
  .record({
    binding: fc.constantFrom("saddle-stitch" as const, "fold-only" as const),
    sheets: fc.integer({ min: 1, max: 6 }),
    foldPages: fc.constantFrom(4, 6, 8),
    pieces: fc.array(
      fc.record({
        length: fc.integer({ min: 1, max: 3 }),
        inks: fc.subarray(INKS, { minLength: 1 }),
        start: fc.nat(),
      }),
      { maxLength: 12 },
    ),
  })
  .map(({ binding, sheets, foldPages, pieces }): MapState => {
    const pageCount = binding === "fold-only" ? foldPages : sheets * 4;
    const placed: MapPiece[] = [];
    const placements: Array<[number, number[]]> = [];
    const taken = new Set<number>();
    pieces.forEach((p, i) => {
      const first = (p.start % pageCount) + 1;
      const pages = Array.from({ length: p.length }, (_, k) => first + k);
      if (pages.some((pg) => pg > pageCount || taken.has(pg))) return;
      pages.forEach((pg) => taken.add(pg));
      const id = i + 1;
      placed.push({ id, title: `Piece ${id}`, kind: "run", pageCount: p.length, inks: p.inks });
      placements.push([id, pages]);
    });
    return withPlaced(
      map(pageCount, placed, { binding, pressInks: ["black", "teal", "red"] }),
      placements,
    );
  });

describe("the passes the sheet view counts are exactly the masters produced", () => {
  it("for a press laying one ink per pass, over many maps", () => {
    fc.assert(
      fc.property(arbitraryMap, (state) => {
        const count = countPasses({ ...state, inksPerPass: 1 });
        const masters = mastersFor(state, sheetSides(state.pageCount, state.binding));
        expect(masterCount(masters)).toBe(count.passesPerCopy);
        expect(masterCount(masters)).toBe(count.mastersPerRun);
        // Side by side: each side's inks are the inks with a master on that side, in the same order.
        for (const side of count.sides)
          expect(
            masters.filter((m) => m.sides.some((s) => s.key === side.key)).map((m) => m.ink),
          ).toEqual(side.inks);
      }),
      { numRuns: 300 },
    );
  });
});
