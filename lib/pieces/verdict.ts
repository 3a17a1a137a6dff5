/**
 * A piece's spec verdict: the worst finding over the current file of every page, or "missing"
 * while a page has no file yet. Pure; the review table sorts and filters by it.
 */

export const PIECE_VERDICTS = ["blocker", "missing", "warning", "note", "pass"] as const;
export type PieceVerdict = (typeof PIECE_VERDICTS)[number];

export const PIECE_VERDICT_LABELS: Record<PieceVerdict, string> = {
  blocker: "Won't print",
  missing: "Files missing",
  warning: "Needs a look",
  note: "Notes only",
  pass: "Meets the spec",
};

/**
 * Higher is worse. A missing file stops the piece going to print just as surely as a file that
 * fails the spec, but the file that fails is the one a contributor must redo, so it ranks worst.
 */
export const PIECE_VERDICT_RANK: Record<PieceVerdict, number> = {
  pass: 0,
  note: 1,
  warning: 2,
  missing: 3,
  blocker: 4,
};

export function isPieceVerdict(value: string): value is PieceVerdict {
  return (PIECE_VERDICTS as readonly string[]).includes(value);
}

/** Worst verdict over the current file of every page; "missing" while a page has no file. */
export function pieceVerdictOf(pageVerdicts: readonly (string | null)[]): PieceVerdict {
  let worst: PieceVerdict = "pass";
  for (const v of pageVerdicts) {
    const verdict: PieceVerdict =
      v === null
        ? "missing"
        : v === "blocker" || v === "warning" || v === "note" || v === "pass"
          ? v
          : "blocker";
    if (PIECE_VERDICT_RANK[verdict] > PIECE_VERDICT_RANK[worst]) worst = verdict;
  }
  return pageVerdicts.length === 0 ? "missing" : worst;
}
