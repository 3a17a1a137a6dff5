// A two-page spread is uploaded one page file at a time; the artwork may run across the fold
// (the spine), which is not a trim edge. Worked at half letter, 5.5 x 8.5 in (PWG
// na_invoice_5.5x8.5in), 1/8 in bleed (Wikipedia "Bleed (printing)") and a 1/4 in safe margin
// (common practice, no source), at 100 ppi: each page file with bleed is 575 x 875 px, the bleed
// 12.5 px and the safe band the 25 px inside the trim (pixels = inches x ppi).
import { describe, expect, it } from "vitest";
import { checkArtwork, type SpecReport } from "@/lib/print/check";
import { specForPiece } from "@/lib/pieces/submission-rules";
import type { PrintSpec } from "@/lib/print/spec";
import { inToMm } from "@/lib/print/units";
import { makePng, physData, type Paint } from "./fixtures";

const spec = (over: Partial<PrintSpec> = {}): PrintSpec => ({
  trimWidthMm: inToMm(5.5),
  trimHeightMm: inToMm(8.5),
  bleedMm: inToMm(0.125),
  safeMarginMm: inToMm(0.25),
  minPpi: 100,
  printMethod: "duplicator",
  inks: ["black"],
  ...over,
});

const PAGE_W = 575; // (5.5 + 2 x 0.125) in x 100 ppi
const PAGE_H = 875; // (8.5 + 2 x 0.125) in x 100 ppi
const PPM_100 = Math.round(100 / 0.0254);

/**
 * The whole spread painted once, 2 x 575 px wide, then cut into its left and right page files:
 * a dark band across the middle of the spread, from x = 400 on the left page to x = 175 on the
 * right page, crossing the fold; every outer edge white.
 */
const spreadArt =
  (extra: Paint = () => [255, 255, 255, 255]): Paint =>
  (x, y) =>
    x >= 400 && x < PAGE_W + 175 && y >= 300 && y < 600 ? [30, 30, 30, 255] : extra(x, y);

function pageFile(paint: Paint, page: "left" | "right"): Buffer {
  const offset = page === "left" ? 0 : PAGE_W;
  return makePng(PAGE_W, PAGE_H, (x, y) => paint(x + offset, y), {
    colorType: 0,
    phys: physData(PPM_100, PPM_100, 1),
  });
}

const EDGE_CODES = ["no-bleed", "art-stops-at-trim", "content-in-safe-band"];
const edgeFindings = (r: SpecReport) => r.findings.filter((f) => EDGE_CODES.includes(f.code));

describe("a spread's page files and the fold", () => {
  it("the spec of a spread's left page has the fold on its right, the right page on its left", () => {
    const anthology = spec();
    expect(specForPiece(anthology, { inks: ["black"], kind: "spread" }, 1).foldSide).toBe("right");
    expect(specForPiece(anthology, { inks: ["black"], kind: "spread" }, 2).foldSide).toBe("left");
    expect(
      specForPiece(anthology, { inks: ["black"], kind: "single" }, 1).foldSide,
    ).toBeUndefined();
  });

  it("art crossing the fold but clear of the outer safe margin gives no edge finding on either page", async () => {
    const left = await checkArtwork(pageFile(spreadArt(), "left"), spec({ foldSide: "right" }));
    const right = await checkArtwork(pageFile(spreadArt(), "right"), spec({ foldSide: "left" }));
    expect(left.measured.sizeMatch).toBe("trim-and-bleed");
    expect(edgeFindings(left)).toEqual([]);
    expect(edgeFindings(right)).toEqual([]);
  });

  it("checked as a lone page, the same left page is flagged at its right edge: the fold is what clears it", async () => {
    const report = await checkArtwork(pageFile(spreadArt(), "left"), spec());
    const crowded = report.findings.find((f) => f.code === "content-in-safe-band");
    expect(crowded?.where).toBe("right edge");
  });

  it("art near the outer trim of a spread page is still flagged, on that edge only", async () => {
    // A mark 20-60 px in from the left-page's outer (left) edge: inside the 12.5 + 25 px safe band.
    const nearOuter = spreadArt((x, y) =>
      x >= 20 && x < 60 && y >= 400 && y < 500 ? [30, 30, 30, 255] : [255, 255, 255, 255],
    );
    const report = await checkArtwork(pageFile(nearOuter, "left"), spec({ foldSide: "right" }));
    const found = edgeFindings(report);
    expect(found.map((f) => f.code)).toEqual(["content-in-safe-band"]);
    expect(found[0]?.where).toBe("left edge");
  });
});
