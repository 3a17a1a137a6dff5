/** Small read helpers over a map state, shared by the check, the edits and the proposal. */
import type { MapPiece, MapSlot, MapState } from "./types";

/** Pages a piece takes: a single 1, a spread 2, a run its page count. */
export function pieceLength(piece: Pick<MapPiece, "kind" | "pageCount">): number {
  if (piece.kind === "single") return 1;
  if (piece.kind === "spread") return 2;
  return Math.max(1, Math.floor(piece.pageCount));
}

/** An empty slot for a page. */
export function emptySlot(page: number): MapSlot {
  return { page, reservation: null, pieceId: null, piecePageIndex: null, locked: false };
}

/** A fresh map with one empty slot per page. */
export function emptyMap(init: Omit<MapState, "slots"> & { slots?: MapSlot[] }): MapState {
  const slots = init.slots ?? Array.from({ length: init.pageCount }, (_, i) => emptySlot(i + 1));
  return { ...init, slots };
}

/** Slots indexed by page (index 0 unused); when a page appears twice the first wins. */
export function slotsByPage(state: MapState): Array<MapSlot | undefined> {
  const out: Array<MapSlot | undefined> = new Array(state.pageCount + 1);
  for (const s of state.slots)
    if (s.page >= 1 && s.page <= state.pageCount && out[s.page] === undefined) out[s.page] = s;
  return out;
}

/** Where each piece sits: piece id → [{page, index}] sorted by page. */
export function piecePages(
  state: MapState,
): Map<number, Array<{ page: number; index: number | null }>> {
  const out = new Map<number, Array<{ page: number; index: number | null }>>();
  for (const s of state.slots) {
    if (s.pieceId === null) continue;
    const list = out.get(s.pieceId) ?? [];
    list.push({ page: s.page, index: s.piecePageIndex });
    out.set(s.pieceId, list);
  }
  for (const list of out.values()) list.sort((a, b) => a.page - b.page);
  return out;
}

/** Whether a slot is free for a piece: no reservation, no piece, not locked. */
export function slotIsFree(slot: MapSlot | undefined): boolean {
  return slot !== undefined && slot.reservation === null && slot.pieceId === null && !slot.locked;
}

/** Pieces that are neither placed nor left out, by id. */
export function unplacedPieces(state: MapState): MapPiece[] {
  const placed = new Set(
    state.slots.map((s) => s.pieceId).filter((id): id is number => id !== null),
  );
  return state.pieces.filter((p) => !p.leftOut && !placed.has(p.id)).sort((a, b) => a.id - b.id);
}

/** "pages 4 and 5", "pages 3, 4 and 5", "page 7". */
export function pagesInWords(pages: readonly number[]): string {
  if (pages.length === 0) return "no pages";
  if (pages.length === 1) return `page ${pages[0]}`;
  return `pages ${pages.slice(0, -1).join(", ")} and ${pages[pages.length - 1]}`;
}

/** “Title” (piece 12). */
export function pieceName(piece: Pick<MapPiece, "id" | "title"> | undefined, id: number): string {
  return piece ? `“${piece.title}”` : `piece ${id}`;
}

export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}
