import { describe, expect, it } from "vitest";
import {
  defaultSheetFor,
  MARKS_ALLOWANCE_MM,
  neededSheetMm,
  presetSheetsFor,
  resolveSheet,
  sheetMarksFor,
  type SheetLayoutInput,
} from "@/lib/print/press-sheet";
import { produceRequestSchema } from "@/lib/validations/print-files";

// REFERENCE.md: half letter 139.7 x 215.9 mm, letter 215.9 x 279.4 mm, tabloid 279.4 x 431.8 mm.
const halfLetter: SheetLayoutInput = {
  trimPreset: "half-letter",
  trimWidthMm: 139.7,
  trimHeightMm: 215.9,
  bleedMm: 3.175,
  binding: "saddle-stitch",
  pageCount: 16,
};
// ISO 216: A5 148 x 210, A4 210 x 297, A3 297 x 420 mm.
const a5: SheetLayoutInput = {
  ...halfLetter,
  trimPreset: "a5",
  trimWidthMm: 148,
  trimHeightMm: 210,
  bleedMm: 3,
};
const letter: SheetLayoutInput = {
  ...halfLetter,
  trimPreset: "letter",
  trimWidthMm: 215.9,
  trimHeightMm: 279.4,
};
const a4: SheetLayoutInput = { ...a5, trimPreset: "a4", trimWidthMm: 210, trimHeightMm: 297 };

describe("press sheets for a trim", () => {
  it("half letter prints on letter (letter folded = half letter, REFERENCE.md), or a larger sheet it fits", () => {
    // A4 is 210 mm across: two half-letter pages stand 215.9 mm tall, so it holds them neither way.
    expect(presetSheetsFor(halfLetter).map((s) => s.id)).toEqual([
      "letter",
      "legal",
      "tabloid",
      "a3",
    ]);
    expect(defaultSheetFor(halfLetter)?.id).toBe("letter");
    // Letter is the spread itself: edge to edge, said so; tabloid and A3 keep bleed and marks.
    const byId = Object.fromEntries(presetSheetsFor(halfLetter).map((s) => [s.id, s.layoutNote]));
    expect(byId.letter).toContain("no room for bleed or crop marks");
    expect(byId.tabloid).toBeNull();
    expect(byId.a3).toBeNull();
  });
  it("A5 on A4 (A4 folded = A5, ISO 216); letter on tabloid; A4 on A3", () => {
    expect(defaultSheetFor(a5)?.id).toBe("a4");
    // Letter is 279.4 mm long: two A5 pages need 296 mm, so it is not offered for A5.
    expect(presetSheetsFor(a5).map((s) => s.id)).not.toContain("letter");
    expect(presetSheetsFor(letter).map((s) => s.id)).toEqual(["tabloid"]);
    expect(defaultSheetFor(a4)?.id).toBe("a3");
  });
  it("a named sheet that does not suit the trim is refused, naming the ones that do", () => {
    const r = resolveSheet(halfLetter, "a4");
    expect(r.ok).toBe(false);
    if (!r.ok)
      expect(r.message).toMatch(/^A4 .*does not suit this trim: use Letter \(8\.5 x 11 in\)/);
    const unknown = resolveSheet(halfLetter, "napkin");
    expect(unknown.ok).toBe(false);
  });
  it("a custom sheet must hold two pages side by side, the bleed and the marks", () => {
    // Half letter spread: 2 x 139.7 = 279.4 mm wide, 215.9 mm high, plus 2 x (3.175 + marks).
    const needed = neededSheetMm(halfLetter);
    expect(needed.widthMm).toBeCloseTo(279.4 + 2 * (3.175 + MARKS_ALLOWANCE_MM), 6);
    expect(needed.heightMm).toBeCloseTo(215.9 + 2 * (3.175 + MARKS_ALLOWANCE_MM), 6);
    // Letter itself (215.9 x 279.4) has no room for bleed or marks.
    const tooSmall = resolveSheet(halfLetter, { widthMm: 215.9, heightMm: 279.4 });
    expect(tooSmall.ok).toBe(false);
    if (!tooSmall.ok) expect(tooSmall.message).toContain("need 301.8 mm x 238.3 mm");
    // SRA4 (225 x 320 mm, ISO 217) is 225 mm short side: 13.3 mm too little for 238.3 mm.
    expect(resolveSheet(halfLetter, { widthMm: 225, heightMm: 320 }).ok).toBe(false);
    // SRA3 (320 x 450 mm, ISO 217) holds it, given either way round.
    const sra3 = resolveSheet(halfLetter, { widthMm: 450, heightMm: 320 });
    expect(sra3).toEqual({
      ok: true,
      sheet: { id: "custom", name: "Custom 320 mm x 450 mm", widthMm: 320, heightMm: 450 },
    });
  });
  it("an A6 trim with no pairing is offered the named sheets its spread fits", () => {
    // ISO 216: A6 105 x 148 mm; its spread 210 x 148 mm plus bleed and marks fits letter and A4.
    const a6 = { ...a5, trimPreset: "a6", trimWidthMm: 105, trimHeightMm: 148 };
    expect(presetSheetsFor(a6).map((s) => s.id)).toEqual([
      "letter",
      "a4",
      "legal",
      "tabloid",
      "a3",
    ]);
  });
  it("the request schema takes a named sheet or a custom size in millimetres", () => {
    expect(produceRequestSchema.safeParse({ sheet: "letter" }).success).toBe(true);
    expect(produceRequestSchema.safeParse({ sheet: { widthMm: 320, heightMm: 450 } }).success).toBe(
      true,
    );
    expect(produceRequestSchema.safeParse({ sheet: { widthMm: 0, heightMm: 450 } }).success).toBe(
      false,
    );
    expect(produceRequestSchema.safeParse({ sheet: "" }).success).toBe(false);
    expect(produceRequestSchema.safeParse({}).success).toBe(false);
  });
});

describe("sheetMarksFor", () => {
  // ANSI/ASME Y14.1: letter 8.5 x 11 in, tabloid 11 x 17 in; half letter 5.5 x 8.5 in.
  const halfLetter = { trimWidthMm: 139.7, trimHeightMm: 215.9, bleedMm: 3.175 };
  const letter = { name: "Letter", widthMm: 215.9, heightMm: 279.4 };
  const tabloid = { name: "Tabloid", widthMm: 279.4, heightMm: 431.8 };

  it("keeps the bleed and the marks on a sheet with room for them", () => {
    expect(sheetMarksFor(halfLetter, tabloid)).toEqual({ bleedMm: 3.175, marks: true, note: null });
  });

  it("lays half letter on letter edge to edge, the two pages filling the sheet, and says so", () => {
    // Common practice, no source: a letter sheet folded once makes a half-letter booklet.
    const fit = sheetMarksFor(halfLetter, letter);
    expect(fit?.bleedMm).toBe(0);
    expect(fit?.marks).toBe(false);
    expect(fit?.note).toContain("no room for bleed or crop marks");
  });

  it("lays A5 on A4 edge to edge too (ISO 216: A5 148 x 210 mm, A4 210 x 297 mm)", () => {
    const fit = sheetMarksFor(
      { trimWidthMm: 148, trimHeightMm: 210, bleedMm: 3 },
      { name: "A4", widthMm: 210, heightMm: 297 },
    );
    expect(fit).toMatchObject({ bleedMm: 0, marks: false });
  });

  it("keeps the bleed without marks when only that fits", () => {
    // 2 x 139.7 + 2 x 3.175 = 285.75 mm wide, 222.25 mm tall: too tight for marks.
    const fit = sheetMarksFor(halfLetter, { name: "Snug", widthMm: 230, heightMm: 290 });
    expect(fit).toMatchObject({ bleedMm: 3.175, marks: false });
    expect(fit?.note).toContain("no crop or fold marks");
  });

  it("is null when the pages alone do not fit", () => {
    expect(sheetMarksFor(halfLetter, { name: "Small", widthMm: 200, heightMm: 270 })).toBeNull();
  });
});
