/**
 * Where a file's thumbnail sits against the page's bleed, trim and safe lines. Pure geometry in
 * millimetres, with the trim's top-left corner at (0, 0); components/spec-overlay.tsx draws it.
 */
import type { Measured } from "@/lib/print/check";
import { bleedBoxOf, safeAreaOf, type PrintSpec } from "@/lib/print/spec";
import { ptToMm } from "@/lib/print/units";

export type Rect = { x: number; y: number; width: number; height: number };

/** The part of a print spec (built with `specOf`) the drawing needs. */
export type OverlaySpec = Pick<
  PrintSpec,
  "trimWidthMm" | "trimHeightMm" | "bleedMm" | "safeMarginMm"
>;

export type OverlayLayout = {
  bleed: Rect;
  trim: Rect;
  safe: Rect | null;
  /** Where the thumbnail goes, or null when the file gave no picture (unreadable). */
  image: Rect | null;
  /** What the drawing covers: the bleed box and the image, with a little room around. */
  view: Rect;
  /** How the image was placed, for the caption. */
  placement: "fills-bleed" | "fills-trim" | "covers-page" | "pdf-boxes" | "none";
};

const near = (a: number, b: number, tol = 0.6) => Math.abs(a - b) <= tol;

function union(a: Rect, b: Rect): Rect {
  const x = Math.min(a.x, b.x);
  const y = Math.min(a.y, b.y);
  return {
    x,
    y,
    width: Math.max(a.x + a.width, b.x + b.width) - x,
    height: Math.max(a.y + a.height, b.y + b.height) - y,
  };
}

function grow(r: Rect, by: number): Rect {
  return { x: r.x - by, y: r.y - by, width: r.width + 2 * by, height: r.height + 2 * by };
}

/**
 * Places the image the way the spec check judged it: a file the size of trim + bleed fills the
 * bleed box; one the trim size fills the trim (leaving the bleed band visibly empty); any other
 * proportion is scaled to cover the bleed box, centred, as a printer would place it.
 */
export function overlayLayout(
  spec: OverlaySpec,
  measured: Measured | null | undefined,
  format?: string,
): OverlayLayout {
  const b = spec.bleedMm;
  const trim: Rect = { x: 0, y: 0, width: spec.trimWidthMm, height: spec.trimHeightMm };
  const bleedBox = bleedBoxOf(spec);
  const bleed: Rect = { x: -b, y: -b, width: bleedBox.widthMm, height: bleedBox.heightMm };
  const s = spec.safeMarginMm;
  const safeArea = safeAreaOf(spec);
  const safe: Rect | null =
    s > 0 && safeArea.widthMm > 0 && safeArea.heightMm > 0
      ? { x: s, y: s, width: safeArea.widthMm, height: safeArea.heightMm }
      : null;
  let image: Rect | null = null;
  let placement: OverlayLayout["placement"] = "none";

  const page = measured?.pdfPages?.[0];
  if (format === "pdf" && page) {
    const crop = page.cropBox;
    if (page.trimBox.explicit) {
      const t = page.trimBox;
      // Line the page's own trim box up with the spec's trim, centre to centre.
      const dx = (spec.trimWidthMm - t.widthMm) / 2;
      const dy = (spec.trimHeightMm - t.heightMm) / 2;
      image = {
        x: dx + ptToMm(crop.xPt - t.xPt),
        y: dy + ptToMm(t.yPt + t.heightPt - (crop.yPt + crop.heightPt)),
        width: crop.widthMm,
        height: crop.heightMm,
      };
    } else if (b > 0 && near(crop.widthMm, bleed.width) && near(crop.heightMm, bleed.height)) {
      image = { ...bleed };
    } else {
      image = {
        x: (spec.trimWidthMm - crop.widthMm) / 2,
        y: (spec.trimHeightMm - crop.heightMm) / 2,
        width: crop.widthMm,
        height: crop.heightMm,
      };
    }
    placement = "pdf-boxes";
  } else if (measured?.widthPx && measured.heightPx) {
    const w = measured.widthPx;
    const h = measured.heightPx;
    if (measured.sizeMatch === "trim-and-bleed") {
      image = { ...bleed };
      placement = "fills-bleed";
    } else if (measured.sizeMatch === "trim-only") {
      image = { ...trim };
      placement = "fills-trim";
    } else {
      const scale = Math.max(bleed.width / w, bleed.height / h);
      const width = w * scale;
      const height = h * scale;
      image = {
        x: bleed.x + (bleed.width - width) / 2,
        y: bleed.y + (bleed.height - height) / 2,
        width,
        height,
      };
      placement = "covers-page";
    }
  }
  const content = image ? union(bleed, image) : bleed;
  const pad = Math.max(2, Math.min(content.width, content.height) * 0.03);
  return { bleed, trim, safe, image, view: grow(content, pad), placement };
}
