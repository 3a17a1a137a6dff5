/**
 * Drum passes per sheet side. Every ink on a sheet side is one more stencil and one more run
 * of that side through the duplicator (Fancyclopedia, "Mimeography": "each copy sheet is run
 * thru the mimeo as many times as there are colors"); a press that lays several inks per pass
 * needs ⌈inks ÷ inks per pass⌉ passes. Pieces sharing a side add their inks together.
 * Saddle-stitch sides come from lib/print/passes (planInkPasses); fold-only sides are counted
 * here from the fold layout.
 */
import { planInkPasses, type Placement } from "@/lib/print/passes";
import { allSides, sheetSides } from "./layout";
import { plural } from "./state";
import type { MapState, PassCount, SidePassCount } from "./types";

/** Passes one side needs: ⌈distinct inks ÷ inks per pass⌉ (0 for a side with no ink). */
export function passesForInks(inkCount: number, inksPerPass: number): number {
  const perPass = Math.max(1, Math.floor(inksPerPass));
  return Math.ceil(inkCount / perPass);
}

function inkRanker(pressInks: readonly string[]) {
  return (a: string, b: string) => {
    const ra = pressInks.indexOf(a);
    const rb = pressInks.indexOf(b);
    const ka = ra === -1 ? pressInks.length : ra;
    const kb = rb === -1 ? pressInks.length : rb;
    return ka - kb || a.localeCompare(b);
  };
}

/** For every sheet side of the map, its pieces, inks and passes; totals per copy and per run. */
export function countPasses(state: MapState, copies = 1): PassCount {
  if (!Number.isInteger(copies) || copies < 0)
    throw new RangeError(`copies must be a whole number, got ${copies}`);
  const plan = sheetSides(state.pageCount, state.binding);
  const inksById = new Map(state.pieces.map((p) => [p.id, p.inks]));
  const placed = state.slots.filter(
    (s): s is typeof s & { pieceId: number } =>
      s.pieceId !== null && s.page >= 1 && s.page <= state.pageCount && inksById.has(s.pieceId),
  );
  const byInk = inkRanker(state.pressInks);
  const raw: Array<{
    sheet: number;
    side: "front" | "back";
    key: string;
    pages: number[];
    pieceIds: number[];
    inks: string[];
  }> = [];

  if (plan.foldFormat === undefined) {
    // Saddle stitch (padded if needed): the print engine groups placements by side.
    const placements: Placement[] = placed.map((s) => ({
      page: s.page,
      pieceId: String(s.pieceId),
    }));
    const pieces = state.pieces.map((p) => ({ id: String(p.id), inks: p.inks }));
    const engine = planInkPasses({
      pages: plan.laidOutPages,
      placements,
      pieces,
      copies,
      inkOrder: state.pressInks,
    });
    for (const s of engine.sides)
      raw.push({
        sheet: s.sheet,
        side: s.side,
        key: `${s.sheet}-${s.side}`,
        pages: [...s.pages],
        pieceIds: s.pieceIds.map(Number).sort((a, b) => a - b),
        inks: [...s.inks].sort(byInk),
      });
  } else {
    const pieceOn = new Map(placed.map((s) => [s.page, s.pieceId]));
    for (const side of allSides(plan)) {
      const ids = new Set<number>();
      const inks = new Set<string>();
      for (const p of side.pages) {
        const id = pieceOn.get(p);
        if (id === undefined) continue;
        ids.add(id);
        for (const ink of inksById.get(id) ?? []) inks.add(ink);
      }
      raw.push({
        sheet: side.sheet,
        side: side.side,
        key: side.key,
        pages: side.pages,
        pieceIds: [...ids].sort((a, b) => a - b),
        inks: [...inks].sort(byInk),
      });
    }
  }

  const press = new Set(state.pressInks);
  const sidesPerInk: Record<string, number> = {};
  const sides: SidePassCount[] = raw.map((s) => {
    for (const ink of s.inks) sidesPerInk[ink] = (sidesPerInk[ink] ?? 0) + 1;
    return {
      ...s,
      passes: passesForInks(s.inks.length, state.inksPerPass),
      missingInks: s.inks.filter((i) => !press.has(i)),
    };
  });
  const passesPerCopy = sides.reduce((n, s) => n + s.passes, 0);
  const mastersPerRun = sides.reduce((n, s) => n + s.inks.length, 0);
  const perPass = Math.max(1, Math.floor(state.inksPerPass));
  const explanation =
    `Each sheet side goes through the press once per pass; a pass lays ${plural(perPass, "ink")}, ` +
    `so a side needs its distinct inks ÷ ${perPass}, rounded up. ` +
    `Pieces sharing a side share its passes. ${plural(sides.length, "side")}, ${plural(passesPerCopy, "pass", "passes")} per copy` +
    `, ${plural(passesPerCopy * copies, "pass", "passes")} for ${plural(copies, "copy", "copies")}.`;
  return {
    inksPerPass: perPass,
    copies,
    sides,
    passesPerCopy,
    passesPerRun: passesPerCopy * copies,
    mastersPerRun,
    sidesPerInk,
    explanation,
  };
}
