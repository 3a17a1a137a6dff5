/** The page-map engine: pure functions over a map state (no React, no database). */
export * from "./types";
export { readerSpreads, sheetSides, allSides, foldFormatFor } from "./layout";
export { checkMap, mapErrors, severityOf } from "./check";
export { countPasses, passesForInks } from "./passes";
export { placePiece, movePiece, removePiece, setReservation, lockSlot, resizeMap } from "./edit";
export { proposePlacement } from "./propose";
export { emptyMap, emptySlot, pieceLength, piecePages, unplacedPieces, slotIsFree } from "./state";
