/**
 * Placement edits. Each returns a new state (the input is never changed) or a refusal that
 * says why in plain words with the page numbers.
 */
import {
  emptySlot,
  pagesInWords,
  pieceLength,
  pieceName,
  piecePages,
  plural,
  slotsByPage,
} from "./state";
import type {
  EditDone,
  EditRefusal,
  EditResult,
  MapPiece,
  MapSlot,
  MapState,
  RefusalCode,
  ResizeRequest,
  SlotReservation,
} from "./types";

function refuse(
  code: RefusalCode,
  reason: string,
  pages: number[] = [],
  pieceIds: number[] = [],
): EditRefusal {
  return { ok: false, code, reason, pages, pieceIds };
}

function done(state: MapState, changedPages: number[], droppedPieceIds: number[] = []): EditDone {
  return {
    ok: true,
    state,
    changedPages: [...new Set(changedPages)].sort((a, b) => a - b),
    droppedPieceIds,
  };
}

/** Slots 1..pageCount in page order, copied; a page without a slot gets an empty one. */
function normalisedSlots(state: MapState): MapSlot[] {
  const byPage = slotsByPage(state);
  return Array.from({ length: state.pageCount }, (_, i) => ({
    ...(byPage[i + 1] ?? emptySlot(i + 1)),
  }));
}

function findPiece(state: MapState, pieceId: number): MapPiece | undefined {
  return state.pieces.find((p) => p.id === pieceId);
}

function describeSlot(state: MapState, slot: MapSlot): string {
  if (slot.pieceId !== null) {
    const piece = findPiece(state, slot.pieceId);
    const len = piece ? pieceLength(piece) : 0;
    return `${pieceName(piece, slot.pieceId)}${len > 1 ? ` (its page ${slot.piecePageIndex} of ${len})` : ""}`;
  }
  return `the ${slot.reservation}`;
}

/** Can `piece` go on startPage… in these slots? Returns the pages, or a refusal. */
function fit(
  state: MapState,
  slots: MapSlot[],
  piece: MapPiece,
  startPage: number,
): number[] | EditRefusal {
  const len = pieceLength(piece);
  const name = pieceName(piece, piece.id);
  if (!Number.isInteger(startPage) || startPage < 1 || startPage + len - 1 > state.pageCount)
    return refuse(
      "page-out-of-range",
      `${name} takes ${plural(len, "page")}; starting on page ${startPage} it would not fit in pages 1–${state.pageCount}.`,
      [startPage],
      [piece.id],
    );
  if (piece.kind === "spread" && startPage % 2 !== 0)
    return refuse(
      "spread-must-start-on-even-page",
      `${name} is a spread: it starts on a left (even) page and ends on the right (odd) page after it. Page ${startPage} is a right page; try ${startPage - 1 >= 2 ? startPage - 1 : startPage + 1}.`,
      [startPage],
      [piece.id],
    );
  const pages = Array.from({ length: len }, (_, i) => startPage + i);
  for (const p of pages) {
    const slot = slots[p - 1];
    if (!slot) return refuse("page-out-of-range", `Page ${p} is not in the map.`, [p], [piece.id]);
    if (slot.locked)
      return refuse(
        "slot-locked",
        `Page ${p} is locked; unlock it before placing ${name} there.`,
        [p],
        [piece.id],
      );
    if (slot.reservation !== null)
      return refuse(
        "slot-reserved",
        `Page ${p} is kept for the ${slot.reservation}; clear that before placing ${name} there.`,
        [p],
        [piece.id],
      );
    if (slot.pieceId !== null)
      return refuse(
        "slot-taken",
        `Page ${p} already holds ${describeSlot(state, slot)}.`,
        [p],
        [piece.id, slot.pieceId],
      );
  }
  return pages;
}

/** Puts an unplaced piece on startPage (a single on 1 page, a spread on an even page and the next, a run on consecutive pages). */
export function placePiece(state: MapState, pieceId: number, startPage: number): EditResult {
  const piece = findPiece(state, pieceId);
  if (!piece)
    return refuse(
      "unknown-piece",
      `Piece ${pieceId} is not one of the accepted pieces.`,
      [],
      [pieceId],
    );
  if (piece.leftOut)
    return refuse(
      "piece-left-out",
      `${pieceName(piece, pieceId)} is marked left out of this issue; bring it back before placing it.`,
      [],
      [pieceId],
    );
  const where = piecePages(state).get(pieceId);
  // Placed again exactly where it already is: nothing to do, and nothing refused.
  const alreadyThere =
    where !== undefined &&
    where.length === pieceLength(piece) &&
    where.every((w, i) => w.page === startPage + i && w.index === i + 1);
  if (alreadyThere) return done({ ...state, slots: normalisedSlots(state) }, []);
  if (where && where.length)
    return refuse(
      "piece-already-placed",
      `${pieceName(piece, pieceId)} is already on ${pagesInWords(where.map((w) => w.page))}; move it instead.`,
      where.map((w) => w.page),
      [pieceId],
    );
  const slots = normalisedSlots(state);
  const pages = fit(state, slots, piece, startPage);
  if (!Array.isArray(pages)) return pages;
  pages.forEach((p, i) => {
    const slot = slots[p - 1];
    if (slot) {
      slot.pieceId = pieceId;
      slot.piecePageIndex = i + 1;
    }
  });
  return done({ ...state, slots }, pages);
}

/** Takes a piece off the map (every page it is on); refused when one of its pages is locked. */
export function removePiece(state: MapState, pieceId: number): EditResult {
  const piece = findPiece(state, pieceId);
  const slots = normalisedSlots(state);
  const mine = slots.filter((s) => s.pieceId === pieceId);
  if (mine.length === 0)
    return refuse(
      "piece-not-placed",
      `${pieceName(piece, pieceId)} is not on the map.`,
      [],
      [pieceId],
    );
  const locked = mine.filter((s) => s.locked).map((s) => s.page);
  if (locked.length)
    return refuse(
      "slot-locked",
      `${pieceName(piece, pieceId)} sits on locked ${pagesInWords(locked)}; unlock first.`,
      locked,
      [pieceId],
    );
  for (const s of mine) {
    s.pieceId = null;
    s.piecePageIndex = null;
  }
  return done(
    { ...state, slots },
    mine.map((s) => s.page),
  );
}

/** Moves a placed piece so it starts on startPage; its old pages count as free for the move. */
export function movePiece(state: MapState, pieceId: number, startPage: number): EditResult {
  const piece = findPiece(state, pieceId);
  if (!piece)
    return refuse(
      "unknown-piece",
      `Piece ${pieceId} is not one of the accepted pieces.`,
      [],
      [pieceId],
    );
  const removed = removePiece(state, pieceId);
  if (!removed.ok) return removed;
  if (piece.leftOut)
    return refuse(
      "piece-left-out",
      `${pieceName(piece, pieceId)} is marked left out of this issue; bring it back before moving it.`,
      [],
      [pieceId],
    );
  const slots = removed.state.slots.map((s) => ({ ...s }));
  const pages = fit(removed.state, slots, piece, startPage);
  if (!Array.isArray(pages)) return pages;
  pages.forEach((p, i) => {
    const slot = slots[p - 1];
    if (slot) {
      slot.pieceId = pieceId;
      slot.piecePageIndex = i + 1;
    }
  });
  return done({ ...state, slots }, [...removed.changedPages, ...pages]);
}

/** Keeps a page for a cover, contents, credits… (or frees it with null). Refused on a locked page or one holding a piece. */
export function setReservation(
  state: MapState,
  page: number,
  reservation: SlotReservation | null,
): EditResult {
  const slots = normalisedSlots(state);
  const slot = slots[page - 1];
  if (!slot || !Number.isInteger(page))
    return refuse("page-out-of-range", `Page ${page} is not in pages 1–${state.pageCount}.`, [
      page,
    ]);
  if (slot.locked)
    return refuse(
      "slot-locked",
      `Page ${page} is locked; unlock it to change what it is kept for.`,
      [page],
    );
  if (reservation !== null && slot.pieceId !== null)
    return refuse(
      "slot-taken",
      `Page ${page} holds ${describeSlot(state, slot)}; move or remove it before keeping the page for the ${reservation}.`,
      [page],
      [slot.pieceId],
    );
  slot.reservation = reservation;
  return done({ ...state, slots }, [page]);
}

/** Locks (or unlocks) a page so edits and proposals leave it as it is. */
export function lockSlot(state: MapState, page: number, locked = true): EditResult {
  const slots = normalisedSlots(state);
  const slot = slots[page - 1];
  if (!slot || !Number.isInteger(page))
    return refuse("page-out-of-range", `Page ${page} is not in pages 1–${state.pageCount}.`, [
      page,
    ]);
  slot.locked = locked;
  return done({ ...state, slots }, [page]);
}

/**
 * Adds or removes one sheet's worth of pages (4) at a chosen page and renumbers what follows.
 * Four pages keep every later page on the same side (even stays even), so spreads stay spreads.
 * Adding is refused past the page limit or inside a piece; removing is refused when pieces or
 * locked pages would go, unless forced, in which case those pieces leave the map whole.
 */
export function resizeMap(state: MapState, request: ResizeRequest): EditResult {
  const { delta, atPage } = request;
  if (delta !== 4 && delta !== -4)
    return refuse(
      "resize-not-a-sheet",
      `The map grows or shrinks one folded sheet at a time, 4 pages; ${delta} is not that.`,
    );
  const slots = normalisedSlots(state);
  const n = state.pageCount;
  if (delta === 4) {
    if (!Number.isInteger(atPage) || atPage < 1 || atPage > n + 1)
      return refuse(
        "page-out-of-range",
        `New pages go in at a page from 1 to ${n + 1}; ${atPage} is outside that.`,
        [atPage],
      );
    if (n + 4 > state.maxPages)
      return refuse(
        "resize-over-max-pages",
        `Adding 4 pages makes ${n + 4}, over the ${state.maxPages} this binding allows.`,
        [],
      );
    const before = slots[atPage - 2];
    const after = slots[atPage - 1];
    if (before && after && before.pieceId !== null && before.pieceId === after.pieceId) {
      const piece = findPiece(state, before.pieceId);
      return refuse(
        "resize-splits-piece",
        `Pages ${atPage - 1} and ${atPage} both hold ${pieceName(piece, before.pieceId)}; new pages there would split it. Add them before page ${Math.min(...slots.filter((s) => s.pieceId === before.pieceId).map((s) => s.page))} or after its last page.`,
        [atPage - 1, atPage],
        [before.pieceId],
      );
    }
    const fresh = [0, 1, 2, 3].map((i) => emptySlot(atPage + i));
    const next = [
      ...slots.slice(0, atPage - 1),
      ...fresh,
      ...slots.slice(atPage - 1).map((s) => ({ ...s, page: s.page + 4 })),
    ];
    const changed: number[] = [];
    for (let p = atPage; p <= n + 4; p++) changed.push(p);
    return done({ ...state, pageCount: n + 4, slots: next }, changed);
  }
  if (n - 4 < 4)
    return refuse("resize-too-small", `A booklet needs at least 4 pages; this one has ${n}.`);
  if (!Number.isInteger(atPage) || atPage < 1 || atPage + 3 > n)
    return refuse(
      "page-out-of-range",
      `Removing 4 pages from page ${atPage} reaches past page ${n}; start at a page from 1 to ${n - 3}.`,
      [atPage],
    );
  const gone = slots.slice(atPage - 1, atPage + 3);
  const dropIds = [
    ...new Set(gone.map((s) => s.pieceId).filter((id): id is number => id !== null)),
  ].sort((a, b) => a - b);
  const locked = gone.filter((s) => s.locked).map((s) => s.page);
  const lockedElsewhere = slots
    .filter((s) => s.locked && s.pieceId !== null && dropIds.includes(s.pieceId))
    .map((s) => s.page);
  if (!request.force && dropIds.length) {
    const names = dropIds.map((id) => pieceName(findPiece(state, id), id));
    return refuse(
      "resize-drops-pieces",
      `Removing pages ${atPage}–${atPage + 3} would drop ${names.join(", ")}; move ${dropIds.length === 1 ? "it" : "them"} first, or force the removal to take ${dropIds.length === 1 ? "it" : "them"} off the map.`,
      gone.filter((s) => s.pieceId !== null).map((s) => s.page),
      dropIds,
    );
  }
  if (!request.force && (locked.length || lockedElsewhere.length))
    return refuse(
      "slot-locked",
      `Removing pages ${atPage}–${atPage + 3} touches locked ${pagesInWords([...new Set([...locked, ...lockedElsewhere])].sort((a, b) => a - b))}; unlock first or force it.`,
      [...locked, ...lockedElsewhere],
    );
  const droppedPages = slots
    .filter((s) => s.pieceId !== null && dropIds.includes(s.pieceId))
    .map((s) => s.page);
  const kept = [
    ...slots.slice(0, atPage - 1),
    ...slots.slice(atPage + 3).map((s) => ({ ...s, page: s.page - 4 })),
  ].map((s) =>
    s.pieceId !== null && dropIds.includes(s.pieceId)
      ? { ...s, pieceId: null, piecePageIndex: null }
      : s,
  );
  const changed: number[] = droppedPages.filter((p) => p < atPage);
  for (let p = atPage; p <= n - 4; p++) changed.push(p);
  return done({ ...state, pageCount: n - 4, slots: kept }, changed, dropIds);
}
