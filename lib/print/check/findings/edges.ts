/** Findings about the page's edges: bleed, art that stops at the trim, content in the safe band. */
import { bleedBoxOf, pixelsFor, type PrintSpec } from "../../spec";
import { lengthText, specUsesInches, type SizeVerdict } from "../geometry";
import { listText } from "../report";
import type { Finding } from "../types";
import { targetPpi } from "./size";

/** Share of a band that must carry ink to count as reaching it. */
const REACHES = 0.02;
/** Area in the safe band that must differ from the background to be reported: a 1.5 mm dot, mm². */
const SAFE_BAND_CONTENT_MM2 = 2;

/**
 * Edge findings from the edge analysis of a page-sized image. On one page of a spread the side on
 * the fold is left out: art that crosses the fold continues on the facing page and is not cut
 * there (common practice, no source).
 */
export function edgeFindings(
  spec: PrintSpec,
  v: SizeVerdict,
  allSides: ReadonlyArray<{
    side: string;
    outerInk: number;
    insideTrimInk: number;
    safeBandContentMm2: number;
  }>,
  widthPx: number,
  heightPx: number,
): Finding[] {
  const sides = allSides.filter((s) => s.side !== spec.foldSide);
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
