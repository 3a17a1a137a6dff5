import "server-only";
import type { Anthology } from "@/db/queries/anthologies";
import { contributorContact } from "@/db/queries/review";
import { pieceReceiptMail } from "@/lib/mail/templates/piece-receipt";
import { appUrl, sendLoggedMail } from "@/server/mail";

export type SubmittedPiece = { id: number; title: string; pageCount: number };

/**
 * After a piece is submitted: the contributor gets a receipt, once per piece (the dedupe key is
 * the piece id, so a retried request cannot mail it twice). A failed send is in the e-mail log
 * and never undoes the submission.
 */
export async function mailPieceSubmitted(
  anthology: Anthology,
  piece: SubmittedPiece,
  contributorId: string,
): Promise<{ receipt: boolean }> {
  const contact = await contributorContact(contributorId);
  if (!contact) return { receipt: false };
  const mail = pieceReceiptMail({
    pieceTitle: piece.title,
    anthologyTitle: anthology.title,
    greeting: contact.name?.trim() || "there",
    pageCount: piece.pageCount,
    pieceUrl: appUrl(`/studio/${anthology.slug}/my-pieces/${piece.id}`),
  });
  const outcome = await sendLoggedMail(
    {
      anthologyId: anthology.id,
      pieceId: piece.id,
      kind: "piece-receipt",
      to: contact.email,
      dedupeKey: `piece-receipt:${piece.id}`,
    },
    mail,
  );
  return { receipt: outcome.sent };
}
