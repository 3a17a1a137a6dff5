/**
 * Step 3: local improvement. Each proposed piece moves to a cheaper start if there is one, and
 * single pages with different inks on different sides swap when that saves passes; rounds go on
 * while the total goes down.
 */
import type { Item } from "./board";
import { multiCandidates } from "./candidates";
import type { ProposalRun } from "./context";

/** Moves and swaps the proposed pieces among `pieces` for at most maxRounds rounds. */
export function improve(run: ProposalRun, pieces: readonly Item[], maxRounds: number): void {
  const { board, chosen, sideOf, centreStart, put, take } = run;
  for (let rounds = 0; rounds < maxRounds; rounds++) {
    let improved = false;
    const items = pieces.filter((t) => chosen.has(t.piece.id));
    for (const item of items) {
      const start = chosen.get(item.piece.id);
      if (start === undefined) continue;
      take(item);
      const startDelta = board.delta(start, item);
      let bestStart = start;
      let bestDelta = startDelta;
      const starts =
        item.len === 1
          ? [...board.lowestFreeBySide()].filter((p) => p >= 1)
          : multiCandidates(board, item, centreStart).map((c) => c.start);
      for (const st of starts) {
        const d = board.delta(st, item);
        if (d < bestDelta) {
          bestDelta = d;
          bestStart = st;
        }
      }
      put(item, bestStart);
      if (bestDelta < startDelta) improved = true;
    }
    const singlesNow = items.filter((t) => t.len === 1);
    for (let i = 0; i < singlesNow.length; i++) {
      for (let j = i + 1; j < singlesNow.length; j++) {
        const x = singlesNow[i];
        const y = singlesNow[j];
        if (!x || !y || x.key === y.key) continue;
        const px = chosen.get(x.piece.id);
        const py = chosen.get(y.piece.id);
        if (px === undefined || py === undefined || sideOf[px] === sideOf[py]) continue;
        const before = board.cost;
        take(x);
        take(y);
        put(x, py);
        put(y, px);
        if (board.cost < before) improved = true;
        else {
          take(x);
          take(y);
          put(x, px);
          put(y, py);
        }
      }
    }
    if (!improved) break;
  }
}
