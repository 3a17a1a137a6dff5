// The save rule of the page map: which changes the route handler accepts, worked on an
// 8-page saddle-stitched booklet (sheet 1 carries 8|1 and 2|7, sheet 2 carries 6|3 and 4|5).
import { describe, expect, it } from "vitest";
import { checkMap } from "@/lib/map/check";
import { emptyMap } from "@/lib/map/state";
import type { MapState } from "@/lib/map/types";
import {
  applyChange,
  checkedChange,
  describeChange,
  newBlockingErrors,
} from "@/lib/map-edits/apply";

function booklet(): MapState {
  const state = emptyMap({
    binding: "saddle-stitch",
    pageCount: 8,
    maxPages: 16,
    inksPerPass: 1,
    pressInks: ["black", "teal"],
    pieces: [
      { id: 1, title: "Moths", kind: "single", pageCount: 1, inks: ["black"] },
      { id: 2, title: "Kelp", kind: "spread", pageCount: 2, inks: ["teal"] },
      { id: 3, title: "Heron", kind: "single", pageCount: 1, inks: ["teal"] },
    ],
  });
  state.slots[0]!.reservation = "cover";
  state.slots[7]!.reservation = "cover";
  return state;
}

describe("checkedChange", () => {
  it("saves a placement while other pieces still wait in the tray", () => {
    const result = checkedChange(booklet(), { op: "place", pieceId: 1, startPage: 2 });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.changedPages).toEqual([2]);
    expect(result.summary).toBe("Placed “Moths” on page 2.");
    expect(result.check.errors.map((m) => m.code)).toEqual([
      "piece-not-placed",
      "piece-not-placed",
    ]);
  });

  it("refuses a spread starting on a right-hand (odd) page, in the engine's words", () => {
    const result = checkedChange(booklet(), { op: "place", pieceId: 2, startPage: 3 });
    expect(result).toMatchObject({ ok: false, pieceIds: [2] });
    if (result.ok) return;
    expect(result.reason).toContain("left (even) page");
  });

  it("refuses a piece on a page kept for the cover", () => {
    const result = checkedChange(booklet(), { op: "place", pieceId: 3, startPage: 8 });
    expect(result.ok).toBe(false);
  });

  it("names the pieces a removal of 4 pages would drop", () => {
    const placed = applyChange(booklet(), { op: "place", pieceId: 2, startPage: 4 });
    if (!placed.ok) throw new Error(placed.reason);
    const result = checkedChange(placed.state, { op: "resize", delta: -4, atPage: 3 });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.reason).toContain("“Kelp”");
  });
});

describe("newBlockingErrors", () => {
  it("lets errors that were already there stand, and ignores pieces waiting in the tray", () => {
    const state = booklet();
    // A hand-made double booking the engine would never produce.
    state.slots[2] = { ...state.slots[2]!, pieceId: 1, piecePageIndex: 1 };
    state.slots[3] = { ...state.slots[3]!, pieceId: 1, piecePageIndex: 1 };
    const broken = checkMap(state);
    expect(broken.errors.some((m) => m.code === "piece-page-placed-twice")).toBe(true);
    expect(newBlockingErrors(broken, broken)).toEqual([]);
    expect(newBlockingErrors(checkMap(booklet()), broken).map((m) => m.code)).toContain(
      "piece-page-placed-twice",
    );
  });
});

describe("applying a proposal", () => {
  it("puts every proposed piece on its pages as one change and leaves placed pieces alone", () => {
    const placed = applyChange(booklet(), { op: "place", pieceId: 1, startPage: 2 });
    if (!placed.ok) throw new Error(placed.reason);
    const result = applyChange(placed.state, {
      op: "apply-proposal",
      placements: [
        { pieceId: 2, pages: [4, 5] },
        { pieceId: 3, pages: [6] },
      ],
    });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.changedPages).toEqual([4, 5, 6]);
    expect(
      result.state.slots.filter((s) => s.pieceId !== null).map((s) => [s.page, s.pieceId]),
    ).toEqual([
      [2, 1],
      [4, 2],
      [5, 2],
      [6, 3],
    ]);
    expect(
      describeChange(placed.state, result.state, {
        op: "apply-proposal",
        placements: [
          { pieceId: 2, pages: [4, 5] },
          { pieceId: 3, pages: [6] },
        ],
      }),
    ).toBe("Accepted a proposal placing 2 pieces.");
  });

  it("refuses a proposal whose pages no longer fit the map", () => {
    const result = applyChange(booklet(), {
      op: "apply-proposal",
      placements: [{ pieceId: 3, pages: [1] }],
    });
    expect(result.ok).toBe(false);
  });
});
