/**
 * The reader proof, read back with poppler: one page per reader spread (cover alone, 2–3, …, back
 * cover alone), pages cut at the trim, numbers under them, titles and credits beside them.
 */
import { afterAll, describe, expect, it } from "vitest";
import { readerSpreads } from "@/lib/print/imposition";
import { PROOF_BOTTOM_MM, PROOF_NOTE_MM, PROOF_TOP_MM, readerProof } from "@/lib/print/pdf/proof";
import type { PageContent, ProofInput } from "@/lib/print/pdf/types";
import {
  cleanUp,
  labelledArtPdf,
  labelsOn,
  pdfinfoBoxes,
  pdfinfoPages,
  pdftotext,
  render,
  tempFile,
  wordBoxes,
} from "./pdf-poppler";

afterAll(cleanUp);

const PT_PER_MM = 72 / 25.4; // 72 pt per inch (ISO 32000-1 Table 30), 25.4 mm per inch
const CREDITS = ["Marta Oyelaran", "Jun Halloway", "Beatriz Connell", null];

function art(page: number): PageContent {
  return {
    kind: "art",
    title: `Salt Roads part ${page}`,
    credit: CREDITS[page % 4] ?? null,
    load: async () => ({ format: "pdf", bytes: await labelledArtPdf(page, 148, 210, 3) }),
  };
}

function proofOf(pages: number, content: (page: number) => PageContent = art): ProofInput {
  return {
    title: "Low Tide Quarterly",
    trimWidthMm: 148,
    trimHeightMm: 210,
    bleedMm: 3,
    // CSS Paged Media "Facing Pages": the even page on the left (lib/print/imposition.ts readerSpreads).
    spreads: readerSpreads(pages).map((s) => ({
      pages: s.pages.map((page) => ({ page, content: content(page) })),
    })),
  };
}

describe("reader proof", () => {
  it("8 pages give 5 spreads: [1], [2|3], [4|5], [6|7], [8], each numbered under its page", async () => {
    const out = await readerProof(proofOf(8));
    const path = tempFile(out.bytes);
    expect(out.pageCount).toBe(5);
    expect(pdfinfoPages(path)).toBe(5);
    expect([1, 2, 3, 4, 5].map((p) => labelsOn(path, p))).toEqual([
      [1],
      [2, 3],
      [4, 5],
      [6, 7],
      [8],
    ]);
    // Two A5 trims (ISO 216, 148 x 210 mm) side by side with the notes' margins around them.
    const w = 2 * PROOF_NOTE_MM + 296;
    const h = PROOF_TOP_MM + 210 + PROOF_BOTTOM_MM;
    for (const boxes of pdfinfoBoxes(path, 5)) {
      expect(boxes.MediaBox[2]).toBeCloseTo(w * PT_PER_MM, 1);
      expect(boxes.MediaBox[3]).toBeCloseTo(h * PT_PER_MM, 1);
      expect(boxes.TrimBox[0]).toBeCloseTo(PROOF_NOTE_MM * PT_PER_MM, 1);
      expect(boxes.TrimBox[2] - boxes.TrimBox[0]).toBeCloseTo(296 * PT_PER_MM, 1);
    }
    // The page numbers sit under the trim, centred on each page.
    const words = wordBoxes(path, 2);
    const trimBottomFromTop = (PROOF_TOP_MM + 210) * PT_PER_MM;
    const two = words.find((x) => x.word === "2" && x.yMin > trimBottomFromTop);
    const three = words.find((x) => x.word === "3" && x.yMin > trimBottomFromTop);
    expect(((two?.xMin ?? 0) + (two?.xMax ?? 0)) / 2).toBeCloseTo(
      (PROOF_NOTE_MM + 74) * PT_PER_MM,
      -1,
    );
    expect(((three?.xMin ?? 0) + (three?.xMax ?? 0)) / 2).toBeCloseTo(
      (PROOF_NOTE_MM + 222) * PT_PER_MM,
      -1,
    );
  });

  it("titles and credits in the margin beside each page, left of the left page and right of the right page", async () => {
    const out = await readerProof(proofOf(8));
    const path = tempFile(out.bytes);
    const text = pdftotext(path, 2);
    expect(text).toContain("Low Tide Quarterly - reader proof, 2 of 5");
    expect(text).toContain("Salt Roads part 2");
    expect(text).toContain("Beatriz Connell");
    expect(text).toContain("Salt Roads part 3");
    // Spread 4|5: Marta Oyelaran's credit left of page 4, Jun Halloway's right of page 5.
    const words = wordBoxes(path, 3);
    const leftNote = words.filter((x) => x.word === "Oyelaran");
    const rightNote = words.filter((x) => x.word === "Halloway");
    expect(leftNote).toHaveLength(1);
    expect(rightNote).toHaveLength(1);
    for (const x of leftNote) expect(x.xMax).toBeLessThanOrEqual(PROOF_NOTE_MM * PT_PER_MM);
    for (const x of rightNote)
      expect(x.xMin).toBeGreaterThanOrEqual((PROOF_NOTE_MM + 296) * PT_PER_MM);
    // Page 3's credit is null: its title alone, and no stray words.
    expect(text).not.toContain("null");
  });

  it("cut at the trim: the art's bleed is not shown; the front cover is a right-hand page, the back cover left", async () => {
    const out = await readerProof(proofOf(8));
    const path = tempFile(out.bytes);
    const dpi = 72;
    const px = (mm: number) => Math.round((mm * dpi) / 25.4);
    const midY = px(PROOF_TOP_MM + 105);
    const cover = render(path, 1, dpi);
    expect(cover.at(px(PROOF_NOTE_MM + 148 + 20), midY)).toBeLessThan(230); // the right half is the cover
    expect(cover.at(px(PROOF_NOTE_MM + 20), midY)).toBe(255); // the left half is empty
    expect(cover.at(px(PROOF_NOTE_MM + 296 + 1.5), midY)).toBe(255); // bleed past the trim is cut off
    const back = render(path, 5, dpi);
    expect(back.at(px(PROOF_NOTE_MM + 20), midY)).toBeLessThan(230);
    expect(back.at(px(PROOF_NOTE_MM + 148 + 20), midY)).toBe(255);
    expect(back.at(px(PROOF_NOTE_MM - 1.5), midY)).toBe(255);
  });

  it("blank and text pages: the blank says so in the margin, the text page is set", async () => {
    const content = (page: number): PageContent =>
      page === 7
        ? { kind: "blank" }
        : page === 6
          ? {
              kind: "text",
              heading: "Colophon",
              lines: ["Printed on a duplicator in Harrowgate", "Edition of 120"],
            }
          : art(page);
    const out = await readerProof(proofOf(8, content));
    const path = tempFile(out.bytes);
    const text = pdftotext(path, 4);
    expect(text).toContain("Colophon");
    expect(text).toContain("Printed on a duplicator in Harrowgate");
    expect(text).toContain("blank");
    expect(labelsOn(path, 4)).toEqual([]);
  });

  it("loads one page at a time and reports progress after each", async () => {
    const events: string[] = [];
    const input = proofOf(4, (page) => ({
      ...(art(page) as Extract<PageContent, { kind: "art" }>),
      load: async () => {
        events.push(`load ${page}`);
        return { format: "pdf", bytes: await labelledArtPdf(page, 148, 210, 3) };
      },
    }));
    input.onProgress = (done, total) => {
      events.push(`${done}/${total}`);
    };
    await readerProof(input);
    expect(events).toEqual(["load 1", "1/4", "load 2", "2/4", "load 3", "3/4", "load 4", "4/4"]);
  });

  it("a spread of three pages is refused", async () => {
    const input = proofOf(4);
    input.spreads[1]?.pages.push({ page: 9, content: { kind: "blank" } });
    await expect(readerProof(input)).rejects.toThrow(/Spread 2 has 3 pages/);
  });
});
