/**
 * Spec check of a raster file (PNG, JPEG, TIFF, WebP) with sharp. The header is read first and
 * the pixel count refused before any decode; the full check then decodes once, downsampled,
 * for the edge analysis, transparency and a truncation check.
 */
import sharp, { type Metadata, type OutputInfo } from "sharp";
import { bleedBoxOf, pixelsFor, type PrintSpec } from "../spec";
import { roundTo } from "../units";
import { analyseEdges } from "./edges";
import { readDeclaredDensity } from "./density";
import {
  classifySize,
  lengthText,
  meetsPpi,
  ppiText,
  sizeText,
  specUsesInches,
  type SizeVerdict,
} from "./geometry";
import { listText } from "./report";
import { formatName } from "./sniff";
import type { ArtworkFormat, Finding, Measured } from "./types";

/** Below this share of the spec's ppi a file is refused: 1.5× screen ruling is the accepted
 * minimum against the 2× standard (300 ppi for 150 lpi), so 0.75 of the standard. */
export const LOW_PPI_BLOCKER_RATIO = 0.75;

/** Long side of the decode used for edge analysis, px. */
const ANALYSIS_LONG_SIDE = 1200;
/** Share of a band that must carry ink to count as reaching it. */
const REACHES = 0.02;
/** Area in the safe band that must differ from the background to be reported: a 1.5 mm dot, mm². */
const SAFE_BAND_CONTENT_MM2 = 2;

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
    findings.push(unreadable(format, bytes, error));
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
    findings.push({
      code: "too-many-pixels",
      severity: "blocker",
      message: `Your image is ${widthPx} x ${heightPx} px (${roundTo((widthPx * heightPx) / 1e6, 1)} megapixels); files above ${roundTo(maxPixels / 1e6, 1)} megapixels are refused unopened.`,
      fix: sizeFix(spec, Math.max(spec.minPpi, 300), "Export it at the size it will print:"),
    });
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
  if (measured.bitDepth === 16)
    findings.push({
      code: "high-bit-depth",
      severity: "note",
      message: "The file has 16 bits per channel; printing uses 8, so it will be reduced.",
      fix: "Nothing to do, or save it at 8 bits to make the file smaller.",
    });
  return { measured, findings, verdict, stop: false };
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
    decoded = await sharp(bytes, { limitInputPixels: options.maxPixels, failOn: "truncated" })
      .resize({
        width: Math.max(1, Math.round(widthPx * scale)),
        height: Math.max(1, Math.round(heightPx * scale)),
        fit: "fill",
      })
      .toColourspace("srgb")
      .ensureAlpha()
      .raw({ depth: "uchar" })
      .toBuffer({ resolveWithObject: true });
  } catch (error) {
    return { measured, findings: [...findings, decodeFailure(format, error)] };
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
  if (measured.hasAlpha) findings.push(alphaFinding(edges.transparentShare));
  if (options.edgeAnalysis && placed) {
    findings = findings.filter((f) => f.code !== "no-bleed");
    findings.push(...edgeFindings(spec, verdict, edges.sides, widthPx, heightPx));
  }
  return { measured, findings };
}

function unreadable(format: ArtworkFormat, bytes: Uint8Array, error: unknown): Finding {
  if (looksTruncated(bytes, format)) return truncatedFinding(format);
  return {
    code: "file-damaged",
    severity: "blocker",
    message: `The file starts like a ${formatName(format)} image but cannot be read (${errorText(error)}).`,
    fix: "Export it again from your drawing or photo program and upload the new file.",
  };
}

function decodeFailure(format: ArtworkFormat, error: unknown): Finding {
  const text = errorText(error);
  if (/premature|truncat|end of|read error|unexpected end/i.test(text))
    return truncatedFinding(format);
  return {
    code: "file-damaged",
    severity: "blocker",
    message: `The ${formatName(format)} header reads, but the picture inside does not (${text}).`,
    fix: "Export it again from your drawing or photo program and upload the new file.",
  };
}

function truncatedFinding(format: ArtworkFormat): Finding {
  return {
    code: "file-truncated",
    severity: "blocker",
    message: `The ${formatName(format)} file stops before its end; the upload was cut short or the file is damaged.`,
    fix: "Upload the file again; if it still fails, export a new copy.",
  };
}

function errorText(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/** The pixel size a fix asks for: trim + bleed at a resolution. */
function sizeFix(spec: PrintSpec, ppi: number, lead: string): string {
  const withBleed = bleedBoxOf(spec);
  const px = pixelsFor(withBleed, ppi);
  const size = sizeText(withBleed, specUsesInches(spec));
  return `${lead} ${px.widthPx} x ${px.heightPx} px (${size} with bleed) at ${ppi} ppi.`;
}

function targetPpi(spec: PrintSpec, effective: number): number {
  return Math.max(spec.minPpi, Math.round(effective));
}

function sizeFindings(
  widthPx: number,
  heightPx: number,
  spec: PrintSpec,
  v: SizeVerdict,
): Finding[] {
  const inches = specUsesInches(spec);
  const ppi = targetPpi(spec, v.effectivePpi);
  const withBleed = bleedBoxOf(spec);
  const bleedPx = pixelsFor(withBleed, ppi);
  const pageWithBleed = sizeText(withBleed, inches);
  if (v.match === "trim-only")
    return [
      {
        code: "no-bleed",
        severity: "warning",
        message: `Your image is ${widthPx} x ${heightPx} px: that is the trim size without bleed.`,
        fix: `Extend the artwork by ${lengthText(spec.bleedMm, inches)} on every side: ${bleedPx.widthPx} x ${bleedPx.heightPx} px at ${ppi} ppi.`,
      },
    ];
  if (v.match === "rotated") {
    const isLandscape = widthPx > heightPx;
    return [
      {
        code: "wrong-orientation",
        severity: "blocker",
        message: `Your image is ${isLandscape ? "landscape" : "portrait"} (${widthPx} x ${heightPx} px) but the page is ${isLandscape ? "portrait" : "landscape"} (${pageWithBleed} with bleed).`,
        fix: `Turn the artwork a quarter turn and export it at ${bleedPx.widthPx} x ${bleedPx.heightPx} px (${ppi} ppi).`,
      },
    ];
  }
  if (v.match === "mismatch") {
    const axis = v.excessWidthMm > v.excessHeightMm ? "width" : "height";
    const excess = Math.max(v.excessWidthMm, v.excessHeightMm);
    const perSide = excess / 2;
    const ratio = (a: number, b: number) => roundTo(Math.max(a, b) / Math.min(a, b), 3);
    return [
      {
        code: "wrong-aspect",
        severity: perSide <= spec.safeMarginMm ? "warning" : "blocker",
        message:
          `Your image is ${widthPx} x ${heightPx} px, proportions 1:${ratio(widthPx, heightPx)}; the page with bleed is ${pageWithBleed}, ` +
          `proportions 1:${ratio(withBleed.widthMm, withBleed.heightMm)}. ` +
          `Scaled to cover the page, ${lengthText(excess, inches)} of its ${axis} would be cut off (${lengthText(perSide, inches)} on each side).`,
        fix: `Crop or extend the artwork to the page's proportions: ${bleedPx.widthPx} x ${bleedPx.heightPx} px at ${ppi} ppi.`,
      },
    ];
  }
  return [];
}

function resolutionFindings(
  spec: PrintSpec,
  v: SizeVerdict,
  declaredPpi: number | null,
): Finding[] {
  const out: Finding[] = [];
  const inches = specUsesInches(spec);
  const printed = sizeText(v.box, inches);
  if (!meetsPpi(v.effectivePpi, spec.minPpi)) {
    const blocker = v.effectivePpi < spec.minPpi * LOW_PPI_BLOCKER_RATIO;
    out.push({
      code: blocker ? "resolution-too-low" : "resolution-low",
      severity: blocker ? "blocker" : "warning",
      message: `Printed at ${printed}, your image is ${ppiText(v.effectivePpi)}; the spec asks for at least ${spec.minPpi} ppi${blocker ? ", so it will look soft or blocky" : ""}.`,
      fix: sizeFix(
        spec,
        spec.minPpi,
        "Supply more pixels, from the original scan or drawing rather than by enlarging:",
      ),
    });
  }
  if (declaredPpi !== null && Math.abs(declaredPpi - v.effectivePpi) / v.effectivePpi > 0.02) {
    out.push({
      code: "declared-density-differs",
      severity: "note",
      message: `The file says ${ppiText(declaredPpi)}, but printed at ${printed} it is ${ppiText(v.effectivePpi)}; only the printed size counts.`,
      fix: "Nothing to do; the number written in the file does not change how it prints.",
    });
  }
  return out;
}

const COLOUR_CODES = new Set([
  "colour-for-duplicator",
  "colour-for-black-printing",
  "cmyk-for-desktop-printer",
  "no-colour-profile",
  "grey-in-colour-file",
]);

function colourFindings(
  spec: PrintSpec,
  measured: Measured,
  colourfulShare: number | undefined,
): Finding[] {
  const space = measured.colourSpace;
  const label = space === "cmyk" ? "CMYK" : space === "rgb" ? "RGB" : "colour";
  const inColour = space === "rgb" || space === "cmyk";
  // An RGB file whose pixels are all grey prints like a greyscale one.
  const lookGrey = colourfulShare !== undefined && colourfulShare < 0.001;
  const out: Finding[] = [];
  if (spec.printMethod === "duplicator" && inColour) {
    const inks = spec.inks.length;
    if (lookGrey) {
      out.push({
        code: "grey-in-colour-file",
        severity: "note",
        message: `The file is saved as ${label} but holds only greys; it will be used as a greyscale file.`,
        fix: "Nothing to do, or save it as greyscale.",
      });
    } else {
      out.push({
        code: "colour-for-duplicator",
        severity: inks > 1 ? "blocker" : "warning",
        message:
          inks > 1
            ? `The file is in ${label} colour; duplicator printing with ${inks} inks (${spec.inks.join(", ")}) needs one greyscale file per ink.`
            : `The file is in ${label} colour; duplicator printing with one ink (${spec.inks[0] ?? "black"}) takes a greyscale file, dark where the ink goes.`,
        fix:
          inks > 1
            ? `Separate the artwork into ${inks} greyscale files, one per ink, dark where that ink goes, and upload each.`
            : "Convert it to greyscale and check the contrast before uploading again.",
      });
    }
  }
  if (spec.printMethod === "laser-black" && inColour && !lookGrey)
    out.push({
      code: "colour-for-black-printing",
      severity: "note",
      message: `The file is in ${label} colour and will print in black only; colours become greys and some may look alike.`,
      fix: "Check a greyscale version for contrast.",
    });
  if ((spec.printMethod === "laser-colour" || spec.printMethod === "inkjet") && space === "cmyk")
    out.push({
      code: "cmyk-for-desktop-printer",
      severity: "note",
      message:
        "The file is CMYK; desktop laser and inkjet printers take RGB and convert it, so colours may shift.",
      fix: "If colours matter, export an RGB (sRGB) version.",
    });
  if (
    (spec.printMethod === "laser-colour" || spec.printMethod === "inkjet") &&
    inColour &&
    !measured.hasIcc
  )
    out.push({
      code: "no-colour-profile",
      severity: "note",
      message: `The ${label} file carries no colour profile, so its colours will be read as ${space === "cmyk" ? "generic CMYK" : "sRGB"}.`,
      fix: "Embed the profile when exporting if the colours were prepared for another one.",
    });
  return out;
}

function alphaFinding(transparentShare: number | undefined): Finding {
  if (transparentShare === undefined)
    return {
      code: "alpha-channel",
      severity: "note",
      message:
        "The file has a transparency (alpha) channel; any transparent areas will print as bare paper.",
      fix: "Flatten it onto the background you want before exporting.",
    };
  if (transparentShare > 0)
    return {
      code: "transparency",
      severity: "warning",
      message: `About ${Math.max(1, Math.round(transparentShare * 100))}% of the image is transparent; transparent areas print as bare paper.`,
      fix: "Flatten it onto white, or onto the colour you want, before exporting.",
    };
  return {
    code: "alpha-channel",
    severity: "note",
    message: "The file has a transparency (alpha) channel, but every pixel is opaque.",
    fix: "Nothing to do, or export without transparency to make the file smaller.",
  };
}

function edgeFindings(
  spec: PrintSpec,
  v: SizeVerdict,
  sides: ReadonlyArray<{
    side: string;
    outerInk: number;
    insideTrimInk: number;
    safeBandContentMm2: number;
  }>,
  widthPx: number,
  heightPx: number,
): Finding[] {
  const inches = specUsesInches(spec);
  const out: Finding[] = [];
  const ppi = targetPpi(spec, v.effectivePpi);
  const bleedPx = pixelsFor(bleedBoxOf(spec), ppi);
  if (v.match === "trim-only") {
    const touching = sides.filter((s) => s.outerInk >= REACHES).map((s) => s.side);
    out.push(
      touching.length > 0
        ? {
            code: "no-bleed",
            severity: "blocker",
            message: `Your image is ${widthPx} x ${heightPx} px: that is the trim size without bleed, and the artwork runs to the ${listText(touching)} edge${touching.length > 1 ? "s" : ""}, so a thin white line can show after trimming.`,
            fix: `Extend the artwork by ${lengthText(spec.bleedMm, inches)} on every side: ${bleedPx.widthPx} x ${bleedPx.heightPx} px at ${ppi} ppi.`,
            where: `${listText(touching)} edge${touching.length > 1 ? "s" : ""}`,
          }
        : {
            code: "no-bleed",
            severity: "note",
            message: `Your image is ${widthPx} x ${heightPx} px: that is the trim size without bleed, but its edges are blank, so it can print as it is.`,
            fix: `Nothing to do; if you add artwork that reaches the edge, extend it by ${lengthText(spec.bleedMm, inches)} on every side.`,
          },
    );
  } else if (spec.bleedMm > 0) {
    const stops = sides
      .filter((s) => s.outerInk < REACHES && s.insideTrimInk >= REACHES)
      .map((s) => s.side);
    if (stops.length > 0)
      out.push({
        code: "art-stops-at-trim",
        severity: "warning",
        message: `The artwork stops at the trim line on the ${listText(stops)} edge${stops.length > 1 ? "s" : ""} and the bleed is left white; a cut a fraction off will show a white sliver.`,
        fix: `Extend the background ${lengthText(spec.bleedMm, inches)} past the trim into the bleed, or pull it back well inside the page.`,
        where: `${listText(stops)} edge${stops.length > 1 ? "s" : ""}`,
      });
  }
  // A side already reported as stopping at the trim is not reported again for its safe band.
  const flagged = new Set(
    out.flatMap((f) =>
      f.code === "art-stops-at-trim" || f.code === "no-bleed" ? (f.where ?? "") : "",
    ),
  );
  const crowded = sides
    .filter(
      (s) =>
        s.safeBandContentMm2 >= SAFE_BAND_CONTENT_MM2 &&
        ![...flagged].some((w) => w.includes(s.side)),
    )
    .map((s) => s.side);
  if (crowded.length > 0 && spec.safeMarginMm > 0)
    out.push({
      code: "content-in-safe-band",
      severity: "note",
      message: `Something sits within ${lengthText(spec.safeMarginMm, inches)} of the trim on the ${listText(crowded)} edge${crowded.length > 1 ? "s" : ""}, where trimming and folding can cut into it.`,
      fix: `Keep text, faces and anything important at least ${lengthText(spec.safeMarginMm, inches)} inside the trim.`,
      where: `${listText(crowded)} edge${crowded.length > 1 ? "s" : ""}`,
    });
  return out;
}
