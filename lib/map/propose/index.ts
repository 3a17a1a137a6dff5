/**
 * Proposes where the unplaced accepted pieces go. What is already on the map (placed, locked,
 * reserved) stays; the proposal only fills free pages. It honours the placement rules (spreads
 * on an even page and the next, runs on consecutive pages, no page used twice), keeps a lone
 * full-bleed spread on the centre spread, and keeps drum passes low: a sheet side needs
 * ⌈distinct inks ÷ inks per pass⌉ passes, so pieces with the same inks are put on the same sides.
 *
 * Method, all deterministic (ties broken by page, then piece id), one module per step:
 * 0. a lone full-bleed spread on the centre spread (`centre.ts`);
 * 1. runs and spreads first, largest first, each where it adds the fewest passes, with a
 *    bounded backtracking search so they all fit when they can (`multis.ts`);
 * 2. single pages, most inks first and grouped by ink set, each on the side where it adds the
 *    fewest passes (fuller sides first on a tie, keeping empty sides for other ink sets)
 *    (`singles.ts`);
 * 3. local improvement: swap or move the proposed pieces while total passes go down
 *    (`improve.ts`);
 * 4. on small maps, a bounded branch-and-bound over every arrangement (identical single pages
 *    are interchangeable and pages on one side are equivalent, which keeps it small); it
 *    replaces the result only with a strictly cheaper one (`exact.ts`).
 * `context.ts` builds the board the steps share (`board.ts`); `result.ts` writes the answer.
 */
import type { MapState, Proposal, ProposeOptions } from "../types";
import { multiOrder, singleOrder } from "./candidates";
import { placeCentreSpread } from "./centre";
import { startProposal } from "./context";
import { searchExactly } from "./exact";
import { placeRunsAndSpreads } from "./multis";
import { finishProposal } from "./result";
import { placeSinglesAndImprove } from "./singles";

/** Places every unplaced accepted piece that fits on the free pages, keeping drum passes low. */
export function proposePlacement(state: MapState, options: ProposeOptions = {}): Proposal {
  const run = startProposal(state, options.copies ?? 1);
  const fixedId = placeCentreSpread(run);
  const rest = run.todo.filter((t) => t.piece.id !== fixedId);
  const multis = rest.filter((t) => t.len > 1).sort(multiOrder);
  const singles = rest.filter((t) => t.len === 1).sort(singleOrder);
  placeRunsAndSpreads(run, multis);
  placeSinglesAndImprove(run, multis, singles, options.maxImproveRounds ?? 50);
  const all = [...multis, ...singles];
  searchExactly(run, all, options.searchBudget ?? 200_000, options.exactSearchMaxFreePages ?? 40);
  const fixed = fixedId !== null ? run.todo.filter((x) => x.piece.id === fixedId) : [];
  return finishProposal(run, [...all, ...fixed]);
}
