/**
 * How an anthology moves through its stages (planning → call open → call closed → laying out →
 * printing → wrapped up) and when its open call takes work. Pure: the route handlers gather the
 * facts, these rules decide.
 */
import {
  ANTHOLOGY_STAGES,
  PIECE_KIND_LABELS,
  STAGE_LABELS,
  type AnthologyStage,
  type PieceKind,
  type PrintMethod,
} from "@/lib/domain";
import { specOf, specProblems } from "@/lib/print/spec";

/** The dates of a call: UTC instants. */
export interface CallWindow {
  opensAt: Date;
  closesAt: Date;
}

/**
 * True when the call takes submissions: the anthology is at "call open" and `now` is between the
 * opening (inclusive) and the closing (exclusive). Uploads are refused otherwise.
 */
export function isCallOpen(
  call: CallWindow | null | undefined,
  anthologyStage: AnthologyStage,
  now: Date,
): boolean {
  if (!call || anthologyStage !== "call-open") return false;
  const t = now.getTime();
  return call.opensAt.getTime() <= t && t < call.closesAt.getTime();
}

/** What a visitor of the public call page sees. */
export type CallPhase = "unpublished" | "upcoming" | "open" | "closed";

/**
 * "unpublished" before the call is opened (the public page is a 404), "upcoming" when opened
 * ahead of its opening date, "open" while it takes work, "closed" after its closing date or once
 * the anthology has moved past the call.
 */
export function callPhase(
  call: CallWindow | null | undefined,
  anthologyStage: AnthologyStage,
  now: Date,
): CallPhase {
  if (!call || stageIndex(anthologyStage) < stageIndex("call-open")) return "unpublished";
  if (anthologyStage !== "call-open") return "closed";
  if (now.getTime() < call.opensAt.getTime()) return "upcoming";
  return isCallOpen(call, anthologyStage, now) ? "open" : "closed";
}

export function stageIndex(stage: AnthologyStage): number {
  return ANTHOLOGY_STAGES.indexOf(stage);
}

/** The stage after this one, or null at the end. Stages only move forward, one at a time. */
export function nextStage(stage: AnthologyStage): AnthologyStage | null {
  return ANTHOLOGY_STAGES[stageIndex(stage) + 1] ?? null;
}

/** The open call as the stage rules need it (a draft may be incomplete). */
export interface CallDraft extends CallWindow {
  theme: string;
  brief: string;
  allowedKinds: PieceKind[];
  allowedInks: string[];
  rightsAsked: string;
}

/** Everything the stage rules look at. */
export interface StageFacts {
  stage: AnthologyStage;
  anthology: {
    trimWidthMm: number;
    trimHeightMm: number;
    bleedMm: number;
    safeMarginMm: number;
    minPpi: number;
    printMethod: PrintMethod;
    inks: string[];
  };
  call: CallDraft | null;
  /** Pieces in the book (accepted) and pieces nobody has read yet. */
  pieces: { accepted: number; awaitingReview: number };
  /** What is still open on the page map, for the move to printing (gathered by the caller). */
  layout?: LayoutFacts;
  now: Date;
}

/** The page map's loose ends: what a move to printing leaves behind. */
export interface LayoutFacts {
  /** Pages neither holding a piece nor kept for something (a cover, the credits, a blank). */
  emptyPages: number[];
  /** Accepted pieces neither on the map nor left out of this issue. */
  unplacedPieces: number;
  /** Pieces in this issue whose current files do not meet the spec (won't print, missing, needs a look). */
  piecesNotPassing: number;
}

/** "pages 3, 4 and 7", "page 5". */
function pagesText(pages: readonly number[]): string {
  if (pages.length === 1) return `page ${pages[0]}`;
  return `pages ${pages.slice(0, -1).join(", ")} and ${pages[pages.length - 1]}`;
}

/** What is still open on the map before printing: cautions, since an editor may print anyway. */
export function layoutCautions(layout: LayoutFacts): string[] {
  const out: string[] = [];
  const { emptyPages, unplacedPieces, piecesNotPassing } = layout;
  if (emptyPages.length > 0)
    out.push(
      `${emptyPages.length === 1 ? "1 page is" : `${emptyPages.length} pages are`} still empty on the page map (${pagesText(emptyPages)}); ${emptyPages.length === 1 ? "it" : "they"} would print blank.`,
    );
  if (unplacedPieces > 0)
    out.push(
      `${unplacedPieces === 1 ? "1 accepted piece is" : `${unplacedPieces} accepted pieces are`} not on the page map yet.`,
    );
  if (piecesNotPassing > 0)
    out.push(
      `${piecesNotPassing === 1 ? "1 piece has files" : `${piecesNotPassing} pieces have files`} that do not meet the print spec yet (won't print, missing or needing a look).`,
    );
  return out;
}

/** What stops a move (problems) and what the editor should know before making it (cautions). */
export interface StageMoveReview {
  from: AnthologyStage;
  to: AnthologyStage;
  problems: string[];
  cautions: string[];
}

/** Checks a move to `target`: only the next stage, and only once what it needs exists. */
export function reviewStageMove(
  facts: StageFacts,
  target: AnthologyStage,
  formatDate: (d: Date) => string = (d) => d.toISOString(),
): StageMoveReview {
  const review: StageMoveReview = { from: facts.stage, to: target, problems: [], cautions: [] };
  const next = nextStage(facts.stage);
  if (target === facts.stage) {
    review.problems.push(`The anthology is already at "${STAGE_LABELS[target]}".`);
    return review;
  }
  if (target !== next) {
    review.problems.push(
      next
        ? `Stages move one step forward: after "${STAGE_LABELS[facts.stage]}" comes "${STAGE_LABELS[next]}".`
        : `"${STAGE_LABELS[facts.stage]}" is the last stage.`,
    );
    return review;
  }
  const { call, now } = facts;
  switch (target) {
    case "call-open": {
      if (!call) {
        review.problems.push("Write and save the open call first.");
        break;
      }
      if (!call.theme.trim()) review.problems.push("The call needs a theme.");
      if (!call.brief.trim()) review.problems.push("The call needs a brief.");
      if (call.closesAt.getTime() <= call.opensAt.getTime())
        review.problems.push("The call must close after it opens.");
      else if (call.closesAt.getTime() <= now.getTime())
        review.problems.push(
          `The closing date (${formatDate(call.closesAt)}) has passed: set a later one before opening the call.`,
        );
      if (call.allowedKinds.length === 0)
        review.problems.push("Say what a piece may be (one page, a spread or a run of pages).");
      if (call.allowedInks.length === 0) review.problems.push("Allow at least one ink.");
      const unknown = call.allowedInks.filter(
        (ink) => !facts.anthology.inks.some((i) => i.toLowerCase() === ink.toLowerCase()),
      );
      if (unknown.length)
        review.problems.push(
          `The call allows ${unknown.join(", ")}, which the anthology does not print with (${facts.anthology.inks.join(", ")}).`,
        );
      if (!call.rightsAsked.trim()) review.problems.push("Say which rights you ask for.");
      for (const problem of specProblems(specOf(facts.anthology)))
        review.problems.push(`Print spec: ${problem}`);
      if (review.problems.length === 0 && call.opensAt.getTime() > now.getTime())
        review.cautions.push(
          `The public page goes up now and takes work from ${formatDate(call.opensAt)}.`,
        );
      break;
    }
    case "call-closed": {
      if (call && now.getTime() < call.closesAt.getTime())
        review.cautions.push(
          `The call is due to close on ${formatDate(call.closesAt)}; closing it now stops submissions early.`,
        );
      break;
    }
    case "laying-out": {
      if (facts.pieces.accepted === 0)
        review.problems.push("Accept at least one piece before laying out the pages.");
      if (facts.pieces.awaitingReview > 0)
        review.cautions.push(
          `${facts.pieces.awaitingReview} ${facts.pieces.awaitingReview === 1 ? "piece still waits" : "pieces still wait"} for a read.`,
        );
      break;
    }
    case "printing": {
      if (facts.layout) review.cautions.push(...layoutCautions(facts.layout));
      break;
    }
    case "wrapped-up":
    case "planning":
      break;
  }
  return review;
}

/** The kinds a call allows, in plain words: "One page, two-page spread or run of up to 4 pages". */
export function kindsText(kinds: readonly PieceKind[], maxRunPages: number): string {
  const words = kinds.map((kind, n) => {
    const label = kind === "run" ? `run of up to ${maxRunPages} pages` : PIECE_KIND_LABELS[kind];
    return n === 0 ? label : label.charAt(0).toLowerCase() + label.slice(1);
  });
  if (words.length <= 1) return words[0] ?? "";
  return `${words.slice(0, -1).join(", ")} or ${words.at(-1)}`;
}
