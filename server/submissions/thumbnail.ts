import "server-only";
/** Small WebP previews of uploaded artwork, stored beside each file version. */
import path from "node:path";
import sharp from "sharp";
import type { SpecReport } from "@/lib/print/check";
import { mmToIn } from "@/lib/print/units";

export const THUMBNAIL_LONG_SIDE_PX = 480;

export type Thumbnail = { webp: Buffer; widthPx: number; heightPx: number };

const RASTER = new Set(["png", "jpeg", "tiff", "webp"]);

/**
 * A preview no longer than 480 px on its long side. Rasters are decoded with the same pixel
 * ceiling as the spec check, so a file the check refused unopened is never decoded here either.
 * A PDF's first page is drawn with pdf.js onto a small canvas; if it cannot be drawn (damaged or
 * encrypted files), a page-shaped card naming the page size stands in.
 */
export async function makeThumbnail(
  bytes: Uint8Array,
  report: SpecReport,
  maxPixels: number,
): Promise<Thumbnail | null> {
  const m = report.measured;
  if (RASTER.has(report.format)) {
    if (!m.widthPx || !m.heightPx || m.widthPx * m.heightPx > maxPixels) return null;
    if (
      report.findings.some(
        (f) =>
          f.code === "too-many-pixels" || f.code === "file-damaged" || f.code === "file-truncated",
      )
    )
      return null;
    try {
      const { data, info } = await sharp(bytes, { limitInputPixels: maxPixels, failOn: "error" })
        .resize({
          width: THUMBNAIL_LONG_SIDE_PX,
          height: THUMBNAIL_LONG_SIDE_PX,
          fit: "inside",
          withoutEnlargement: true,
        })
        .flatten({ background: "#ffffff" })
        .toColourspace("srgb")
        .webp({ quality: 78 })
        .toBuffer({ resolveWithObject: true });
      return { webp: data, widthPx: info.width, heightPx: info.height };
    } catch {
      return null;
    }
  }
  const page = m.pdfPages?.[0];
  if (report.format === "pdf" && page) {
    return (
      (await renderPdfFirstPage(bytes)) ??
      pdfCard(page.cropBox.widthMm, page.cropBox.heightMm, m.pdfPageCount ?? 1)
    );
  }
  return null;
}

/** Draws page 1 (its visible area: CropBox within MediaBox) at 480 px on the long side. */
async function renderPdfFirstPage(bytes: Uint8Array): Promise<Thumbnail | null> {
  try {
    const [{ getDocument }, { createCanvas }] = await Promise.all([
      import("pdfjs-dist/legacy/build/pdf.mjs"),
      import("@napi-rs/canvas"),
    ]);
    const task = getDocument({
      // pdf.js takes ownership of the buffer it is given: hand it a copy.
      data: new Uint8Array(bytes),
      isEvalSupported: false,
      disableFontFace: true,
      standardFontDataUrl: STANDARD_FONTS,
      verbosity: 0,
    });
    try {
      const pdf = await task.promise;
      const first = await pdf.getPage(1);
      const unit = first.getViewport({ scale: 1 });
      const viewport = first.getViewport({
        scale: THUMBNAIL_LONG_SIDE_PX / Math.max(unit.width, unit.height),
      });
      const canvas = createCanvas(Math.round(viewport.width), Math.round(viewport.height));
      const context = canvas.getContext("2d");
      context.fillStyle = "#ffffff";
      context.fillRect(0, 0, canvas.width, canvas.height);
      await first.render({ canvas: canvas as never, canvasContext: context as never, viewport })
        .promise;
      const { data, info } = await sharp(canvas.toBuffer("image/png"))
        .webp({ quality: 78 })
        .toBuffer({ resolveWithObject: true });
      return { webp: data, widthPx: info.width, heightPx: info.height };
    } finally {
      await task.destroy();
    }
  } catch {
    return null;
  }
}

// pdf.js reads the 14 standard fonts from here (a folder path, with its trailing slash, under Node).
const STANDARD_FONTS = `${path.join(process.cwd(), "node_modules", "pdfjs-dist", "standard_fonts")}/`;

/** A neutral card in the page's proportions naming the page size; stands in for a rendered PDF page. */
async function pdfCard(
  widthMm: number,
  heightMm: number,
  pages: number,
): Promise<Thumbnail | null> {
  if (!(widthMm > 0 && heightMm > 0)) return null;
  const scale = THUMBNAIL_LONG_SIDE_PX / Math.max(widthMm, heightMm);
  const w = Math.max(24, Math.round(widthMm * scale));
  const h = Math.max(24, Math.round(heightMm * scale));
  const inches = `${mmToIn(widthMm).toFixed(2)} x ${mmToIn(heightMm).toFixed(2)} in`;
  const mm = `${widthMm.toFixed(1)} x ${heightMm.toFixed(1)} mm`;
  const font = Math.max(10, Math.round(Math.min(w, h) / 14));
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}" viewBox="0 0 ${w} ${h}">
  <rect width="${w}" height="${h}" fill="#f3efe6"/>
  <path d="M0 0L${w} ${h}M${w} 0L0 ${h}" stroke="#d9cfb8" stroke-width="2"/>
  <rect x="${w / 2 - font * 5}" y="${h / 2 - font * 2.4}" width="${font * 10}" height="${font * 4.8}" rx="6" fill="#fbf9f4" stroke="#d9cfb8"/>
  <text x="50%" y="${h / 2 - font * 0.8}" font-family="sans-serif" font-size="${font * 1.2}" font-weight="700" text-anchor="middle" fill="#1f2a24">PDF${pages > 1 ? `, ${pages} pages` : ""}</text>
  <text x="50%" y="${h / 2 + font * 0.6}" font-family="sans-serif" font-size="${font}" text-anchor="middle" fill="#4a5249">${inches}</text>
  <text x="50%" y="${h / 2 + font * 1.8}" font-family="sans-serif" font-size="${font * 0.85}" text-anchor="middle" fill="#7b8178">${mm}</text>
</svg>`;
  try {
    const { data, info } = await sharp(Buffer.from(svg))
      .webp({ quality: 80 })
      .toBuffer({ resolveWithObject: true });
    return { webp: data, widthPx: info.width, heightPx: info.height };
  } catch {
    return null;
  }
}
