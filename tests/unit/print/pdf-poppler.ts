/**
 * Reading produced PDFs back with an independent reader, poppler (pdfinfo, pdftotext, pdftoppm,
 * pdfimages from poppler-utils, installed by the launcher), and making test art with pdf-lib and
 * sharp: page PDFs that print a big "P7" and a grey fill to the bleed edge.
 */
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import {
  PDFArray,
  PDFDocument,
  PDFRawStream,
  StandardFonts,
  decodePDFRawStream,
  grayscale,
} from "pdf-lib";
import sharp from "sharp";
import type { PageContent, SideInput } from "@/lib/print/pdf/types";
import { saddleStitchSheets } from "@/lib/print/imposition";
import { mmToPt } from "@/lib/print/units";

const dirs: string[] = [];

/** Writes bytes to a fresh temporary file; `cleanUp` removes them all. */
export function tempFile(bytes: Uint8Array, name = "file.pdf"): string {
  const dir = mkdtempSync(join(tmpdir(), "quireline-pdf-"));
  dirs.push(dir);
  const path = join(dir, name);
  writeFileSync(path, bytes);
  return path;
}

export function cleanUp(): void {
  for (const dir of dirs.splice(0)) rmSync(dir, { recursive: true, force: true });
}

export type Box = [number, number, number, number];
export interface PageBoxes {
  MediaBox: Box;
  CropBox: Box;
  BleedBox: Box;
  TrimBox: Box;
  ArtBox: Box;
}

/** `pdfinfo -box -f 1 -l N`: every page's boxes in points (poppler prints two decimals). */
export function pdfinfoBoxes(path: string, pages: number): PageBoxes[] {
  const out = execFileSync("pdfinfo", ["-box", "-f", "1", "-l", String(pages), path], {
    encoding: "utf8",
  });
  const result: PageBoxes[] = [];
  for (const m of out.matchAll(
    /^Page\s+(\d+)\s+(MediaBox|CropBox|BleedBox|TrimBox|ArtBox):\s+(\S+)\s+(\S+)\s+(\S+)\s+(\S+)/gm,
  )) {
    const index = Number(m[1]) - 1;
    const boxes = (result[index] ??= {} as PageBoxes);
    boxes[m[2] as keyof PageBoxes] = [Number(m[3]), Number(m[4]), Number(m[5]), Number(m[6])];
  }
  return result;
}

/** `pdfinfo`'s "Pages:" line. */
export function pdfinfoPages(path: string): number {
  const out = execFileSync("pdfinfo", [path], { encoding: "utf8" });
  return Number(/^Pages:\s+(\d+)/m.exec(out)?.[1]);
}

/** `pdftotext -layout` of one page. */
export function pdftotext(path: string, page: number): string {
  return execFileSync("pdftotext", ["-layout", "-f", String(page), "-l", String(page), path, "-"], {
    encoding: "utf8",
  });
}

/** The "P<n>" labels of the test art on one page, left to right. */
export function labelsOn(path: string, page: number): number[] {
  return [...pdftotext(path, page).matchAll(/\bP(\d+)\b/g)].map((m) => Number(m[1]));
}

export interface Gray {
  width: number;
  height: number;
  data: Uint8Array;
  at(x: number, y: number): number;
}

/** `pdftoppm -gray -r dpi` of one page (optionally a region, in pixels), as an 8-bit grey image. */
export function render(
  path: string,
  page: number,
  dpi: number,
  region?: { x: number; y: number; w: number; h: number },
  antialias = true,
): Gray {
  const dir = mkdtempSync(join(tmpdir(), "quireline-ppm-"));
  dirs.push(dir);
  const args = ["-gray", "-r", String(dpi), "-f", String(page), "-l", String(page), "-singlefile"];
  if (!antialias) args.push("-aa", "no", "-aaVector", "no");
  if (region)
    args.push(
      "-x",
      String(Math.round(region.x)),
      "-y",
      String(Math.round(region.y)),
      "-W",
      String(Math.round(region.w)),
      "-H",
      String(Math.round(region.h)),
    );
  execFileSync("pdftoppm", [...args, path, join(dir, "page")]);
  return readPgm(readFileSync(join(dir, "page.pgm")));
}

/** Netpbm P5 (binary greymap, maxval 255). */
function readPgm(buf: Buffer): Gray {
  const header: string[] = [];
  let i = 0;
  while (header.length < 4) {
    while (/\s/.test(String.fromCharCode(buf[i] ?? 32))) i++;
    if (buf[i] === 0x23) {
      while (buf[i] !== 0x0a) i++;
      continue;
    }
    let token = "";
    while (i < buf.length && !/\s/.test(String.fromCharCode(buf[i] ?? 32)))
      token += String.fromCharCode(buf[i++] ?? 32);
    header.push(token);
  }
  i++; // one whitespace byte after maxval
  const [magic, w, h] = header;
  if (magic !== "P5") throw new Error(`expected a P5 greymap, got ${magic}`);
  const width = Number(w);
  const height = Number(h);
  const data = new Uint8Array(buf.subarray(i, i + width * height));
  return { width, height, data, at: (x, y) => data[y * width + x] ?? -1 };
}

/** `pdfimages -list`: the encoding column of each image on the pages. */
export function pdfimagesList(
  path: string,
): Array<{ page: number; enc: string; width: number; height: number }> {
  const out = execFileSync("pdfimages", ["-list", path], { encoding: "utf8" });
  return out
    .split("\n")
    .slice(2)
    .map((l) => l.trim().split(/\s+/))
    .filter((c) => c.length > 9)
    .map((c) => ({
      page: Number(c[0]),
      width: Number(c[3]),
      height: Number(c[4]),
      enc: c[8] ?? "",
    }));
}

/** `pdfimages -j`: DCT (JPEG) streams written out as they are stored, one file per image. */
export function pdfimagesJpegs(path: string, page: number): Buffer[] {
  const dir = mkdtempSync(join(tmpdir(), "quireline-img-"));
  dirs.push(dir);
  execFileSync("pdfimages", ["-j", "-f", String(page), "-l", String(page), path, join(dir, "img")]);
  return readdirSync(dir)
    .filter((f) => f.endsWith(".jpg"))
    .sort()
    .map((f) => readFileSync(join(dir, f)));
}

/** Grey level of the test art's fill (0 black, 1 white): renders as about 204 of 255. */
export const ART_GREY = 0.8;

/**
 * A page art PDF at trim + bleed: a grey fill to the bleed edge and a big "P<n>" label; with
 * `trimBox` the TrimBox is set, otherwise the MediaBox alone stands for trim + bleed.
 */
export async function labelledArtPdf(
  page: number,
  trimWidthMm: number,
  trimHeightMm: number,
  bleedMm: number,
  trimBox = true,
): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const w = mmToPt(trimWidthMm + 2 * bleedMm);
  const h = mmToPt(trimHeightMm + 2 * bleedMm);
  const pdfPage = doc.addPage([w, h]);
  if (trimBox) {
    const b = mmToPt(bleedMm);
    pdfPage.setTrimBox(b, b, mmToPt(trimWidthMm), mmToPt(trimHeightMm));
  }
  pdfPage.drawRectangle({ x: 0, y: 0, width: w, height: h, color: grayscale(ART_GREY) });
  const font = await doc.embedFont(StandardFonts.HelveticaBold);
  const label = `P${page}`;
  const size = 72;
  pdfPage.drawText(label, {
    x: w / 2 - font.widthOfTextAtSize(label, size) / 2,
    y: h / 2,
    size,
    font,
    color: grayscale(0),
  });
  return doc.save();
}

/** A grey JPEG at trim + bleed and a resolution, made with sharp. */
export async function greyJpeg(widthPx: number, heightPx: number, level = 180): Promise<Buffer> {
  return sharp({
    create: {
      width: widthPx,
      height: heightPx,
      channels: 3,
      background: { r: level, g: level, b: level },
    },
  })
    .jpeg({ quality: 80 })
    .toBuffer();
}

/** Sides of an N-page saddle-stitched booklet in print order, each page's content from `content`. */
export function bookletSides(
  pages: number,
  content: (page: number) => PageContent,
  stockNote: (sheet: number) => string | null = () => null,
): SideInput[] {
  return saddleStitchSheets(pages).flatMap((s) =>
    (["front", "back"] as const).map((side) => ({
      sheet: s.sheet,
      side,
      pages: [s[side].left, s[side].right].map((page) => ({ page, content: content(page) })),
      stockNote: stockNote(s.sheet),
    })),
  );
}

/** Art content that loads the labelled test PDF, counting loads. */
export function labelledArt(
  trimWidthMm: number,
  trimHeightMm: number,
  bleedMm: number,
  loads: number[] = [],
): (page: number) => PageContent {
  return (page) => ({
    kind: "art",
    title: `Piece on page ${page}`,
    credit: null,
    load: async () => {
      loads.push(page);
      return {
        format: "pdf",
        bytes: await labelledArtPdf(page, trimWidthMm, trimHeightMm, bleedMm),
      };
    },
  });
}

/**
 * The matrix of every `cm` that places an art XObject (`... cm /Art... Do`), page by page, read
 * from the decoded content streams with pdf-lib's parser (the exact numbers written, no rendering).
 */
export async function placedArtMatrices(bytes: Uint8Array): Promise<number[][][]> {
  const doc = await PDFDocument.load(bytes);
  return doc.getPages().map((page) => {
    const contents = page.node.Contents();
    const streams =
      contents instanceof PDFArray
        ? contents.asArray().map((ref) => doc.context.lookup(ref))
        : [contents];
    const text = streams
      .map((s) =>
        s instanceof PDFRawStream
          ? Buffer.from(decodePDFRawStream(s).decode()).toString("latin1")
          : "",
      )
      .join("\n");
    return [...text.matchAll(/(\S+) (\S+) (\S+) (\S+) (\S+) (\S+) cm\s+\/Art\S* Do/g)].map((m) =>
      m.slice(1, 7).map(Number),
    );
  });
}

export interface WordBox {
  word: string;
  xMin: number;
  yMin: number;
  xMax: number;
  yMax: number;
}

/** `pdftotext -bbox`: each word and its box in points, origin at the page's top-left. */
export function wordBoxes(path: string, page: number): WordBox[] {
  const html = execFileSync(
    "pdftotext",
    ["-bbox", "-f", String(page), "-l", String(page), path, "-"],
    { encoding: "utf8" },
  );
  return [
    ...html.matchAll(
      /<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)<\/word>/g,
    ),
  ].map((m) => ({
    xMin: Number(m[1]),
    yMin: Number(m[2]),
    xMax: Number(m[3]),
    yMax: Number(m[4]),
    word: (m[5] ?? "").replace(/&amp;/g, "&").replace(/&lt;/g, "<").replace(/&gt;/g, ">"),
  }));
}
