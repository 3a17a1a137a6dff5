/**
 * The notice an editor who opted in gets when a piece reaches the open call. Pure;
 * server/piece-submitted.ts sends it. The editor turns it off on the submissions page.
 */
import { composeMail, type Mail } from "../compose";

export type NewPieceNoticeInput = {
  pieceTitle: string;
  pageCount: number;
  anthologyTitle: string;
  /** The editor's name, or a neutral word. */
  greeting: string;
  /** Who sent it, named as editors may see them. */
  contributorLabel: string;
  /** The piece on the editors' side, absolute. */
  pieceUrl: string;
  /** The submissions page, where the notice is turned off, absolute. */
  settingsUrl: string;
};

export function newPieceNoticeMail(input: NewPieceNoticeInput): Mail {
  const pages = input.pageCount === 1 ? "one page" : `${input.pageCount} pages`;
  return composeMail(
    `New piece for ${input.anthologyTitle}: "${input.pieceTitle}"`,
    [
      `Hello ${input.greeting},`,
      `${input.contributorLabel} sent "${input.pieceTitle}" (${pages}) to the open call of ${input.anthologyTitle}.`,
      `You get this because you asked to hear about new pieces. To stop, untick "E-mail me about each new piece" on the submissions page: ${input.settingsUrl}`,
    ],
    { href: input.pieceUrl, label: "Read the piece" },
  );
}
