import { PDFDocument } from "pdf-lib";
import { describe, expect, it } from "vitest";
import { checkArtwork, type SpecReport } from "@/lib/print/check";
import type { PrintSpec } from "@/lib/print/spec";
import { inToMm, mmToPt } from "@/lib/print/units";
import { encryptedPdf, makePdf } from "./fixtures";

const a5: PrintSpec = {
  trimWidthMm: 148,
  trimHeightMm: 210,
  bleedMm: 3,
  safeMarginMm: 5,
  minPpi: 300,
  printMethod: "laser-colour",
  inks: [],
};
const halfLetter: PrintSpec = {
  ...a5,
  trimWidthMm: inToMm(5.5),
  trimHeightMm: inToMm(8.5),
  bleedMm: inToMm(0.125),
  safeMarginMm: inToMm(0.25),
};
const codes = (r: SpecReport) => r.findings.map((f) => f.code);
const find = (r: SpecReport, code: string) => r.findings.find((f) => f.code === code);

// A5 trim with 3 mm bleed, MediaBox = BleedBox (ISO 216 A5 = 148 x 210 mm; 1 pt = 1/72 in and the boxes per
// ISO 32000-1:2008 Table 30; as pdf-lib 1.17.1 saves and reloads them):
// MediaBox {0, 0, 436.535433, 612.283465}, TrimBox {8.503937, 8.503937, 419.527559, 595.275591}
const A5_BLEED: [number, number] = [436.535433, 612.283465];
const A5_TRIM: [number, number, number, number] = [8.503937, 8.503937, 419.527559, 595.275591];

describe("page boxes (ISO 32000-1 Table 30 defaults)", () => {
  it("A5 + 3 mm bleed with a TrimBox passes; trim 148 x 210 mm, bleed 3 mm", async () => {
    const pdf = await makePdf([{ media: A5_BLEED, trim: A5_TRIM }]);
    const r = await checkArtwork(pdf, a5);
    expect(r.verdict).toBe("pass");
    const p = r.measured.pdfPages?.[0];
    expect(p?.trimBox.explicit).toBe(true);
    expect(p?.trimBox.widthMm).toBeCloseTo(148, 4);
    expect(p?.trimBox.heightMm).toBeCloseTo(210, 4);
    expect(p?.bleedMm).toBeCloseTo(3, 4);
    // BleedBox not set: defaults to CropBox, which defaults to MediaBox
    expect(p?.bleedBox.explicit).toBe(false);
    expect(p?.bleedBox.widthPt).toBeCloseTo(436.535433, 5);
    expect(p?.artBox.widthPt).toBeCloseTo(436.535433, 5);
  });

  it("a letter page with no boxes: TrimBox and BleedBox both default to [0 0 612 792]", async () => {
    const letter: PrintSpec = { ...halfLetter, trimWidthMm: inToMm(8.5), trimHeightMm: inToMm(11) };
    const r = await checkArtwork(await makePdf([{ media: [612, 792] }]), letter);
    const p = r.measured.pdfPages?.[0];
    expect([
      p?.trimBox.widthPt,
      p?.trimBox.heightPt,
      p?.bleedBox.widthPt,
      p?.bleedBox.heightPt,
    ]).toEqual([612, 792, 612, 792]);
    expect(find(r, "no-bleed")?.severity).toBe("warning");
    expect(find(r, "no-bleed")?.message).toContain("8.5 x 11 in");
  });

  it("no TrimBox but the page is trim + bleed (5.75 x 8.75 in = 414 x 630 pt): trim taken as centred, a note", async () => {
    const r = await checkArtwork(await makePdf([{ media: [414, 630] }]), halfLetter);
    expect(codes(r)).toEqual(["pdf-no-trimbox"]);
    expect(find(r, "pdf-no-trimbox")?.message).toContain("5.75 x 8.75 in");
  });

  it("bleed smaller than the spec", async () => {
    const b = mmToPt(1);
    const pdf = await makePdf([
      { media: [mmToPt(150), mmToPt(212)], trim: [b, b, mmToPt(148), mmToPt(210)] },
    ]);
    const f = find(await checkArtwork(pdf, a5), "bleed-too-small");
    expect(f?.message).toBe("The bleed is 1 mm; the spec asks for 3 mm.");
  });

  it("an A4 page for an A5 spec: trim size blocker with both sizes", async () => {
    const r = await checkArtwork(await makePdf([{ media: [595.28, 841.89] }]), a5);
    const f = find(r, "pdf-trim-size");
    expect(f?.severity).toBe("blocker");
    expect(f?.message).toBe(
      "The trim is 210 x 297 mm; the spec asks for 148 x 210 mm (within 0.5 mm).",
    );
  });

  it("a landscape page for a portrait trim is the wrong way round", async () => {
    const r = await checkArtwork(
      await makePdf([
        {
          media: [A5_BLEED[1], A5_BLEED[0]],
          trim: [A5_TRIM[1], A5_TRIM[0], A5_TRIM[3], A5_TRIM[2]],
        },
      ]),
      a5,
    );
    expect(find(r, "wrong-orientation")?.severity).toBe("blocker");
  });

  it("a landscape page with /Rotate 90 shows upright: size accepted, rotation warned", async () => {
    const r = await checkArtwork(
      await makePdf([
        {
          media: [A5_BLEED[1], A5_BLEED[0]],
          trim: [A5_TRIM[1], A5_TRIM[0], A5_TRIM[3], A5_TRIM[2]],
          rotate: 90,
        },
      ]),
      a5,
    );
    expect(codes(r)).toEqual(["pdf-page-rotated"]);
    expect(r.measured.pdfPages?.[0]?.rotateDeg).toBe(90);
  });

  it("a TrimBox beyond the MediaBox is reduced to the intersection (§14.11.2.1)", async () => {
    const pdf = await makePdf([{ media: [419.527559, 595.275591], trim: [0, 0, 500, 700] }]);
    const r = await checkArtwork(pdf, { ...a5, bleedMm: 0 });
    expect(codes(r)).toEqual(["pdf-box-outside-media"]);
    expect(r.measured.pdfPages?.[0]?.trimBox.widthPt).toBeCloseTo(419.527559, 5);
  });
});

describe("page count", () => {
  it("3 pages where 2 are expected is a blocker; identical findings are grouped by page", async () => {
    const pdf = await makePdf([
      { media: [419.53, 595.28] },
      { media: [419.53, 595.28] },
      { media: [419.53, 595.28] },
    ]);
    const r = await checkArtwork(pdf, { ...a5, pagesExpected: 2 });
    expect(r.measured.pdfPageCount).toBe(3);
    expect(find(r, "pdf-page-count")?.message).toBe("The PDF has 3 pages; 2 are expected.");
    const noBleed = r.findings.filter((f) => f.code === "no-bleed");
    expect(noBleed).toHaveLength(1);
    expect(noBleed[0]?.where).toBe("pages 1–3");
  });

  it("a PDF with no pages", async () => {
    const doc = await PDFDocument.create();
    const r = await checkArtwork(await doc.save({ addDefaultPage: false }), a5);
    expect(codes(r)).toContain("pdf-no-pages");
  });
});

describe("damaged and protected PDFs", () => {
  it("an encrypted PDF is a blocker", async () => {
    const r = await checkArtwork(encryptedPdf(), halfLetter, { filename: "piece.pdf" });
    expect(r.measured.pdfEncrypted).toBe(true);
    expect(find(r, "pdf-encrypted")?.severity).toBe("blocker");
  });

  it("a PDF cut short has no %%EOF: truncated", async () => {
    const pdf = await makePdf([{ media: A5_BLEED, trim: A5_TRIM }]);
    const r = await checkArtwork(pdf.subarray(0, Math.floor(pdf.length * 0.6)), a5);
    expect(codes(r)).toContain("file-truncated");
    expect(r.verdict).toBe("blocker");
  });

  it("a PDF header followed by nonsense is a blocker, not a crash", async () => {
    const r = await checkArtwork(Buffer.from("%PDF-1.7\nnothing here at all\n%%EOF\n"), a5);
    expect(r.verdict).toBe("blocker");
  });
});
