import "server-only";
import type { Anthology } from "@/db/queries/anthologies";
import { contributorContact, recordPieceMove } from "@/db/queries/review";
import type { PieceStatus } from "@/lib/domain";
import { statusChangeMail } from "@/lib/mail/templates/status-change";
import { STATUSES_THAT_EMAIL } from "@/lib/pieces/status";
import { appUrl, sendLoggedMail } from "@/server/mail";

export type StatusChangeOutcome =
  | { pieceId: number; changed: true; from: PieceStatus; to: PieceStatus; mailed: boolean | null }
  | { pieceId: number; changed: false; reason: string; needsConfirm?: true };

/**
 * An editor moves one piece: the move is recorded (db/queries/review.ts), then the contributor is
 * e-mailed when it is a move they hear about; the mail goes out once per recorded move.
 */
export async function movePiece(
  anthology: Anthology,
  actor: { id: string; name: string | null },
  pieceId: number,
  to: PieceStatus,
  options: { message?: string; expectedFrom?: PieceStatus; confirmAccept?: boolean } = {},
): Promise<StatusChangeOutcome> {
  const move = await recordPieceMove(anthology, actor, pieceId, to, options);
  if (!move.changed)
    return move.needsConfirm
      ? { pieceId, changed: false, reason: move.reason, needsConfirm: true }
      : { pieceId, changed: false, reason: move.reason };
  let mailed: boolean | null = null;
  if (STATUSES_THAT_EMAIL.includes(to)) {
    mailed = false;
    const contact = await contributorContact(move.contributorId);
    const mail = contact
      ? statusChangeMail({
          to,
          pieceTitle: move.title,
          anthologyTitle: anthology.title,
          contributorName: contact.name,
          editorName: actor.name,
          message: options.message,
          pieceUrl: appUrl(`/studio/${anthology.slug}/my-pieces/${pieceId}`),
        })
      : null;
    if (contact && mail) {
      const outcome = await sendLoggedMail(
        {
          anthologyId: anthology.id,
          pieceId,
          kind: `status-${to}`,
          to: contact.email,
          dedupeKey: move.eventId ? `piece-event-${move.eventId}` : undefined,
        },
        mail,
      );
      mailed = outcome.sent;
    }
  }
  return { pieceId, changed: true, from: move.from, to, mailed };
}

/** Moves several pieces, each in its own transaction; refusals do not stop the others. */
export async function movePieces(
  anthology: Anthology,
  actor: { id: string; name: string | null },
  pieceIds: number[],
  to: PieceStatus,
  message?: string,
  confirmAccept = false,
) {
  const outcomes: StatusChangeOutcome[] = [];
  for (const pieceId of pieceIds)
    outcomes.push(await movePiece(anthology, actor, pieceId, to, { message, confirmAccept }));
  return {
    changed: outcomes.filter((o) => o.changed),
    refused: outcomes.filter((o) => !o.changed),
  };
}
