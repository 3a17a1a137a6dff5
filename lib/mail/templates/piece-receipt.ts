/**
 * The receipt a contributor gets when their piece reaches an open call: what arrived, what
 * happens next, and the link to their piece's page. Pure; server/piece-submitted.ts sends it.
 */
import { composeMail, type Mail } from "../compose";

export type PieceReceiptInput = {
  pieceTitle: string;
  anthologyTitle: string;
  /** Their name, or a neutral word; never their address. */
  greeting: string;
  pageCount: number;
  /** The contributor's own page for this piece, absolute. */
  pieceUrl: string;
};

export function pieceReceiptMail(input: PieceReceiptInput): Mail {
  const pages = input.pageCount === 1 ? "one page" : `${input.pageCount} pages`;
  return composeMail(
    `We have "${input.pieceTitle}" for ${input.anthologyTitle}`,
    [
      `Hello ${input.greeting},`,
      `"${input.pieceTitle}" (${pages}) has reached the open call of ${input.anthologyTitle}. This e-mail is your receipt.`,
      "Upload a file for each page from your piece's page if you have not yet; each file is checked against the print spec as it lands. The editors read pieces once the call closes, and you will hear from them then.",
    ],
    { href: input.pieceUrl, label: "Open your piece" },
  );
}
