import { describe, expect, it } from "vitest";
import { planInkPasses } from "@/lib/print/passes";

// One pass per ink per sheet side: Fancyclopedia "Mimeography" ("each copy sheet is run thru the
// mimeo as many times as there are colors"); expertsmind "Stencil duplicating".
describe("duplicator ink passes", () => {
  const pieces = [
    { id: "cover", inks: ["black", "pink"] },
    { id: "poem", inks: ["black"] },
    { id: "comic", inks: ["black", "teal"] },
    { id: "photo", inks: ["pink"] },
  ];

  it("8 pages: inks add up per sheet side, passes per copy and per run", () => {
    // sides (pages sharing a side sum to N + 1, GeeksforGeeks "Puzzle 28 (Newspaper Puzzle)", geeksforgeeks.org/puzzle-28-newspaper-puzzle/):
    // s1 front 8|1, s1 back 2|7, s2 front 6|3, s2 back 4|5
    const plan = planInkPasses({
      pages: 8,
      copies: 50,
      inkOrder: ["black", "pink", "teal"],
      pieces,
      placements: [
        { page: 1, pieceId: "cover" },
        { page: 8, pieceId: "cover" },
        { page: 2, pieceId: "poem" },
        { page: 3, pieceId: "comic" },
        { page: 4, pieceId: "comic" },
        { page: 5, pieceId: "photo" },
        { page: 6, pieceId: "poem" },
        { page: 7, pieceId: "poem" },
      ],
    });
    expect(plan.sides.map((s) => [s.sheet, s.side, s.inks])).toEqual([
      [1, "front", ["black", "pink"]],
      [1, "back", ["black"]],
      [2, "front", ["black", "teal"]],
      [2, "back", ["black", "pink", "teal"]],
    ]);
    expect(plan.passesPerCopy).toBe(8);
    expect(plan.mastersPerRun).toBe(8);
    expect(plan.passesPerRun).toBe(400);
    expect(plan.passesPerInkPerCopy).toEqual({ black: 4, pink: 2, teal: 2 });
  });

  it("moving the one-ink pieces together saves passes", () => {
    const base = { pages: 8, copies: 1, pieces };
    const spread = planInkPasses({
      ...base,
      placements: [
        { page: 1, pieceId: "photo" },
        { page: 3, pieceId: "photo" },
      ],
    });
    const together = planInkPasses({
      ...base,
      placements: [
        { page: 1, pieceId: "photo" },
        { page: 8, pieceId: "photo" },
      ],
    });
    expect(spread.passesPerCopy).toBe(2);
    expect(together.passesPerCopy).toBe(1);
  });

  it("blank sides need no pass; unknown pieces are refused", () => {
    const plan = planInkPasses({ pages: 8, copies: 10, pieces, placements: [] });
    expect(plan.passesPerCopy).toBe(0);
    expect(() =>
      planInkPasses({ pages: 8, copies: 1, pieces, placements: [{ page: 1, pieceId: "nope" }] }),
    ).toThrow();
  });
});
