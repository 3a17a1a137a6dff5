/** What the review route handlers answer; shared by the handlers and the editors' screens. */
import type { PieceKind, PieceStatus } from "@/lib/domain";
import type { PieceVerdict } from "@/lib/pieces/verdict";

/** One row of the submissions table. */
export interface SubmissionRow {
  id: number;
  title: string;
  kind: PieceKind;
  pageCount: number;
  inks: string[];
  verdict: PieceVerdict;
  status: PieceStatus;
  creditLine: string;
  /** ISO 8601, UTC. */
  updatedAt: string;
  contributor: { id: string; name: string | null; email: string | null };
}

/** GET /api/anthologies/[slug]/submissions: one page of rows and the total that match. */
export interface SubmissionsPage {
  rows: SubmissionRow[];
  total: number;
  page: number;
  pageSize: number;
}

/** One piece's move: done (and whether its contributor was e-mailed), or refused with the reason. */
export type PieceMoveOutcome =
  | { pieceId: number; changed: true; from: PieceStatus; to: PieceStatus; mailed: boolean | null }
  | { pieceId: number; changed: false; reason: string; needsConfirm?: true };

export type PieceMoved = Extract<PieceMoveOutcome, { changed: true }>;
export type PieceMoveRefused = Extract<PieceMoveOutcome, { changed: false }>;

/** POST /api/pieces/[id]/status: 200 with the move; 409 with the refusal beside the message. */
export type PieceMoveAnswer = PieceMoved;
export interface PieceMoveRefusalAnswer {
  error: string;
  refused: PieceMoveRefused;
}

/**
 * 409 from either status route when accepting would put a piece that cannot print (no files,
 * pages without a file, a file that won't print) into the book: nothing moved; send the same
 * request again with `confirm: true` to go ahead.
 */
export interface AcceptWarningAnswer {
  error: string;
  warning: string;
  needsConfirm: true;
  pieces: { pieceId: number; warning: string }[];
}

/** POST /api/anthologies/[slug]/submissions/status: each piece changed or refused on its own. */
export interface BulkMoveAnswer {
  changed: PieceMoved[];
  refused: PieceMoveRefused[];
}

/** GET/PUT /api/anthologies/[slug]/notifications: the signed-in editor's own setting. */
export interface NotificationSettingsAnswer {
  /** E-mail me when a piece is submitted. */
  newPieces: boolean;
}

/** An editors' note; contributors never see these. */
export interface EditorNoteView {
  id: number;
  body: string;
  /** ISO 8601, UTC. */
  createdAt: string;
  author: { id: string; name: string | null };
}

/** GET /api/pieces/[id]/notes, newest first. */
export interface NotesAnswer {
  notes: EditorNoteView[];
}

/** POST /api/pieces/[id]/notes (201). */
export interface NoteAddedAnswer {
  note: EditorNoteView;
}
