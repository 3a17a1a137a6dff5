/**
 * Shapes of the page map: the slots of a booklet (one per reader page), the accepted pieces
 * that go into them, the rule messages a check returns, and the results of placement edits,
 * pass counts and proposals. Pure data: no React, no database.
 *
 * Names here are stable; new fields are added, never renamed.
 */
import type { Binding, PieceKind, SlotReservation } from "@/lib/domain";

export type { Binding, PieceKind, SlotReservation };

/** One reader page of the booklet. */
export interface MapSlot {
  /** Reader page number, 1 = front cover. */
  page: number;
  /** What the page is kept for (cover, contents, credits…), or null when it is free for pieces. */
  reservation: SlotReservation | null;
  /** The piece on this page, or null. */
  pieceId: number | null;
  /** Which page of that piece sits here, 1-based; null when no piece. */
  piecePageIndex: number | null;
  /** A locked slot keeps its reservation and piece; edits and proposals leave it as it is. */
  locked: boolean;
}

/** An accepted piece as the map sees it. */
export interface MapPiece {
  id: number;
  title: string;
  /** single = 1 page, spread = 2 facing pages (even left, odd right), run = pageCount pages in order. */
  kind: PieceKind;
  pageCount: number;
  /** Ink names the piece prints in, e.g. ["black", "teal"]. */
  inks: string[];
  /** Prints to the trimmed edge (matters for spreads: the centre sheet keeps both halves on one side). */
  fullBleed?: boolean;
  /** Accepted but deliberately kept out of this issue; the map does not ask to place it. */
  leftOut?: boolean;
}

/** The whole page map. */
export interface MapState {
  binding: Binding;
  /** Reader pages, covers included. */
  pageCount: number;
  /** Most pages the binding allows (e.g. from the stapler). */
  maxPages: number;
  /** Inks the press lays in one pass over a sheet side; a stencil duplicator lays 1. */
  inksPerPass: number;
  /** Inks the press has, in press order. */
  pressInks: string[];
  /** One slot per reader page, page 1 first. */
  slots: MapSlot[];
  /** The accepted pieces (placed, unplaced or left out). */
  pieces: MapPiece[];
}

export type RuleSeverity = "error" | "warning";

/** Stable codes of the page-map rules. */
export type RuleCode =
  // errors
  | "page-count-not-multiple-of-4"
  | "fold-only-page-count"
  | "over-max-pages"
  | "slots-do-not-match-pages"
  | "unknown-piece"
  | "piece-page-index-invalid"
  | "spread-not-on-facing-pages"
  | "run-out-of-order"
  | "piece-page-placed-twice"
  | "reserved-slot-holds-piece"
  | "piece-not-placed"
  | "piece-placed-partially"
  // warnings
  | "left-out-piece-placed"
  | "spread-across-sheets"
  | "ink-not-on-press"
  | "side-over-press-inks"
  | "side-needs-several-passes"
  | "page-empty";

/** One finding of the page-map check, in plain words with the numbers. */
export interface RuleMessage {
  code: RuleCode;
  severity: RuleSeverity;
  message: string;
  /** Reader pages concerned. */
  pages: number[];
  pieceIds: number[];
}

/** What `checkMap` returns. */
export interface MapCheck {
  /** True when there are no errors (warnings allowed). */
  ok: boolean;
  errors: RuleMessage[];
  warnings: RuleMessage[];
  /** Errors first, then warnings, each in page order. */
  messages: RuleMessage[];
}

/** What a reader sees opening the booklet: the cover alone, 2–3, 4–5, …, the back cover alone. */
export interface MapReaderSpread {
  /** "unpaired" only when the page count is odd or otherwise unsuitable and a page has no partner. */
  kind: "front-cover" | "spread" | "back-cover" | "unpaired";
  /** One page for a cover, [left, right] for an open spread. */
  pages: number[];
}

export type MapSheetSideName = "front" | "back";

/** One printed side of one sheet. */
export interface MapSheetSide {
  sheet: number;
  side: MapSheetSideName;
  /** Stable key, e.g. "2-front". */
  key: string;
  /** Pages on this side, left to right as seen from this side (2 for saddle stitch; 0–8 for folds). */
  pages: number[];
}

export interface MapSheet {
  /** 1 = outermost. */
  sheet: number;
  front: MapSheetSide;
  back: MapSheetSide;
  /** The centre sheet: its inside carries the one reader spread printed in one piece. */
  centre: boolean;
}

/** What `sheetSides` returns. */
export interface SheetPlan {
  binding: Binding;
  /** Reader pages asked about. */
  pageCount: number;
  /** Pages actually laid out on sheets (saddle stitch pads to a multiple of 4). */
  laidOutPages: number;
  /** Pages the padding adds (beyond pageCount). */
  paddingPages: number[];
  sheets: MapSheet[];
  /** Number of the centre sheet, null when there is none. */
  centreSheet: number | null;
  /** The reader spread printed whole on one side (saddle stitch: N/2 | N/2+1), null when none. */
  centreSpread: [number, number] | null;
  /** For fold-only: which single-sheet fold is used ("half-fold" | "tri-fold" | "one-sheet-eight"). */
  foldFormat?: string;
}

/** Why an edit was refused. Stable codes. */
export type RefusalCode =
  | "unknown-piece"
  | "piece-left-out"
  | "page-out-of-range"
  | "spread-must-start-on-even-page"
  | "slot-taken"
  | "slot-reserved"
  | "slot-locked"
  | "piece-already-placed"
  | "piece-not-placed"
  | "resize-not-a-sheet"
  | "resize-over-max-pages"
  | "resize-too-small"
  | "resize-splits-piece"
  | "resize-drops-pieces";

export interface EditRefusal {
  ok: false;
  code: RefusalCode;
  /** Plain words with the numbers, e.g. "Page 7 already holds “Moths” (page 1 of 2)." */
  reason: string;
  pages: number[];
  pieceIds: number[];
}

export interface EditDone {
  ok: true;
  state: MapState;
  /** Reader pages whose slot changed (after the edit's numbering). */
  changedPages: number[];
  /** Pieces removed from the map by a forced resize. */
  droppedPieceIds: number[];
}

/** A placement edit either returns the new state or refuses with a reason. The input is never mutated. */
export type EditResult = EditDone | EditRefusal;

export interface ResizeRequest {
  /** +4 adds one sheet's worth of pages, −4 removes one. */
  delta: 4 | -4;
  /** Adding: the new pages become atPage…atPage+3 and what was there moves back by 4.
   *  Removing: pages atPage…atPage+3 go and what follows moves forward by 4. */
  atPage: number;
  /** Removing pages that hold pieces is refused unless forced; forced, those pieces leave the map whole. */
  force?: boolean;
}

/** Inks and drum passes on one sheet side. */
export interface SidePassCount {
  sheet: number;
  side: MapSheetSideName;
  key: string;
  pages: number[];
  pieceIds: number[];
  /** Distinct inks on the side, in press order (inks the press lacks last, alphabetically). */
  inks: string[];
  /** ⌈inks ÷ inksPerPass⌉. */
  passes: number;
  /** Inks on this side that the press does not have. */
  missingInks: string[];
}

/** What `countPasses` returns. */
export interface PassCount {
  inksPerPass: number;
  copies: number;
  sides: SidePassCount[];
  /** Sum of passes over every side: runs through the press for one copy. */
  passesPerCopy: number;
  /** passesPerCopy × copies. */
  passesPerRun: number;
  /** Stencils (masters) to cut, one per ink per side; made once per run however many copies. */
  mastersPerRun: number;
  /** Sides each ink appears on, per copy. */
  sidesPerInk: Record<string, number>;
  /** Plain-words explanation of how the passes were counted. */
  explanation: string;
}

export interface ProposeOptions {
  /** Copies, for the run totals in notes (default 1). */
  copies?: number;
  /** Upper bound on improvement rounds (default 50). */
  maxImproveRounds?: number;
  /** Upper bound on search nodes for the exhaustive search on small maps (default 200 000; 0 turns it off). */
  searchBudget?: number;
  /** The exhaustive search runs only when at most this many pages are free for the proposal (default 40). */
  exactSearchMaxFreePages?: number;
}

export interface ProposedPlacement {
  pieceId: number;
  /** Reader pages the piece was put on, in piece order. */
  pages: number[];
}

export interface UnplacedPiece {
  pieceId: number;
  reason: string;
}

/** What `proposePlacement` returns. */
export interface Proposal {
  /** The proposed map (input untouched). */
  state: MapState;
  /** Passes per copy before and after the proposal. */
  passesBefore: number;
  passesAfter: number;
  placed: ProposedPlacement[];
  unplaced: UnplacedPiece[];
  /** Plain-words notes on what the proposal did and why. */
  notes: string[];
}
