/**
 * The shapes the print-file builders take and give back. The builders (lib/print/pdf/*) are pure:
 * they are handed page art as bytes, one page at a time through `load`, and return PDF bytes. The
 * print worker (server/print/*) gathers the map, the files and the spec, and stores the result.
 *
 * Conventions: millimetres throughout; a sheet is given portrait and laid landscape when the spread
 * needs it; sides are listed in print order (sheet 1 front, sheet 1 back, sheet 2 front, ...), each
 * side's pages left to right as seen from that side (lib/print/imposition.ts).
 */

/** Page art ready to place. The server converts anything that is not one of these once, with sharp. */
export interface ArtBytes {
  bytes: Uint8Array;
  format: "jpeg" | "png" | "pdf";
}

/** What goes on one page of the booklet. */
export type PageContent =
  /** A piece's page (or one ink's separation of it), loaded only when it is placed. */
  | { kind: "art"; load: () => Promise<ArtBytes>; title: string; credit: string | null }
  /** A page set in type: the credits page or the colophon. */
  | { kind: "text"; heading: string; lines: string[] }
  /** Left empty on purpose (a blank the map has, or padding), or empty in this ink. */
  | { kind: "blank" };

/** One reader page on a sheet side. */
export interface PlacedPage {
  /** Reader page number, 1 = front cover. */
  page: number;
  content: PageContent;
}

/** One printed side of one sheet, pages left to right as seen from that side. */
export interface SideInput {
  sheet: number;
  side: "front" | "back";
  pages: PlacedPage[];
  /** Slug-line note for the stock, e.g. "cover stock 250 gsm"; null for the text paper. */
  stockNote: string | null;
}

/** A press sheet, given portrait. */
export interface PressSheet {
  name: string;
  widthMm: number;
  heightMm: number;
}

/** Everything the imposed print PDF is made from. */
export interface ImposeInput {
  title: string;
  trimWidthMm: number;
  trimHeightMm: number;
  bleedMm: number;
  sheet: PressSheet;
  /** In print order; one PDF page per side. */
  sides: SideInput[];
  /** Push-out per sheet, outermost first (lib/print/creep.ts bookletCreepMm); each page moves toward the spine by it. */
  creepMm: number[];
  /** The ink these masters are for (slug line), or null for a composite print file. */
  ink: string | null;
  /**
   * Crop marks, fold marks and the slug line outside the bleed (default true). Without them the
   * spread + bleed alone must fit, e.g. an A5 booklet printed edge to edge on A4 with no bleed.
   */
  marks?: boolean;
  /** Inset from the trim that text pages are set inside (default 0.25 in, lib/print/pdf/draw.ts). */
  safeMarginMm?: number;
  /** Called after each page is placed: pages placed so far of all pages. */
  onProgress?: (done: number, total: number) => void | Promise<void>;
}

/** A reader spread of the proof: the cover alone, 2–3, …, the back cover alone. */
export interface ProofSpread {
  pages: PlacedPage[];
}

export interface ProofInput {
  title: string;
  trimWidthMm: number;
  trimHeightMm: number;
  bleedMm: number;
  spreads: ProofSpread[];
  /** Inset from the trim that text pages are set inside (default 0.25 in, lib/print/pdf/draw.ts). */
  safeMarginMm?: number;
  onProgress?: (done: number, total: number) => void | Promise<void>;
}

/** A finished PDF. */
export interface ProducedPdf {
  bytes: Uint8Array;
  pageCount: number;
}
