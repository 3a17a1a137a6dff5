/**
 * Step 4: on small maps, a bounded branch-and-bound over every arrangement. Identical single
 * pages are interchangeable and pages on one side are equivalent, which keeps it small; it
 * replaces the result only with a strictly cheaper one (or with one that places every piece).
 */
import { plural } from "../state";
import type { Item } from "./board";
import { canStillFit, multiCandidates, sameShape } from "./candidates";
import { freePages, type ProposalRun } from "./context";

/** Searches every arrangement of `all` when few enough pages are free, within budget nodes. */
export function searchExactly(
  run: ProposalRun,
  all: readonly Item[],
  budget: number,
  exactLimit: number,
): void {
  const { board, chosen, centreStart, perPass, unplaced, notes, put, take } = run;
  const allPlaced = all.every((t) => chosen.has(t.piece.id));
  const needed = all.reduce((a, t) => a + t.len, 0);
  // Pages free for the proposal: those free now and those its own pieces hold.
  const freeAtStart =
    freePages(board) + all.filter((t) => chosen.has(t.piece.id)).reduce((a, t) => a + t.len, 0);
  if (budget <= 0 || all.length === 0) return;
  if (freeAtStart > exactLimit) {
    notes.push(
      `With ${freeAtStart} free pages the map is too large to search every arrangement; this is the best arrangement found.`,
    );
    return;
  }
  if (!allPlaced && needed > freeAtStart) return;
  const snapshot = new Map(chosen);
  const heuristicCost = board.cost;
  for (const t of all) take(t);
  let bestCost = allPlaced ? heuristicCost : Infinity;
  let best: Map<number, number> | null = null;
  let nodes = 0;
  let exhausted = false;
  const groupSide = new Map<string, number>();
  // Lower bound (one ink per pass): an ink the remaining pieces need that no side with a free
  // page carries yet will add at least one pass somewhere.
  const suffixInks: number[][] = [];
  for (let i = all.length - 1, acc = new Set<number>(); i >= 0; i--) {
    for (const ink of all[i]?.inks ?? []) acc.add(ink);
    suffixInks[i] = [...acc];
  }
  const extraAtLeast = (i: number): number => {
    if (perPass !== 1) return 0;
    let extra = 0;
    for (const ink of suffixInks[i] ?? []) {
      let present = false;
      for (let sd = 0; sd < board.nSides && !present; sd++)
        if ((board.freeOnSide[sd] ?? 0) > 0 && (board.counts[sd * board.nInks + ink] ?? 0) > 0)
          present = true;
      if (!present) extra++;
    }
    return extra;
  };
  const dfs = (i: number): void => {
    if (board.cost + extraAtLeast(i) >= bestCost) return;
    const item = all[i];
    if (!item) {
      bestCost = board.cost;
      best = new Map(chosen);
      return;
    }
    if (++nodes > budget) {
      exhausted = true;
      return;
    }
    if (item.len > 1) {
      if (!canStillFit(board, all, i)) return;
      const prevItem = all[i - 1];
      const after =
        sameShape(prevItem, item) && prevItem ? (chosen.get(prevItem.piece.id) ?? 0) : 0;
      for (const c of multiCandidates(board, item, centreStart)) {
        if (c.start <= after || board.cost + c.delta >= bestCost) continue;
        put(item, c.start);
        dfs(i + 1);
        take(item);
        if (exhausted) return;
      }
      return;
    }
    const prev = all[i - 1];
    const minSide =
      prev && prev.len === 1 && prev.key === item.key ? (groupSide.get(item.key) ?? 0) : 0;
    const lowest = board.lowestFreeBySide();
    const options: Array<{ page: number; side: number; delta: number }> = [];
    for (let s = minSide; s < lowest.length; s++) {
      const page = lowest[s] ?? -1;
      if (page >= 1) options.push({ page, side: s, delta: board.delta(page, item) });
    }
    options.sort((a, b) => a.delta - b.delta || a.side - b.side);
    const saved = groupSide.get(item.key);
    for (const o of options) {
      if (board.cost + o.delta >= bestCost) continue;
      put(item, o.page);
      groupSide.set(item.key, o.side);
      dfs(i + 1);
      take(item);
      if (exhausted) break;
    }
    if (saved === undefined) groupSide.delete(item.key);
    else groupSide.set(item.key, saved);
  };
  dfs(0);
  const found: Map<number, number> | null = best;
  const use = found ?? snapshot;
  for (const t of all) {
    const s = use.get(t.piece.id);
    if (s !== undefined) put(t, s);
  }
  if (found) {
    // The exhaustive search placed everything; earlier "no room" reasons no longer hold.
    for (let i = unplaced.length - 1; i >= 0; i--)
      if (chosen.has(unplaced[i]?.pieceId ?? -1)) unplaced.splice(i, 1);
    notes.push(
      allPlaced
        ? `A full search of the arrangements found one ${plural(heuristicCost - board.cost, "pass", "passes")} cheaper per copy, and used it.`
        : `A full search of the arrangements found room for every piece.`,
    );
  } else if (!exhausted)
    notes.push(
      `A full search of the arrangements found nothing cheaper: this is the fewest passes possible around what is already placed.`,
    );
  else
    notes.push(
      `The search of every arrangement stopped at its limit of ${budget} steps; this is the best arrangement found.`,
    );
}
