import { describe, expect, it } from "vitest";
import { acceptWarning, acceptWarningForMany } from "@/lib/pieces/accept-warning";

// The rule (common practice, no source): a piece goes into the book only when every page has a
// file that prints; otherwise the editor is told why and confirms.
describe("acceptWarning", () => {
  const piece = { title: "Kelp Run", verdict: "pass", pageCount: 2, pagesWithFiles: 2 };
  it("says nothing for a piece whose every page has a file that prints", () => {
    expect(acceptWarning(piece)).toBeNull();
    expect(acceptWarning({ ...piece, verdict: "warning" })).toBeNull();
    expect(acceptWarning({ ...piece, verdict: "note" })).toBeNull();
  });
  it("warns about a piece with no files at all", () => {
    expect(acceptWarning({ ...piece, verdict: "missing", pagesWithFiles: 0 })).toBe(
      "“Kelp Run” has no files yet, so nothing of it can go to print.",
    );
  });
  it("counts the pages still waiting for a file", () => {
    expect(acceptWarning({ ...piece, verdict: "missing", pagesWithFiles: 1 })).toBe(
      "“Kelp Run” still has 1 of 2 pages without a file.",
    );
  });
  it("warns about a file that won't print", () => {
    expect(acceptWarning({ ...piece, verdict: "blocker" })).toMatch(
      /^“Kelp Run” has a file that won't print as it is/,
    );
  });
});

describe("acceptWarningForMany", () => {
  it("is null for none, the one warning for one, and names all for several", () => {
    expect(acceptWarningForMany([])).toBeNull();
    expect(acceptWarningForMany(["A."])).toBe("A.");
    expect(acceptWarningForMany(["A.", "B."])).toBe(
      "2 of these pieces may not print as they are: A. B.",
    );
  });
});
