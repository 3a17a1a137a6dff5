/**
 * How an image's pixels map onto the page: does it fill trim + bleed, the trim only, the
 * page turned 90°, or neither; the effective ppi at that size; and lengths written the way the
 * anthology's spec is written (inches for inch trims, millimetres otherwise).
 */
import { mmToIn, pxToMm, roundTo } from "../units";
import type { SizeMm } from "../sizes";
import { bleedBoxOf, trimOf, type PrintSpec } from "../spec";
import type { SizeMatch } from "./types";

export interface SizeVerdict {
  match: SizeMatch;
  /** The box the pixels are taken to fill once placed (after turning, for "rotated"). */
  box: SizeMm;
  boxName: "trim-and-bleed" | "trim";
  /** Pixels per inch when the image is scaled to cover that box. */
  effectivePpi: number;
  /** Length of the image beyond the bleed box when scaled to cover it, per axis (mismatch only), mm. */
  excessWidthMm: number;
  excessHeightMm: number;
}

function coverFit(widthPx: number, heightPx: number, box: SizeMm) {
  const ppi = Math.min(widthPx / mmToIn(box.widthMm), heightPx / mmToIn(box.heightMm));
  const printedW = pxToMm(widthPx, ppi);
  const printedH = pxToMm(heightPx, ppi);
  const excessWidthMm = Math.max(0, printedW - box.widthMm);
  const excessHeightMm = Math.max(0, printedH - box.heightMm);
  // Half a millimetre, or the rounding of a pixel and a half, whichever is larger.
  const toleranceMm = Math.max(0.5, pxToMm(1.5, ppi));
  return {
    ppi,
    excessWidthMm,
    excessHeightMm,
    fits: Math.max(excessWidthMm, excessHeightMm) <= toleranceMm,
  };
}

/** Classifies pixel dimensions against the spec; bleed is tried first, then trim, then both turned. */
export function classifySize(widthPx: number, heightPx: number, spec: PrintSpec): SizeVerdict {
  const bleedBox = bleedBoxOf(spec);
  const trim = trimOf(spec);
  const candidates: Array<{ box: SizeMm; boxName: SizeVerdict["boxName"]; match: SizeMatch }> = [
    { box: bleedBox, boxName: "trim-and-bleed", match: "trim-and-bleed" },
  ];
  if (spec.bleedMm > 0) candidates.push({ box: trim, boxName: "trim", match: "trim-only" });
  for (const c of candidates) {
    const fit = coverFit(widthPx, heightPx, c.box);
    if (fit.fits)
      return {
        match: c.match,
        box: c.box,
        boxName: c.boxName,
        effectivePpi: fit.ppi,
        excessWidthMm: 0,
        excessHeightMm: 0,
      };
  }
  if (widthPx !== heightPx) {
    for (const c of candidates) {
      const fit = coverFit(heightPx, widthPx, c.box);
      if (fit.fits)
        return {
          match: "rotated",
          box: c.box,
          boxName: c.boxName,
          effectivePpi: fit.ppi,
          excessWidthMm: 0,
          excessHeightMm: 0,
        };
    }
  }
  const fit = coverFit(widthPx, heightPx, bleedBox);
  return {
    match: "mismatch",
    box: bleedBox,
    boxName: "trim-and-bleed",
    effectivePpi: fit.ppi,
    excessWidthMm: fit.excessWidthMm,
    excessHeightMm: fit.excessHeightMm,
  };
}

/** True when the spec's trim is a whole number of sixteenths of an inch, so messages use inches. */
export function specUsesInches(spec: PrintSpec): boolean {
  const sixteenths = (mm: number) => (mmToIn(mm) * 16) % 1;
  const whole = (v: number) => Math.min(v, 1 - v) < 1e-6;
  return whole(sixteenths(spec.trimWidthMm)) && whole(sixteenths(spec.trimHeightMm));
}

/** A length in the spec's units: "0.125 in" or "3 mm". */
export function lengthText(mm: number, inches: boolean): string {
  return inches ? `${roundTo(mmToIn(mm), 3)} in` : `${roundTo(mm, 1)} mm`;
}

/** A size in the spec's units: "5.75 x 8.75 in" or "154 x 216 mm". */
export function sizeText(size: SizeMm, inches: boolean): string {
  return inches
    ? `${roundTo(mmToIn(size.widthMm), 3)} x ${roundTo(mmToIn(size.heightMm), 3)} in`
    : `${roundTo(size.widthMm, 1)} x ${roundTo(size.heightMm, 1)} mm`;
}

/** Whole ppi as people say it; 299.9994 is 300. */
export function ppiText(ppi: number): string {
  return `${Math.round(ppi)} ppi`;
}

/**
 * Meets a minimum ppi after rounding to the nearest whole ppi, so a correctly written 300 ppi
 * PNG (11811 px/m = 299.9994 ppi, PNG spec) and 1748 px across A5 (299.995 ppi) pass 300.
 */
export function meetsPpi(ppi: number, minPpi: number): boolean {
  return Math.round(ppi) >= minPpi;
}
