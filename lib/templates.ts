/**
 * Downloadable page templates for an open call: one page at trim plus bleed with the bleed
 * edge, the trim line and the safe area drawn, as a PNG at the anthology's minimum resolution
 * (sharp) and as a PDF whose MediaBox = BleedBox = trim plus bleed and whose TrimBox is the trim
 * (pdf-lib; box meanings from ISO 32000-1:2008 Table 30). No database, no file system.
 */
import { PDFDocument, rgb, StandardFonts, type PDFFont } from "pdf-lib";
import sharp from "sharp";
import { bleedBoxOf, pixelsFor } from "@/lib/print/spec";
import { mmToIn, mmToPt, mmToPx } from "@/lib/print/units";

export type TemplateFormat = "png" | "pdf";
export const TEMPLATE_FORMATS: readonly TemplateFormat[] = ["png", "pdf"];

/** What a template needs from the anthology. */
export interface TemplateSpec {
  trimWidthMm: number;
  trimHeightMm: number;
  bleedMm: number;
  safeMarginMm: number;
  minPpi: number;
  /** Shown on the template, e.g. "Low Tide Almanac". */
  title: string;
  /** Shown on the template when set, e.g. "One greyscale file per ink (black, teal)". */
  colourMode?: string;
  /** Show lengths in inches first (inch trims). */
  inchesFirst?: boolean;
}

/** PNG templates above this many pixels are drawn at a lower resolution (the PDF has no limit). */
export const MAX_TEMPLATE_MEGAPIXELS = 60;

// Proof-line colours, the same as the `line` colours of the theme.
const COLOURS = {
  trim: "#c8553d",
  bleed: "#2a6f6b",
  safe: "#d9a441",
  text: "#4a5249",
  bleedTint: "#e3f0ee",
} as const;

export interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface PngLayout {
  widthPx: number;
  heightPx: number;
  /** The resolution the PNG is drawn at: the minimum ppi unless that would exceed the pixel cap. */
  ppi: number;
  /** Rectangles in pixels from the top-left corner. */
  trim: Rect;
  safe: Rect;
}

/** Pixel size and line positions of the PNG template. Size = ceil(trim plus bleed × ppi). */
export function pngLayout(spec: TemplateSpec): PngLayout {
  const size = bleedBoxOf(spec);
  let ppi = spec.minPpi;
  let px = pixelsFor(size, ppi);
  if ((px.widthPx * px.heightPx) / 1e6 > MAX_TEMPLATE_MEGAPIXELS) {
    ppi = Math.floor(
      Math.sqrt((MAX_TEMPLATE_MEGAPIXELS * 1e6) / (mmToIn(size.widthMm) * mmToIn(size.heightMm))),
    );
    px = pixelsFor(size, ppi);
  }
  const at = (mm: number) => mmToPx(mm, ppi);
  return {
    widthPx: px.widthPx,
    heightPx: px.heightPx,
    ppi,
    trim: {
      x: at(spec.bleedMm),
      y: at(spec.bleedMm),
      width: at(spec.trimWidthMm),
      height: at(spec.trimHeightMm),
    },
    safe: {
      x: at(spec.bleedMm + spec.safeMarginMm),
      y: at(spec.bleedMm + spec.safeMarginMm),
      width: at(spec.trimWidthMm - 2 * spec.safeMarginMm),
      height: at(spec.trimHeightMm - 2 * spec.safeMarginMm),
    },
  };
}

export interface PdfBoxes {
  /** MediaBox = BleedBox: trim plus bleed, origin at the lower left. */
  media: Rect;
  trim: Rect;
  safe: Rect;
}

/** PDF boxes in points (1 pt = 1/72 in): the media is the page with bleed, the trim sits `bleed` in. */
export function pdfBoxes(spec: TemplateSpec): PdfBoxes {
  const size = bleedBoxOf(spec);
  const b = mmToPt(spec.bleedMm);
  const s = mmToPt(spec.bleedMm + spec.safeMarginMm);
  return {
    media: { x: 0, y: 0, width: mmToPt(size.widthMm), height: mmToPt(size.heightMm) },
    trim: { x: b, y: b, width: mmToPt(spec.trimWidthMm), height: mmToPt(spec.trimHeightMm) },
    safe: {
      x: s,
      y: s,
      width: mmToPt(spec.trimWidthMm - 2 * spec.safeMarginMm),
      height: mmToPt(spec.trimHeightMm - 2 * spec.safeMarginMm),
    },
  };
}

/** The lines of text the template carries, in both formats. */
export function templateLegend(
  spec: TemplateSpec,
  ppi: number,
): { bleed: string; trim: string; safe: string; body: string[] } {
  const length = (mm: number) => {
    const inches = `${Number(mmToIn(mm).toFixed(3))} in`;
    const mm2 = `${Number(mm.toFixed(2))} mm`;
    return spec.inchesFirst ? `${inches} (${mm2})` : `${mm2} (${inches})`;
  };
  const size = (w: number, h: number) =>
    spec.inchesFirst
      ? `${Number(mmToIn(w).toFixed(3))} x ${Number(mmToIn(h).toFixed(3))} in`
      : `${Number(w.toFixed(2))} x ${Number(h.toFixed(2))} mm`;
  const withBleed = bleedBoxOf(spec);
  const px = pixelsFor(withBleed, spec.minPpi);
  return {
    bleed: `BLEED ${length(spec.bleedMm)}: extend artwork to this edge`,
    trim: `TRIM ${size(spec.trimWidthMm, spec.trimHeightMm)}: the page is cut here`,
    safe: `SAFE AREA ${length(spec.safeMarginMm)} in from the trim: keep words and faces inside`,
    body: [
      spec.title,
      `Page with bleed: ${size(withBleed.widthMm, withBleed.heightMm)}`,
      `At ${spec.minPpi} ppi: ${px.widthPx} x ${px.heightPx} px`,
      ...(ppi !== spec.minPpi ? [`(this guide is drawn at ${ppi} ppi to keep it small)`] : []),
      ...(spec.colourMode ? [spec.colourMode] : []),
      "Hide or delete these guides before you export.",
    ],
  };
}

/** The PNG template: white page, lightly tinted bleed band, trim line, dashed safe line, legend. */
export async function renderTemplatePng(spec: TemplateSpec): Promise<Buffer> {
  const layout = pngLayout(spec);
  const { widthPx: w, heightPx: h, ppi, trim, safe } = layout;
  const legend = templateLegend(spec, ppi);
  const stroke = Math.max(1, Math.round(ppi / 100));
  const font = Math.max(8, Math.round(ppi * 0.075));
  const bleedFont = Math.max(6, Math.min(font, Math.floor(trim.y * 0.6)));
  const dash = `${stroke * 6} ${stroke * 4}`;
  const text = (
    x: number,
    y: number,
    size: number,
    fill: string,
    body: string,
    anchor = "start",
    weight = "normal",
  ) =>
    `<text x="${x.toFixed(1)}" y="${y.toFixed(1)}" font-family="DejaVu Sans, Helvetica, Arial, sans-serif" font-size="${size}" font-weight="${weight}" fill="${fill}" text-anchor="${anchor}">${escapeXml(body)}</text>`;
  const centreX = w / 2;
  const lineGap = font * 1.5;
  const bodyTop = h / 2 - ((legend.body.length - 1) * lineGap) / 2;
  const svg = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}" viewBox="0 0 ${w} ${h}">`,
    `<rect x="0" y="0" width="${w}" height="${h}" fill="${spec.bleedMm > 0 ? COLOURS.bleedTint : "#ffffff"}"/>`,
    `<rect x="${trim.x}" y="${trim.y}" width="${trim.width}" height="${trim.height}" fill="#ffffff"/>`,
    spec.bleedMm > 0
      ? `<rect x="${stroke / 2}" y="${stroke / 2}" width="${w - stroke}" height="${h - stroke}" fill="none" stroke="${COLOURS.bleed}" stroke-width="${stroke}"/>`
      : "",
    `<rect x="${trim.x}" y="${trim.y}" width="${trim.width}" height="${trim.height}" fill="none" stroke="${COLOURS.trim}" stroke-width="${stroke}"/>`,
    safe.width > 0 && safe.height > 0
      ? `<rect x="${safe.x}" y="${safe.y}" width="${safe.width}" height="${safe.height}" fill="none" stroke="${COLOURS.safe}" stroke-width="${stroke}" stroke-dasharray="${dash}"/>`
      : "",
    spec.bleedMm > 0 && bleedFont >= 6
      ? text(
          trim.x,
          trim.y - (trim.y - bleedFont) / 2 - bleedFont * 0.15,
          bleedFont,
          COLOURS.bleed,
          legend.bleed,
        )
      : "",
    text(trim.x + stroke * 4, trim.y + font * 1.3, font, COLOURS.trim, legend.trim),
    safe.width > 0
      ? text(safe.x + stroke * 4, safe.y + safe.height - font * 0.6, font, "#8a6414", legend.safe)
      : "",
    ...legend.body.map((line, n) =>
      text(
        centreX,
        bodyTop + n * lineGap,
        n === 0 ? Math.round(font * 1.4) : font,
        COLOURS.text,
        line,
        "middle",
        n === 0 ? "bold" : "normal",
      ),
    ),
    `</svg>`,
  ].join("");
  return sharp(Buffer.from(svg), { density: 72, limitInputPixels: false })
    .flatten({ background: "#ffffff" })
    .removeAlpha()
    .png({ compressionLevel: 9 })
    .withMetadata({ density: ppi })
    .toBuffer();
}

/** The PDF template: one page, MediaBox = BleedBox = trim plus bleed, TrimBox = trim, lines and legend. */
export async function renderTemplatePdf(spec: TemplateSpec): Promise<Uint8Array> {
  const boxes = pdfBoxes(spec);
  const legend = templateLegend(spec, spec.minPpi);
  const doc = await PDFDocument.create();
  doc.setTitle(`${spec.title}: page template`);
  doc.setCreator("Quireline");
  doc.setProducer("Quireline");
  const page = doc.addPage([boxes.media.width, boxes.media.height]);
  page.setMediaBox(0, 0, boxes.media.width, boxes.media.height);
  page.setBleedBox(0, 0, boxes.media.width, boxes.media.height);
  page.setTrimBox(boxes.trim.x, boxes.trim.y, boxes.trim.width, boxes.trim.height);
  const font = await doc.embedFont(StandardFonts.Helvetica);
  const bold = await doc.embedFont(StandardFonts.HelveticaBold);
  const hex = (value: string) =>
    rgb(
      parseInt(value.slice(1, 3), 16) / 255,
      parseInt(value.slice(3, 5), 16) / 255,
      parseInt(value.slice(5, 7), 16) / 255,
    );
  const line = 0.75;
  if (spec.bleedMm > 0) {
    page.drawRectangle({ ...boxes.media, color: hex(COLOURS.bleedTint) });
    page.drawRectangle({ ...boxes.trim, color: rgb(1, 1, 1) });
    page.drawRectangle({
      x: line / 2,
      y: line / 2,
      width: boxes.media.width - line,
      height: boxes.media.height - line,
      borderColor: hex(COLOURS.bleed),
      borderWidth: line,
    });
  }
  page.drawRectangle({ ...boxes.trim, borderColor: hex(COLOURS.trim), borderWidth: line });
  if (boxes.safe.width > 0 && boxes.safe.height > 0) {
    page.drawRectangle({
      ...boxes.safe,
      borderColor: hex(COLOURS.safe),
      borderWidth: line,
      borderDashArray: [4, 3],
    });
  }
  const size = 6.5;
  const bleedSize = Math.min(size, boxes.trim.y * 0.6);
  const write = (
    body: string,
    x: number,
    y: number,
    fontSize: number,
    colour: string,
    f: PDFFont = font,
    centred = false,
  ) => {
    const safeText = encodable(body, f);
    const width = f.widthOfTextAtSize(safeText, fontSize);
    page.drawText(safeText, {
      x: centred ? x - width / 2 : x,
      y,
      size: fontSize,
      font: f,
      color: hex(colour),
    });
  };
  if (spec.bleedMm > 0 && bleedSize >= 3)
    write(
      legend.bleed,
      boxes.trim.x,
      boxes.trim.y + boxes.trim.height + (boxes.trim.y - bleedSize) / 2 + bleedSize * 0.15,
      bleedSize,
      COLOURS.bleed,
    );
  write(
    legend.trim,
    boxes.trim.x + 3,
    boxes.trim.y + boxes.trim.height - size * 1.4,
    size,
    COLOURS.trim,
  );
  if (boxes.safe.width > 0)
    write(legend.safe, boxes.safe.x + 3, boxes.safe.y + size * 0.6, size, "#8a6414");
  const gap = size * 1.5;
  const top = boxes.media.height / 2 + ((legend.body.length - 1) * gap) / 2;
  legend.body.forEach((text, n) =>
    write(
      text,
      boxes.media.width / 2,
      top - n * gap,
      n === 0 ? size * 1.4 : size,
      COLOURS.text,
      n === 0 ? bold : font,
      true,
    ),
  );
  return doc.save();
}

/** A download name such as "low-tide-almanac-page-template-1725x2625px-300ppi.png". */
export function templateFileName(slug: string, spec: TemplateSpec, format: TemplateFormat): string {
  if (format === "png") {
    const { widthPx, heightPx, ppi } = pngLayout(spec);
    return `${slug}-page-template-${widthPx}x${heightPx}px-${ppi}ppi.png`;
  }
  const withBleed = bleedBoxOf(spec);
  const round = (n: number) => Number(n.toFixed(1));
  return `${slug}-page-template-${round(withBleed.widthMm)}x${round(withBleed.heightMm)}mm.pdf`;
}

function escapeXml(text: string): string {
  return text
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;");
}

/** The text with characters the standard font cannot draw replaced (titles may hold any script). */
function encodable(text: string, font: PDFFont): string {
  const supported = new Set(font.getCharacterSet());
  return Array.from(text.normalize("NFC"))
    .map((ch) => {
      if (supported.has(ch.codePointAt(0) ?? 0)) return ch;
      const plain = ch.normalize("NFKD").replace(/[\u0300-\u036f]/g, "");
      return plain && Array.from(plain).every((c) => supported.has(c.codePointAt(0) ?? 0))
        ? plain
        : "?";
    })
    .join("");
}
