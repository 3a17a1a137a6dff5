/**
 * A contributor's proof: the reader spreads their piece sits on, and what else is on them. Pure,
 * over the page map; who may see a neighbour's artwork is lib/auth/policy.ts `maySeeProofNeighbour`.
 */
import { readerSpreads } from "@/lib/map/layout";
import { slotsByPage } from "@/lib/map/state";
import type { MapReaderSpread, MapState, SlotReservation } from "@/lib/map/types";

/** One page of a proof spread. */
export type ProofPage =
  | { page: number; kind: "own"; pieceId: number; piecePageIndex: number }
  | { page: number; kind: "neighbour"; pieceId: number; piecePageIndex: number }
  | { page: number; kind: "reserved"; reservation: SlotReservation }
  | { page: number; kind: "empty" };

export interface ProofSpread {
  spread: MapReaderSpread;
  pages: ProofPage[];
}

/** The reader spreads that hold any page of `pieceId`, in page order, each page as the proof shows it. */
export function proofSpreads(state: MapState, pieceId: number): ProofSpread[] {
  const slots = slotsByPage(state);
  return readerSpreads(state.pageCount)
    .filter((spread) => spread.pages.some((page) => slots[page]?.pieceId === pieceId))
    .map((spread) => ({
      spread,
      pages: spread.pages.map((page): ProofPage => {
        const slot = slots[page];
        if (slot?.pieceId != null)
          return {
            page,
            kind: slot.pieceId === pieceId ? "own" : "neighbour",
            pieceId: slot.pieceId,
            piecePageIndex: slot.piecePageIndex ?? 1,
          };
        if (slot?.reservation) return { page, kind: "reserved", reservation: slot.reservation };
        return { page, kind: "empty" };
      }),
    }));
}

/** Whether reader page `page` is on a spread with a page of `pieceId` (the proof's own piece). */
export function sharesSpreadWith(state: MapState, pieceId: number, page: number): boolean {
  return proofSpreads(state, pieceId).some((s) => s.spread.pages.includes(page));
}
