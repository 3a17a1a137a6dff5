/** What the contributor's piece routes answer; shared by the handlers and the contributor's screens. */
import type { PieceKind, PieceStatus } from "@/lib/domain";
import type { PieceVerdict } from "@/lib/pieces/verdict";

/** POST /api/anthologies/[slug]/pieces (201): the new piece and where its upload screen is. */
export interface PieceCreatedAnswer {
  piece: {
    id: number;
    title: string;
    kind: PieceKind;
    pageCount: number;
    inks: string[];
    status: PieceStatus;
    verdict: string;
  };
  url: string;
}

/** PATCH /api/pieces/[id] { action: "withdraw" }: the piece's status afterwards. */
export interface PieceWithdrawnAnswer {
  status: PieceStatus;
}

/** PATCH /api/pieces/[id] { action: "use-version" }: the page's new revision and the piece's verdict. */
export interface VersionChosenAnswer {
  revision: number;
  verdict: PieceVerdict;
}

/** PATCH /api/pieces/[id] { action: "alt-text" }. */
export interface AltTextSavedAnswer {
  ok: true;
}
