/**
 * Accepting a piece into the book is a promise to print it. A piece with no files, with pages
 * still waiting for a file, or with a file whose spec report has a blocker cannot print as it
 * is; the editor is warned with the reason and may still accept it (a fix can follow).
 */
import type { PieceVerdict } from "./verdict";

export type AcceptFacts = {
  title: string;
  verdict: PieceVerdict | string;
  pageCount: number;
  /** Pages that have a current file. */
  pagesWithFiles: number;
};

/** Why accepting this piece needs the editor's confirmation, or null when it can print. */
export function acceptWarning(piece: AcceptFacts): string | null {
  const name = `“${piece.title}”`;
  if (piece.pagesWithFiles === 0)
    return `${name} has no files yet, so nothing of it can go to print.`;
  if (piece.verdict === "missing" || piece.pagesWithFiles < piece.pageCount) {
    const waiting = Math.max(piece.pageCount - piece.pagesWithFiles, 1);
    return `${name} still has ${waiting} of ${piece.pageCount} pages without a file.`;
  }
  if (piece.verdict === "blocker")
    return `${name} has a file that won't print as it is: its spec report shows a problem that stops printing.`;
  return null;
}

/** One warning for several pieces, naming each with its reason. */
export function acceptWarningForMany(warnings: readonly string[]): string | null {
  if (warnings.length <= 1) return warnings[0] ?? null;
  return `${warnings.length} of these pieces may not print as they are: ${warnings.join(" ")}`;
}
