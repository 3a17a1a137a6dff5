// Leaving a piece out of this issue through the map's change route: the piece leaves the tray and
// the rules, a placed piece must come off the map first, and it can be brought back. Worked on an
// 8-page saddle-stitched booklet with its covers kept on pages 1 and 8.
import { describe, expect, it } from "vitest";
import { checkMap } from "@/lib/map/check";
import { emptyMap, unplacedPieces } from "@/lib/map/state";
import type { MapState } from "@/lib/map/types";
import { checkedChange } from "@/lib/map-edits/apply";
import { mapChangeSchema } from "@/lib/validations/page-map";

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
    ],
  });
  state.slots[0]!.reservation = "cover";
  state.slots[7]!.reservation = "cover";
  return state;
}

const unplacedMessages = (state: MapState) =>
  checkMap(state).messages.filter((m) => m.code === "piece-not-placed");

describe("leave-out change", () => {
  it("is a change the route accepts", () => {
    expect(mapChangeSchema.parse({ op: "leave-out", pieceId: 2, leftOut: true })).toEqual({
      op: "leave-out",
      pieceId: 2,
      leftOut: true,
    });
    expect(mapChangeSchema.safeParse({ op: "leave-out", pieceId: 2 }).success).toBe(false);
  });

  it("takes an unplaced piece out of the tray and the rules, saying so for the history", () => {
    const before = booklet();
    expect(unplacedMessages(before).map((m) => m.pieceIds)).toEqual([[1], [2]]);
    const result = checkedChange(before, { op: "leave-out", pieceId: 2, leftOut: true });
    expect(result).toMatchObject({ ok: true, changed: true, changedPages: [] });
    if (!result.ok) return;
    expect(result.summary).toBe("Left “Kelp” out of this issue.");
    expect(unplacedPieces(result.state).map((p) => p.id)).toEqual([1]);
    expect(unplacedMessages(result.state).map((m) => m.pieceIds)).toEqual([[1]]);
    expect(result.state.pieces.find((p) => p.id === 2)?.leftOut).toBe(true);
  });

  it("brings a left-out piece back to the tray, where the rules ask to place it again", () => {
    const out = checkedChange(booklet(), { op: "leave-out", pieceId: 2, leftOut: true });
    if (!out.ok) throw new Error(out.reason);
    const back = checkedChange(out.state, { op: "leave-out", pieceId: 2, leftOut: false });
    expect(back).toMatchObject({ ok: true, changed: true });
    if (!back.ok) return;
    expect(back.summary).toBe("Brought “Kelp” back to the tray.");
    expect(unplacedPieces(back.state).map((p) => p.id)).toEqual([1, 2]);
  });

  it("refuses to leave out a placed piece until it is taken off the map", () => {
    const placed = checkedChange(booklet(), { op: "place", pieceId: 2, startPage: 4 });
    if (!placed.ok) throw new Error(placed.reason);
    const result = checkedChange(placed.state, { op: "leave-out", pieceId: 2, leftOut: true });
    expect(result).toMatchObject({ ok: false, pages: [4, 5], pieceIds: [2] });
    if (result.ok) return;
    expect(result.reason).toBe(
      "“Kelp” is on pages 4 and 5; take it off the map before leaving it out of this issue.",
    );
  });

  it("saves nothing for a piece already left out, or already in the tray", () => {
    const out = checkedChange(booklet(), { op: "leave-out", pieceId: 1, leftOut: true });
    if (!out.ok) throw new Error(out.reason);
    const again = checkedChange(out.state, { op: "leave-out", pieceId: 1, leftOut: true });
    expect(again).toMatchObject({
      ok: true,
      changed: false,
      summary: "Nothing changed: “Moths” is already left out of this issue.",
    });
    const inTray = checkedChange(booklet(), { op: "leave-out", pieceId: 1, leftOut: false });
    expect(inTray).toMatchObject({
      ok: true,
      changed: false,
      summary: "Nothing changed: “Moths” is already in the tray.",
    });
  });

  it("refuses a piece the map does not know", () => {
    expect(checkedChange(booklet(), { op: "leave-out", pieceId: 9, leftOut: true })).toMatchObject({
      ok: false,
      pieceIds: [9],
    });
  });

  it("refuses placing a left-out piece until it is brought back", () => {
    const out = checkedChange(booklet(), { op: "leave-out", pieceId: 1, leftOut: true });
    if (!out.ok) throw new Error(out.reason);
    expect(checkedChange(out.state, { op: "place", pieceId: 1, startPage: 2 })).toMatchObject({
      ok: false,
    });
  });
});
