/** What PATCH /api/anthologies/[slug]/spec answers; shared by the route handler and the spec screen. */
import type { Verdict } from "@/lib/print/check";
import type { SpecImpact } from "@/lib/print/spec-change";
import type { ErrorAnswer } from "./errors";

export type { SpecImpact };

/** One current file whose verdict the re-check changed. */
export interface RecheckedFile {
  versionId: number;
  pieceId: number;
  pieceTitle: string;
  pageIndex: number;
  /** The ink of a separation; null for a page's composite file. */
  ink: string | null;
  fileName: string;
  before: string;
  after: Verdict;
}

/** What checking every current file again against the new spec found. */
export interface RecheckSummary {
  /** Files checked again. */
  checked: number;
  /** Files that did not fail before and fail now. */
  nowFailing: number;
  /** Files whose bytes could not be fetched from the file host; they keep their old report. */
  notChecked: number;
  /** Every file whose verdict changed, in piece and page order. */
  changed: RecheckedFile[];
}

/** 200: the spec is saved; what it changed, and the re-check of the current files. */
export interface SpecSavedAnswer {
  saved: true;
  impacts: SpecImpact[];
  recheck: RecheckSummary;
}

/**
 * 409: not saved. "changes" when something would break (the refusals among the impacts say what);
 * "confirmation" when the editor must confirm the warnings and send the change again with
 * `confirm: true`.
 */
export interface SpecNotSavedAnswer extends ErrorAnswer {
  saved: false;
  needs: "changes" | "confirmation";
  impacts: SpecImpact[];
}
