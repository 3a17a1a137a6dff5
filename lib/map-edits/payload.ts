/** What the page-map route handlers answer; shared by the handlers and the map screen. */
import type { Binding, PieceStatus, PrintMethod } from "@/lib/domain";
import type { MapCheck, MapState, PassCount, Proposal } from "@/lib/map/types";

/** A piece as the map screen lists it: the engine's fields plus who made it. */
export interface MapPieceCard {
  id: number;
  contributorName: string;
  status: PieceStatus;
  /**
   * Each page's current artwork preview (the editor thumbnail route) and its description, page 1
   * first; absent for viewers who may not see pieces (finishers), null where a page has no preview.
   */
  art?: MapPageArt[];
}

/** One page of a piece as the map shows it. */
export interface MapPageArt {
  pageIndex: number;
  thumbnailUrl: string | null;
  altText: string | null;
}

export interface MapEventView {
  id: number;
  mapVersion: number;
  action: string;
  summary: string;
  actorName: string;
  at: string;
}

export interface MapPayload {
  anthology: {
    id: number;
    slug: string;
    title: string;
    binding: Binding;
    printMethod: PrintMethod;
    paperCaliperMm: number;
    coverStock: "self" | "separate";
    /** Copies the editor plans to print, kept with the anthology; the default pass figures use it. */
    plannedCopies: number;
  };
  version: number;
  state: MapState;
  cards: MapPieceCard[];
  check: MapCheck;
  passes: PassCount;
  /** Push-out of every sheet at the fore-edge, outermost first (lib/print/creep, linear model). */
  creepMm: number[];
  events: MapEventView[];
  canEdit: boolean;
}

/**
 * A saved change: the fresh map and the one-line summary written to the history. A change that
 * left the map as it was (`changed: false`) saved nothing: same version, no history entry, and a
 * summary that says so.
 */
export interface MapChangeAnswer extends MapPayload {
  summary: string;
  changed: boolean;
}

/** A refused change: why, the pages and pieces concerned; with 409 also the fresh map. */
export interface MapRefusalAnswer {
  error: string;
  pages?: number[];
  pieceIds?: number[];
  map?: MapPayload;
}

export interface ProposalAnswer {
  /** The version the proposal was computed against; accepting it sends this version back. */
  version: number;
  copies: number;
  proposal: Proposal;
  check: MapCheck;
  passes: PassCount;
}

export interface PlannedCopiesAnswer {
  copies: number;
}

/** One contributor a page notice would go to, named as the viewer may see them (never an address they may not). */
export interface NoticePreviewEntry {
  contributorName: string;
  pieces: { title: string; pages: number[] }[];
  /** This notice, for these pages, went out before: sending again skips them. */
  alreadySent: boolean;
  /** False when the account has no address to send to. */
  hasAddress: boolean;
}

/** What "E-mail contributors their pages" would send, before anything is sent. */
export interface NoticesPreviewAnswer {
  contributors: NoticePreviewEntry[];
  toSend: number;
  alreadySent: number;
}

export interface NoticesAnswer {
  sent: number;
  alreadySent: number;
  failed: number;
  contributors: number;
}
