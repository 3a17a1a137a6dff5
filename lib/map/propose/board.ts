/**
 * The proposal's working board: free pages and ink counts per sheet side, with the running
 * drum-pass total, so each step can ask what a placement would cost before making it.
 */
import type { MapPiece } from "../types";

/** A piece as the proposal handles it: its length and its inks as indexes into one ink list. */
export interface Item {
  piece: MapPiece;
  len: number;
  inks: number[];
  /** Ink set key, for grouping identical single pages. */
  key: string;
}

/** Mutable board: free pages and ink counts per side, with the running pass total. */
export class Board {
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
