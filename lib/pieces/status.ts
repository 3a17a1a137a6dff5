/**
 * How a submitted piece moves between statuses, and who may move it. Pure: the route handlers
 * consult it before writing, and the review table uses it to offer only the moves that exist.
 */
import { PIECE_STATUS_LABELS, type PieceStatus } from "@/lib/domain";

/** Moves an editor may make from each status. */
const EDITOR_MOVES: Record<PieceStatus, readonly PieceStatus[]> = {
  "awaiting-review": ["fix-requested", "shortlisted", "accepted", "declined"],
  "fix-requested": ["awaiting-review", "shortlisted", "accepted", "declined"],
  shortlisted: ["awaiting-review", "fix-requested", "accepted", "declined"],
  accepted: ["shortlisted", "fix-requested", "declined"],
  declined: ["awaiting-review", "shortlisted", "accepted"],
  withdrawn: [],
};

/** Statuses from which the contributor may still withdraw their piece. */
const WITHDRAWABLE: readonly PieceStatus[] = [
  "awaiting-review",
  "fix-requested",
  "shortlisted",
  "accepted",
];

export type Mover = "editor" | "contributor";

/** True when `mover` may take a piece from `from` to `to`. */
export function canMove(from: PieceStatus, to: PieceStatus, mover: Mover): boolean {
  if (mover === "contributor") return to === "withdrawn" && WITHDRAWABLE.includes(from);
  return EDITOR_MOVES[from].includes(to);
}

/** The statuses an editor can choose next for a piece in `from`. */
export function editorMovesFrom(from: PieceStatus): readonly PieceStatus[] {
  return EDITOR_MOVES[from];
}

/** A fresh file from the contributor answers a fix request: the piece goes back to be read. */
export function statusAfterNewFile(current: PieceStatus): PieceStatus {
  return current === "fix-requested" ? "awaiting-review" : current;
}

/** Whether the contributor may upload or replace files: open call, or a piece an editor asked to fix. */
export function mayUploadFiles(current: PieceStatus, callOpen: boolean): boolean {
  if (current === "withdrawn" || current === "declined") return false;
  return callOpen || current === "fix-requested";
}

/** Status changes the contributor is told about by e-mail. */
export const STATUSES_THAT_EMAIL: readonly PieceStatus[] = [
  "fix-requested",
  "shortlisted",
  "accepted",
  "declined",
];

const quoted = (s: PieceStatus) => `"${PIECE_STATUS_LABELS[s]}"`;

/** Why an editor cannot move a piece from `from` to `to`, in plain words, or null when they can. */
export function editorMoveRefusal(from: PieceStatus, to: PieceStatus): string | null {
  if (from === to) return `It is already ${quoted(to)}.`;
  if (from === "withdrawn")
    return "The contributor withdrew this piece; it can no longer be moved.";
  if (to === "withdrawn") return "Only the contributor can withdraw a piece.";
  if (!canMove(from, to, "editor"))
    return `A piece that is ${quoted(from)} cannot be moved to ${quoted(to)}.`;
  return null;
}
