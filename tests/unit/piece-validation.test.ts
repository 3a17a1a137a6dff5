import { describe, expect, it } from "vitest";
import {
  pageCountRange,
  pieceProblems,
  pieceSchemaFor,
  type CallRules,
} from "@/lib/validations/piece";

const call: CallRules = {
  allowedKinds: ["single", "spread", "run"],
  maxRunPages: 4,
  allowedInks: ["black", "teal"],
};
const base = {
  title: "Heron",
  kind: "single",
  pageCount: 1,
  inks: ["black"],
  creditLine: "Bea",
  statement: "",
  altTexts: [],
};
const problemsOf = (input: Record<string, unknown>, rules = call) => {
  const parsed = pieceSchemaFor(rules).safeParse({ ...base, ...input });
  return parsed.success
    ? {}
    : Object.fromEntries(parsed.error.issues.map((i) => [i.path.join("."), i.message]));
};

describe("page counts per kind of piece", () => {
  // common practice, no source: a spread is two facing pages; a run is two or more.
  it("a single page has 1, a spread 2, a run 2 up to the call's limit", () => {
    expect(pageCountRange("single", 4)).toEqual({ min: 1, max: 1 });
    expect(pageCountRange("spread", 4)).toEqual({ min: 2, max: 2 });
    expect(pageCountRange("run", 4)).toEqual({ min: 2, max: 4 });
    expect(pageCountRange("run", 1)).toEqual({ min: 2, max: 2 });
  });

  it("refuses a count outside the kind's range", () => {
    expect(problemsOf({ kind: "single", pageCount: 2 })).toEqual({
      pageCount: "This kind of piece has 1 page",
    });
    expect(problemsOf({ kind: "spread", pageCount: 1 })).toEqual({
      pageCount: "This kind of piece has 2 pages",
    });
    expect(problemsOf({ kind: "run", pageCount: 5 })).toEqual({
      pageCount: "A run has 2 to 4 pages in this call",
    });
    expect(problemsOf({ kind: "run", pageCount: 3 })).toEqual({});
  });
});

describe("the call's rules", () => {
  it("only the kinds the call allows", () => {
    expect(
      problemsOf({ kind: "run", pageCount: 3 }, { ...call, allowedKinds: ["single"] }),
    ).toEqual({ kind: "This call does not take that kind of piece" });
  });

  it("inks are a subset of the call's, named once, at least one, case-insensitively", () => {
    expect(problemsOf({ inks: ["Teal"] })).toEqual({});
    expect(problemsOf({ inks: ["gold"] }).inks).toBe(
      "This call prints in black, teal; gold is not one of them",
    );
    expect(problemsOf({ inks: ["black", "BLACK"] }).inks).toBe("Each ink once");
    expect(problemsOf({ inks: [] }).inks).toBe("Tick the inks your piece uses");
  });

  it("no more page descriptions than pages", () => {
    expect(
      pieceProblems(
        { ...base, kind: "single", altTexts: ["a", "b"], statement: "" } as never,
        call,
      ),
    ).toEqual([{ path: "altTexts", message: "One description per page at most" }]);
  });

  it("needs a title and a credit line, trims them, and coerces the page count from a form string", () => {
    expect(problemsOf({ title: " ", creditLine: "x" })).toEqual({
      title: "Give the piece a title",
      creditLine: "Say how your name should appear in the credits",
    });
    const parsed = pieceSchemaFor(call).parse({
      ...base,
      title: "  Heron  ",
      kind: "run",
      pageCount: "3",
    });
    expect(parsed).toMatchObject({ title: "Heron", pageCount: 3 });
  });
});
