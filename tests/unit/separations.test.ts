import { describe, expect, it } from "vitest";
import { checkArtwork } from "@/lib/print/check";
import {
  masterName,
  missingFileCount,
  needsSeparations,
  pieceVerdictOverFiles,
  requiredFileLabel,
  requiredFilesOf,
  separationsExplanation,
  specForFile,
  uploadInkRefusal,
} from "@/lib/pieces/separations";
import { makePng } from "./print/fixtures";

const duplicator = { printMethod: "duplicator" as const };
const laser = { printMethod: "laser-colour" as const };

describe("which files a page needs", () => {
  it("a duplicator piece in two inks: one separation per ink, in the piece's order", () => {
    expect(requiredFilesOf(duplicator, { inks: ["teal", "black"] })).toEqual([
      { kind: "separation", ink: "teal" },
      { kind: "separation", ink: "black" },
    ]);
  });
  it("a one-ink duplicator piece's page file is itself the master: one composite", () => {
    expect(requiredFilesOf(duplicator, { inks: ["black"] })).toEqual([{ kind: "composite" }]);
    expect(needsSeparations(duplicator, { inks: ["black"] })).toBe(false);
  });
  it("laser and inkjet keep one composite file per page whatever the inks", () => {
    expect(requiredFilesOf(laser, { inks: ["black", "teal"] })).toEqual([{ kind: "composite" }]);
    expect(requiredFilesOf({ printMethod: "inkjet" }, { inks: [] })).toEqual([
      { kind: "composite" },
    ]);
  });
  it("an ink named twice is one ink", () => {
    expect(requiredFilesOf(duplicator, { inks: ["black", "black"] })).toEqual([
      { kind: "composite" },
    ]);
  });
});

describe("the piece's verdict over every required file", () => {
  const twoInks = requiredFilesOf(duplicator, { inks: ["black", "teal"] });
  it("a missing separation makes the piece's files missing", () => {
    const pages = [{ composite: null, separations: { black: "pass" } }];
    expect(pieceVerdictOverFiles(twoInks, pages)).toBe("missing");
    expect(missingFileCount(twoInks, pages)).toBe(1);
  });
  it("with both separations in, the worst of them; a colour guide beside them is not counted", () => {
    const pages = [{ composite: "blocker", separations: { black: "pass", teal: "warning" } }];
    expect(pieceVerdictOverFiles(twoInks, pages)).toBe("warning");
    expect(missingFileCount(twoInks, pages)).toBe(0);
  });
  it("every page counts: a second page without its teal master is missing", () => {
    const pages = [
      { composite: null, separations: { black: "pass", teal: "pass" } },
      { composite: null, separations: { black: "note", teal: null } },
    ];
    expect(pieceVerdictOverFiles(twoInks, pages)).toBe("missing");
  });
  it("a composite piece is judged by its composites, as before", () => {
    const one = requiredFilesOf(duplicator, { inks: ["black"] });
    expect(pieceVerdictOverFiles(one, [{ composite: "note", separations: {} }])).toBe("note");
    expect(pieceVerdictOverFiles(one, [{ composite: null, separations: { black: "pass" } }])).toBe(
      "missing",
    );
    expect(pieceVerdictOverFiles(one, [])).toBe("missing");
  });
});

describe("which uploads a piece takes", () => {
  it("an ink of a two-ink duplicator piece, or no ink (a colour guide)", () => {
    expect(uploadInkRefusal(duplicator, { inks: ["black", "teal"] }, "teal")).toBeNull();
    expect(uploadInkRefusal(duplicator, { inks: ["black", "teal"] }, null)).toBeNull();
  });
  it("refuses an ink the piece does not print in, naming its inks", () => {
    const r = uploadInkRefusal(duplicator, { inks: ["black", "teal"] }, "gold");
    expect(r?.status).toBe(400);
    expect(r?.message).toBe("This piece prints in black and teal; “gold” is not one of its inks.");
  });
  it("refuses an ink for a piece that takes one file per page", () => {
    expect(uploadInkRefusal(duplicator, { inks: ["black"] }, "black")?.message).toContain(
      "prints in one ink",
    );
    expect(uploadInkRefusal(laser, { inks: ["black", "teal"] }, "teal")?.message).toContain(
      "one file with all its colours",
    );
  });
});

describe("words", () => {
  it("labels each control with the page and the ink", () => {
    expect(requiredFileLabel("Page 1", { kind: "separation", ink: "teal" })).toBe(
      "Page 1 — teal master",
    );
    expect(requiredFileLabel("Page 1", { kind: "composite" })).toBe("Page 1");
    expect(masterName("black")).toBe("black master");
  });
  it("explains why: one file per ink, greyscale, black for full ink", () => {
    const text = separationsExplanation(["black", "teal"]);
    expect(text).toContain("2 files, one per ink (black and teal)");
    expect(text).toContain("greyscale");
    expect(text).toContain("black where that ink prints fully");
  });
});

describe("the spec check of a separation", () => {
  // ISO 216: A5 = 148 x 210 mm; with 3 mm bleed 154 x 216 mm = 607 x 851 px at 100 ppi, rounded up.
  const anthology = {
    trimWidthMm: 148,
    trimHeightMm: 210,
    bleedMm: 3,
    safeMarginMm: 5,
    minPpi: 100,
    printMethod: "duplicator" as const,
    inks: ["black", "teal"],
  };
  const piece = { inks: ["black", "teal"], kind: "single" as const };
  const grey = makePng(607, 851, (x) => (x < 300 ? [40, 40, 40, 255] : [250, 250, 250, 255]));
  const colour = makePng(607, 851, (x) => (x < 300 ? [20, 120, 110, 255] : [250, 250, 250, 255]));

  it("says which ink the report is for, and a greyscale master has no colour finding", async () => {
    const report = await checkArtwork(grey, specForFile(anthology, piece, 1, "teal"));
    expect(report.ink).toBe("teal");
    expect(report.findings.map((f) => f.code)).not.toContain("colour-in-separation");
  });

  it("colour in a master is a warning asking for a greyscale master for that ink", async () => {
    const report = await checkArtwork(colour, specForFile(anthology, piece, 1, "teal"));
    const finding = report.findings.find((f) => f.code === "colour-in-separation");
    expect(finding?.severity).toBe("warning");
    expect(finding?.message).toContain("teal master");
    expect(finding?.fix).toContain("Send a greyscale master for teal");
    // Not the composite's blocker: the file is already one ink's master.
    expect(report.findings.map((f) => f.code)).not.toContain("colour-for-duplicator");
  });

  it("a composite of the same piece has no ink and keeps the composite's colour rule", async () => {
    const report = await checkArtwork(colour, specForFile(anthology, piece, 1, null));
    expect(report.ink).toBeUndefined();
    expect(report.findings.find((f) => f.code === "colour-for-duplicator")?.severity).toBe(
      "blocker",
    );
  });
});

describe("the spec report mail for a master", () => {
  it("names the ink in the subject and the first line", async () => {
    const { specReportMail } = await import("@/lib/mail/templates/spec-report");
    const mail = specReportMail({
      personName: "Wren",
      fileName: "kelp-teal.png",
      pieceTitle: "Kelp",
      pageIndex: 1,
      ink: "teal",
      versionNumber: 2,
      anthologyTitle: "Two Drums",
      report: { verdict: "pass", findings: [] },
      notUsed: null,
      link: "http://localhost/x",
    });
    expect(mail.subject).toBe('Spec check: "Kelp", page 1, teal master: Meets the spec');
    expect(mail.text).toContain('version 2 of the teal master of page 1 of "Kelp"');
  });
});
