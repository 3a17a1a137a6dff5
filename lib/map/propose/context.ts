/**
 * What every step of the proposal shares: the board built from the map as it stands (placed,
 * locked and reserved pages stay), the pieces still to place, and the running record of where
 * the proposal has put each piece, what it could not place, and the notes it explains itself with.
 */
import { allSides, sheetSides, sideIndexByPage } from "../layout";
import { countPasses } from "../passes";
import { pieceLength, plural, slotIsFree, slotsByPage, unplacedPieces } from "../state";
import type { MapPiece, MapSlot, MapState, UnplacedPiece } from "../types";
import { Board, type Item } from "./board";

export interface ProposalRun {
  readonly state: MapState;
  readonly pageCount: number;
  readonly copies: number;
  /** Sheet side of each reader page (−1 for none). */
  readonly sideOf: Int32Array;
  readonly perPass: number;
  readonly byPage: Array<MapSlot | undefined>;
  readonly pieceById: ReadonlyMap<number, MapPiece>;
  readonly board: Board;
  /** The unplaced accepted pieces, by id. */
  readonly todo: Item[];
  /** The centre spread's pages on a saddle-stitched booklet, else null. */
  readonly centre: [number, number] | null;
  readonly centreStart: number | null;
  readonly passesBefore: number;
  /** Piece id → start page, for every piece the proposal has put on the board. */
  readonly chosen: Map<number, number>;
  readonly unplaced: UnplacedPiece[];
  readonly notes: string[];
  put(item: Item, start: number): void;
  take(item: Item): void;
}

/** Builds the board from the map and notes what is kept as it is. */
export function startProposal(state: MapState, copies: number): ProposalRun {
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
      ` and filled only free pages (${plural(freePages(board), "free page")}).`,
  );

  const chosen = new Map<number, number>();
  const centre = plan.binding === "saddle-stitch" ? plan.centreSpread : null;
  return {
    state,
    pageCount: n,
    copies,
    sideOf,
    perPass,
    byPage,
    pieceById,
    board,
    todo: unplacedPieces(state).map(itemOf),
    centre,
    centreStart: centre ? centre[0] : null,
    passesBefore,
    chosen,
    unplaced: [],
    notes,
    put(item, start) {
      board.put(start, item);
      chosen.set(item.piece.id, start);
    },
    take(item) {
      const start = chosen.get(item.piece.id);
      if (start === undefined) return;
      board.take(start, item);
      chosen.delete(item.piece.id);
    },
  };
}

/** Free pages left on the board. */
export function freePages(board: Board): number {
  return board.freeOnSide.reduce((a, b) => a + b, 0);
}
