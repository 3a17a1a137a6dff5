import { describe, expect, it } from "vitest";
import {
  checkMap,
  lockSlot,
  movePiece,
  placePiece,
  removePiece,
  resizeMap,
  setReservation,
} from "@/lib/map";
import type { EditResult, MapState } from "@/lib/map";
import { map, run, single, spread } from "./fixtures";

function ok(r: EditResult): MapState {
  if (!r.ok) throw new Error(`refused: ${r.reason}`);
  return r.state;
}
function pieceOn(state: MapState): Array<number | null> {
  return state.slots.map((s) => s.pieceId);
}

const pieces = [
  single(1, ["black"]),
  spread(2, ["teal"]),
  run(3, 3, ["red"]),
  single(4, ["black"], { leftOut: true }),
];

describe("placing pieces", () => {
  it("a single takes one page; a spread an even page and the next; a run consecutive pages in order", () => {
    let s = map(12, pieces);
    s = ok(placePiece(s, 1, 1));
    s = ok(placePiece(s, 2, 4));
    s = ok(placePiece(s, 3, 7));
    expect(pieceOn(s)).toEqual([1, null, null, 2, 2, null, 3, 3, 3, null, null, null]);
    expect(s.slots.slice(6, 9).map((x) => x.piecePageIndex)).toEqual([1, 2, 3]);
    expect(checkMap(s).errors.map((e) => e.code)).toEqual([]);
  });

  it("refuses a spread on an odd page, an occupied or reserved or locked page, and pages past the end", () => {
    const s = ok(placePiece(map(12, pieces), 1, 5));
    const odd = placePiece(s, 2, 3);
    expect(odd.ok ? null : odd.code).toBe("spread-must-start-on-even-page");
    const taken = placePiece(s, 2, 4);
    expect(taken.ok ? null : [taken.code, taken.pages, taken.reason]).toEqual([
      "slot-taken",
      [5],
      "Page 5 already holds “Piece 1”.",
    ]);
    const reserved = ok(setReservation(s, 2, "contents"));
    const r = placePiece(reserved, 2, 2);
    expect(r.ok ? null : r.code).toBe("slot-reserved");
    const locked = ok(lockSlot(s, 9));
    const l = placePiece(locked, 3, 8);
    expect(l.ok ? null : [l.code, l.pages]).toEqual(["slot-locked", [9]]);
    const end = placePiece(s, 3, 11);
    expect(end.ok ? null : end.code).toBe("page-out-of-range");
  });

  it("refuses a left-out piece, an unknown piece and placing one twice", () => {
    const s = ok(placePiece(map(12, pieces), 1, 5));
    expect((placePiece(s, 4, 1) as { code?: string }).code).toBe("piece-left-out");
    expect((placePiece(s, 99, 1) as { code?: string }).code).toBe("unknown-piece");
    expect((placePiece(s, 1, 2) as { code?: string }).code).toBe("piece-already-placed");
  });

  it("moves a run onto pages that overlap its own old ones, and removes it", () => {
    let s = ok(placePiece(map(12, pieces), 3, 2));
    const moved = movePiece(s, 3, 3);
    s = ok(moved);
    expect(pieceOn(s).slice(0, 6)).toEqual([null, null, 3, 3, 3, null]);
    expect(moved.ok && moved.changedPages).toEqual([2, 3, 4, 5]);
    s = ok(removePiece(s, 3));
    expect(pieceOn(s).every((x) => x === null)).toBe(true);
    expect((removePiece(s, 3) as { code?: string }).code).toBe("piece-not-placed");
  });

  it("refuses to move or remove a piece on a locked page; never changes its input", () => {
    const s = ok(lockSlot(ok(placePiece(map(12, pieces), 1, 5)), 5));
    const before = JSON.stringify(s);
    expect((movePiece(s, 1, 6) as { code?: string }).code).toBe("slot-locked");
    expect((removePiece(s, 1) as { code?: string }).code).toBe("slot-locked");
    expect((setReservation(s, 5, null) as { code?: string }).code).toBe("slot-locked");
    expect(JSON.stringify(s)).toBe(before);
  });

  it("refuses to reserve a page that holds a piece; clears a reservation", () => {
    const s = ok(placePiece(map(12, pieces), 1, 5));
    expect((setReservation(s, 5, "credits") as { code?: string }).code).toBe("slot-taken");
    const r = ok(setReservation(s, 12, "colophon"));
    expect(r.slots[11]?.reservation).toBe("colophon");
    expect(ok(setReservation(r, 12, null)).slots[11]?.reservation).toBeNull();
  });
});

describe("resizing by one sheet", () => {
  it("adding 4 pages at page 5 shifts what follows by 4, keeping spreads on even|odd", () => {
    let s = ok(placePiece(map(8, pieces), 2, 6));
    s = ok(placePiece(s, 1, 1));
    const r = resizeMap(s, { delta: 4, atPage: 5 });
    const next = ok(r);
    expect(next.pageCount).toBe(12);
    expect(pieceOn(next)).toEqual([1, null, null, null, null, null, null, null, null, 2, 2, null]);
    expect(next.slots.map((x) => x.page)).toEqual(Array.from({ length: 12 }, (_, i) => i + 1));
    expect(checkMap(next).errors.map((e) => e.code)).toEqual(["piece-not-placed"]); // the run is still unplaced
  });

  it("refuses to add past the page limit, inside a piece, or anything but ±4", () => {
    const s = ok(placePiece(map(8, pieces, { maxPages: 8 }), 2, 4));
    expect((resizeMap(s, { delta: 4, atPage: 1 }) as { code?: string }).code).toBe(
      "resize-over-max-pages",
    );
    const roomy = { ...s, maxPages: 40 };
    const split = resizeMap(roomy, { delta: 4, atPage: 5 });
    expect(split.ok ? null : [split.code, split.pieceIds]).toEqual(["resize-splits-piece", [2]]);
    expect((resizeMap(roomy, { delta: 2 as 4, atPage: 1 }) as { code?: string }).code).toBe(
      "resize-not-a-sheet",
    );
  });

  it("refuses a removal that drops placed pieces, naming them, unless forced; forced, the whole piece leaves", () => {
    let s = map(12, pieces);
    s = ok(placePiece(s, 3, 4)); // pages 4–6
    s = ok(placePiece(s, 1, 11));
    const refused = resizeMap(s, { delta: -4, atPage: 6 });
    expect(refused.ok).toBe(false);
    if (!refused.ok) {
      expect(refused.code).toBe("resize-drops-pieces");
      expect(refused.pieceIds).toEqual([3]);
      expect(refused.reason).toContain("“Run 3”");
    }
    const forced = resizeMap(s, { delta: -4, atPage: 6, force: true });
    const next = ok(forced);
    expect(next.pageCount).toBe(8);
    expect(pieceOn(next)).toEqual([null, null, null, null, null, null, 1, null]);
    expect(forced.ok && forced.droppedPieceIds).toEqual([3]);
    // Removing empty pages needs no force.
    expect(ok(resizeMap(s, { delta: -4, atPage: 7 })).slots.map((x) => x.pieceId)).toEqual([
      null,
      null,
      null,
      3,
      3,
      3,
      1,
      null,
    ]);
  });

  it("refuses to shrink below 4 pages and ranges past the end", () => {
    expect((resizeMap(map(4, []), { delta: -4, atPage: 1 }) as { code?: string }).code).toBe(
      "resize-too-small",
    );
    expect((resizeMap(map(8, []), { delta: -4, atPage: 6 }) as { code?: string }).code).toBe(
      "page-out-of-range",
    );
  });
});
