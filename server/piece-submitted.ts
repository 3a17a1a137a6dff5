import "server-only";
import type { Anthology } from "@/db/queries/anthologies";
import { newPieceWatchers } from "@/db/queries/notifications";
import { contributorContact } from "@/db/queries/review";
import { newPieceNoticeMail } from "@/lib/mail/templates/new-piece-notice";
import { pieceReceiptMail } from "@/lib/mail/templates/piece-receipt";
import { personLabel } from "@/lib/people";
import { appUrl, sendLoggedMail } from "@/server/mail";

export type SubmittedPiece = { id: number; title: string; pageCount: number };

/**
 * After a piece is submitted: the contributor gets a receipt and each editor or lead who opted in
 * (membership.notify_new_pieces) a notice, each once per piece (the dedupe keys carry the piece
 * id, so a retried request cannot mail twice). A failed send is in the e-mail log and never
 * undoes the submission.
 */
export async function mailPieceSubmitted(
  anthology: Anthology,
  piece: SubmittedPiece,
  contributorId: string,
): Promise<{ receipt: boolean; notices: number }> {
  const contact = await contributorContact(contributorId);
  const receipt = contact ? await sendReceipt(anthology, piece, contact) : false;
  let notices = 0;
  for (const editor of await newPieceWatchers(anthology.id)) {
    if (editor.userId === contributorId) continue;
    const mail = newPieceNoticeMail({
      pieceTitle: piece.title,
      pageCount: piece.pageCount,
      anthologyTitle: anthology.title,
      greeting: editor.name?.trim() || "there",
      contributorLabel: contact
        ? personLabel(contact, { mayShowEmail: true, unnamed: "A contributor" })
        : "A contributor",
      pieceUrl: appUrl(`/studio/${anthology.slug}/submissions/${piece.id}`),
      settingsUrl: appUrl(`/studio/${anthology.slug}/submissions`),
    });
    const outcome = await sendLoggedMail(
      {
        anthologyId: anthology.id,
        pieceId: piece.id,
        kind: "new-piece-notice",
        to: editor.email,
        dedupeKey: `new-piece-notice:${piece.id}:${editor.userId}`,
      },
      mail,
    );
    if (outcome.sent) notices++;
  }
  return { receipt, notices };
}

async function sendReceipt(
  anthology: Anthology,
  piece: SubmittedPiece,
  contact: { email: string; name: string | null },
): Promise<boolean> {
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
  return outcome.sent;
}
