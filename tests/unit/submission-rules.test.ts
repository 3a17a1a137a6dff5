// The rules of sending work to an open call, and the piece verdict over its pages.
import { describe, expect, it } from "vitest";
import {
  specForPiece,
  submitRefusal,
  uploadsAllowed,
  uploadsClosedReason,
} from "@/lib/pieces/submission-rules";
import { pieceVerdictOf } from "@/lib/pieces/verdict";
import { halfLetterDuplicatorSpec } from "../helpers/anthology-spec";

const call = {
  piecesPerPerson: 2,
  opensAt: new Date("2031-03-01T00:00:00Z"),
  closesAt: new Date("2031-04-01T00:00:00Z"),
};
const during = new Date("2031-03-15T12:00:00Z");
const after = new Date("2031-04-02T00:00:00Z");

describe("submitRefusal", () => {
  it("keeps the people who decide, and the finisher, out of their own call", () => {
    expect(submitRefusal("lead", 0, call)?.status).toBe(403);
    expect(submitRefusal("editor", 0, call)?.status).toBe(403);
    expect(submitRefusal("finisher", 0, call)?.message).toMatch(/finisher/);
  });
  it("lets anyone else send up to the call's limit", () => {
    expect(submitRefusal(null, 0, call)).toBeNull();
    expect(submitRefusal("contributor", 1, call)).toBeNull();
    const refused = submitRefusal("contributor", 2, call);
    expect(refused?.status).toBe(409);
    expect(refused?.message).toContain("2 pieces per person");
  });
});

describe("uploadsAllowed", () => {
  const open = { stage: "call-open" as const };
  it("is open while the call is, and for a fix an editor asked for afterwards", () => {
    expect(uploadsAllowed("awaiting-review", call, open, during)).toBe(true);
    expect(uploadsAllowed("awaiting-review", call, open, after)).toBe(false);
    expect(uploadsAllowed("fix-requested", call, { stage: "call-closed" }, after)).toBe(true);
  });
  it("is closed for withdrawn and declined pieces, and says why", () => {
    expect(uploadsAllowed("withdrawn", call, open, during)).toBe(false);
    expect(uploadsAllowed("declined", call, open, during)).toBe(false);
    expect(uploadsClosedReason("withdrawn")).toMatch(/withdrew/);
    expect(uploadsClosedReason("accepted")).toMatch(/call has closed/);
  });
});

describe("specForPiece", () => {
  it("checks one page per file against the piece's own inks, else the anthology's", () => {
    const anthology = { ...halfLetterDuplicatorSpec, pagesExpected: undefined } as never;
    expect(specForPiece(anthology, { inks: ["teal"] })).toMatchObject({
      pagesExpected: 1,
      inks: ["teal"],
    });
    expect(specForPiece(anthology, { inks: [] }).inks).toEqual(["black", "teal"]);
  });
});

describe("pieceVerdictOf", () => {
  it("is the worst page's verdict, and missing while a page has no file", () => {
    expect(pieceVerdictOf(["pass", "note"])).toBe("note");
    expect(pieceVerdictOf(["pass", "blocker", "warning"])).toBe("blocker");
    expect(pieceVerdictOf(["pass", null])).toBe("missing");
    expect(pieceVerdictOf([])).toBe("missing");
  });
});
