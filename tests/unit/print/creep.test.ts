import { describe, expect, it } from "vitest";
import {
  bookletCalipersMm,
  bookletCreepMm,
  closedThicknessMm,
  creepPerSheetMm,
  pageShifts,
  sheetCalipersMm,
} from "@/lib/print/creep";
import { defaultCaliperMm } from "@/lib/print/paper";

// Worked creep values. Linear model: common practice, no source; round-fold model: derived geometry.
// Caliper 0.1 mm: copy paper is about 0.004 in (The Physics Factbook, "Thickness of a Piece of Paper",
// hypertextbook.com/facts/2001/JuliaSherlis.shtml; a measured 75 g/m² ream gives 0.103–0.104 mm a sheet).
describe("per-sheet push-out", () => {
  it.each([
    [2, 0.1, [0, 0.1], 0.157, 0.4],
    [4, 0.1, [0, 0.1, 0.2, 0.3], 0.471, 0.8],
    [4, 0.104, [0, 0.104, 0.208, 0.312], 0.49, 0.832],
  ])(
    "%i sheets at %f mm: linear %j, round-fold innermost %f mm, closed %f mm",
    (sheets, t, linear, round, closed) => {
      const got = creepPerSheetMm(sheets, t, "linear");
      got.forEach((v, i) => expect(v).toBeCloseTo(linear[i] ?? NaN, 9));
      expect(creepPerSheetMm(sheets, t, "round-fold").at(-1)).toBeCloseTo(round, 3);
      expect(closedThicknessMm(sheetCalipersMm(sheets, t))).toBeCloseTo(closed, 9);
    },
  );

  it("32 pages (8 sheets) at 0.1 mm: innermost 0.7 mm linear, 1.100 mm round-fold, 1.6 mm closed", () => {
    expect(creepPerSheetMm(8, 0.1).at(-1)).toBeCloseTo(0.7, 9);
    expect(creepPerSheetMm(8, 0.1, "round-fold").at(-1)).toBeCloseTo(1.1, 3);
    expect(closedThicknessMm(sheetCalipersMm(8, 0.1))).toBeCloseTo(1.6, 9);
  });

  it("a thicker separate cover pushes every inner sheet out by its own caliper", () => {
    const calipers = sheetCalipersMm(3, 0.1, 0.3);
    expect(calipers).toEqual([0.3, 0.1, 0.1]);
    const c = creepPerSheetMm(3, calipers);
    expect(c[1]).toBeCloseTo(0.3, 9);
    expect(c[2]).toBeCloseTo(0.4, 9);
  });
});

describe("per-page shift", () => {
  it("all four pages of a sheet move toward the spine by that sheet's push-out (PrintWiki 'Shingling')", () => {
    const shifts = pageShifts(16, 0.1);
    const byPage = new Map(shifts.map((s) => [s.page, s]));
    // sheet 4 carries 7, 8, 9, 10 (7 + 10 = 8 + 9 = N + 1, GeeksforGeeks "Puzzle 28 (Newspaper Puzzle)", geeksforgeeks.org/puzzle-28-newspaper-puzzle/)
    for (const p of [7, 8, 9, 10]) expect(byPage.get(p)?.towardSpineMm).toBeCloseTo(0.3, 9);
    for (const p of [1, 2, 15, 16]) expect(byPage.get(p)?.towardSpineMm).toBe(0);
    // right-hand (odd) pages move left, left-hand (even) pages move right
    expect(byPage.get(9)?.shiftXMm).toBeCloseTo(-0.3, 9);
    expect(byPage.get(8)?.shiftXMm).toBeCloseTo(0.3, 9);
    expect(Object.is(byPage.get(1)?.shiftXMm, -0)).toBe(false);
  });
});

describe("a booklet's calipers and creep", () => {
  // 24 pages fold from 6 sheets (a sheet folded once carries 4 pages: common practice, no source).
  const sheets = 24 / 4;
  it("uses the text caliper on every sheet of a self-cover booklet, linear push-out", () => {
    const stock = { paperCaliperMm: 0.1, coverStock: "self" as const, coverPaperGsm: null };
    expect(bookletCalipersMm(sheets, stock)).toEqual(Array(6).fill(0.1));
    // Linear model: sheet k sticks out by the calipers outside it, (k-1) x 0.1 mm.
    const creep = bookletCreepMm(sheets, stock);
    expect(creep.map((c) => Number(c.toFixed(6)))).toEqual([0, 0.1, 0.2, 0.3, 0.4, 0.5]);
  });
  it("gives the outer sheet of a separate cover the caliper of its weight", () => {
    const stock = { paperCaliperMm: 0.1, coverStock: "separate" as const, coverPaperGsm: 216 };
    const cover = defaultCaliperMm(216);
    expect(bookletCalipersMm(sheets, stock)[0]).toBeCloseTo(cover, 9);
    expect(bookletCreepMm(sheets, stock)[1]).toBeCloseTo(cover, 9);
    expect(bookletCreepMm(sheets, stock)[5]).toBeCloseTo(cover + 0.4, 9);
  });
});
