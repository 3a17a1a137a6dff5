import "server-only";
import { errorSummary, log } from "@/server/log";
/**
 * After the print spec changes: every current file of the anthology (each page's file and each
 * separation's current master, checked as that ink's) is fetched again from the file host and checked against the new spec with the upload pipeline's own check, its report
 * replaced, and each piece's verdict recomputed. One file at a time, so a large anthology does
 * not hold every file in memory at once.
 */
import { eq } from "drizzle-orm";
import { db, schema } from "@/db";
import { markOutputsStale } from "@/db/queries/print-files";
import { listCurrentFiles, refreshPieceVerdicts, storeReport } from "@/db/queries/spec-edit";
import type { RecheckSummary } from "@/lib/wire/spec-change";
import { readStoredFile, storedFileUrl } from "@/server/uploads";
import { checkPageFile } from "./ingest";

export async function recheckCurrentFiles(anthologyId: number): Promise<RecheckSummary> {
  const [anthology] = await db
    .select()
    .from(schema.anthologies)
    .where(eq(schema.anthologies.id, anthologyId));
  if (!anthology) throw new Error(`anthology ${anthologyId} vanished`);
  const summary: RecheckSummary = { checked: 0, nowFailing: 0, notChecked: 0, changed: [] };
  const touched: number[] = [];
  for (const file of await listCurrentFiles(anthologyId)) {
    let bytes: Buffer;
    try {
      bytes = await readStoredFile(await storedFileUrl(file.storageKey));
    } catch (error) {
      // The file keeps the report it has; the summary says how many could not be checked.
      log.error(
        { kind: "recheck", version: file.versionId, error: errorSummary(error) },
        "could not fetch a file to check it again",
      );
      summary.notChecked++;
      continue;
    }
    const report = await checkPageFile(
      anthology,
      { inks: file.pieceInks, kind: file.pieceKind },
      bytes,
      { name: file.fileName, type: file.mimeType },
      file.pageIndex,
      file.ink,
    );
    await storeReport(file.versionId, report);
    summary.checked++;
    touched.push(file.pieceId);
    if (report.verdict === file.verdict) continue;
    if (report.verdict === "blocker") summary.nowFailing++;
    summary.changed.push({
      versionId: file.versionId,
      pieceId: file.pieceId,
      pieceTitle: file.pieceTitle,
      pageIndex: file.pageIndex,
      ink: file.ink,
      fileName: file.fileName,
      before: file.verdict,
      after: report.verdict,
    });
  }
  await refreshPieceVerdicts(touched);
  // The spec changed in what the file check reads: print files made before no longer match it.
  await markOutputsStale(anthologyId);
  return summary;
}
