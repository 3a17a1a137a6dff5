/**
 * The rules of sending work to an open call: who may start a piece, what a piece may be, when its
 * files may change, and the spec each page file is checked against. Pure; the database and route
 * layers ask these and act on the answer.
 */
import { can } from "@/lib/auth/policy";
import type { AnthologyStage, PieceKind, PieceStatus, Role } from "@/lib/domain";
import { specOf, type PrintSpec, type SpecColumns } from "@/lib/print/spec";
import { Refusal } from "@/lib/refusal";
import { isCallOpen, type CallWindow } from "@/lib/stages";
import type { CallRules } from "@/lib/validations/piece";
import { mayUploadFiles } from "./status";

/** What the call lets a piece be: its kinds, the longest run of pages and the inks. */
export function callRulesOf(call: CallRules): CallRules {
  return {
    allowedKinds: call.allowedKinds,
    maxRunPages: call.maxRunPages,
    allowedInks: call.allowedInks,
  };
}

/**
 * Why this person may not start a new piece in this call, or null when they may. The people who
 * decide what goes in (lead, editors) and the finisher do not submit to their own call; everyone
 * else may send up to the call's limit, withdrawn pieces not counted.
 */
export function submitRefusal(
  role: Role | null,
  activePieces: number,
  call: { piecesPerPerson: number },
): Refusal | null {
  // People outside the anthology may submit: their first piece makes them a contributor.
  if (role !== null && !can(role, "pieces:submit"))
    return new Refusal(
      403,
      can(role, "pieces:review")
        ? "You edit this anthology, so you cannot submit to its call. Ask another editor to add your piece, or use a separate contributor account."
        : "You are this anthology's finisher; finishers cannot submit to its call.",
    );
  if (activePieces >= call.piecesPerPerson)
    return new Refusal(
      409,
      `This call takes ${call.piecesPerPerson} piece${call.piecesPerPerson === 1 ? "" : "s"} per person and you already have ${activePieces}. Withdraw one to send another.`,
    );
  return null;
}

/** Whether this piece's files may change now: the call is open, or an editor asked for a fix. */
export function uploadsAllowed(
  status: PieceStatus,
  call: CallWindow | null | undefined,
  anthology: { stage: AnthologyStage },
  now = new Date(),
): boolean {
  return mayUploadFiles(status, isCallOpen(call ?? null, anthology.stage, now));
}

/** Why uploads to this piece are closed, in words for the contributor. */
export function uploadsClosedReason(status: PieceStatus): string {
  if (status === "withdrawn") return "You withdrew this piece, so it takes no more files.";
  if (status === "declined")
    return "This piece was not taken for this issue, so it takes no more files.";
  return "The call has closed, so files can no longer be changed unless an editor asks you for a fix.";
}

/**
 * The spec one page file is checked against: the anthology's, one page per file, the piece's inks,
 * and for a page of a spread the side on the fold.
 */
export function specForPiece(
  anthology: SpecColumns,
  piece: { inks: string[]; kind?: PieceKind },
  pageIndex?: number,
): PrintSpec {
  // A spread's left page (its first) meets the fold on its right side, the right page on its left.
  const foldSide =
    piece.kind === "spread" && pageIndex !== undefined
      ? pageIndex === 1
        ? ("right" as const)
        : ("left" as const)
      : undefined;
  return specOf(anthology, { pagesExpected: 1, inks: piece.inks, foldSide });
}
