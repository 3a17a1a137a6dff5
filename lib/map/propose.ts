/**
 * Proposes where the unplaced accepted pieces go. What is already on the map (placed, locked,
 * reserved) stays; the proposal only fills free pages. It honours the placement rules (spreads
 * on an even page and the next, runs on consecutive pages, no page used twice), keeps a lone
 * full-bleed spread on the centre spread, and keeps drum passes low: a sheet side needs
 * ⌈distinct inks ÷ inks per pass⌉ passes, so pieces with the same inks are put on the same sides.
 *
 * Method, all deterministic (ties broken by page, then piece id):
 * 1. runs and spreads first, largest first, each where it adds the fewest passes, with a
 *    bounded backtracking search so they all fit when they can;
 * 2. single pages, most inks first and grouped by ink set, each on the side where it adds the
 *    fewest passes (fuller sides first on a tie, keeping empty sides for other ink sets);
 * 3. local improvement: swap or move the proposed pieces while total passes go down;
 * 4. on small maps, a bounded branch-and-bound over every arrangement (identical single pages
 *    are interchangeable and pages on one side are equivalent, which keeps it small); it
 *    replaces the result only with a strictly cheaper one.
 */
import { allSides, sheetSides, sideIndexByPage } from "./layout";
import { countPasses } from "./passes";
import {
  pagesInWords,
  pieceLength,
  pieceName,
  plural,
  slotIsFree,
  slotsByPage,
  unplacedPieces,
} from "./state";
import type {
  MapPiece,
  MapState,
  Proposal,
  ProposeOptions,
  ProposedPlacement,
  UnplacedPiece,
} from "./types";

interface Item {
  piece: MapPiece;
  len: number;
  inks: number[];
  /** Ink set key, for grouping identical single pages. */
  key: string;
}

/** Mutable board: free pages and ink counts per side, with the running pass total. */
class Board {
  readonly counts: Int32Array;
  readonly distinct: Int32Array;
  readonly free: Uint8Array;
  readonly freeOnSide: Int32Array;
  cost = 0;
  constructor(
    readonly pageCount: number,
    readonly sideOf: Int32Array,
    readonly nSides: number,
    readonly nInks: number,
    readonly perPass: number,
  ) {
    this.counts = new Int32Array(Math.max(1, nSides * nInks));
    this.distinct = new Int32Array(nSides);
    this.free = new Uint8Array(pageCount + 2);
    this.freeOnSide = new Int32Array(nSides);
  }
  private passes(d: number): number {
    return Math.ceil(d / this.perPass);
  }
  addInks(page: number, inks: readonly number[]): void {
    const s = this.sideOf[page] ?? -1;
    if (s < 0) return;
    const before = this.passes(this.distinct[s] ?? 0);
    const base = s * this.nInks;
    for (const i of inks)
      if ((this.counts[base + i] = (this.counts[base + i] ?? 0) + 1) === 1)
        this.distinct[s] = (this.distinct[s] ?? 0) + 1;
    this.cost += this.passes(this.distinct[s] ?? 0) - before;
  }
  removeInks(page: number, inks: readonly number[]): void {
    const s = this.sideOf[page] ?? -1;
    if (s < 0) return;
    const before = this.passes(this.distinct[s] ?? 0);
    const base = s * this.nInks;
    for (const i of inks)
      if ((this.counts[base + i] = (this.counts[base + i] ?? 0) - 1) === 0)
        this.distinct[s] = (this.distinct[s] ?? 0) - 1;
    this.cost += this.passes(this.distinct[s] ?? 0) - before;
  }
  setFree(page: number, free: boolean): void {
    const was = this.free[page] === 1;
    if (was === free) return;
    this.free[page] = free ? 1 : 0;
    const s = this.sideOf[page] ?? -1;
    if (s >= 0) this.freeOnSide[s] = (this.freeOnSide[s] ?? 0) + (free ? 1 : -1);
  }
  put(start: number, item: Item): void {
    for (let i = 0; i < item.len; i++) {
      this.setFree(start + i, false);
      this.addInks(start + i, item.inks);
    }
  }
  take(start: number, item: Item): void {
    for (let i = 0; i < item.len; i++) {
      this.removeInks(start + i, item.inks);
      this.setFree(start + i, true);
    }
  }
  fits(start: number, item: Item): boolean {
    if (start < 1 || start + item.len - 1 > this.pageCount) return false;
    if (item.piece.kind === "spread" && start % 2 !== 0) return false;
    for (let i = 0; i < item.len; i++) if (this.free[start + i] !== 1) return false;
    return true;
  }
  /** Passes added by putting item at start (board unchanged afterwards). */
  delta(start: number, item: Item): number {
    const before = this.cost;
    for (let i = 0; i < item.len; i++) this.addInks(start + i, item.inks);
    const after = this.cost;
    for (let i = 0; i < item.len; i++) this.removeInks(start + i, item.inks);
    return after - before;
  }
  /** Lowest free page on each side, −1 when the side is full. */
  lowestFreeBySide(): Int32Array {
    const out = new Int32Array(this.nSides).fill(-1);
    for (let p = this.pageCount; p >= 1; p--)
      if (this.free[p] === 1) {
        const s = this.sideOf[p] ?? -1;
        if (s >= 0) out[s] = p;
      }
    return out;
  }
}

interface Candidate {
  start: number;
  delta: number;
  centre: number;
  snug: number;
}

/** Feasible starts for a multi-page item, cheapest first (then centre for spreads, then snug, then page). */
function multiCandidates(board: Board, item: Item, centreStart: number | null): Candidate[] {
  const out: Candidate[] = [];
  const step = item.piece.kind === "spread" ? 2 : 1;
  const first = item.piece.kind === "spread" ? 2 : 1;
  for (let start = first; start + item.len - 1 <= board.pageCount; start += step) {
    if (!board.fits(start, item)) continue;
    const before = start - 1 >= 1 && board.free[start - 1] === 1 ? 0 : 1;
    const after = start + item.len <= board.pageCount && board.free[start + item.len] === 1 ? 0 : 1;
    out.push({
      start,
      delta: board.delta(start, item),
      centre: centreStart === start ? 0 : 1,
      snug: -(before + after),
    });
  }
  out.sort(
    (a, b) => a.delta - b.delta || a.centre - b.centre || a.snug - b.snug || a.start - b.start,
  );
  return out;
}

/** Single-page items placed in this order: most inks first, grouped by ink set, then id. */
function singleOrder(a: Item, b: Item): number {
  return (
    b.inks.length - a.inks.length ||
    (a.key < b.key ? -1 : a.key > b.key ? 1 : 0) ||
    a.piece.id - b.piece.id
  );
}

function multiOrder(a: Item, b: Item): number {
  return (
    b.len - a.len ||
    (a.piece.kind === b.piece.kind ? 0 : a.piece.kind === "spread" ? -1 : 1) ||
    (a.key < b.key ? -1 : a.key > b.key ? 1 : 0) ||
    a.piece.id - b.piece.id
  );
}

/** Same shape and inks: two such pieces can trade places without changing anything that counts. */
function sameShape(a: Item | undefined, b: Item | undefined): boolean {
  return (
    a !== undefined &&
    b !== undefined &&
    a.len === b.len &&
    a.piece.kind === b.piece.kind &&
    a.key === b.key
  );
}

/**
 * A necessary condition for the multi-page items from index i on to still fit: enough free
 * facing pairs for the spreads, and enough free pages in stretches long enough for the shortest
 * remaining piece.
 */
function canStillFit(board: Board, items: readonly Item[], i: number): boolean {
  let spreads = 0;
  let pages = 0;
  let minLen = Number.POSITIVE_INFINITY;
  for (let j = i; j < items.length; j++) {
    const t = items[j];
    if (!t) continue;
    if (t.piece.kind === "spread") spreads++;
    pages += t.len;
    minLen = Math.min(minLen, t.len);
  }
  if (pages === 0) return true;
  let pairs = 0;
  for (let p = 2; p + 1 <= board.pageCount; p += 2)
    if (board.free[p] === 1 && board.free[p + 1] === 1) pairs++;
  if (pairs < spreads) return false;
  const stretches: number[] = [];
  let stretch = 0;
  for (let p = 1; p <= board.pageCount + 1; p++) {
    if (p <= board.pageCount && board.free[p] === 1) stretch++;
    else {
      if (stretch > 0) stretches.push(stretch);
      stretch = 0;
    }
  }
  // For every length L among the remaining pieces: the pieces at least L long each need L pages
  // in a row inside one free stretch, so they number at most Σ⌊stretch ÷ L⌋ and their pages fit
  // in the stretches at least L long.
  const lengths = [...new Set(items.slice(i).map((t) => t.len))];
  for (const L of lengths) {
    let count = 0;
    let need = 0;
    for (let j = i; j < items.length; j++) {
      const t = items[j];
      if (t && t.len >= L) {
        count++;
        need += t.len;
      }
    }
    let room = 0;
    let pagesRoom = 0;
    for (const st of stretches) {
      room += Math.floor(st / L);
      if (st >= L) pagesRoom += st;
    }
    if (room < count || pagesRoom < need) return false;
  }
  return minLen > 0;
}

/** Places every unplaced accepted piece that fits on the free pages, keeping drum passes low. */
export function proposePlacement(state: MapState, options: ProposeOptions = {}): Proposal {
  const copies = options.copies ?? 1;
  const maxRounds = options.maxImproveRounds ?? 50;
  const budget = options.searchBudget ?? 200_000;
  const n = state.pageCount;
  const plan = sheetSides(n, state.binding);
  const sides = allSides(plan);
  const sideOf = sideIndexByPage(plan);
  const perPass = Math.max(1, Math.floor(state.inksPerPass));
  const byPage = slotsByPage(state);
  const pieceById = new Map(state.pieces.map((p) => [p.id, p]));
  const notes: string[] = [];

  const inkIndex = new Map<string, number>();
  for (const p of [...state.pieces].sort((a, b) => a.id - b.id))
    for (const ink of [...p.inks].sort()) if (!inkIndex.has(ink)) inkIndex.set(ink, inkIndex.size);
  const itemOf = (piece: MapPiece): Item => {
    const inks = [...new Set(piece.inks)].sort();
    return {
      piece,
      len: pieceLength(piece),
      inks: inks.map((i) => inkIndex.get(i) ?? 0),
      key: inks.join("\u0000"),
    };
  };

  const board = new Board(n, sideOf, sides.length, Math.max(1, inkIndex.size), perPass);
  let keptPieces = 0;
  const seenPlaced = new Set<number>();
  for (let p = 1; p <= n; p++) {
    const slot = byPage[p];
    if (slot && slotIsFree(slot)) board.setFree(p, true);
    if (slot?.pieceId != null) {
      const piece = pieceById.get(slot.pieceId);
      if (piece) {
        board.addInks(p, itemOf(piece).inks);
        if (!seenPlaced.has(piece.id)) keptPieces++;
        seenPlaced.add(piece.id);
      }
    }
  }
  const passesBefore = countPasses(state, copies).passesPerCopy;
  const lockedCount = state.slots.filter((s) => s.locked).length;
  notes.push(
    `Kept ${plural(keptPieces, "placed piece")} where ${keptPieces === 1 ? "it is" : "they are"}` +
      (lockedCount ? `, left ${plural(lockedCount, "locked page")} untouched` : "") +
      ` and filled only free pages (${plural(
        board.freeOnSide.reduce((a, b) => a + b, 0),
        "free page",
      )}).`,
  );

  const todo = unplacedPieces(state).map(itemOf);
  const unplaced: UnplacedPiece[] = [];
  const chosen = new Map<number, number>(); // piece id → start page
  const put = (item: Item, start: number) => {
    board.put(start, item);
    chosen.set(item.piece.id, start);
  };
  const take = (item: Item) => {
    const start = chosen.get(item.piece.id);
    if (start === undefined) return;
    board.take(start, item);
    chosen.delete(item.piece.id);
  };

  // 0. A lone full-bleed spread goes on the centre spread, the only one printed whole on one side.
  const centre = plan.binding === "saddle-stitch" ? plan.centreSpread : null;
  const bleedSpreads = state.pieces.filter((p) => p.kind === "spread" && p.fullBleed && !p.leftOut);
  let fixedId: number | null = null;
  if (centre && bleedSpreads.length === 1 && centre[1] <= n) {
    const item = todo.find((t) => t.piece.id === bleedSpreads[0]?.id);
    if (item && board.fits(centre[0], item)) {
      put(item, centre[0]);
      fixedId = item.piece.id;
      notes.push(
        `Put the full-bleed spread ${pieceName(item.piece, item.piece.id)} on the centre spread, pages ${centre[0]} and ${centre[1]}, where both halves print side by side on one sheet and need no lining up.`,
      );
    } else if (item)
      notes.push(
        `The centre spread (pages ${centre[0]} and ${centre[1]}) is not free, so the full-bleed spread ${pieceName(item.piece, item.piece.id)} goes where it fits.`,
      );
  }
  const rest = todo.filter((t) => t.piece.id !== fixedId);
  const multis = rest.filter((t) => t.len > 1).sort(multiOrder);
  const singles = rest.filter((t) => t.len === 1).sort(singleOrder);
  const centreStart = centre ? centre[0] : null;

  // 1. Runs and spreads, largest first, backtracking (bounded) so that all fit when they can.
  let multiNodes = 0;
  let leftmost = false;
  const multiBudget = 20_000; // search steps for fitting runs and spreads, whatever the exhaustive budget
  const dfsMulti = (i: number): boolean => {
    const item = multis[i];
    if (!item) return true;
    if (++multiNodes > multiBudget) return false;
    if (!canStillFit(board, multis, i)) return false;
    const cands = multiCandidates(board, item, centreStart);
    if (leftmost) cands.sort((x, y) => x.start - y.start);
    for (const c of cands) {
      put(item, c.start);
      if (dfsMulti(i + 1)) return true;
      take(item);
      if (multiNodes > multiBudget) return false;
    }
    return false;
  };
  if (multis.length) {
    let fitted = dfsMulti(0);
    if (!fitted) {
      // Second try: pack from the front, the usual way to make awkward lengths fit.
      for (const item of multis) take(item);
      multiNodes = 0;
      leftmost = true;
      fitted = dfsMulti(0);
      leftmost = false;
    }
    if (!fitted) {
      for (const item of multis) take(item);
      for (const item of multis) {
        const best = multiCandidates(board, item, centreStart)[0];
        if (best) put(item, best.start);
        else
          unplaced.push({
            pieceId: item.piece.id,
            reason:
              item.piece.kind === "spread"
                ? `No free pair of facing pages (an even page and the odd page after it) is left for this spread.`
                : item.len > n
                  ? `The run has ${item.len} pages, more than the booklet's ${n}.`
                  : `No ${item.len} free pages in a row are left for this run.`,
          });
      }
    }
    const placedMulti = multis.filter((m) => chosen.has(m.piece.id));
    if (placedMulti.length)
      notes.push(
        `Placed ${plural(placedMulti.length, "run or spread", "runs and spreads")} first, largest first, each where it adds the fewest drum passes.`,
      );
  }

  // 2–3. Single pages, then local improvement; tried with two orders of the single pages
  // (most inks first; largest ink group first) and the cheaper result kept (first on a tie).
  const freeAfterMulti = board.freeOnSide.reduce((a, b) => a + b, 0);
  const afterMulti = new Map(chosen);
  const rest2 = [...multis, ...singles];
  const restore = (snap: ReadonlyMap<number, number>) => {
    for (const t of rest2) take(t);
    for (const t of rest2) {
      const at = snap.get(t.piece.id);
      if (at !== undefined) put(t, at);
    }
  };
  const groupSize = new Map<string, number>();
  for (const t of singles) groupSize.set(t.key, (groupSize.get(t.key) ?? 0) + 1);
  const orders: Item[][] = [
    singles,
    [...singles].sort(
      (x, y) => (groupSize.get(y.key) ?? 0) - (groupSize.get(x.key) ?? 0) || singleOrder(x, y),
    ),
  ];
  const greedySingles = (order: readonly Item[]): Item[] => {
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
      if (best) put(item, best.page);
      else dropped.push(item);
    }
    return dropped;
  };
  const improve = () => {
    for (let rounds = 0; rounds < maxRounds; rounds++) {
      let improved = false;
      const items = rest2.filter((t) => chosen.has(t.piece.id));
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
  };
  let bestTry: {
    snap: Map<number, number>;
    cost: number;
    greedy: number;
    dropped: Item[];
    order: number;
  } | null = null;
  orders.forEach((order, o) => {
    if (o > 0 && singles.length < 2) return;
    restore(afterMulti);
    const dropped = greedySingles(order);
    const greedy = board.cost;
    improve();
    if (!bestTry || board.cost < bestTry.cost)
      bestTry = { snap: new Map(chosen), cost: board.cost, greedy, dropped, order: o };
  });
  const tried = bestTry as {
    snap: Map<number, number>;
    cost: number;
    greedy: number;
    dropped: Item[];
    order: number;
  } | null;
  if (tried) {
    restore(tried.snap);
    for (const item of tried.dropped)
      unplaced.push({
        pieceId: item.piece.id,
        reason: `No free page is left: ${plural(freeAfterMulti, "free page")} for ${plural(singles.length, "single page")}.`,
      });
    if (singles.length > tried.dropped.length)
      notes.push(
        tried.order === 0
          ? `Placed single pages with the most inks first and grouped pages with the same inks on the same sheet sides.`
          : `Placed single pages largest ink group first, keeping pages with the same inks on the same sheet sides.`,
      );
    if (tried.cost < tried.greedy)
      notes.push(
        `Moving and swapping proposed pieces saved ${plural(tried.greedy - tried.cost, "pass", "passes")} per copy.`,
      );
  }

  // 4. Small maps: branch and bound over every arrangement for a strictly cheaper one.
  const all = [...multis, ...singles];
  const allPlaced = all.every((t) => chosen.has(t.piece.id));
  const freeNow = board.freeOnSide.reduce((a, b) => a + b, 0);
  const needed = all.reduce((a, t) => a + t.len, 0);
  const exactLimit = options.exactSearchMaxFreePages ?? 40;
  const freeAtStart =
    freeNow + all.filter((t) => chosen.has(t.piece.id)).reduce((a, t) => a + t.len, 0);
  if (budget > 0 && freeAtStart > exactLimit && all.length > 0)
    notes.push(
      `With ${freeAtStart} free pages the map is too large to search every arrangement; this is the best arrangement found.`,
    );
  if (
    budget > 0 &&
    freeAtStart <= exactLimit &&
    all.length > 0 &&
    (allPlaced ||
      needed <= freeNow + all.filter((t) => chosen.has(t.piece.id)).reduce((a, t) => a + t.len, 0))
  ) {
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

  // Result.
  const slots = Array.from({ length: n }, (_, i) => ({
    ...(byPage[i + 1] ?? {
      page: i + 1,
      reservation: null,
      pieceId: null,
      piecePageIndex: null,
      locked: false,
    }),
  }));
  const placed: ProposedPlacement[] = [];
  for (const t of [
    ...all,
    ...(fixedId !== null ? todo.filter((x) => x.piece.id === fixedId) : []),
  ].sort((a, b) => a.piece.id - b.piece.id)) {
    const start = chosen.get(t.piece.id);
    if (start === undefined) continue;
    const pages = Array.from({ length: t.len }, (_, i) => start + i);
    pages.forEach((p, i) => {
      const slot = slots[p - 1];
      if (slot) {
        slot.pieceId = t.piece.id;
        slot.piecePageIndex = i + 1;
      }
    });
    placed.push({ pieceId: t.piece.id, pages });
  }
  unplaced.sort((a, b) => a.pieceId - b.pieceId);
  const next: MapState = { ...state, slots };
  const after = countPasses(next, copies);
  notes.push(
    `Placed ${plural(placed.length, "piece")}` +
      (unplaced.length
        ? `; ${plural(unplaced.length, "piece")} did not fit (${unplaced.map((u) => pieceName(pieceById.get(u.pieceId), u.pieceId)).join(", ")})`
        : "") +
      `. Drum passes per copy: ${passesBefore} before, ${after.passesPerCopy} after` +
      (copies !== 1 ? ` (${after.passesPerRun} for ${copies} copies)` : "") +
      `; a side needs its distinct inks ÷ ${perPass} per pass, rounded up.`,
  );
  for (const p of placed.filter(
    (x) => x.pages.length > 1 && pieceById.get(x.pieceId)?.kind === "spread",
  )) {
    const [l, r] = p.pages;
    if (l !== undefined && r !== undefined && centre && l !== centre[0])
      notes.push(
        `${pieceName(pieceById.get(p.pieceId), p.pieceId)} on ${pagesInWords(p.pages)} crosses two sheets; its halves must line up when folded.`,
      );
  }
  return { state: next, passesBefore, passesAfter: after.passesPerCopy, placed, unplaced, notes };
}
