/**
 * Step 1: runs and spreads, largest first, each where it adds the fewest drum passes, with a
 * bounded backtracking search so that they all fit when they can.
 */
import { plural } from "../state";
import type { Item } from "./board";
import { canStillFit, multiCandidates } from "./candidates";
import type { ProposalRun } from "./context";

/** Search steps for fitting runs and spreads, whatever the exhaustive budget. */
const MULTI_BUDGET = 20_000;

/** Places the runs and spreads (already in placing order); those with no room go to run.unplaced. */
export function placeRunsAndSpreads(run: ProposalRun, multis: readonly Item[]): void {
  if (!multis.length) return;
  const { board, centreStart } = run;
  let multiNodes = 0;
  let leftmost = false;
  const dfsMulti = (i: number): boolean => {
    const item = multis[i];
    if (!item) return true;
    if (++multiNodes > MULTI_BUDGET) return false;
    if (!canStillFit(board, multis, i)) return false;
    const cands = multiCandidates(board, item, centreStart);
    if (leftmost) cands.sort((x, y) => x.start - y.start);
    for (const c of cands) {
      run.put(item, c.start);
      if (dfsMulti(i + 1)) return true;
      run.take(item);
      if (multiNodes > MULTI_BUDGET) return false;
    }
    return false;
  };
  let fitted = dfsMulti(0);
  if (!fitted) {
    // Second try: pack from the front, the usual way to make awkward lengths fit.
    for (const item of multis) run.take(item);
    multiNodes = 0;
    leftmost = true;
    fitted = dfsMulti(0);
    leftmost = false;
  }
  if (!fitted) {
    for (const item of multis) run.take(item);
    for (const item of multis) {
      const best = multiCandidates(board, item, centreStart)[0];
      if (best) run.put(item, best.start);
      else
        run.unplaced.push({
          pieceId: item.piece.id,
          reason:
            item.piece.kind === "spread"
              ? `No free pair of facing pages (an even page and the odd page after it) is left for this spread.`
              : item.len > run.pageCount
                ? `The run has ${item.len} pages, more than the booklet's ${run.pageCount}.`
                : `No ${item.len} free pages in a row are left for this run.`,
        });
    }
  }
  const placedMulti = multis.filter((m) => run.chosen.has(m.piece.id));
  if (placedMulti.length)
    run.notes.push(
      `Placed ${plural(placedMulti.length, "run or spread", "runs and spreads")} first, largest first, each where it adds the fewest drum passes.`,
    );
}
