import { describe, expect, it } from "vitest";
import { newPieceNoticeMail } from "@/lib/mail/templates/new-piece-notice";
import { pieceReceiptMail } from "@/lib/mail/templates/piece-receipt";

describe("pieceReceiptMail", () => {
  it("names the piece, its pages and the anthology, with the link to the piece", () => {
    const mail = pieceReceiptMail({
      pieceTitle: "Mudflat <Dawn>",
      anthologyTitle: "Low Tide Almanac",
      greeting: "Bea",
      pageCount: 1,
      pieceUrl: "http://localhost:3000/studio/low-tide-almanac/my-pieces/7",
    });
    expect(mail.subject).toBe('We have "Mudflat <Dawn>" for Low Tide Almanac');
    expect(mail.text).toContain("Hello Bea,");
    expect(mail.text).toContain('"Mudflat <Dawn>" (one page) has reached the open call');
    expect(mail.text).toContain(
      "Open your piece: http://localhost:3000/studio/low-tide-almanac/my-pieces/7",
    );
    expect(mail.html).toContain("Mudflat &#60;Dawn&#62;");
  });
});

describe("newPieceNoticeMail", () => {
  it("tells the editor who sent what, links to it and says how to stop", () => {
    const mail = newPieceNoticeMail({
      pieceTitle: "Eel Run",
      pageCount: 4,
      anthologyTitle: "Low Tide Almanac",
      greeting: "Odile",
      contributorLabel: "Tomasz Vireo",
      pieceUrl: "http://localhost:3000/studio/low-tide-almanac/submissions/9",
      settingsUrl: "http://localhost:3000/studio/low-tide-almanac/submissions",
    });
    expect(mail.subject).toBe('New piece for Low Tide Almanac: "Eel Run"');
    expect(mail.text).toContain('Tomasz Vireo sent "Eel Run" (4 pages) to the open call');
    expect(mail.text).toContain('untick "E-mail me about each new piece"');
    expect(mail.text).toContain(
      "Read the piece: http://localhost:3000/studio/low-tide-almanac/submissions/9",
    );
  });
});
