/**
 * Shared by the steps: where a multi-page piece may start, the orders pieces are placed in, and
 * a quick test of whether the remaining runs and spreads can still fit.
 */
import type { Board, Item } from "./board";

export interface Candidate {
  start: number;
  delta: number;
  centre: number;
  snug: number;
}

/** Feasible starts for a multi-page item, cheapest first (then centre for spreads, then snug, then page). */
export function multiCandidates(board: Board, item: Item, centreStart: number | null): Candidate[] {
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
export function singleOrder(a: Item, b: Item): number {
  return (
    b.inks.length - a.inks.length ||
    (a.key < b.key ? -1 : a.key > b.key ? 1 : 0) ||
    a.piece.id - b.piece.id
  );
}

/** Runs and spreads placed in this order: longest first, spreads before runs, by ink set, then id. */
export function multiOrder(a: Item, b: Item): number {
  return (
    b.len - a.len ||
    (a.piece.kind === b.piece.kind ? 0 : a.piece.kind === "spread" ? -1 : 1) ||
    (a.key < b.key ? -1 : a.key > b.key ? 1 : 0) ||
    a.piece.id - b.piece.id
  );
}

/** Same shape and inks: two such pieces can trade places without changing anything that counts. */
export function sameShape(a: Item | undefined, b: Item | undefined): boolean {
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
export function canStillFit(board: Board, items: readonly Item[], i: number): boolean {
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
