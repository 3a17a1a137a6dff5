import { describe, expect, it } from "vitest";
import { PIECE_STATUSES } from "@/lib/domain";
import { STATUSES_THAT_EMAIL } from "@/lib/pieces/status";
import { statusMail } from "@/lib/pieces/status-mail";

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
