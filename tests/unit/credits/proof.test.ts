import { describe, expect, it } from "vitest";
import { proofSpreads, sharesSpreadWith } from "@/lib/credits/proof";
import { setReservation } from "@/lib/map/edit";
import { map, single, spread, withPlaced } from "../map/fixtures";

// An 8-page saddle-stitched booklet reads 1 | 2–3 | 4–5 | 6–7 | 8 (cover alone, spreads, back alone).
function booklet() {
  const placed = withPlaced(
    map(8, [single(1, ["black"]), single(2, ["black"]), spread(3, ["black"])]),
    [
      [1, [2]],
      [2, [5]],
      [3, [6, 7]],
    ],
  );
  const r = setReservation(placed, 3, "credits");
  if (!r.ok) throw new Error(r.reason);
  return r.state;
}

describe("a contributor's proof", () => {
  it("shows the spread their piece is on with its facing page as it stands", () => {
    expect(proofSpreads(booklet(), 1)).toEqual([
      {
        spread: { kind: "spread", pages: [2, 3] },
        pages: [
          { page: 2, kind: "own", pieceId: 1, piecePageIndex: 1 },
          { page: 3, kind: "reserved", reservation: "credits" },
        ],
      },
    ]);
  });

  it("names a neighbour on the same spread, and an empty facing page", () => {
    const [only] = proofSpreads(booklet(), 2);
    expect(only!.pages).toEqual([
      { page: 4, kind: "empty" },
      { page: 5, kind: "own", pieceId: 2, piecePageIndex: 1 },
    ]);
    expect(proofSpreads(booklet(), 3)[0]!.pages.map((p) => p.kind)).toEqual(["own", "own"]);
  });

  it("has no spreads for a piece not on the map", () => {
    expect(proofSpreads(booklet(), 99)).toEqual([]);
  });

  it("says which pages share a spread with the piece, and no others", () => {
    const state = withPlaced(booklet(), [[9, [4]]]);
    expect(sharesSpreadWith(state, 2, 4)).toBe(true);
    expect(sharesSpreadWith(state, 2, 5)).toBe(true);
    expect(sharesSpreadWith(state, 2, 6)).toBe(false);
    expect(sharesSpreadWith(state, 2, 1)).toBe(false);
  });
});
