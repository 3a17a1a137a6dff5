/**
 * What one copy takes, read from the page map and the print method rather than typed in: the
 * sheets the imposition lays out (a saddle stitch pads to whole sheets of 4 pages), the outer
 * sheet on cover stock when the cover is separate, the sides that carry a page, and the drum
 * passes and masters the inks on each side need (lib/map/passes).
 */
import type { CoverStock, PrintMethod } from "@/lib/domain";
import { allSides, sheetSides } from "@/lib/map/layout";
import { countPasses } from "@/lib/map/passes";
import type { MapState } from "@/lib/map/types";
import { staplesPerCopy } from "./checklist";
import type { CopyCounts } from "./plan";

export interface CountsSpec {
  printMethod: PrintMethod;
  coverStock: CoverStock;
  trimHeightMm: number;
}

export function copyCounts(
  state: MapState,
  spec: CountsSpec,
): CopyCounts & {
  laidOutPages: number;
  sheetsPerCopy: number;
} {
  const plan = sheetSides(state.pageCount, state.binding);
  const sheets = plan.sheets.length;
  const coverSheets =
    spec.coverStock === "separate" && state.binding === "saddle-stitch" && sheets > 1 ? 1 : 0;
  // Every side of a laid-out sheet that carries a page prints, blank padding pages included:
  // a copy shop charges for the side either way.
  const printedSides = allSides(plan).filter((s) => s.pages.length > 0).length;
  const duplicator = spec.printMethod === "duplicator";
  const passes = duplicator ? countPasses(state, 1) : null;
  return {
    insideSheets: sheets - coverSheets,
    coverSheets,
    printedSides,
    passes: passes ? passes.passesPerCopy : printedSides,
    mastersPerRun: passes ? passes.mastersPerRun : 0,
    staples: staplesPerCopy(state.binding, spec.trimHeightMm),
    duplicator,
    laidOutPages: plan.laidOutPages,
    sheetsPerCopy: sheets,
  };
}
