/**
 * The reader proof: the booklet as a reader turns it, one PDF page per reader spread (the front
 * cover alone on the right, 2–3, …, the back cover alone on the left), each page cut at its trim
 * with a thin trim line, its number under it and the piece's title and credit in the margin
 * beside it. No bleed, marks or creep: this is for reading, not for the press.
 */
import { PDFDocument, grayscale } from "pdf-lib";
import { mmToPt } from "../units";
import {
  DEFAULT_SAFE_MARGIN_MM,
  drawContent,
  embedFonts,
  fitLine,
  winAnsiSafe,
  wrapText,
  type Fonts,
  type PageFrame,
} from "./draw";
import type { PlacedPage, ProducedPdf, ProofInput } from "./types";

/** Room beside the spread for the notes, above it for the heading and below for page numbers, mm. */
export const PROOF_NOTE_MM = 40;
export const PROOF_TOP_MM = 14;
export const PROOF_BOTTOM_MM = 14;
const NOTE_SIZE_PT = 8;
const NUMBER_SIZE_PT = 9;
const HEADING_SIZE_PT = 10;
const TRIM_LINE_PT = 0.5;

/** What the margin says about a page. */
export function pageNote(placed: PlacedPage): string[] {
  const c = placed.content;
  if (c.kind === "art") return c.credit ? [c.title, c.credit] : [c.title];
  if (c.kind === "text") return [c.heading];
  return ["blank"];
}

function drawNote(
  page: ReturnType<PDFDocument["addPage"]>,
  lines: string[],
  x: number,
  topY: number,
  width: number,
  align: "left" | "right",
  fonts: Fonts,
): void {
  let y = topY;
  lines.forEach((raw, i) => {
    const font = i === 0 ? fonts.bold : fonts.regular;
    for (const line of wrapText(winAnsiSafe(raw, font), font, NOTE_SIZE_PT, width).slice(0, 6)) {
      y -= NOTE_SIZE_PT * 1.3;
      const w = font.widthOfTextAtSize(line, NOTE_SIZE_PT);
      page.drawText(line, {
        x: align === "left" ? x : x + width - w,
        y,
        size: NOTE_SIZE_PT,
        font,
        color: grayscale(0),
      });
    }
    y -= NOTE_SIZE_PT * 0.4;
  });
}

/** Builds the reader proof, loading one page's art at a time. */
export async function readerProof(input: ProofInput): Promise<ProducedPdf> {
  const { trimWidthMm: w, trimHeightMm: h } = input;
  if (!(w > 0) || !(h > 0)) throw new RangeError("The trim size must be greater than zero.");
  if (!(input.bleedMm >= 0)) throw new RangeError("The bleed cannot be negative.");
  if (input.spreads.length === 0) throw new RangeError("There are no spreads to proof.");
  const p = mmToPt;
  const safeMarginPt = p(input.safeMarginMm ?? DEFAULT_SAFE_MARGIN_MM);
  const doc = await PDFDocument.create();
  doc.setTitle(`${input.title} - reader proof`);
  doc.setProducer("Quireline");
  doc.setCreator("Quireline");
  const fonts = await embedFonts(doc);
  const pageW = 2 * PROOF_NOTE_MM + 2 * w;
  const pageH = PROOF_TOP_MM + h + PROOF_BOTTOM_MM;
  const total = input.spreads.reduce((n, s) => n + s.pages.length, 0);
  let done = 0;
  for (const [index, spread] of input.spreads.entries()) {
    if (spread.pages.length < 1 || spread.pages.length > 2)
      throw new RangeError(
        `Spread ${index + 1} has ${spread.pages.length} pages; a reader spread has one (a cover) or two.`,
      );
    const page = doc.addPage([p(pageW), p(pageH)]);
    const heading = fitLine(
      winAnsiSafe(
        `${input.title} - reader proof, ${index + 1} of ${input.spreads.length}`,
        fonts.bold,
      ),
      fonts.bold,
      HEADING_SIZE_PT,
      p(pageW - 8),
    );
    page.drawText(heading, {
      x: p(4),
      y: p(pageH - 4) - fonts.bold.heightAtSize(HEADING_SIZE_PT, { descender: false }),
      size: HEADING_SIZE_PT,
      font: fonts.bold,
      color: grayscale(0),
    });
    page.setTrimBox(p(PROOF_NOTE_MM), p(PROOF_BOTTOM_MM), p(2 * w), p(h));
    for (const [i, placed] of spread.pages.entries()) {
      // One page alone is a cover: the front cover is a right-hand page, the back cover a left-hand one.
      const half: 0 | 1 = spread.pages.length === 2 ? (i === 0 ? 0 : 1) : index === 0 ? 1 : 0;
      const trimX = p(PROOF_NOTE_MM + half * w);
      const trim = { x: trimX, y: p(PROOF_BOTTOM_MM), width: p(w), height: p(h) };
      const frame: PageFrame = {
        trim,
        bleedPt: p(input.bleedMm),
        clip: trim,
        shiftXPt: 0,
        safeMarginPt,
      };
      await drawContent(doc, page, placed.content, frame, fonts, placed.page);
      page.drawRectangle({
        ...trim,
        borderColor: grayscale(0.55),
        borderWidth: TRIM_LINE_PT,
      });
      const number = String(placed.page);
      const numberW = fonts.regular.widthOfTextAtSize(number, NUMBER_SIZE_PT);
      page.drawText(number, {
        x: trim.x + trim.width / 2 - numberW / 2,
        y: p(PROOF_BOTTOM_MM - 6),
        size: NUMBER_SIZE_PT,
        font: fonts.regular,
        color: grayscale(0),
      });
      const noteW = p(PROOF_NOTE_MM - 8);
      drawNote(
        page,
        pageNote(placed),
        half === 0 ? p(4) : p(PROOF_NOTE_MM + 2 * w + 4),
        trim.y + trim.height,
        noteW,
        half === 0 ? "right" : "left",
        fonts,
      );
      done++;
      await input.onProgress?.(done, total);
    }
  }
  const bytes = await doc.save();
  return { bytes, pageCount: doc.getPageCount() };
}
