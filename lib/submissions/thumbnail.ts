import "server-only";
/** Small WebP previews of uploaded artwork, stored beside each file version. */
import sharp from "sharp";
import type { SpecReport } from "@/lib/print/check";
import { mmToIn } from "@/lib/print/units";

export const THUMBNAIL_LONG_SIDE_PX = 480;

export type Thumbnail = { webp: Buffer; widthPx: number; heightPx: number };

const RASTER = new Set(["png", "jpeg", "tiff", "webp"]);

/**
 * A preview no longer than 480 px on its long side. Rasters are decoded with the same pixel
 * ceiling as the spec check, so a file the check refused unopened is never decoded here either.
 * PDFs get a plain page-shaped card with the page size: the stack has no PDF rasteriser.
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
  if (report.format === "pdf" && page)
    return pdfCard(page.cropBox.widthMm, page.cropBox.heightMm, m.pdfPageCount ?? 1);
  return null;
}

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
