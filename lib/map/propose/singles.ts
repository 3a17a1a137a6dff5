/**
 * Step 2: single pages, each on the side where it adds the fewest passes (fuller sides first on
 * a tie, keeping empty sides for other ink sets). Tried with two orders of the single pages (most
 * inks first; largest ink group first), each followed by step 3, and the cheaper result kept
 * (the first on a tie).
 */
import { plural } from "../state";
import type { Item } from "./board";
import { singleOrder } from "./candidates";
import { freePages, type ProposalRun } from "./context";
import { improve } from "./improve";

/** Puts each single page, in order, on the cheapest side's lowest free page; returns those with no room. */
function greedySingles(run: ProposalRun, order: readonly Item[]): Item[] {
  const { board } = run;
  const dropped: Item[] = [];
  for (const item of order) {
    const lowest = board.lowestFreeBySide();
    let best: { page: number; delta: number; left: number } | null = null;
    for (let s = 0; s < lowest.length; s++) {
      const page = lowest[s] ?? -1;
      if (page < 1) continue;
      const delta = board.delta(page, item);
      const left = (board.freeOnSide[s] ?? 0) - 1;
      if (
        !best ||
        delta < best.delta ||
        (delta === best.delta && (left < best.left || (left === best.left && page < best.page)))
      )
        best = { page, delta, left };
    }
    if (best) run.put(item, best.page);
    else dropped.push(item);
  }
  return dropped;
}

interface Attempt {
  snap: Map<number, number>;
  cost: number;
  greedy: number;
  dropped: Item[];
  order: number;
}

/**
 * Places the single pages (already in singleOrder) after the runs and spreads, then improves
 * the whole proposal; keeps the cheaper of the two orders.
 */
export function placeSinglesAndImprove(
  run: ProposalRun,
  multis: readonly Item[],
  singles: readonly Item[],
  maxRounds: number,
): void {
  const { board, chosen } = run;
  const freeAfterMulti = freePages(board);
  const afterMulti = new Map(chosen);
  const pieces = [...multis, ...singles];
  const restore = (snap: ReadonlyMap<number, number>) => {
    for (const t of pieces) run.take(t);
    for (const t of pieces) {
      const at = snap.get(t.piece.id);
      if (at !== undefined) run.put(t, at);
    }
  };
  const groupSize = new Map<string, number>();
  for (const t of singles) groupSize.set(t.key, (groupSize.get(t.key) ?? 0) + 1);
  const orders: Item[][] = [
    [...singles],
    [...singles].sort(
      (x, y) => (groupSize.get(y.key) ?? 0) - (groupSize.get(x.key) ?? 0) || singleOrder(x, y),
    ),
  ];
  let tried: Attempt | null = null;
  for (let o = 0; o < orders.length; o++) {
    const order = orders[o];
    if (!order || (o > 0 && singles.length < 2)) continue;
    restore(afterMulti);
    const dropped = greedySingles(run, order);
    const greedy = board.cost;
    improve(run, pieces, maxRounds);
    if (!tried || board.cost < tried.cost)
      tried = { snap: new Map(chosen), cost: board.cost, greedy, dropped, order: o };
  }
  if (!tried) return;
  restore(tried.snap);
  for (const item of tried.dropped)
    run.unplaced.push({
      pieceId: item.piece.id,
      reason: `No free page is left: ${plural(freeAfterMulti, "free page")} for ${plural(singles.length, "single page")}.`,
    });
  if (singles.length > tried.dropped.length)
    run.notes.push(
      tried.order === 0
        ? `Placed single pages with the most inks first and grouped pages with the same inks on the same sheet sides.`
        : `Placed single pages largest ink group first, keeping pages with the same inks on the same sheet sides.`,
    );
  if (tried.cost < tried.greedy)
    run.notes.push(
      `Moving and swapping proposed pieces saved ${plural(tried.greedy - tried.cost, "pass", "passes")} per copy.`,
    );
}
