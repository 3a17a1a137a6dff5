/**
 * Which of a page's file versions is the one in use. Every upload is kept with its spec report,
 * but a file the check could not read (empty, cut short, damaged, encrypted, not an image the
 * checker opens) never takes the page away from a file it could read: a broken copy sent by
 * mistake must not replace the working one. Pure; the upload pipeline, the version chooser and
 * the contributor's piece page all decide with these.
 */
import type { SpecReport } from "@/lib/print/check";

/**
 * Finding codes that mean the check could not read the artwork, so it measured nothing of the
 * page: the file is empty, of a type the checker does not open, damaged or cut short, an
 * encrypted or page-less PDF, or an image refused unopened for its pixel count.
 */
export const UNREADABLE_CODES: ReadonlySet<string> = new Set([
  "file-empty",
  "file-unrecognised",
  "file-unsupported",
  "file-damaged",
  "file-truncated",
  "pdf-encrypted",
  "pdf-no-pages",
  "too-many-pixels",
]);

type ReportFindings = Pick<SpecReport, "findings">;

/** True when the check could read the file: none of its findings is an unreadable one. */
export function readable(report: ReportFindings): boolean {
  return !report.findings.some((f) => UNREADABLE_CODES.has(f.code));
}

/**
 * Whether a new upload becomes the page's current file. A readable file always does. An
 * unreadable one does only when there is nothing readable to keep: the page has no file yet, or
 * its current file could not be read either (then the newest is shown, so the contributor sees
 * what became of their latest try).
 */
export function shouldBecomeCurrent(
  newReport: ReportFindings,
  currentReport: ReportFindings | null,
): boolean {
  if (readable(newReport)) return true;
  return currentReport === null || !readable(currentReport);
}

/** Why a stored upload is not the page's current file: another upload replaced the page first, or it could not be read. */
export type HeldBack = "replaced" | "unreadable";

/** What the contributor is told about an upload held back because it could not be read. */
export const UNREADABLE_KEPT_EARLIER =
  "This file could not be read, so your earlier file stays in use.";

/**
 * Uploads made after the page's current file that were held back because they could not be read,
 * newest first: the ones the piece page shows beside the file in use, with their reports.
 */
export function unreadableSinceCurrent<
  V extends { id: number; versionNumber: number; report: ReportFindings },
>(versions: readonly V[], currentVersionId: number | null): V[] {
  const current = versions.find((v) => v.id === currentVersionId);
  if (!current || !readable(current.report)) return [];
  return versions
    .filter((v) => v.versionNumber > current.versionNumber && !readable(v.report))
    .sort((a, b) => b.versionNumber - a.versionNumber);
}
