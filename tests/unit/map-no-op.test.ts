// Changes that leave the page map as it was, worked on an 8-page saddle-stitched booklet with
// covers kept on pages 1 and 8: the save rule answers them without a new version.
import { describe, expect, it } from "vitest";
import { emptyMap } from "@/lib/map/state";
import type { MapState } from "@/lib/map/types";
import { applyChange, checkedChange, leavesMapAsItWas } from "@/lib/map-edits/apply";
import type { MapChange } from "@/lib/validations/page-map";

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

function after(state: MapState, change: MapChange): MapState {
  const result = applyChange(state, change);
  if (!result.ok) throw new Error(result.reason);
  return result.state;
}

/** Moths on page 2, Kelp on 4–5, page 6 locked. */
function laidOut(): MapState {
  let s = booklet();
  s = after(s, { op: "place", pieceId: 1, startPage: 2 });
  s = after(s, { op: "place", pieceId: 2, startPage: 4 });
  return after(s, { op: "lock", page: 6, locked: true });
}

describe("leavesMapAsItWas", () => {
  it("is true for the same slots, also when a page's slot is missing and the other is empty", () => {
    const s = laidOut();
    expect(leavesMapAsItWas(s, structuredClone(s))).toBe(true);
    const sparse = { ...s, slots: s.slots.filter((x) => x.page !== 7) };
    expect(leavesMapAsItWas(s, sparse)).toBe(true);
  });

  it("is false when any page differs in piece, page of the piece, reservation, lock or count", () => {
    const s = laidOut();
    const edits: ((x: MapState) => void)[] = [
      (x) => (x.slots[2]!.pieceId = 3),
      (x) => (x.slots[4]!.piecePageIndex = 1),
      (x) => (x.slots[6]!.reservation = "colophon"),
      (x) => (x.slots[6]!.locked = true),
      (x) => (x.pageCount = 12),
    ];
    for (const edit of edits) {
      const changed = structuredClone(s);
      edit(changed);
      expect(leavesMapAsItWas(s, changed)).toBe(false);
    }
  });
});

describe("checkedChange of a change that changes nothing", () => {
  const same: [MapChange, string][] = [
    [
      { op: "place", pieceId: 2, startPage: 4 },
      "Nothing changed: “Kelp” is already on pages 4 and 5.",
    ],
    [{ op: "move", pieceId: 1, startPage: 2 }, "Nothing changed: “Moths” is already on page 2."],
    [{ op: "lock", page: 6, locked: true }, "Nothing changed: page 6 is already locked."],
    [{ op: "lock", page: 3, locked: false }, "Nothing changed: page 3 is already unlocked."],
    [
      { op: "reserve", page: 1, reservation: "cover" },
      "Nothing changed: page 1 is already kept for the cover.",
    ],
    [
      { op: "reserve", page: 7, reservation: null },
      "Nothing changed: page 7 is already free for pieces.",
    ],
    [
      { op: "apply-proposal", placements: [{ pieceId: 1, pages: [2] }] },
      "Nothing changed: every piece in the proposal is already where it proposes.",
    ],
  ];

  it.each(same)("%o is answered as unchanged, with the map as it was", (change, summary) => {
    const s = laidOut();
    const result = checkedChange(s, change);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.changed).toBe(false);
    expect(result.changedPages).toEqual([]);
    expect(result.summary).toBe(summary);
    expect(leavesMapAsItWas(s, result.state)).toBe(true);
  });

  it("still counts a real change as one", () => {
    const result = checkedChange(laidOut(), { op: "lock", page: 3, locked: true });
    expect(result).toMatchObject({ ok: true, changed: true, changedPages: [3] });
  });

  it("still refuses placing a piece on other pages than the ones it is on", () => {
    const result = checkedChange(laidOut(), { op: "place", pieceId: 1, startPage: 3 });
    expect(result.ok).toBe(false);
  });
});
