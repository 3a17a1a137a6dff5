/** Shapes of a spec-check report: what was measured, what was found, and the overall verdict. */

export type Severity = "blocker" | "warning" | "note";
export type Verdict = Severity | "pass";

/** File types the checker recognises from their bytes. */
export type ArtworkFormat =
  | "png"
  | "jpeg"
  | "tiff"
  | "webp"
  | "pdf"
  | "gif"
  | "bmp"
  | "heif"
  | "psd"
  | "svg"
  | "zip"
  | "unknown"
  | "empty";

/** The one list of format names people read, in messages and on screens. */
export const FORMAT_NAMES: Record<ArtworkFormat, string> = {
  png: "PNG",
  jpeg: "JPEG",
  tiff: "TIFF",
  webp: "WebP",
  pdf: "PDF",
  gif: "GIF",
  bmp: "BMP",
  heif: "HEIF/HEIC/AVIF",
  psd: "Photoshop (PSD)",
  svg: "SVG",
  zip: "ZIP archive",
  unknown: "Not a recognised file type",
  empty: "Empty file",
};

/** Formats the checker can measure. */
export const SUPPORTED_FORMATS: readonly ArtworkFormat[] = ["png", "jpeg", "tiff", "webp", "pdf"];

/** "PNG, JPEG, TIFF, WebP or PDF": the formats the checker measures, by name. */
const supportedNames = SUPPORTED_FORMATS.map((f) => FORMAT_NAMES[f]);
export const SUPPORTED_FORMATS_TEXT = `${supportedNames.slice(0, -1).join(", ")} or ${supportedNames[supportedNames.length - 1]}`;

export interface Finding {
  /** Stable kebab-case code the interface and tests rely on. */
  code: string;
  severity: Severity;
  /** Plain words with the numbers. */
  message: string;
  /** What to do about it. */
  fix?: string;
  /** Which edge, page or part of the file. */
  where?: string;
}

/** How an image's pixel size relates to the page. */
export type SizeMatch = "trim-and-bleed" | "trim-only" | "rotated" | "mismatch";

export interface DeclaredDensity {
  /** Pixels per inch as written, or null when the file gives only an aspect ratio. */
  xPpi: number | null;
  yPpi: number | null;
  source: "png-phys" | "jfif" | "exif" | "tiff";
  unit: "inch" | "cm" | "metre" | "none";
}

export interface EdgeSide {
  side: "top" | "right" | "bottom" | "left";
  /** Share of the outer band (bleed, or the outer 1 mm without bleed) that carries ink, 0–1. */
  outerInk: number;
  /** Share of the 1.5 mm just inside the trim that carries ink, 0–1. */
  insideTrimInk: number;
  /** Share of the band between trim and safe margin that differs from the edge's background, 0–1. */
  safeBandContent: number;
  /** Area of that differing content, mm². */
  safeBandContentMm2: number;
}

/** How transparent an image is, from its analysed pixels; all opaque when it has no alpha. */
export interface TransparencyStats {
  /** Share of pixels that are not fully opaque (alpha below full), 0–1. */
  notOpaqueShare: number;
  /** Share of pixels that are fully or mostly transparent (under 50% opacity), 0–1. */
  mostlyTransparentShare: number;
  /** Average opacity over all pixels, 0 (all clear) to 1 (all opaque). */
  meanOpacity: number;
}

export interface EdgeReport {
  analysedWidthPx: number;
  analysedHeightPx: number;
  sides: EdgeSide[];
  transparency: TransparencyStats;
}

export interface PdfBox {
  xPt: number;
  yPt: number;
  widthPt: number;
  heightPt: number;
  widthMm: number;
  heightMm: number;
  /** Whether the page sets this box itself; otherwise it is the ISO 32000 default. */
  explicit: boolean;
}

export interface PdfPageMeasure {
  page: number;
  rotateDeg: number;
  userUnit: number;
  mediaBox: PdfBox;
  cropBox: PdfBox;
  bleedBox: PdfBox;
  trimBox: PdfBox;
  artBox: PdfBox;
  /** Bleed on each side of the trim (smallest of the four), mm. */
  bleedMm: number;
}

export interface Measured {
  byteLength: number;
  declaredFormat?: ArtworkFormat;
  widthPx?: number;
  heightPx?: number;
  megapixels?: number;
  declaredDensity?: DeclaredDensity | null;
  /** Pixels per inch at the printed size, the figure that counts. */
  effectivePpi?: number;
  sizeMatch?: SizeMatch;
  colourSpace?: "rgb" | "cmyk" | "greyscale" | "other";
  channels?: number;
  bitDepth?: number;
  hasAlpha?: boolean;
  hasIcc?: boolean;
  edges?: EdgeReport;
  pdfPageCount?: number;
  pdfEncrypted?: boolean;
  pdfPages?: PdfPageMeasure[];
}

export interface SpecReport {
  /** The ink this file is the separation (master) for; absent for a composite page file. */
  ink?: string;
  format: ArtworkFormat;
  measured: Measured;
  findings: Finding[];
  verdict: Verdict;
}

export interface CheckOptions {
  /** The name the file was uploaded with, to compare its extension with its bytes. */
  filename?: string;
  /** The declared media type, compared the same way. */
  mimeType?: string;
  /** Refuse images with more pixels than this before decoding (default 150 megapixels). */
  maxPixels?: number;
  /** Run the downsampled edge analysis in the full check (default true). */
  edgeAnalysis?: boolean;
  /** Tolerance on PDF trim size against the spec, mm (default 0.5). */
  trimToleranceMm?: number;
}

/**
 * Default pixel ceiling: a letter page with 1/8 in bleed at 1200 ppi is 10500 x 13500 px
 * (141.75 MP), so 150 MP admits every sane page and refuses decompression bombs.
 */
export const DEFAULT_MAX_PIXELS = 150_000_000;
