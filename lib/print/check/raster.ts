/**
 * Spec check of a raster file (PNG, JPEG, TIFF, WebP) with sharp. The header is read first and
 * the pixel count refused before any decode; the full check then decodes once, downsampled,
 * for the edge analysis, transparency and a truncation check.
 */
import sharp, { type Metadata, type OutputInfo } from "sharp";
import type { PrintSpec } from "../spec";
import { roundTo } from "../units";
import { analyseEdges } from "./edges";
import { readDeclaredDensity } from "./density";
import { classifySize, type SizeVerdict } from "./geometry";
import { COLOUR_CODES, colourFindings, highBitDepthFinding } from "./findings/colour";
import { decodeFailureFinding, truncatedFinding, unreadableFinding } from "./findings/damage";
import { edgeFindings } from "./findings/edges";
import { resolutionFindings, sizeFindings, tooManyPixelsFinding } from "./findings/size";
import { alphaFinding } from "./findings/transparency";
import type { ArtworkFormat, Finding, Measured } from "./types";

/** Long side of the decode used for edge analysis, px. */
const ANALYSIS_LONG_SIDE = 1200;

export interface RasterResult {
  measured: Measured;
  findings: Finding[];
}

function colourSpaceOf(space: string | undefined): Measured["colourSpace"] {
  if (space === "srgb" || space === "rgb" || space === "rgb16" || space === "scrgb") return "rgb";
  if (space === "cmyk") return "cmyk";
  if (space === "b-w" || space === "grey16") return "greyscale";
  return "other";
}

/** PNG must end with IEND; a JPEG with EOI (FF D9) somewhere in its last 64 KiB. */
export function looksTruncated(bytes: Uint8Array, format: ArtworkFormat): boolean {
  if (format === "png") {
    const tail = Buffer.from(bytes.subarray(Math.max(0, bytes.length - 12)));
    return !tail.subarray(4, 8).equals(Buffer.from("IEND"));
  }
  if (format === "jpeg") {
    const tail = Buffer.from(bytes.subarray(Math.max(0, bytes.length - 65536)));
    return tail.lastIndexOf(Buffer.from([0xff, 0xd9])) === -1;
  }
  return false;
}

/** Header-only measurements and findings; returns early with a blocker for unreadable files or too many pixels. */
export async function checkRasterHeader(
  bytes: Uint8Array,
  format: ArtworkFormat,
  spec: PrintSpec,
  maxPixels: number,
): Promise<RasterResult & { verdict?: SizeVerdict; stop: boolean }> {
  const measured: Measured = { byteLength: bytes.length };
  const findings: Finding[] = [];
  let meta: Metadata;
  try {
    // Header only: metadata() reads the header without decoding pixels, so no pixel limit here.
    meta = await sharp(bytes, { limitInputPixels: false }).metadata();
  } catch (error) {
    findings.push(
      looksTruncated(bytes, format) ? truncatedFinding(format) : unreadableFinding(format, error),
    );
    return { measured, findings, stop: true };
  }
  const widthPx = meta.width ?? 0;
  const heightPx = meta.height ?? 0;
  Object.assign(measured, {
    widthPx,
    heightPx,
    megapixels: roundTo((widthPx * heightPx) / 1e6, 2),
    channels: meta.channels,
    bitDepth: meta.bitsPerSample ?? (meta.depth === "ushort" ? 16 : 8),
    hasAlpha: meta.hasAlpha,
    hasIcc: meta.hasProfile,
    colourSpace: colourSpaceOf(meta.space),
  });
  if (widthPx * heightPx > maxPixels) {
    findings.push(tooManyPixelsFinding(widthPx, heightPx, maxPixels, spec));
    return { measured, findings, stop: true };
  }
  // Only PNG is judged from its tail here (IEND must close the file); JPEGs may carry trailers
  // after EOI, so their truncation is left to the decode in the full check.
  if (format === "png" && looksTruncated(bytes, format)) {
    findings.push(truncatedFinding(format));
    return { measured, findings, stop: true };
  }
  const declared = readDeclaredDensity(bytes, format);
  measured.declaredDensity = declared;
  const verdict = classifySize(widthPx, heightPx, spec);
  measured.sizeMatch = verdict.match;
  measured.effectivePpi = roundTo(verdict.effectivePpi, 4);
  findings.push(...sizeFindings(widthPx, heightPx, spec, verdict));
  findings.push(...resolutionFindings(spec, verdict, declared?.xPpi ?? null));
  findings.push(...colourFindings(spec, measured, undefined));
  if (measured.hasAlpha) findings.push(alphaFinding(undefined));
  if (measured.bitDepth === 16) findings.push(highBitDepthFinding());
  return { measured, findings, verdict, stop: false };
}

/**
 * The small sRGB + alpha decode the edge and transparency analysis reads, made as cheaply as a
 * full read of the file allows (every pixel is still decoded once, so damage is still found):
 * - nearest-neighbour reduction: samples pixels instead of filtering all of them; the analysis
 *   counts shares of pixels past thresholds, which a sample estimates without bias;
 * - read in one pass from top to bottom (sequentialRead), so libvips streams the file instead
 *   of keeping the decoded image for random access;
 * - JPEG keeps sharp's shrink-on-load (libjpeg scales by 1/2, 1/4 or 1/8 while decoding);
 * - any other CMYK file (TIFF) is reduced while still CMYK and only the small image is converted
 *   to sRGB: sharp otherwise runs the ICC transform over every pixel first, which was most of the
 *   time of a 100-megapixel CMYK TIFF. A CMYK JPEG is left to shrink on load instead (sharp does
 *   not shrink on load once a pipeline colour space is set).
 */
function analysisDecode(
  bytes: Uint8Array,
  format: ArtworkFormat,
  measured: Measured,
  size: { widthPx: number; heightPx: number; maxPixels: number },
): Promise<{ data: Buffer; info: OutputInfo }> {
  let image = sharp(bytes, {
    limitInputPixels: size.maxPixels,
    failOn: "truncated",
    sequentialRead: true,
  });
  if (measured.colourSpace === "cmyk" && format !== "jpeg")
    image = image.pipelineColourspace("cmyk");
  return image
    .resize({ width: size.widthPx, height: size.heightPx, fit: "fill", kernel: "nearest" })
    .toColourspace("srgb")
    .ensureAlpha()
    .raw({ depth: "uchar" })
    .toBuffer({ resolveWithObject: true });
}

/** Full check: the header check, then one downsampled decode for edges, transparency and damage. */
export async function checkRaster(
  bytes: Uint8Array,
  format: ArtworkFormat,
  spec: PrintSpec,
  options: { maxPixels: number; edgeAnalysis: boolean },
): Promise<RasterResult> {
  const header = await checkRasterHeader(bytes, format, spec, options.maxPixels);
  if (header.stop || !header.verdict) return header;
  const { measured, verdict } = header;
  let findings = header.findings;
  const widthPx = measured.widthPx ?? 1;
  const heightPx = measured.heightPx ?? 1;
  const scale = Math.min(1, ANALYSIS_LONG_SIDE / Math.max(widthPx, heightPx));
  let decoded: { data: Buffer; info: OutputInfo };
  try {
    decoded = await analysisDecode(bytes, format, measured, {
      widthPx: Math.max(1, Math.round(widthPx * scale)),
      heightPx: Math.max(1, Math.round(heightPx * scale)),
      maxPixels: options.maxPixels,
    });
  } catch (error) {
    return { measured, findings: [...findings, decodeFailureFinding(format, error)] };
  }
  const placed = verdict.match === "trim-and-bleed" || verdict.match === "trim-only";
  const analysis = analyseEdges(decoded.data, decoded.info.width, decoded.info.height, {
    boxWidthMm: verdict.box.widthMm,
    boxHeightMm: verdict.box.heightMm,
    bleedMm: verdict.match === "trim-and-bleed" ? spec.bleedMm : 0,
    safeMarginMm: spec.safeMarginMm,
  });
  const { colourfulShare, ...edges } = analysis;
  if (options.edgeAnalysis && placed) measured.edges = edges;
  // Colour and alpha findings now know what the pixels hold.
  findings = findings.filter((f) => !COLOUR_CODES.has(f.code) && f.code !== "alpha-channel");
  findings.push(...colourFindings(spec, measured, colourfulShare));
  if (measured.hasAlpha) findings.push(alphaFinding(edges.transparency));
  if (options.edgeAnalysis && placed) {
    findings = findings.filter((f) => f.code !== "no-bleed");
    findings.push(...edgeFindings(spec, verdict, edges.sides, widthPx, heightPx));
  }
  return { measured, findings };
}
