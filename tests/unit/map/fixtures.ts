/** Small builders for page-map tests. */
import { emptyMap } from "@/lib/map";
import type { MapPiece, MapState } from "@/lib/map";

export function single(id: number, inks: string[], extra: Partial<MapPiece> = {}): MapPiece {
  return { id, title: `Piece ${id}`, kind: "single", pageCount: 1, inks, ...extra };
}
export function spread(id: number, inks: string[], extra: Partial<MapPiece> = {}): MapPiece {
  return { id, title: `Spread ${id}`, kind: "spread", pageCount: 2, inks, ...extra };
}
export function run(
  id: number,
  pageCount: number,
  inks: string[],
  extra: Partial<MapPiece> = {},
): MapPiece {
  return { id, title: `Run ${id}`, kind: "run", pageCount, inks, ...extra };
}

export function map(
  pageCount: number,
  pieces: MapPiece[],
  extra: Partial<MapState> = {},
): MapState {
  return emptyMap({
    binding: "saddle-stitch",
    pageCount,
    maxPages: 64,
    inksPerPass: 1,
    pressInks: ["black", "teal", "red"],
    pieces,
    ...extra,
  });
}

/** Puts pieces on the given pages directly (no rule checks), for building test states. */
export function withPlaced(
  state: MapState,
  placements: Array<[pieceId: number, pages: number[]]>,
): MapState {
  const slots = state.slots.map((s) => ({ ...s }));
  for (const [pieceId, pages] of placements)
    pages.forEach((p, i) => {
      const slot = slots[p - 1];
      if (!slot) throw new Error(`no page ${p}`);
      slot.pieceId = pieceId;
      slot.piecePageIndex = i + 1;
    });
  return { ...state, slots };
}

export function codes(messages: Array<{ code: string }>): string[] {
  return messages.map((m) => m.code);
}
