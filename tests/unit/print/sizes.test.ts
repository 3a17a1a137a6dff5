import { PageSizes } from "pdf-lib";
import { describe, expect, it } from "vitest";
import {
  findPreset,
  fitOnSheet,
  foldInHalf,
  iso216ToleranceMm,
  matchPreset,
  orientationOf,
  parentSheetFor,
  rotateSize,
  TRIM_PRESETS,
  withOrientation,
} from "@/lib/print/sizes";
import { bleedBoxOf } from "@/lib/print/spec";
import { inToMm, mmToPt } from "@/lib/print/units";

const preset = (id: string) => {
  const p = findPreset(id);
  if (!p) throw new Error(`no preset ${id}`);
  return p;
};

describe("ISO 216 catalogue", () => {
  it.each([
    // ISO 216 (Kuhn; Wikipedia "ISO 216"; CUPS pwg-media.c)
    ["a0", 841, 1189],
    ["a1", 594, 841],
    ["a2", 420, 594],
    ["a3", 297, 420],
    ["a4", 210, 297],
    ["a5", 148, 210],
    ["a6", 105, 148],
    ["a7", 74, 105],
    ["a8", 52, 74],
    ["a9", 37, 52],
    ["a10", 26, 37],
    ["b0", 1000, 1414],
    ["b1", 707, 1000],
    ["b2", 500, 707],
    ["b3", 353, 500],
    ["b4", 250, 353],
    ["b5", 176, 250],
    ["b6", 125, 176],
    ["b7", 88, 125],
  ])("%s is %i x %i mm", (id, w, h) => {
    expect(preset(id).widthMm).toBe(w);
    expect(preset(id).heightMm).toBe(h);
  });

  it("A0 has an area of 1 m² before rounding (0.999949 m²)", () => {
    // ISO 216 rule (Kuhn; Wikipedia "ISO 216")
    expect((preset("a0").widthMm * preset("a0").heightMm) / 1e6).toBeCloseTo(0.999949, 6);
  });

  it("A(n+1) = floor(long side of A(n) / 2) x short side, for A0–A10 and B0–B10", () => {
    // Fold rule derived from ISO 216:2007 (A(n+1) is A(n) halved parallel to its shorter side, in whole
    // millimetres), reproducing every tabulated ISO 216 size
    for (const series of ["a", "b"]) {
      for (let n = 0; n < 10; n++) {
        const big = preset(`${series}${n}`);
        const next = preset(`${series}${n + 1}`);
        const folded = foldInHalf(big);
        expect(Math.floor(folded.widthMm)).toBe(next.widthMm);
        expect(folded.heightMm).toBe(next.heightMm);
      }
    }
  });

  it("A4 folded is 148.5 x 210 mm, which is A5 within the ISO 216 ±1.5 mm tolerance, not exactly", () => {
    const folded = foldInHalf(preset("a4"));
    expect(folded).toEqual({ widthMm: 148.5, heightMm: 210 });
    expect(folded.widthMm).not.toBe(148);
    expect(Math.abs(folded.widthMm - 148)).toBeLessThanOrEqual(iso216ToleranceMm(148));
    expect(matchPreset(folded)?.id).toBe("a5");
  });

  it("ISO 216 tolerances: ±1.5 mm to 150 mm, ±2 mm to 600 mm, ±3 mm above", () => {
    expect(iso216ToleranceMm(148)).toBe(1.5);
    expect(iso216ToleranceMm(210)).toBe(2);
    expect(iso216ToleranceMm(841)).toBe(3);
  });

  it("B5 in points is 498.898 x 708.661 (derived) and agrees with pdf-lib PageSizes.B5", () => {
    expect(mmToPt(preset("b5").widthMm)).toBeCloseTo(498.898, 3);
    expect(mmToPt(preset("b5").heightMm)).toBeCloseTo(708.661, 3);
    // pdf-lib 1.17.1 PageSizes are rounded to 2 decimals: allow ±0.005 pt
    expect(Math.abs(mmToPt(preset("b5").widthMm) - PageSizes.B5[0])).toBeLessThanOrEqual(0.005);
  });

  it.each([
    ["a4", PageSizes.A4],
    ["a5", PageSizes.A5],
    ["a3", PageSizes.A3],
    ["letter", PageSizes.Letter],
    ["legal", PageSizes.Legal],
    ["tabloid", PageSizes.Tabloid],
  ] as const)("%s agrees with pdf-lib PageSizes within 0.005 pt", (id, [w, h]) => {
    expect(Math.abs(mmToPt(preset(id).widthMm) - w)).toBeLessThanOrEqual(0.005);
    expect(Math.abs(mmToPt(preset(id).heightMm) - h)).toBeLessThanOrEqual(0.005);
  });
});

describe("North American sizes", () => {
  it("letter, legal, tabloid, half letter and quarter letter in mm (x 25.4)", () => {
    // CSS Paged Media §page-size: letter 8.5 x 11 in, legal 8.5 x 14 in, ledger 11 x 17 in
    expect(preset("letter").widthMm).toBeCloseTo(215.9, 9);
    expect(preset("letter").heightMm).toBeCloseTo(279.4, 9);
    expect(preset("legal").heightMm).toBeCloseTo(355.6, 9);
    expect(preset("tabloid").widthMm).toBeCloseTo(279.4, 9);
    expect(preset("tabloid").heightMm).toBeCloseTo(431.8, 9);
    // PWG 5101.1 na_invoice_5.5x8.5in (CUPS pwg-media.c)
    expect(preset("half-letter").widthMm).toBeCloseTo(139.7, 9);
    expect(preset("half-letter").heightMm).toBeCloseTo(215.9, 9);
    expect(mmToPt(preset("half-letter").widthMm)).toBeCloseTo(396, 9);
    expect(preset("quarter-letter").widthMm).toBeCloseTo(inToMm(4.25), 9);
  });

  it("tabloid folded is letter, letter folded is half letter, legal folded is 7 x 8.5 in (exact)", () => {
    // ANSI/ASME Y14.1: "cutting a sheet in half would produce two sheets of the next smaller size"
    const t = foldInHalf(preset("tabloid"));
    expect(t.widthMm).toBeCloseTo(inToMm(8.5), 9);
    expect(t.heightMm).toBeCloseTo(inToMm(11), 9);
    const l = foldInHalf(preset("letter"));
    expect(l.widthMm).toBeCloseTo(inToMm(5.5), 9);
    expect(l.heightMm).toBeCloseTo(inToMm(8.5), 9);
    const g = foldInHalf(preset("legal"));
    expect(g.widthMm).toBeCloseTo(inToMm(7), 9);
    expect(g.heightMm).toBeCloseTo(inToMm(8.5), 9);
  });

  it("small zine trims are in the catalogue", () => {
    // common practice, no source: 4x6, 5x5, 5x6, 3.5x4.5, 4.5x6 in are common zine trims
    for (const [w, h] of [
      [4, 6],
      [5, 5],
      [5, 6],
      [3.5, 4.5],
      [4.5, 6],
    ] as const) {
      expect(matchPreset({ widthMm: inToMm(w), heightMm: inToMm(h) })?.family).toBe("small-trim");
    }
  });

  it("every id is unique", () => {
    expect(new Set(TRIM_PRESETS.map((p) => p.id)).size).toBe(TRIM_PRESETS.length);
  });
});

describe("orientation", () => {
  it("portrait, landscape, square and turning", () => {
    const a5 = preset("a5");
    expect(orientationOf(a5)).toBe("portrait");
    expect(orientationOf(rotateSize(a5))).toBe("landscape");
    expect(orientationOf({ widthMm: 127, heightMm: 127 })).toBe("square");
    expect(withOrientation(a5, "landscape")).toEqual({ widthMm: 210, heightMm: 148 });
    expect(withOrientation(rotateSize(a5), "portrait")).toEqual({ widthMm: 148, heightMm: 210 });
  });

  it("bleed box = trim grown by the bleed on every side", () => {
    // Derived (the BleedBox is the TrimBox grown by the bleed, ISO 32000-1:2008 Table 30):
    // A5 + 3 mm → 154 x 216 mm; half letter + 0.125 in → 5.75 x 8.75 in
    const a5 = preset("a5");
    expect(bleedBoxOf({ trimWidthMm: a5.widthMm, trimHeightMm: a5.heightMm, bleedMm: 3 })).toEqual({
      widthMm: 154,
      heightMm: 216,
    });
    const halfLetter = preset("half-letter");
    const hl = bleedBoxOf({
      trimWidthMm: halfLetter.widthMm,
      trimHeightMm: halfLetter.heightMm,
      bleedMm: inToMm(0.125),
    });
    expect(hl.widthMm).toBeCloseTo(inToMm(5.75), 9);
    expect(hl.heightMm).toBeCloseTo(inToMm(8.75), 9);
  });
});

describe("parent sheet of a saddle-stitched booklet", () => {
  it("A5 booklet prints on A4, A4 on A3 (ISO 216 tolerance)", () => {
    // Typical pairings, derived from ISO 216:2007's halving rule: A4 sheet → A5 booklet; A3 → A4
    expect(parentSheetFor(preset("a5")).preset?.id).toBe("a4");
    expect(parentSheetFor(preset("a4")).preset?.id).toBe("a3");
  });

  it("half letter prints on letter, letter on tabloid, quarter letter on half letter", () => {
    // common practice, no source: letter sheets folded once make half-letter booklets
    expect(parentSheetFor(preset("half-letter")).preset?.id).toBe("letter");
    expect(parentSheetFor(preset("letter")).preset?.id).toBe("tabloid");
    expect(parentSheetFor(preset("quarter-letter")).preset?.id).toBe("half-letter");
  });

  it("a 4 x 6 in booklet has an 8 x 6 in spread: too wide for half letter and A5, once on letter", () => {
    const p = parentSheetFor({ widthMm: inToMm(4), heightMm: inToMm(6) });
    expect(p.preset).toBeUndefined();
    expect(p.spread.widthMm).toBeCloseTo(inToMm(8), 9);
    expect(p.smallestCommonSheet?.preset.id).toBe("letter");
    expect(p.smallestCommonSheet?.up).toBe(1);
  });
});

describe("n-up on a sheet with bleed and gripper", () => {
  it("four A6 on A4 with no bleed, three straight cuts plus the edges", () => {
    // ISO 216: A4 = 2 x 2 A6
    const fit = fitOnSheet(preset("a6"), preset("a4"), { bleedMm: 0, gripperMm: 0 });
    expect(fit.up).toBe(4);
    expect(fit.columns * fit.rows).toBe(4);
    expect(fit.cuts.filter((c) => c.direction === "vertical").map((c) => c.atMm)).toEqual([
      0, 105, 210,
    ]);
  });

  it("with 3 mm bleed A6 no longer fits 4-up on A4 (111 x 154 mm pieces)", () => {
    // derived: 2 x 111 = 222 > 210 and 2 x 154 = 308 > 297 in either orientation
    const fit = fitOnSheet(preset("a6"), preset("a4"), { bleedMm: 3, gripperMm: 0 });
    expect(fit.up).toBe(2);
    expect(fit.piece).toEqual(
      fit.placed === "as-given" ? { widthMm: 111, heightMm: 154 } : { widthMm: 154, heightMm: 111 },
    );
  });

  it("quarter letter is 4-up on letter without bleed; with 1/8 in bleed and a 1/4 in gripper, 2-up", () => {
    // derived: 2 x 4.25 = 8.5, 2 x 5.5 = 11; with bleed 4.5 x 5.75 pieces on 8.5 x 10.75 usable
    const q = preset("quarter-letter");
    const letter = preset("letter");
    expect(fitOnSheet(q, letter, { bleedMm: 0, gripperMm: 0 }).up).toBe(4);
    const withGripper = fitOnSheet(q, letter, { bleedMm: inToMm(0.125), gripperMm: inToMm(0.25) });
    expect(withGripper.up).toBe(2);
    // Two cuts per piece per axis with bleed: each piece is cut out on its own trim lines.
    expect(withGripper.cuts.length).toBe(2 * withGripper.columns + 2 * withGripper.rows);
  });

  it("tries the trim turned and keeps the layout with more pieces", () => {
    // derived: 3.5 x 4.5 in on 8.5 x 11 in: as given 2 x 2 = 4; turned (4.5 x 3.5) 1 x 3 = 3
    const fit = fitOnSheet({ widthMm: inToMm(3.5), heightMm: inToMm(4.5) }, preset("letter"), {
      bleedMm: 0,
      gripperMm: 0,
    });
    expect(fit.up).toBe(4);
    expect(fit.placed).toBe("as-given");
    // derived: 5 x 2 in on 8.5 x 11 in: as given 1 x 5 = 5; turned (2 x 5) 4 x 2 = 8
    const wide = fitOnSheet({ widthMm: inToMm(5), heightMm: inToMm(2) }, preset("letter"), {
      bleedMm: 0,
      gripperMm: 0,
    });
    expect(wide.up).toBe(8);
    expect(wide.placed).toBe("rotated");
    expect(wide.pieceOrientation).toBe("portrait");
    expect(wide.trimOrigins).toHaveLength(8);
  });

  it("a trim bigger than the sheet fits 0 times and has no cuts", () => {
    const fit = fitOnSheet(preset("a3"), preset("a4"), { bleedMm: 3, gripperMm: 10 });
    expect(fit.up).toBe(0);
    expect(fit.cuts).toEqual([]);
  });
});
