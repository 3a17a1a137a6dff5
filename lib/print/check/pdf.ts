/**
 * Spec check of a PDF with pdf-lib: page count, page boxes with the ISO 32000-1 Table 30
 * defaults (CropBox → MediaBox; BleedBox, TrimBox, ArtBox → CropBox), boxes reduced to their
 * intersection with the MediaBox (§14.11.2.1), UserUnit, rotation, bleed, and trim size
 * against the spec within a stated tolerance. Encrypted and damaged files become findings.
 */
import { PDFDocument, PDFName, PDFNumber, type PDFPage } from "pdf-lib";
import { ptToMm } from "../units";
import { bleedBoxOf, trimOf, type PrintSpec } from "../spec";
import { lengthText, sizeText, specUsesInches } from "./geometry";
import { pagesText } from "./report";
import type { Finding, Measured, PdfBox, PdfPageMeasure } from "./types";

/**
 * Trim size tolerance, mm: absorbs points rounded to 2 decimals (0.005 pt) and sizes typed in
 * rounded inches (A5 as 5.83 in is 148.08 mm) while catching a 1 mm error or A4 given as letter.
 */
export const DEFAULT_TRIM_TOLERANCE_MM = 0.5;
/** Bleed this much short of the spec still counts as full bleed, mm. */
const BLEED_SLACK_MM = 0.1;

interface Rect {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

function rectOf(box: { x: number; y: number; width: number; height: number }): Rect {
  const xs = [box.x, box.x + box.width].sort((a, b) => a - b);
  const ys = [box.y, box.y + box.height].sort((a, b) => a - b);
  return { x1: xs[0] ?? 0, y1: ys[0] ?? 0, x2: xs[1] ?? 0, y2: ys[1] ?? 0 };
}

function intersect(a: Rect, b: Rect): Rect {
  const x1 = Math.max(a.x1, b.x1);
  const y1 = Math.max(a.y1, b.y1);
  return { x1, y1, x2: Math.max(x1, Math.min(a.x2, b.x2)), y2: Math.max(y1, Math.min(a.y2, b.y2)) };
}

function sticksOut(inner: Rect, outer: Rect): boolean {
  const e = 0.01;
  return (
    inner.x1 < outer.x1 - e ||
    inner.y1 < outer.y1 - e ||
    inner.x2 > outer.x2 + e ||
    inner.y2 > outer.y2 + e
  );
}

function boxOf(r: Rect, userUnit: number, explicit: boolean): PdfBox {
  const widthPt = (r.x2 - r.x1) * userUnit;
  const heightPt = (r.y2 - r.y1) * userUnit;
  return {
    xPt: r.x1 * userUnit,
    yPt: r.y1 * userUnit,
    widthPt,
    heightPt,
    widthMm: ptToMm(widthPt),
    heightMm: ptToMm(heightPt),
    explicit,
  };
}

/** Boxes of one page with the Table 30 defaults and the MediaBox intersection applied. */
export function measurePage(
  page: PDFPage,
  index: number,
): PdfPageMeasure & { boxesOutsideMedia: string[] } {
  const node = page.node;
  const unitObj = node.get(PDFName.of("UserUnit"));
  const userUnit = unitObj instanceof PDFNumber && unitObj.asNumber() > 0 ? unitObj.asNumber() : 1;
  const media = rectOf(page.getMediaBox());
  const outside: string[] = [];
  const clipped = (name: string, r: Rect, explicit: boolean) => {
    if (explicit && sticksOut(r, media)) outside.push(name);
    return intersect(r, media);
  };
  const crop = clipped("CropBox", rectOf(page.getCropBox()), node.CropBox() !== undefined);
  const bleed = clipped("BleedBox", rectOf(page.getBleedBox()), node.BleedBox() !== undefined);
  const trim = clipped("TrimBox", rectOf(page.getTrimBox()), node.TrimBox() !== undefined);
  const art = clipped("ArtBox", rectOf(page.getArtBox()), node.ArtBox() !== undefined);
  const bleedPt = Math.min(
    trim.x1 - bleed.x1,
    trim.y1 - bleed.y1,
    bleed.x2 - trim.x2,
    bleed.y2 - trim.y2,
  );
  const angle = ((page.getRotation().angle % 360) + 360) % 360;
  return {
    page: index + 1,
    rotateDeg: angle,
    userUnit,
    mediaBox: boxOf(media, userUnit, true),
    cropBox: boxOf(crop, userUnit, node.CropBox() !== undefined),
    bleedBox: boxOf(bleed, userUnit, node.BleedBox() !== undefined),
    trimBox: boxOf(trim, userUnit, node.TrimBox() !== undefined),
    artBox: boxOf(art, userUnit, node.ArtBox() !== undefined),
    bleedMm: Math.max(0, ptToMm(bleedPt * userUnit)),
    boxesOutsideMedia: outside,
  };
}

function within(a: number, b: number, tol: number): boolean {
  return Math.abs(a - b) <= tol;
}

/** Per-page findings, without the page number in the message so identical ones can be grouped. */
function pageFindings(
  m: PdfPageMeasure & { boxesOutsideMedia: string[] },
  spec: PrintSpec,
  tol: number,
): Finding[] {
  const inches = specUsesInches(spec);
  const out: Finding[] = [];
  const turned = m.rotateDeg === 90 || m.rotateDeg === 270;
  // Size as displayed and printed: /Rotate 90 or 270 swaps width and height.
  const shown = (b: PdfBox) =>
    turned
      ? { widthMm: b.heightMm, heightMm: b.widthMm }
      : { widthMm: b.widthMm, heightMm: b.heightMm };
  const trim = trimOf(spec);
  const withBleed = bleedBoxOf(spec);
  const matches = (
    s: { widthMm: number; heightMm: number },
    t: { widthMm: number; heightMm: number },
  ) => within(s.widthMm, t.widthMm, tol) && within(s.heightMm, t.heightMm, tol);
  const swapped = (s: { widthMm: number; heightMm: number }) => ({
    widthMm: s.heightMm,
    heightMm: s.widthMm,
  });

  if (m.rotateDeg !== 0)
    out.push({
      code: "pdf-page-rotated",
      severity: "warning",
      message: `The page is set to display turned ${m.rotateDeg}°; some print workflows ignore that and print it the other way.`,
      fix: "Export the page upright, without a rotation setting.",
    });
  if (m.boxesOutsideMedia.length > 0)
    out.push({
      code: "pdf-box-outside-media",
      severity: "note",
      message: `The ${m.boxesOutsideMedia.join(", ")} reach${m.boxesOutsideMedia.length === 1 ? "es" : ""} beyond the page's MediaBox; only the part inside it counts.`,
    });

  let trimShown = shown(m.trimBox);
  let bleedMm = m.bleedMm;
  if (!m.trimBox.explicit) {
    const page = shown(m.cropBox);
    if (spec.bleedMm > 0 && matches(page, withBleed)) {
      // Page size is trim + bleed: take the trim as centred on it.
      trimShown = trim;
      bleedMm = spec.bleedMm;
      out.push({
        code: "pdf-no-trimbox",
        severity: "note",
        message: `The page has no TrimBox; its size, ${sizeText(page, inches)}, is the trim plus ${lengthText(spec.bleedMm, inches)} bleed, so the trim is taken as centred.`,
        fix: "Set the trim box when exporting (a PDF/X export does) so the trim is stated, not guessed.",
      });
    }
  }
  if (!matches(trimShown, trim)) {
    if (matches(swapped(trimShown), trim))
      out.push({
        code: "wrong-orientation",
        severity: "blocker",
        message: `The page is ${sizeText(trimShown, inches)}, turned the wrong way for the ${sizeText(trim, inches)} trim.`,
        fix: `Set the page to ${sizeText(trim, inches)} (${trim.widthMm < trim.heightMm ? "portrait" : "landscape"}) and export it again.`,
      });
    else
      out.push({
        code: "pdf-trim-size",
        severity: "blocker",
        message: `The trim is ${sizeText(trimShown, inches)}; the spec asks for ${sizeText(trim, inches)} (within ${lengthText(tol, inches)}).`,
        fix: `Set the page to ${sizeText(trim, inches)} with ${lengthText(spec.bleedMm, inches)} bleed on every side and export it again.`,
      });
    return out;
  }
  if (spec.bleedMm > 0) {
    if (bleedMm <= 0.05)
      out.push({
        code: "no-bleed",
        severity: "warning",
        message: `The page is the trim size, ${sizeText(trim, inches)}, with no bleed.`,
        fix: `Extend any artwork that reaches the edge by ${lengthText(spec.bleedMm, inches)} and export with bleed: ${sizeText(withBleed, inches)}.`,
      });
    else if (bleedMm < spec.bleedMm - BLEED_SLACK_MM)
      out.push({
        code: "bleed-too-small",
        severity: "warning",
        message: `The bleed is ${lengthText(bleedMm, inches)}; the spec asks for ${lengthText(spec.bleedMm, inches)}.`,
        fix: `Export with ${lengthText(spec.bleedMm, inches)} bleed on every side: ${sizeText(withBleed, inches)} in all.`,
      });
  }
  return out;
}

/** Measures a PDF and judges it against the spec. */
export async function checkPdf(
  bytes: Uint8Array,
  spec: PrintSpec,
  options: { trimToleranceMm?: number } = {},
): Promise<{ measured: Measured; findings: Finding[] }> {
  const measured: Measured = { byteLength: bytes.length };
  const findings: Finding[] = [];
  const tail = Buffer.from(bytes.subarray(Math.max(0, bytes.length - 1024))).toString("latin1");
  const hasEnd = tail.includes("%%EOF");
  let doc: PDFDocument;
  try {
    doc = await PDFDocument.load(bytes, {
      ignoreEncryption: true,
      updateMetadata: false,
      throwOnInvalidObject: false,
    });
  } catch (error) {
    findings.push(hasEnd ? damaged(error) : truncated());
    return { measured, findings };
  }
  if (!hasEnd) findings.push(truncated());
  measured.pdfEncrypted = doc.isEncrypted;
  if (doc.isEncrypted)
    findings.push({
      code: "pdf-encrypted",
      severity: "blocker",
      message: "The PDF is encrypted (password-protected), so it cannot be placed in the booklet.",
      fix: "Save or export a copy without a password or security settings and upload that.",
    });
  let pages: PDFPage[];
  try {
    pages = doc.getPages();
  } catch (error) {
    findings.push(damaged(error));
    return { measured, findings };
  }
  measured.pdfPageCount = pages.length;
  if (pages.length === 0) {
    findings.push({
      code: "pdf-no-pages",
      severity: "blocker",
      message: "The PDF has no pages.",
      fix: "Export it again with the artwork on its pages.",
    });
    return { measured, findings };
  }
  if (spec.pagesExpected !== undefined && pages.length !== spec.pagesExpected)
    findings.push({
      code: "pdf-page-count",
      severity: "blocker",
      message: `The PDF has ${pages.length} page${pages.length === 1 ? "" : "s"}; ${spec.pagesExpected} ${spec.pagesExpected === 1 ? "is" : "are"} expected.`,
      fix: `Upload a PDF with exactly ${spec.pagesExpected} page${spec.pagesExpected === 1 ? "" : "s"}.`,
    });
  const tol = options.trimToleranceMm ?? DEFAULT_TRIM_TOLERANCE_MM;
  const grouped = new Map<string, { finding: Finding; pages: number[] }>();
  const measures: PdfPageMeasure[] = [];
  for (const [i, page] of pages.entries()) {
    let m: ReturnType<typeof measurePage>;
    try {
      m = measurePage(page, i);
    } catch (error) {
      findings.push({ ...damaged(error), where: `page ${i + 1}` });
      continue;
    }
    const { boxesOutsideMedia: _unused, ...plain } = m;
    measures.push(plain);
    for (const f of pageFindings(m, spec, tol)) {
      const key = `${f.code}\u0000${f.message}`;
      const entry = grouped.get(key) ?? { finding: f, pages: [] };
      entry.pages.push(i + 1);
      grouped.set(key, entry);
    }
  }
  measured.pdfPages = measures;
  for (const { finding, pages: on } of grouped.values())
    findings.push({ ...finding, where: pagesText(on) });
  return { measured, findings };
}

function damaged(error: unknown): Finding {
  return {
    code: "file-damaged",
    severity: "blocker",
    message: `The PDF cannot be read (${error instanceof Error ? error.message : String(error)}).`,
    fix: "Export it again and upload the new file.",
  };
}

function truncated(): Finding {
  return {
    code: "file-truncated",
    severity: "blocker",
    message:
      "The PDF stops before its end marker (%%EOF); the upload was cut short or the file is damaged.",
    fix: "Upload the file again; if it still fails, export a new copy.",
  };
}
