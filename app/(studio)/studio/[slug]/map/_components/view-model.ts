import { pieceLength } from "@/lib/map/state";
import type { MapPiece, MapState, RuleMessage } from "@/lib/map/types";
import { applyChange } from "@/lib/map-edits/apply";
import type { MapPageArt, MapPieceCard } from "@/lib/map-edits/payload";

export type PieceView = MapPiece & {
  contributorName: string;
  length: number;
  status: MapPieceCard["status"] | null;
  /** Each page's preview and description; empty when the viewer may not see artwork. */
  art: MapPageArt[];
};

/** The preview of one page of a piece (1-based), with alt text from the page's description. */
export function pageArt(
  piece: PieceView,
  pageIndex: number | null,
): { src: string; alt: string } | null {
  const art = piece.art.find((a) => a.pageIndex === (pageIndex ?? 1));
  if (!art?.thumbnailUrl) return null;
  const which = piece.length > 1 ? `, page ${pageIndex ?? 1} of ${piece.length}` : "";
  return { src: art.thumbnailUrl, alt: art.altText ?? `Artwork of ${piece.title}${which}` };
}

/** Pieces by id with who made them, where they are in review and how many pages they take. */
export function piecesById(state: MapState, cards: MapPieceCard[]): Map<number, PieceView> {
  const byId = new Map(cards.map((c) => [c.id, c]));
  return new Map(
    state.pieces.map((p) => [
      p.id,
      {
        ...p,
        contributorName: byId.get(p.id)?.contributorName ?? "A contributor",
        status: byId.get(p.id)?.status ?? null,
        length: pieceLength(p),
        art: byId.get(p.id)?.art ?? [],
      },
    ]),
  );
}

/** Rule messages by the page they concern (empty-page notes left out: an empty slot already says so). */
export function messagesByPage(messages: RuleMessage[]): Map<number, RuleMessage[]> {
  const out = new Map<number, RuleMessage[]>();
  for (const m of messages) {
    if (m.code === "page-empty") continue;
    for (const page of m.pages) out.set(page, [...(out.get(page) ?? []), m]);
  }
  return out;
}

/** Start pages where the engine would accept placing (or moving) the piece. */
export function validStarts(state: MapState, pieceId: number, mode: "place" | "move"): number[] {
  const out: number[] = [];
  for (let page = 1; page <= state.pageCount; page++) {
    if (applyChange(state, { op: mode, pieceId, startPage: page }).ok) out.push(page);
  }
  return out;
}

/** "page 7" or "pages 6–7" for a piece starting on `start`. */
export function spanLabel(start: number, length: number): string {
  return length === 1 ? `page ${start}` : `pages ${start}–${start + length - 1}`;
}

export function inkList(inks: readonly string[]): string {
  return inks.length ? inks.join(" + ") : "no ink";
}
