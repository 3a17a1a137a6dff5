/**
 * Findings about the image's pixel size against the page (bleed, orientation, proportions) and
 * its resolution at the printed size, each with the pixel size to export instead.
 */
import { bleedBoxOf, pixelsFor, type PrintSpec } from "../../spec";
import { roundTo } from "../../units";
import {
  lengthText,
  meetsPpi,
  ppiText,
  sizeText,
  specUsesInches,
  type SizeVerdict,
} from "../geometry";
import type { Finding } from "../types";

/** Below this share of the spec's ppi a file is refused: 1.5× screen ruling is the accepted
 * minimum against the 2× standard (300 ppi for 150 lpi), so 0.75 of the standard. */
export const LOW_PPI_BLOCKER_RATIO = 0.75;

/** A file with more pixels than the checker opens. */
export function tooManyPixelsFinding(
  widthPx: number,
  heightPx: number,
  maxPixels: number,
  spec: PrintSpec,
): Finding {
  return {
    code: "too-many-pixels",
    severity: "blocker",
    message: `Your image is ${widthPx} x ${heightPx} px (${roundTo((widthPx * heightPx) / 1e6, 1)} megapixels); files above ${roundTo(maxPixels / 1e6, 1)} megapixels are refused unopened.`,
    fix: sizeFix(spec, Math.max(spec.minPpi, 300), "Export it at the size it will print:"),
  };
}

/** The pixel size a fix asks for: trim + bleed at a resolution. */
export function sizeFix(spec: PrintSpec, ppi: number, lead: string): string {
  const withBleed = bleedBoxOf(spec);
  const px = pixelsFor(withBleed, ppi);
  const size = sizeText(withBleed, specUsesInches(spec));
  return `${lead} ${px.widthPx} x ${px.heightPx} px (${size} with bleed) at ${ppi} ppi.`;
}

/** The resolution a fix asks for: the image's own when it is above the spec's minimum. */
export function targetPpi(spec: PrintSpec, effective: number): number {
  return Math.max(spec.minPpi, Math.round(effective));
}

export function sizeFindings(
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

export function resolutionFindings(
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
