import { describe, expect, it } from "vitest";
import { PIECE_STATUSES } from "@/lib/domain";
import { STATUSES_THAT_EMAIL } from "@/lib/pieces/status";
import { statusChangeMail, statusMail } from "@/lib/mail/templates/status-change";
import { composeMail, escapeHtml } from "@/lib/mail/compose";
import { invitationMail } from "@/lib/mail/templates/invitation";
import { pageNoticeMail } from "@/lib/mail/templates/page-notice";
import { signInLinkMail } from "@/lib/mail/templates/sign-in-link";
import { specReportMail } from "@/lib/mail/templates/spec-report";
import { creditRequestMail } from "@/lib/mail/templates/credit-request";

const base = {
  pieceTitle: "Sandpiper Tracks",
  anthologyTitle: "Low Tide Almanac",
  contributorName: "Ines Rook",
  editorName: "Odile Farrant",
  pieceUrl: "http://localhost:3000/studio/low-tide-almanac/my-pieces/12",
};

describe("the e-mail a contributor gets when their piece moves", () => {
  it("exists for exactly the moves that e-mail, and names the piece and the book", () => {
    for (const to of PIECE_STATUSES) {
      const mail = statusMail({ ...base, to });
      if (STATUSES_THAT_EMAIL.includes(to)) {
        expect(mail, to).not.toBeNull();
        expect(mail!.subject).toContain("Sandpiper Tracks");
        expect(mail!.subject).toContain("Low Tide Almanac");
        expect(mail!.paragraphs[0]).toBe("Hello Ines Rook,");
        expect(mail!.link.href).toBe(base.pieceUrl);
      } else {
        expect(mail, to).toBeNull();
      }
    }
  });

  it("carries the editor's words: what to fix, or a note with a decision", () => {
    const fix = statusMail({
      ...base,
      to: "fix-requested",
      message: "Add 3 mm of bleed on the outside edge.",
    })!;
    expect(fix.subject).toBe('A fix for "Sandpiper Tracks" (Low Tide Almanac)');
    expect(fix.paragraphs).toContain("Add 3 mm of bleed on the outside edge.");
    expect(fix.paragraphs.join(" ")).toContain("Odile Farrant");
    const accepted = statusMail({ ...base, to: "accepted", message: "Lovely line work." })!;
    expect(accepted.paragraphs.slice(-2)).toEqual([
      "A message from the editors:",
      "Lovely line work.",
    ]);
    const declined = statusMail({ ...base, to: "declined" })!;
    expect(declined.paragraphs.join(" ")).not.toContain("A message from the editors");
  });

  it("greets someone without a name on file", () => {
    expect(statusMail({ ...base, contributorName: null, to: "shortlisted" })!.paragraphs[0]).toBe(
      "Hello there,",
    );
  });
});

describe("composeMail", () => {
  it("puts the paragraphs and the link in both bodies, dropping empty paragraphs", () => {
    const mail = composeMail("Subject", ["One.", "", "Two <b>."], {
      href: "http://localhost:3000/x?a=1&b=2",
      label: "Open it",
    });
    expect(mail.text).toBe("One.\n\nTwo <b>.\n\nOpen it: http://localhost:3000/x?a=1&b=2\n");
    expect(mail.html).toContain("Two &#60;b&#62;.");
    expect(mail.html).toContain('href="http://localhost:3000/x?a=1&#38;b=2"');
    expect(mail.html).not.toContain('<p style="margin:0 0 12px"></p>');
  });
  it("escapes the five HTML-special characters", () => {
    expect(escapeHtml(`<a href="x">&'</a>`)).toBe(
      "&#60;a href=&#34;x&#34;&#62;&#38;&#39;&#60;/a&#62;",
    );
  });
});

describe("the templates", () => {
  it("sign-in link: carries the link once, says it works once", () => {
    const mail = signInLinkMail("http://localhost:3000/api/auth/callback/nodemailer?token=abc");
    expect(mail.subject).toBe("Your Quireline sign-in link");
    expect(mail.text.match(/token=abc/g)).toHaveLength(1);
    expect(mail.text).toContain("works once");
  });

  it("invitation: names the anthology, the inviter and the role, and says it is for this address", () => {
    const mail = invitationMail({
      anthologyTitle: "Low Tide Almanac",
      inviterName: "Odile Farrant",
      role: "finisher",
      link: "http://localhost:3000/invite/t0k3n",
    });
    expect(mail.subject).toBe("You're invited to Low Tide Almanac on Quireline");
    expect(mail.text).toContain('Odile Farrant invited you to join "Low Tide Almanac" as finisher');
    expect(mail.text).toContain("only for this e-mail address");
    expect(mail.text).toContain("http://localhost:3000/invite/t0k3n");
  });

  it("page notice: one line per piece with its pages in words", () => {
    const mail = pageNoticeMail({
      anthologyTitle: "Low Tide Almanac",
      greeting: "Bea",
      pieces: [
        { title: "Heron Study", pages: [4] },
        { title: "Salt Marsh", pages: [8, 9] },
      ],
      link: "http://localhost:3000/studio/low-tide-almanac",
    });
    expect(mail.subject).toBe("Your pages in Low Tide Almanac");
    expect(mail.text).toContain("Hello Bea,");
    expect(mail.text).toMatch(/“Heron Study”: page 4/);
    expect(mail.text).toMatch(/“Salt Marsh”: pages 8/);
  });

  it("spec report: the verdict, each finding with its fix, and why an upload is not used", () => {
    const base = {
      personName: "Tomasz",
      fileName: "gull.png",
      pieceTitle: "Gull Ledger",
      pageIndex: 1,
      versionNumber: 2,
      anthologyTitle: "Low Tide Almanac",
      link: "http://localhost:3000/studio/low-tide-almanac/my-pieces/3",
    };
    const passing = specReportMail({
      ...base,
      report: { verdict: "pass", findings: [] },
      notUsed: null,
    });
    expect(passing.text).toContain("It meets the spec: nothing to fix.");
    const unreadable = specReportMail({
      ...base,
      report: {
        verdict: "blocker",
        findings: [
          {
            code: "unreadable",
            severity: "blocker",
            message: "The file could not be read.",
            fix: "Export it again.",
          },
        ] as never,
      },
      notUsed: "unreadable",
    });
    expect(unreadable.text).toContain(
      "Must fix: The file could not be read. Fix: Export it again.",
    );
    expect(unreadable.text).toContain("your earlier file stays in use");
  });

  it("status change: a move the contributor hears about becomes a mail, others none", () => {
    const input = { ...base, to: "accepted" as const };
    expect(statusChangeMail(input)?.subject).toBe(
      '"Sandpiper Tracks" is going in Low Tide Almanac',
    );
    expect(statusChangeMail({ ...base, to: "awaiting-review" })).toBeNull();
  });
});

describe("the credit request", () => {
  const input = {
    anthologyTitle: "Low Tide Almanac",
    greeting: "Wren Halloway",
    pieceTitle: "Heron at the Sluice Gate",
    creditLine: "Wren Halloway <b>",
    link: "http://localhost:3000/credits/c1.4.abc",
    days: 30,
    again: false,
  };

  it("shows the line as it will print, the link and how long it lasts, escaped in HTML", () => {
    const mail = creditRequestMail(input);
    expect(mail.subject).toBe("Approve your credit in Low Tide Almanac");
    expect(mail.text).toContain("\n\nWren Halloway <b>\n\n");
    expect(mail.text).toContain("Check your credit line: http://localhost:3000/credits/c1.4.abc");
    expect(mail.text).toContain("lasts 30 days");
    expect(mail.html).toContain("Wren Halloway &#60;b&#62;");
    expect(mail.html).not.toContain("<b>");
  });

  it("says why it asks again after a change", () => {
    const mail = creditRequestMail({ ...input, again: true });
    expect(mail.subject).toBe("Approve your changed credit in Low Tide Almanac");
    expect(mail.text).toContain("changed after you approved it");
  });
});
