/**
 * Drawing shared by the print-file builders: placing one page's art inside a clip with a single
 * `cm` (so its position can be read back exactly), setting a text page in type, and keeping text
 * within what Helvetica's WinAnsi encoding can print.
 */
import {
  PDFDocument,
  PDFName,
  StandardFonts,
  clip,
  concatTransformationMatrix,
  drawObject,
  endPath,
  popGraphicsState,
  pushGraphicsState,
  rectangle,
  rgb,
  type PDFFont,
  type PDFPage,
} from "pdf-lib";
import { MM_PER_INCH } from "../units";
import type { ArtBytes, PageContent } from "./types";

/** A rectangle in PDF points, lower-left origin (PDF user space, ISO 32000-1 §8.3.2.3). */
export interface RectPt {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** Where one page goes: its trim rectangle, its bleed, the clip and the creep shift, all in points. */
export interface PageFrame {
  trim: RectPt;
  bleedPt: number;
  /** The art is cut to this: the bleed on the outer edges, the fold on the spine edge. */
  clip: RectPt;
  /** Horizontal move of the content, positive to the right (creep toward the spine). */
  shiftXPt: number;
  /** Inset of the area text is set in, from each trim edge. */
  safeMarginPt: number;
}

export interface Fonts {
  regular: PDFFont;
  bold: PDFFont;
}

export async function embedFonts(doc: PDFDocument): Promise<Fonts> {
  return {
    regular: await doc.embedFont(StandardFonts.Helvetica),
    bold: await doc.embedFont(StandardFonts.HelveticaBold),
  };
}

/**
 * Text Helvetica can encode (pdf-lib's standard fonts use WinAnsi): accents that have no WinAnsi
 * glyph lose their mark (NFKD), anything else becomes "?", control characters become spaces.
 */
export function winAnsiSafe(text: string, font: PDFFont): string {
  const supported = supportedCodePoints(font);
  let out = "";
  for (const ch of text.replace(/[\t\r\n\u2028\u2029]+/g, " ")) {
    const code = ch.codePointAt(0) ?? 0;
    if (supported.has(code)) {
      out += ch;
      continue;
    }
    const stripped = ch.normalize("NFKD").replace(/\p{M}/gu, "");
    out +=
      [...stripped].every((c) => supported.has(c.codePointAt(0) ?? 0)) && stripped ? stripped : "?";
  }
  return out;
}

const codePointCache = new WeakMap<PDFFont, Set<number>>();
function supportedCodePoints(font: PDFFont): Set<number> {
  let set = codePointCache.get(font);
  if (!set) {
    set = new Set(font.getCharacterSet().filter((c) => c >= 0x20));
    codePointCache.set(font, set);
  }
  return set;
}

/** Lines no wider than `widthPt`: words wrap, and a word longer than the line is broken. */
export function wrapText(text: string, font: PDFFont, sizePt: number, widthPt: number): string[] {
  const fits = (s: string) => font.widthOfTextAtSize(s, sizePt) <= widthPt;
  const lines: string[] = [];
  let current = "";
  for (const word of text.split(/ +/).filter(Boolean)) {
    const candidate = current ? `${current} ${word}` : word;
    if (fits(candidate)) {
      current = candidate;
      continue;
    }
    if (current) lines.push(current);
    let rest = word;
    while (rest.length > 1 && !fits(rest)) {
      let cut = rest.length - 1;
      while (cut > 1 && !fits(rest.slice(0, cut))) cut--;
      lines.push(rest.slice(0, cut));
      rest = rest.slice(cut);
    }
    current = rest;
  }
  if (current) lines.push(current);
  return lines;
}

/** Shortens text with "..." until it is no wider than `widthPt`. */
export function fitLine(text: string, font: PDFFont, sizePt: number, widthPt: number): string {
  if (font.widthOfTextAtSize(text, sizePt) <= widthPt) return text;
  let cut = text.length;
  while (cut > 0 && font.widthOfTextAtSize(`${text.slice(0, cut)}...`, sizePt) > widthPt) cut--;
  return `${text.slice(0, cut)}...`;
}

/** Type sizes tried for a text page, largest first; below the last the page is refused. */
const TEXT_SIZES_PT = [11, 10, 9, 8, 7, 6];
const LEADING = 1.3;

/** Sets a text page (heading then lines) inside the safe area, shifted with the page's creep. */
export function drawTextPage(
  page: PDFPage,
  content: { heading: string; lines: string[] },
  frame: PageFrame,
  fonts: Fonts,
  pageNumber: number,
): void {
  const left = frame.trim.x + frame.safeMarginPt + frame.shiftXPt;
  const width = frame.trim.width - 2 * frame.safeMarginPt;
  const height = frame.trim.height - 2 * frame.safeMarginPt;
  if (!(width > 0) || !(height > 0))
    throw new RangeError(`Page ${pageNumber} has no room inside its safe margins for text.`);
  const heading = winAnsiSafe(content.heading, fonts.bold);
  const body = content.lines.map((l) => winAnsiSafe(l, fonts.regular));
  for (const size of TEXT_SIZES_PT) {
    const headingSize = size * 1.4;
    const headingLines = heading ? wrapText(heading, fonts.bold, headingSize, width) : [];
    const bodyLines = body.flatMap((l) =>
      l.trim() ? wrapText(l, fonts.regular, size, width) : [""],
    );
    const needed =
      headingLines.length * headingSize * LEADING +
      (headingLines.length > 0 ? size : 0) +
      bodyLines.length * size * LEADING;
    if (needed > height) continue;
    let y = frame.trim.y + frame.trim.height - frame.safeMarginPt;
    for (const line of headingLines) {
      y -= headingSize * LEADING;
      page.drawText(line, { x: left, y, size: headingSize, font: fonts.bold, color: rgb(0, 0, 0) });
    }
    if (headingLines.length > 0) y -= size;
    for (const line of bodyLines) {
      y -= size * LEADING;
      if (line) page.drawText(line, { x: left, y, size, font: fonts.regular, color: rgb(0, 0, 0) });
    }
    return;
  }
  throw new RangeError(
    `The text of page ${pageNumber} ("${content.heading}") does not fit inside its safe area even at ${TEXT_SIZES_PT[TEXT_SIZES_PT.length - 1]} pt; shorten it or split it over two pages.`,
  );
}

/**
 * Places one page's art. Images are drawn at trim + bleed; a PDF's first page keeps its vectors, its
 * TrimBox laid on the trim when it has one, otherwise its MediaBox taken as trim + bleed. The art is
 * cut to `frame.clip` and moved by `frame.shiftXPt`; the clip does not move.
 */
export async function drawArt(
  doc: PDFDocument,
  page: PDFPage,
  art: ArtBytes,
  frame: PageFrame,
  pageNumber: number,
): Promise<void> {
  const { trim, bleedPt, shiftXPt } = frame;
  let xObject: PDFName;
  let matrix: [number, number, number, number, number, number];
  let finish: () => Promise<void>;
  const bleedW = trim.width + 2 * bleedPt;
  const bleedH = trim.height + 2 * bleedPt;
  if (art.format === "jpeg" || art.format === "png") {
    // embedJpg keeps the JPEG's bytes as they are, as a DCTDecode stream (never re-encoded).
    const image = await (
      art.format === "jpeg" ? doc.embedJpg(art.bytes) : doc.embedPng(art.bytes)
    ).catch((error: unknown) => {
      throw new Error(
        `The art of page ${pageNumber} is not a readable ${art.format.toUpperCase()} file (${errorText(error)}).`,
      );
    });
    xObject = page.node.newXObject("Art", image.ref);
    // An image XObject fills the unit square (ISO 32000-1 §8.9.4): scale it to trim + bleed.
    matrix = [bleedW, 0, 0, bleedH, trim.x - bleedPt + shiftXPt, trim.y - bleedPt];
    finish = () => image.embed();
  } else {
    const source = await PDFDocument.load(art.bytes, { updateMetadata: false }).catch(
      (error: unknown) => {
        throw new Error(
          `The art of page ${pageNumber} is not a readable PDF (${errorText(error)}).`,
        );
      },
    );
    if (source.getPageCount() < 1)
      throw new Error(`The art PDF of page ${pageNumber} has no pages.`);
    const sourcePage = source.getPage(0);
    const media = sourcePage.getMediaBox();
    const box = {
      left: media.x,
      bottom: media.y,
      right: media.x + media.width,
      top: media.y + media.height,
    };
    const embedded = await doc.embedPage(sourcePage, box);
    xObject = page.node.newXObject("Art", embedded.ref);
    const hasTrim = sourcePage.node.get(PDFName.of("TrimBox")) !== undefined;
    if (hasTrim) {
      const srcTrim = sourcePage.getTrimBox();
      const sx = trim.width / srcTrim.width;
      const sy = trim.height / srcTrim.height;
      matrix = [
        sx,
        0,
        0,
        sy,
        trim.x + shiftXPt - sx * (srcTrim.x - box.left),
        trim.y - sy * (srcTrim.y - box.bottom),
      ];
    } else {
      matrix = [
        bleedW / media.width,
        0,
        0,
        bleedH / media.height,
        trim.x - bleedPt + shiftXPt,
        trim.y - bleedPt,
      ];
    }
    finish = async () => {
      await embedded.embed();
      // Once copied into this document the source page is not needed; pdf-lib would otherwise keep
      // every source document alive until save (one per page of the booklet).
      Reflect.set(embedded, "embedder", undefined);
    };
  }
  page.pushOperators(
    pushGraphicsState(),
    rectangle(frame.clip.x, frame.clip.y, frame.clip.width, frame.clip.height),
    clip(),
    endPath(),
    concatTransformationMatrix(...matrix),
    drawObject(xObject),
    popGraphicsState(),
  );
  await finish();
}

/** Draws what one page holds: art, a text page, or nothing for a blank. */
export async function drawContent(
  doc: PDFDocument,
  page: PDFPage,
  content: PageContent,
  frame: PageFrame,
  fonts: Fonts,
  pageNumber: number,
): Promise<void> {
  if (content.kind === "blank") return;
  if (content.kind === "text") {
    drawTextPage(page, content, frame, fonts, pageNumber);
    return;
  }
  // Loaded here and nowhere else, so no one keeps the bytes once the page is placed.
  await drawArt(doc, page, await content.load(), frame, pageNumber);
}

export function errorText(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/** Safe margin for text pages when none is given: 0.25 in for booklets (common practice, no source). */
export const DEFAULT_SAFE_MARGIN_MM = 0.25 * MM_PER_INCH;
