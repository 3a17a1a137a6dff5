/**
 * Ink passes for duplicator printing: one master and one run through the machine per ink per
 * sheet side ("each copy sheet is run thru the mimeo as many times as there are colors",
 * Fancyclopedia "Mimeography"; "separate runs are required for two or more colours").
 * Pieces that share a sheet side print together, so their inks add up on that side.
 */
import { locatePage, saddleStitchSheets, type SheetSide } from "./imposition";

/** Which piece is on a page. A piece spanning a spread appears on both pages. */
export interface Placement {
  page: number;
  pieceId: string;
}

export interface PieceInks {
  id: string;
  inks: readonly string[];
}

export interface SidePasses {
  sheet: number;
  side: SheetSide;
  pages: [number, number];
  pieceIds: string[];
  /** Inks on this side, in the anthology's ink order (unknown inks last, alphabetically). */
  inks: string[];
  passes: number;
}

export interface PassPlan {
  sides: SidePasses[];
  passesPerCopy: number;
  /** One master (stencil) per ink per side; made once per run however many copies. */
  mastersPerRun: number;
  /** Passes for the whole run, copies × passes per copy. */
  passesPerRun: number;
  /** Passes per ink per copy, for ink use. */
  passesPerInkPerCopy: Record<string, number>;
}

/** Inks on every sheet side of an N-page saddle-stitched booklet and the drum passes they need. */
export function planInkPasses(input: {
  pages: number;
  placements: readonly Placement[];
  pieces: readonly PieceInks[];
  copies: number;
  /** Ink order of the anthology; decides the order inks are listed and run. */
  inkOrder?: readonly string[];
}): PassPlan {
  const inksById = new Map(input.pieces.map((p) => [p.id, p.inks]));
  const order = input.inkOrder ?? [];
  const rank = (ink: string) => {
    const i = order.indexOf(ink);
    return i === -1 ? order.length : i;
  };
  const bySide = new Map<string, { pieces: Set<string>; inks: Set<string> }>();
  for (const placement of input.placements) {
    const pos = locatePage(placement.page, input.pages);
    const key = `${pos.sheet}:${pos.side}`;
    const entry = bySide.get(key) ?? { pieces: new Set<string>(), inks: new Set<string>() };
    entry.pieces.add(placement.pieceId);
    const inks = inksById.get(placement.pieceId);
    if (!inks) throw new RangeError(`piece ${placement.pieceId} has no ink list`);
    for (const ink of inks) entry.inks.add(ink);
    bySide.set(key, entry);
  }
  const sides: SidePasses[] = [];
  const perInk: Record<string, number> = {};
  for (const sheet of saddleStitchSheets(input.pages)) {
    for (const side of ["front", "back"] as const) {
      const entry = bySide.get(`${sheet.sheet}:${side}`);
      const inks = [...(entry?.inks ?? [])].sort((a, b) => rank(a) - rank(b) || a.localeCompare(b));
      for (const ink of inks) perInk[ink] = (perInk[ink] ?? 0) + 1;
      sides.push({
        sheet: sheet.sheet,
        side,
        pages: [sheet[side].left, sheet[side].right],
        pieceIds: [...(entry?.pieces ?? [])].sort(),
        inks,
        passes: inks.length,
      });
    }
  }
  const passesPerCopy = sides.reduce((n, s) => n + s.passes, 0);
  return {
    sides,
    passesPerCopy,
    mastersPerRun: passesPerCopy,
    passesPerRun: passesPerCopy * input.copies,
    passesPerInkPerCopy: perInk,
  };
}
