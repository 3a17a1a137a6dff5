/**
 * Step 0: a lone full-bleed spread goes on the centre spread, the only spread printed whole on
 * one side of one sheet, so its halves need no lining up across sheets.
 */
import { pieceName } from "../state";
import type { ProposalRun } from "./context";

/** Puts the lone full-bleed spread on the centre spread when it is free; its id, else null. */
export function placeCentreSpread(run: ProposalRun): number | null {
  const { centre, state, todo, board } = run;
  const bleedSpreads = state.pieces.filter((p) => p.kind === "spread" && p.fullBleed && !p.leftOut);
  if (!centre || bleedSpreads.length !== 1 || centre[1] > run.pageCount) return null;
  const item = todo.find((t) => t.piece.id === bleedSpreads[0]?.id);
  if (item && board.fits(centre[0], item)) {
    run.put(item, centre[0]);
    run.notes.push(
      `Put the full-bleed spread ${pieceName(item.piece, item.piece.id)} on the centre spread, pages ${centre[0]} and ${centre[1]}, where both halves print side by side on one sheet and need no lining up.`,
    );
    return item.piece.id;
  }
  if (item)
    run.notes.push(
      `The centre spread (pages ${centre[0]} and ${centre[1]}) is not free, so the full-bleed spread ${pieceName(item.piece, item.piece.id)} goes where it fits.`,
    );
  return null;
}
