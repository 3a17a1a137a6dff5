/** What the print-file routes answer; shared by the route handlers and the print screen. */
import type { PrintOutputKind, PrintOutputState } from "@/lib/domain";
import type { Preflight, PreflightEntry } from "@/lib/print/preflight";
import type { PressSheetChoice } from "@/lib/print/press-sheet";
import type { ErrorAnswer } from "./errors";

export type { Preflight, PreflightEntry, PressSheetChoice };

/** One produced (or producing) file. Times are ISO 8601 in UTC. */
export interface PrintOutputView {
  id: number;
  kind: PrintOutputKind;
  ink: string | null;
  state: PrintOutputState;
  mapVersion: number;
  sheetName: string | null;
  pagesDone: number;
  pagesTotal: number;
  fileName: string | null;
  sizeBytes: number | null;
  pageCount: number | null;
  /** Set when the map or a file it used changed after it was made. */
  staleAt: string | null;
  error: string | null;
  createdAt: string;
  finishedAt: string | null;
  /** Where a finished file downloads from; null until it is done. */
  downloadUrl: string | null;
}

/** GET /api/anthologies/<slug>/print-files */
export interface PrintFilesAnswer {
  mapVersion: number;
  preflight: Preflight;
  /** Named sheets that suit the trim; the first is the default. */
  sheets: PressSheetChoice[];
  defaultSheetId: string | null;
  /** The smallest custom sheet that holds the layout, its bleed and marks. */
  neededSheetMm: { widthMm: number; heightMm: number };
  /** Whether the signed-in person may produce (print:produce). */
  canProduce: boolean;
  /** Newest first. */
  outputs: PrintOutputView[];
}

/** POST /api/anthologies/<slug>/print-files, 202 */
export interface ProduceAnswer {
  outputs: PrintOutputView[];
}

/** POST refused with 409 while the preflight has blockers. */
export interface ProduceRefusedAnswer extends ErrorAnswer {
  preflight: PreflightEntry[];
}
