/**
 * One page-map change, as the screen sends it, applied through the map engine (lib/map). Pure:
 * the map screen runs it for instant feedback and the route handler runs it again before saving.
 */
import { checkMap } from "@/lib/map/check";
import {
  lockSlot,
  movePiece,
  placePiece,
  removePiece,
  resizeMap,
  setReservation,
} from "@/lib/map/edit";
import { emptySlot, pagesInWords, pieceName, piecePages, slotsByPage } from "@/lib/map/state";
import type {
  EditRefusal,
  EditResult,
  MapCheck,
  MapSlot,
  MapState,
  RuleCode,
  RuleMessage,
} from "@/lib/map/types";
import type { MapChange } from "@/lib/validations/page-map";
import { RESERVATION_PHRASES } from "./labels";

/**
 * Errors that may stand while the map is being filled in: pieces still waiting in the tray.
 * Every other error (a page used twice, a spread off its facing pair, a run out of order, a
 * reserved page holding a piece, a page count the binding cannot take) blocks a save when a
 * change creates it.
 */
export const ALLOWED_WHILE_IN_PROGRESS: ReadonlySet<RuleCode> = new Set<RuleCode>([
  "piece-not-placed",
]);

/** Applies one change; a proposal is applied as a whole: its pieces come off, then go on where proposed. */
export function applyChange(state: MapState, change: MapChange): EditResult {
  switch (change.op) {
    case "place":
      return placePiece(state, change.pieceId, change.startPage);
    case "move":
      return movePiece(state, change.pieceId, change.startPage);
    case "remove":
      return removePiece(state, change.pieceId);
    case "reserve":
      return setReservation(state, change.page, change.reservation);
    case "lock":
      return lockSlot(state, change.page, change.locked);
    case "resize":
      return resizeMap(state, {
        delta: change.delta,
        atPage: change.atPage,
        force: change.force === true,
      });
    case "apply-proposal":
      return applyPlacements(state, change.placements);
    case "leave-out":
      return setLeftOut(state, change.pieceId, change.leftOut);
  }
}

/**
 * Marks a piece left out of this issue, or brings it back to the tray. Only a piece that is off
 * the map can be left out: a placed one is taken off first (its pages may be locked, and taking
 * it off is a change of its own in the history).
 */
export function setLeftOut(state: MapState, pieceId: number, leftOut: boolean): EditResult {
  const piece = state.pieces.find((p) => p.id === pieceId);
  if (!piece)
    return {
      ok: false,
      code: "unknown-piece",
      reason: `Piece ${pieceId} is not one of the accepted pieces.`,
      pages: [],
      pieceIds: [pieceId],
    };
  const pages = (piecePages(state).get(pieceId) ?? []).map((w) => w.page);
  if (leftOut && pages.length > 0)
    return {
      ok: false,
      code: "piece-already-placed",
      reason: `${pieceName(piece, pieceId)} is on ${pagesInWords(pages)}; take it off the map before leaving it out of this issue.`,
      pages,
      pieceIds: [pieceId],
    };
  return {
    ok: true,
    state: {
      ...state,
      pieces: state.pieces.map((p) => (p.id === pieceId ? { ...p, leftOut } : p)),
    },
    changedPages: [],
    droppedPieceIds: [],
  };
}

function applyPlacements(
  state: MapState,
  placements: { pieceId: number; pages: number[] }[],
): EditResult {
  let current = state;
  const changed = new Set<number>();
  const where = piecePages(state);
  const moved = placements.filter((p) => {
    const now = where.get(p.pieceId)?.map((w) => w.page) ?? [];
    return now.join(",") !== p.pages.join(",");
  });
  for (const p of moved) {
    if (!where.has(p.pieceId)) continue;
    const off = removePiece(current, p.pieceId);
    if (!off.ok) return off;
    current = off.state;
    off.changedPages.forEach((page) => changed.add(page));
  }
  for (const p of moved) {
    const start = p.pages[0];
    if (start === undefined) continue;
    const on = placePiece(current, p.pieceId, start);
    if (!on.ok) return on;
    const expected = p.pages.join(",");
    const got = on.changedPages.join(",");
    if (expected !== got) {
      return {
        ok: false,
        code: "page-out-of-range",
        reason: `The proposal put ${pieceName(
          state.pieces.find((x) => x.id === p.pieceId),
          p.pieceId,
        )} on ${pagesInWords(p.pages)}, but it takes ${pagesInWords(on.changedPages)}; ask for a fresh proposal.`,
        pages: p.pages,
        pieceIds: [p.pieceId],
      } satisfies EditRefusal;
    }
    current = on.state;
    on.changedPages.forEach((page) => changed.add(page));
  }
  return {
    ok: true,
    state: current,
    changedPages: [...changed].sort((a, b) => a - b),
    droppedPieceIds: [],
  };
}

/** ", sending “X” back to the tray" for pieces a forced removal took off the map. */
function droppedNote(before: MapState, after: MapState, name: (id: number) => string): string {
  const was = piecePages(before);
  const now = piecePages(after);
  const dropped = [...was.keys()].filter((id) => !now.has(id));
  return dropped.length ? `, sending ${dropped.map(name).join(", ")} back to the tray` : "";
}

function errorKey(m: RuleMessage): string {
  return m.pieceIds.length ? `${m.code}:${m.pieceIds.join(",")}` : `${m.code}:${m.pages.join(",")}`;
}

/**
 * Errors the change created that block saving: present after, absent before, and not of a kind
 * allowed while work is in progress. Keyed by piece (not page) so a resize that renumbers an old
 * problem does not count it as new.
 */
export function newBlockingErrors(before: MapCheck, after: MapCheck): RuleMessage[] {
  const old = new Set(before.errors.map(errorKey));
  return after.errors.filter(
    (m) => !ALLOWED_WHILE_IN_PROGRESS.has(m.code) && !old.has(errorKey(m)),
  );
}

/**
 * True when `after` has the same pages as `before`, each kept for the same thing, holding the
 * same page of the same piece and locked the same way, and the same pieces left out: a change
 * that leaves the map as it was. A page without a slot counts as an empty, unlocked one.
 */
export function leavesMapAsItWas(before: MapState, after: MapState): boolean {
  if (before.pageCount !== after.pageCount) return false;
  const leftOut = (s: MapState) =>
    s.pieces
      .filter((p) => p.leftOut)
      .map((p) => p.id)
      .sort((x, y) => x - y)
      .join(",");
  if (leftOut(before) !== leftOut(after)) return false;
  const was = slotsByPage(before);
  const now = slotsByPage(after);
  const same = (x: MapSlot, y: MapSlot) =>
    x.reservation === y.reservation &&
    x.pieceId === y.pieceId &&
    x.piecePageIndex === y.piecePageIndex &&
    x.locked === y.locked;
  for (let page = 1; page <= before.pageCount; page++)
    if (!same(was[page] ?? emptySlot(page), now[page] ?? emptySlot(page))) return false;
  return true;
}

export type CheckedChange =
  | {
      ok: true;
      state: MapState;
      check: MapCheck;
      changedPages: number[];
      summary: string;
      /** False when the change leaves the map as it was: nothing to save, no new version. */
      changed: boolean;
    }
  | { ok: false; reason: string; pages: number[]; pieceIds: number[] };

/** Applies a change and the save rule: refused when the engine refuses or the result has new blocking errors. */
export function checkedChange(state: MapState, change: MapChange): CheckedChange {
  const result = applyChange(state, change);
  if (!result.ok)
    return { ok: false, reason: result.reason, pages: result.pages, pieceIds: result.pieceIds };
  if (leavesMapAsItWas(state, result.state))
    return {
      ok: true,
      state,
      check: checkMap(state),
      changedPages: [],
      summary: describeNoChange(state, change),
      changed: false,
    };
  const after = checkMap(result.state);
  const blocking = newBlockingErrors(checkMap(state), after);
  if (blocking.length > 0) {
    return {
      ok: false,
      reason: `Not saved: ${blocking.map((m) => m.message).join(" ")}`,
      pages: [...new Set(blocking.flatMap((m) => m.pages))],
      pieceIds: [...new Set(blocking.flatMap((m) => m.pieceIds))],
    };
  }
  return {
    ok: true,
    state: result.state,
    check: after,
    changedPages: result.changedPages,
    summary: describeChange(state, result.state, change),
    changed: true,
  };
}

/** The answer's line for a change that leaves the map as it was. */
export function describeNoChange(state: MapState, change: MapChange): string {
  const name = (id: number) =>
    pieceName(
      state.pieces.find((p) => p.id === id),
      id,
    );
  const pagesOf = (id: number) => (piecePages(state).get(id) ?? []).map((w) => w.page);
  const why = (() => {
    switch (change.op) {
      case "place":
      case "move":
        return `${name(change.pieceId)} is already on ${pagesInWords(pagesOf(change.pieceId))}.`;
      case "reserve":
        return change.reservation === null
          ? `page ${change.page} is already free for pieces.`
          : `page ${change.page} is already kept for ${RESERVATION_PHRASES[change.reservation]}.`;
      case "lock":
        return `page ${change.page} is already ${change.locked ? "locked" : "unlocked"}.`;
      case "apply-proposal":
        return "every piece in the proposal is already where it proposes.";
      case "leave-out":
        return change.leftOut
          ? `${name(change.pieceId)} is already left out of this issue.`
          : `${name(change.pieceId)} is already in the tray.`;
      case "remove":
      case "resize":
        return "the map is as it was.";
    }
  })();
  return `Nothing changed: ${why}`;
}

/** One line for the history panel: who did what, in the map's own words. */
export function describeChange(before: MapState, after: MapState, change: MapChange): string {
  const name = (id: number) =>
    pieceName(
      before.pieces.find((p) => p.id === id),
      id,
    );
  const pagesOf = (s: MapState, id: number) => (piecePages(s).get(id) ?? []).map((w) => w.page);
  switch (change.op) {
    case "place":
      return `Placed ${name(change.pieceId)} on ${pagesInWords(pagesOf(after, change.pieceId))}.`;
    case "move":
      return `Moved ${name(change.pieceId)} from ${pagesInWords(pagesOf(before, change.pieceId))} to ${pagesInWords(pagesOf(after, change.pieceId))}.`;
    case "remove":
      return `Took ${name(change.pieceId)} off ${pagesInWords(pagesOf(before, change.pieceId))} and back to the tray.`;
    case "reserve":
      return change.reservation === null
        ? `Freed page ${change.page} for pieces.`
        : `Kept page ${change.page} for ${RESERVATION_PHRASES[change.reservation]}.`;
    case "lock":
      return change.locked ? `Locked page ${change.page}.` : `Unlocked page ${change.page}.`;
    case "resize":
      return change.delta > 0
        ? `Added 4 pages at page ${change.atPage} (now ${after.pageCount} pages).`
        : `Removed pages ${change.atPage}–${change.atPage + 3} (now ${after.pageCount} pages)${droppedNote(before, after, name)}.`;
    case "leave-out":
      return change.leftOut
        ? `Left ${name(change.pieceId)} out of this issue.`
        : `Brought ${name(change.pieceId)} back to the tray.`;
    case "apply-proposal":
      return `Accepted a proposal placing ${change.placements.length === 1 ? "1 piece" : `${change.placements.length} pieces`}.`;
  }
}
