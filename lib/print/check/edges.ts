/**
 * Edge analysis on a small decode: for each side, whether artwork reaches into the bleed band
 * (or the outer millimetre when the file has no bleed), whether it stops just inside the trim,
 * and whether something differing from the edge's background sits between trim and safe margin.
 */
import type { EdgeReport, EdgeSide } from "./types";

/** Luminance below this (0–255, composited on white) counts as ink. Chosen to ignore JPEG noise on white. */
const INK_BELOW = 235;
/** A pixel this far from the band's background tone counts as content. */
const CONTENT_DELTA = 48;
/**
 * Alpha below this (of 255, so under 50% opacity) counts as mostly transparent: printed on
 * paper such a pixel shows more paper than ink. In PNG (W3C PNG spec, alpha channel) 0 is fully
 * transparent and 255 fully opaque at 8 bits; the decode here is always 8 bits.
 */
export const MOSTLY_TRANSPARENT_BELOW = 128;

export interface EdgeGeometry {
  /** The physical box the whole image covers, mm. */
  boxWidthMm: number;
  boxHeightMm: number;
  /** Bleed included in the image on each side, mm; 0 when the image is the trim only. */
  bleedMm: number;
  safeMarginMm: number;
}

/** Analyses an RGBA 8-bit buffer (any size) against the page geometry. */
export function analyseEdges(
  rgba: Uint8Array,
  width: number,
  height: number,
  geometry: EdgeGeometry,
): EdgeReport & {
  colourfulShare: number;
} {
  const lum = new Uint8Array(width * height);
  let notOpaque = 0;
  let mostlyTransparent = 0;
  let alphaSum = 0;
  let colourful = 0;
  for (let i = 0, p = 0; i < lum.length; i++, p += 4) {
    const r = rgba[p] ?? 255;
    const g = rgba[p + 1] ?? 255;
    const b = rgba[p + 2] ?? 255;
    const alpha = rgba[p + 3] ?? 255;
    const a = alpha / 255;
    if (alpha < 255) notOpaque++;
    if (alpha < MOSTLY_TRANSPARENT_BELOW) mostlyTransparent++;
    alphaSum += alpha;
    if (Math.max(Math.abs(r - g), Math.abs(g - b), Math.abs(r - b)) > 16 && a > 0) colourful++;
    // Rec. 709 luma weights, composited over white paper.
    const y = 0.2126 * r + 0.7152 * g + 0.0722 * b;
    lum[i] = Math.round(y * a + 255 * (1 - a));
  }
  const pxPerMmX = width / geometry.boxWidthMm;
  const pxPerMmY = height / geometry.boxHeightMm;
  const sides: EdgeSide[] = (["top", "right", "bottom", "left"] as const).map((side) => {
    const horizontal = side === "top" || side === "bottom";
    const perMm = horizontal ? pxPerMmY : pxPerMmX;
    const depth = horizontal ? height : width;
    const outerDepth = geometry.bleedMm > 0 ? geometry.bleedMm : 1;
    const toPx = (mm: number) => Math.min(depth, Math.max(0, Math.round(mm * perMm)));
    const outer: [number, number] = [0, Math.max(1, toPx(outerDepth))];
    const trimAt = toPx(geometry.bleedMm);
    const insideTrim: [number, number] = [
      trimAt,
      Math.max(trimAt + 1, toPx(geometry.bleedMm + 1.5)),
    ];
    const safe: [number, number] = [
      trimAt,
      Math.max(trimAt + 1, toPx(geometry.bleedMm + geometry.safeMarginMm)),
    ];
    const band = (range: [number, number]) => bandPixels(lum, width, height, side, range);
    const outerPixels = band(outer);
    const background = median(outerPixels);
    const safePixels = band(safe);
    const safeBandContent = share(safePixels, (v) => Math.abs(v - background) > CONTENT_DELTA);
    return {
      side,
      outerInk: share(outerPixels, (v) => v < INK_BELOW),
      insideTrimInk: share(band(insideTrim), (v) => v < INK_BELOW),
      safeBandContent,
      safeBandContentMm2: (safeBandContent * safePixels.length) / (pxPerMmX * pxPerMmY),
    };
  });
  const total = Math.max(1, width * height);
  return {
    analysedWidthPx: width,
    analysedHeightPx: height,
    sides,
    transparency: {
      notOpaqueShare: notOpaque / total,
      mostlyTransparentShare: mostlyTransparent / total,
      meanOpacity: width * height > 0 ? alphaSum / (255 * width * height) : 1,
    },
    colourfulShare: colourful / total,
  };
}

/** Pixels of a band running along one side, from depth range[0] to range[1] inward. */
function bandPixels(
  lum: Uint8Array,
  width: number,
  height: number,
  side: EdgeSide["side"],
  range: [number, number],
): Uint8Array {
  const [from, to] = range;
  const rows: number[] = [];
  const out: number[] = [];
  if (side === "top" || side === "bottom") {
    for (let d = from; d < Math.min(to, height); d++)
      rows.push(side === "top" ? d : height - 1 - d);
    for (const y of rows) for (let x = 0; x < width; x++) out.push(lum[y * width + x] ?? 255);
  } else {
    for (let d = from; d < Math.min(to, width); d++) rows.push(side === "left" ? d : width - 1 - d);
    for (let y = 0; y < height; y++) for (const x of rows) out.push(lum[y * width + x] ?? 255);
  }
  return Uint8Array.from(out);
}

function share(values: Uint8Array, test: (v: number) => boolean): number {
  if (values.length === 0) return 0;
  let n = 0;
  for (const v of values) if (test(v)) n++;
  return n / values.length;
}

function median(values: Uint8Array): number {
  if (values.length === 0) return 255;
  const histogram = new Uint32Array(256);
  for (const v of values) histogram[v] = (histogram[v] ?? 0) + 1;
  let seen = 0;
  for (let v = 0; v < 256; v++) {
    seen += histogram[v] ?? 0;
    if (seen * 2 >= values.length) return v;
  }
  return 255;
}
