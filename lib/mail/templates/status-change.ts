/**
 * What the contributor is told when an editor moves their piece. Pure: returns the subject, the
 * paragraphs and the link; the caller renders and sends it.
 */
import { PIECE_STATUS_LABELS, type PieceStatus } from "@/lib/domain";
import { composeMail, type Mail } from "../compose";

export type StatusMailInput = {
  to: PieceStatus;
  pieceTitle: string;
  anthologyTitle: string;
  contributorName: string | null;
  editorName: string | null;
  message?: string | null;
  /** The contributor's own page for this piece, absolute. */
  pieceUrl: string;
};

export type StatusMail = {
  subject: string;
  paragraphs: string[];
  link: { href: string; label: string };
};

/** The e-mail for a move the contributor hears about, or null for moves that send none. */
export function statusMail(input: StatusMailInput): StatusMail | null {
  const { pieceTitle: title, anthologyTitle: book } = input;
  const editor = input.editorName ?? "An editor";
  const hello = `Hello ${input.contributorName ?? "there"},`;
  const fromEditors = input.message ? ["A message from the editors:", input.message] : [];
  const link = { href: input.pieceUrl, label: "Open your piece" };
  switch (input.to) {
    case "fix-requested":
      return {
        subject: `A fix for "${title}" (${book})`,
        paragraphs: [
          hello,
          `${editor} read "${title}" for ${book} and asked for a fix before it can go further:`,
          input.message ?? "",
          "Upload a corrected file from your piece's page; the piece goes back to the editors as soon as the new file lands.",
        ],
        link: { ...link, label: "Upload a corrected file" },
      };
    case "shortlisted":
      return {
        subject: `"${title}" is on the shortlist for ${book}`,
        paragraphs: [
          hello,
          `${editor} put "${title}" on the shortlist for ${book}. Nothing is final yet; you will hear again when it is.`,
          ...fromEditors,
        ],
        link,
      };
    case "accepted":
      return {
        subject: `"${title}" is going in ${book}`,
        paragraphs: [
          hello,
          `"${title}" is accepted for ${book} (status: ${PIECE_STATUS_LABELS.accepted}). You will be told which pages it lands on once the page map is set.`,
          ...fromEditors,
        ],
        link,
      };
    case "declined":
      return {
        subject: `About "${title}" and ${book}`,
        paragraphs: [
          hello,
          `Thank you for sending "${title}". The editors will not include it in ${book} this time.`,
          ...fromEditors,
        ],
        link,
      };
    default:
      return null;
  }
}

/** The status-change e-mail ready to send, or null for moves that send none. */
export function statusChangeMail(input: StatusMailInput): Mail | null {
  const mail = statusMail(input);
  return mail ? composeMail(mail.subject, mail.paragraphs, mail.link) : null;
}
