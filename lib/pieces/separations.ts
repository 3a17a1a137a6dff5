/**
 * Per-ink masters (separations) for stencil duplicator printing. A duplicator lays one ink per
 * drum pass, from one stencil per ink, so a page that prints in two or more inks is sent as one
 * greyscale file per ink: dark where that ink goes, black for full ink (common practice, no
 * source). A page of a one-ink piece is itself the master for its ink, and laser and inkjet
 * printing take one composite file per page. Pure: the upload route, the pipeline, the piece
 * pages and the re-check all ask these.
 */
import type { PrintMethod, PrintSpec, SpecColumns } from "@/lib/print/spec";
import { Refusal } from "@/lib/refusal";
import { specForPiece } from "./submission-rules";
import { pieceVerdictOf, type PieceVerdict } from "./verdict";
import type { PieceKind } from "@/lib/domain";

/** One file a page needs: the composite, or one ink's separation. */
export type RequiredFile = { kind: "composite" } | { kind: "separation"; ink: string };

/** The inks of a piece, each once, in the piece's order. */
function distinctInks(inks: readonly string[]): string[] {
  return [...new Set(inks)];
}

/** Whether a piece's pages are sent as one greyscale file per ink. */
export function needsSeparations(
  anthology: { printMethod: PrintMethod },
  piece: { inks: readonly string[] },
): boolean {
  return anthology.printMethod === "duplicator" && distinctInks(piece.inks).length >= 2;
}

/**
 * The files every page of a piece needs: one per ink (in the piece's ink order) for a duplicator
 * piece in two or more inks, otherwise the one composite file.
 */
export function requiredFilesOf(
  anthology: { printMethod: PrintMethod },
  piece: { inks: readonly string[] },
): RequiredFile[] {
  if (!needsSeparations(anthology, piece)) return [{ kind: "composite" }];
  return distinctInks(piece.inks).map((ink) => ({ kind: "separation", ink }));
}

/** The ink a required file is for, or null for a composite (as file_version.ink stores it). */
export function inkOf(file: RequiredFile): string | null {
  return file.kind === "separation" ? file.ink : null;
}

/**
 * Why an upload for this ink (null: a composite) is refused for this piece, or null when it is
 * welcome. A page that needs separations also keeps a composite, as a colour guide for the
 * editors; it is never printed and never counts toward the piece's verdict.
 */
export function uploadInkRefusal(
  anthology: { printMethod: PrintMethod },
  piece: { inks: readonly string[] },
  ink: string | null | undefined,
): Refusal | null {
  if (ink === null || ink === undefined) return null;
  if (!needsSeparations(anthology, piece))
    return new Refusal(
      400,
      anthology.printMethod === "duplicator"
        ? `This piece prints in one ink, so each page takes a single file; upload it without choosing an ink.`
        : `This anthology is printed in one go on a ${anthology.printMethod === "inkjet" ? "inkjet" : "laser"} printer, so each page takes one file with all its colours; upload it without choosing an ink.`,
    );
  if (!distinctInks(piece.inks).includes(ink))
    return new Refusal(
      400,
      `This piece prints in ${listInks(distinctInks(piece.inks))}; “${ink}” is not one of its inks.`,
    );
  return null;
}

/** The current files of one page: the composite's verdict and each ink's, null while missing. */
export interface PageFileVerdicts {
  composite: string | null;
  separations: Readonly<Record<string, string | null>>;
}

/**
 * The piece's verdict over every file its pages need: the worst of them, a missing separation
 * counting as a missing file. A composite kept as a guide beside separations is not counted.
 */
export function pieceVerdictOverFiles(
  required: readonly RequiredFile[],
  pages: readonly PageFileVerdicts[],
): PieceVerdict {
  const verdicts: (string | null)[] = [];
  for (const page of pages)
    for (const file of required)
      verdicts.push(
        file.kind === "composite" ? page.composite : (page.separations[file.ink] ?? null),
      );
  return pieceVerdictOf(verdicts);
}

/** How many required files of a piece have no current file yet. */
export function missingFileCount(
  required: readonly RequiredFile[],
  pages: readonly PageFileVerdicts[],
): number {
  let missing = 0;
  for (const page of pages)
    for (const file of required)
      if (
        (file.kind === "composite" ? page.composite : (page.separations[file.ink] ?? null)) === null
      )
        missing++;
  return missing;
}

/**
 * The spec a separation (ink) or a composite (null) is checked against: the piece's page spec,
 * narrowed for a separation to that one ink, which the report then names.
 */
export function specForFile(
  anthology: SpecColumns,
  piece: { inks: string[]; kind?: PieceKind },
  pageIndex: number | undefined,
  ink: string | null,
): PrintSpec {
  const spec = specForPiece(anthology, piece, pageIndex);
  if (ink === null) return spec;
  return { ...spec, inks: [ink], separationInk: ink };
}

/* ---------- Words ---------- */

/** "black", "black and teal", "black, teal and gold". */
export function listInks(inks: readonly string[]): string {
  if (inks.length <= 1) return inks[0] ?? "";
  return `${inks.slice(0, -1).join(", ")} and ${inks[inks.length - 1]}`;
}

/** "black master": what one ink's separation is called on screens and in mail. */
export function masterName(ink: string): string {
  return `${ink} master`;
}

/** "Page 1 — black master", or the page name alone for a composite. */
export function requiredFileLabel(pageName: string, file: RequiredFile): string {
  return file.kind === "composite" ? pageName : `${pageName} — ${masterName(file.ink)}`;
}

/** Why a page asks for one file per ink, in one short paragraph. */
export function separationsExplanation(inks: readonly string[]): string {
  const list = distinctInks(inks);
  return (
    `The duplicator prints one ink at a time from its own stencil, so each page of this piece ` +
    `takes ${list.length} files, one per ink (${listInks(list)}). Send each as a greyscale file ` +
    `the size of the page: black where that ink prints fully, greys for lighter tones, white where it does not print.`
  );
}
