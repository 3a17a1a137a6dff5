// What the move to "Printing and finishing" says is still open on the page map.
import { describe, expect, it } from "vitest";
import { reviewStageMove, type StageFacts } from "@/lib/stages";

// Half letter (5.5 x 8.5 in = 139.7 x 215.9 mm), 0.125 in bleed, a duplicator in black and teal.
const facts = (layout: StageFacts["layout"]): StageFacts => ({
  stage: "laying-out",
  anthology: {
    trimWidthMm: 139.7,
    trimHeightMm: 215.9,
    bleedMm: 3.175,
    safeMarginMm: 6.35,
    minPpi: 300,
    printMethod: "duplicator",
    inks: ["black", "teal"],
  },
  call: null,
  pieces: { accepted: 6, awaitingReview: 0 },
  layout,
  now: new Date("2025-08-01T12:00:00Z"),
});

describe("moving to printing", () => {
  it("names the empty pages, the pieces not placed and the files not passing, as cautions", () => {
    const review = reviewStageMove(
      facts({ emptyPages: [3, 4, 7], unplacedPieces: 2, piecesNotPassing: 1 }),
      "printing",
    );
    expect(review.problems).toEqual([]);
    expect(review.cautions).toEqual([
      "3 pages are still empty on the page map (pages 3, 4 and 7); they would print blank.",
      "2 accepted pieces are not on the page map yet.",
      "1 piece has files that do not meet the print spec yet (won't print, missing or needing a look).",
    ]);
  });

  it("uses the singular for one page and one piece", () => {
    const review = reviewStageMove(
      facts({ emptyPages: [5], unplacedPieces: 1, piecesNotPassing: 2 }),
      "printing",
    );
    expect(review.cautions).toEqual([
      "1 page is still empty on the page map (page 5); it would print blank.",
      "1 accepted piece is not on the page map yet.",
      "2 pieces have files that do not meet the print spec yet (won't print, missing or needing a look).",
    ]);
  });

  it("says nothing when the map is full, every piece placed and every file passing", () => {
    const review = reviewStageMove(
      facts({ emptyPages: [], unplacedPieces: 0, piecesNotPassing: 0 }),
      "printing",
    );
    expect(review).toMatchObject({ problems: [], cautions: [] });
  });
});
