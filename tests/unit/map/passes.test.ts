import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { countPasses, passesForInks } from "@/lib/map";
import { map, single, spread, withPlaced } from "./fixtures";

/*
 * Hand-worked example, 8 pages, 2 sheets (pages sharing a side sum to N + 1 = 9,
 * GeeksforGeeks "Puzzle 28 (Newspaper Puzzle)", geeksforgeeks.org/puzzle-28-newspaper-puzzle/):
 *   sheet 1 front (8|1), back (2|7); sheet 2 front (6|3), back (4|5).
 * Pieces: 1 black on p1, 2 teal on p8, 3 black spread on p2–3, 4 teal spread on p4–5,
 *         5 black on p6, 6 teal on p7.
 *   sheet 1 front: p8 teal + p1 black  → {black, teal} → 2 passes
 *   sheet 1 back : p2 black + p7 teal  → {black, teal} → 2 passes
 *   sheet 2 front: p6 black + p3 black → {black}       → 1 pass
 *   sheet 2 back : p4 teal  + p5 teal  → {teal}        → 1 pass
 *   per copy 2+2+1+1 = 6 passes; 50 copies → 300; stencils 2+2+1+1 = 6.
 * With a press laying 2 inks per pass every side needs ⌈n/2⌉ = 1 pass → 4 per copy.
 * One pass per ink per side: Fancyclopedia 1 (c. 1944), "Mimeography", fancyclopedia.wikidot.com/mimeography:
 * "Each copy sheet is run thru the mimeo as many times as there are colors".
 */
const pieces = [
  single(1, ["black"]),
  single(2, ["teal"]),
  spread(3, ["black"]),
  spread(4, ["teal"]),
  single(5, ["black"]),
  single(6, ["teal"]),
];
const worked = withPlaced(map(8, pieces, { pressInks: ["black", "teal"] }), [
  [1, [1]],
  [2, [8]],
  [3, [2, 3]],
  [4, [4, 5]],
  [5, [6]],
  [6, [7]],
]);

describe("drum passes, hand-worked 8-page example", () => {
  it("counts inks and passes per side, per copy and per run", () => {
    const count = countPasses(worked, 50);
    expect(count.sides.map((s) => [s.key, s.pages, s.pieceIds, s.inks, s.passes])).toEqual([
      ["1-front", [8, 1], [1, 2], ["black", "teal"], 2],
      ["1-back", [2, 7], [3, 6], ["black", "teal"], 2],
      ["2-front", [6, 3], [3, 5], ["black"], 1],
      ["2-back", [4, 5], [4], ["teal"], 1],
    ]);
    expect(count.passesPerCopy).toBe(6);
    expect(count.passesPerRun).toBe(300);
    expect(count.mastersPerRun).toBe(6);
    expect(count.sidesPerInk).toEqual({ black: 3, teal: 3 });
    expect(count.explanation).toContain("6 passes per copy, 300 passes for 50 copies");
  });

  it("a press laying 2 inks per pass needs 1 pass per side here: 4 per copy", () => {
    expect(countPasses({ ...worked, inksPerPass: 2 }, 1).passesPerCopy).toBe(4);
  });

  it("just a black piece on 1 and a teal piece on 8: that side needs 2 passes, the rest none", () => {
    const s = withPlaced(map(8, [single(1, ["black"]), single(2, ["teal"])]), [
      [1, [1]],
      [2, [8]],
    ]);
    const count = countPasses(s);
    expect(count.sides.map((x) => x.passes)).toEqual([2, 0, 0, 0]);
    expect(count.passesPerCopy).toBe(2);
  });

  it("⌈inks ÷ inks per pass⌉ (hand-worked: 0→0, 1→1, 3 by 2→2, 4 by 4→1)", () => {
    expect([
      passesForInks(0, 1),
      passesForInks(1, 1),
      passesForInks(3, 2),
      passesForInks(4, 4),
      passesForInks(5, 4),
    ]).toEqual([0, 1, 2, 1, 2]);
  });

  it("fold-only 4 pages: outside 4|1 and inside 2|3 are two sides of one sheet (common practice, no source)", () => {
    const s = withPlaced(
      map(4, [single(1, ["black"]), single(2, ["teal"]), spread(3, ["red"])], {
        binding: "fold-only",
      }),
      [
        [1, [1]],
        [2, [4]],
        [3, [2, 3]],
      ],
    );
    const count = countPasses(s);
    expect(count.sides.map((x) => [x.key, x.inks, x.passes])).toEqual([
      ["1-front", ["black", "teal"], 2],
      ["1-back", ["red"], 1],
    ]);
  });
});

describe("drum passes agree with the reverse lookup q = min(p, N+1−p), side = front if q odd (from the N + 1 rule, GeeksforGeeks 'Puzzle 28 (Newspaper Puzzle)')", () => {
  it("for random placements of single pages", () => {
    const inks = ["black", "teal", "red", "gold"];
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 12 }),
        fc.integer({ min: 1, max: 3 }),
        fc.array(fc.option(fc.subarray(inks, { minLength: 1 }), { nil: null }), {
          minLength: 48,
          maxLength: 48,
        }),
        (sheets, perPass, pageInks) => {
          const n = sheets * 4;
          const ps = pageInks.slice(0, n).map((ink, i) => (ink ? single(i + 1, ink) : null));
          const pieces = ps.filter((p): p is NonNullable<typeof p> => p !== null);
          const state = withPlaced(
            map(n, pieces, { inksPerPass: perPass }),
            pieces.map((p) => [p.id, [p.id]]),
          );
          // Independent count: group pages by (sheet, side) from the reverse lookup.
          const sides = new Map<string, Set<string>>();
          for (const p of pieces) {
            const q = Math.min(p.id, n + 1 - p.id);
            const key = `${Math.ceil(q / 2)}-${q % 2 === 1 ? "front" : "back"}`;
            const set = sides.get(key) ?? new Set<string>();
            for (const i of p.inks) set.add(i);
            sides.set(key, set);
          }
          let expected = 0;
          for (const set of sides.values()) expected += Math.ceil(set.size / perPass);
          expect(countPasses(state).passesPerCopy).toBe(expected);
        },
      ),
      { numRuns: 200 },
    );
  });
});
