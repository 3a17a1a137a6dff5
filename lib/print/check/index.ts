/**
 * Spec check of one uploaded artwork file against an anthology's print spec. Never throws for a
 * bad file: empty, truncated, mislabelled, unsupported, oversized and encrypted files all come
 * back as findings with a blocker verdict.
 */
import type { PrintSpec } from "../spec";
import { checkPdf } from "./pdf";
import { checkRaster, checkRasterHeader, type RasterResult } from "./raster";
import { makeReport } from "./report";
import { formatFromFilename, formatFromMimeType, formatName, sniffFormat } from "./sniff";
import {
  DEFAULT_MAX_PIXELS,
  SUPPORTED_FORMATS,
  SUPPORTED_FORMATS_TEXT,
  type ArtworkFormat,
  type CheckOptions,
  type Finding,
  type SpecReport,
} from "./types";

export * from "./types";
export { sniffFormat, formatFromFilename, formatFromMimeType } from "./sniff";
export { readDeclaredDensity } from "./density";
export { classifySize, meetsPpi } from "./geometry";
export { verdictOf } from "./report";
export { LOW_PPI_BLOCKER_RATIO } from "./findings/size";
export { DEFAULT_TRIM_TOLERANCE_MM } from "./pdf";

interface Triage {
  format: ArtworkFormat;
  declaredFormat?: ArtworkFormat;
  findings: Finding[];
  stop: boolean;
}

/** What the bytes are, what the name or media type claimed, and whether we can go on. */
function triage(bytes: Uint8Array, options: CheckOptions): Triage {
  const format = sniffFormat(bytes);
  const declaredFormat =
    (options.filename ? formatFromFilename(options.filename) : undefined) ??
    (options.mimeType ? formatFromMimeType(options.mimeType) : undefined);
  const findings: Finding[] = [];
  if (format === "empty") {
    findings.push({
      code: "file-empty",
      severity: "blocker",
      message: "The file is empty (0 bytes).",
      fix: "Upload the file again; the upload may have failed.",
    });
    return { format, declaredFormat, findings, stop: true };
  }
  const claimed = declaredFormat && declaredFormat !== format ? declaredFormat : undefined;
  if (!SUPPORTED_FORMATS.includes(format)) {
    const what =
      format === "unknown" ? "not a file type we recognise" : `a ${formatName(format)} file`;
    findings.push({
      code: format === "unknown" ? "file-unrecognised" : "file-unsupported",
      severity: "blocker",
      message: claimed
        ? `The file is named as ${formatName(claimed)}, but its contents are ${what}.`
        : `The file is ${what}; artwork must be ${SUPPORTED_FORMATS_TEXT}.`,
      fix: "Export the artwork as PNG, TIFF or PDF (or JPEG at high quality) and upload that.",
    });
    return { format, declaredFormat, findings, stop: true };
  }
  if (claimed)
    findings.push({
      code: "file-type-mismatch",
      severity: "warning",
      message: `The file is named as ${formatName(claimed)}, but its contents are ${formatName(format)}; it was checked as ${formatName(format)}.`,
      fix: `Rename it with the right extension (.${format === "jpeg" ? "jpg" : format === "tiff" ? "tif" : format}) so other programs open it correctly.`,
    });
  return { format, declaredFormat, findings, stop: false };
}

/** Full check: header, size, resolution, colour, then edges and transparency from a small decode (raster) or page boxes (PDF). */
export function checkArtwork(
  bytes: Uint8Array | Buffer,
  spec: PrintSpec,
  options: CheckOptions = {},
): Promise<SpecReport> {
  return runCheck(bytes, spec, options, (data, format) =>
    checkRaster(data, format, spec, {
      maxPixels: options.maxPixels ?? DEFAULT_MAX_PIXELS,
      edgeAnalysis: options.edgeAnalysis ?? true,
    }),
  );
}

/** Header-only verdict on size, resolution and colour; for a raster no pixel is decoded. */
export function checkArtworkHeader(
  bytes: Uint8Array | Buffer,
  spec: PrintSpec,
  options: CheckOptions = {},
): Promise<SpecReport> {
  return runCheck(bytes, spec, options, (data, format) =>
    checkRasterHeader(data, format, spec, options.maxPixels ?? DEFAULT_MAX_PIXELS),
  );
}

/** Sniffs the bytes, checks PDFs by their page boxes and rasters with `raster`; never throws. */
async function runCheck(
  bytes: Uint8Array | Buffer,
  spec: PrintSpec,
  options: CheckOptions,
  raster: (data: Uint8Array, format: ArtworkFormat) => Promise<RasterResult>,
): Promise<SpecReport> {
  const report = await checkBytes(bytes, spec, options, raster);
  return spec.separationInk === undefined ? report : { ink: spec.separationInk, ...report };
}

async function checkBytes(
  bytes: Uint8Array | Buffer,
  spec: PrintSpec,
  options: CheckOptions,
  raster: (data: Uint8Array, format: ArtworkFormat) => Promise<RasterResult>,
): Promise<SpecReport> {
  const data = toBytes(bytes);
  const t = triage(data, options);
  const base = { byteLength: data.length, declaredFormat: t.declaredFormat };
  if (t.stop) return makeReport(t.format, base, t.findings);
  try {
    const result =
      t.format === "pdf"
        ? await checkPdf(data, spec, { trimToleranceMm: options.trimToleranceMm })
        : await raster(data, t.format);
    return makeReport(t.format, { ...result.measured, ...base }, [
      ...t.findings,
      ...result.findings,
    ]);
  } catch (error) {
    return makeReport(t.format, base, [...t.findings, unexpected(error)]);
  }
}

function toBytes(bytes: Uint8Array | Buffer): Uint8Array {
  return bytes instanceof Uint8Array ? bytes : new Uint8Array(bytes);
}

function unexpected(error: unknown): Finding {
  return {
    code: "file-damaged",
    severity: "blocker",
    message: `The file could not be checked (${error instanceof Error ? error.message : String(error)}).`,
    fix: "Export it again and upload the new file; if it keeps failing, tell the editor.",
  };
}
