import "server-only";
/**
 * Changing an anthology's print spec: what the change is weighed against (the page map as it
 * stands, the current file of every page, the call's inks), the change itself in one transaction
 * that holds the anthology row, and the re-checked reports written back with the pieces' verdicts.
 */
import { and, asc, eq, inArray, isNotNull, ne, or, sql } from "drizzle-orm";
import { db, schema } from "@/db";
import type { MapSlot, MapState } from "@/lib/map/types";
import type { SpecReport } from "@/lib/print/check";
import {
  analyseSpecChange,
  keepUnchangedLengths,
  type AnthologySpec,
  type CurrentFile,
  type SpecChange,
} from "@/lib/print/spec-change";
import type { PieceVerdict } from "@/lib/pieces/verdict";
import type { Anthology } from "./anthologies";
import { refreshPieceVerdict } from "./submissions";

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

const a = schema.anthologies;
const s = schema.pageSlots;
const p = schema.pieces;
const pp = schema.piecePages;
const fv = schema.fileVersions;
const ps = schema.pageSeparations;

/** The spec columns of an anthology row. */
export function anthologySpecOf(row: Anthology): AnthologySpec {
  return {
    trimPreset: row.trimPreset,
    trimWidthMm: row.trimWidthMm,
    trimHeightMm: row.trimHeightMm,
    bleedMm: row.bleedMm,
    safeMarginMm: row.safeMarginMm,
    minPpi: row.minPpi,
    printMethod: row.printMethod,
    inks: [...row.inks],
    inksPerPass: row.inksPerPass,
    binding: row.binding,
    pageCountTarget: row.pageCountTarget,
    maxPages: row.maxPages,
    paperGsm: row.paperGsm,
    paperCaliperMm: row.paperCaliperMm,
    coverStock: row.coverStock,
    coverPaperGsm: row.coverPaperGsm,
  };
}

/** The page map as it stands, or null while it has not been laid out (no slots yet). */
async function readMap(tx: Tx, row: Anthology): Promise<MapState | null> {
  const slots: MapSlot[] = (
    await tx
      .select({
        page: s.pageNumber,
        reservation: s.reservation,
        pieceId: s.pieceId,
        piecePageIndex: s.piecePageIndex,
        locked: s.locked,
      })
      .from(s)
      .where(eq(s.anthologyId, row.id))
      .orderBy(asc(s.pageNumber))
  ).map((r) => ({ ...r, reservation: r.reservation ?? null, locked: Boolean(r.locked) }));
  if (slots.length === 0) return null;
  const onMap = [...new Set(slots.flatMap((x) => (x.pieceId === null ? [] : [x.pieceId])))];
  // The map's pieces: accepted ones, and any still placed after leaving "accepted" (as the map shows them).
  const pieces = await tx
    .select({
      id: p.id,
      title: p.title,
      kind: p.kind,
      pageCount: p.pageCount,
      inks: p.inks,
      leftOut: p.leftOut,
      status: p.status,
    })
    .from(p)
    .where(
      and(
        eq(p.anthologyId, row.id),
        onMap.length
          ? or(eq(p.status, "accepted"), inArray(p.id, onMap))
          : eq(p.status, "accepted"),
      ),
    )
    .orderBy(asc(p.id));
  return {
    binding: row.binding,
    pageCount: slots.length,
    maxPages: row.maxPages,
    inksPerPass: row.inksPerPass,
    pressInks: row.inks,
    slots,
    pieces: pieces.map((x) => ({
      id: x.id,
      title: x.title,
      kind: x.kind,
      pageCount: x.pageCount,
      inks: Array.isArray(x.inks) ? x.inks : [],
      leftOut: x.leftOut || x.status !== "accepted",
    })),
  };
}

/** A current file with what the re-check needs to fetch and check it again. */
export type StoredCurrentFile = CurrentFile & {
  /** A spread's pages are checked with their fold side (lib/pieces/submission-rules.ts specForPiece). */
  pieceKind: (typeof schema.pieces.$inferSelect)["kind"];
  storageKey: string;
  mimeType: string;
  verdict: string;
  /** The ink of a separation (checked as that ink's master); null for a composite page file. */
  ink: string | null;
};

/**
 * The current file of every page of every piece not withdrawn, and the current master of every
 * separation, in piece and page order (a page's composite before its separations).
 */
export async function listCurrentFiles(
  anthologyId: number,
  tx: Tx | typeof db = db,
): Promise<StoredCurrentFile[]> {
  const columns = {
    versionId: fv.id,
    pieceId: p.id,
    pieceTitle: p.title,
    pageIndex: pp.pageIndex,
    fileName: fv.fileName,
    mimeType: fv.mimeType,
    storageKey: fv.storageKey,
    pieceInks: p.inks,
    pieceKind: p.kind,
    report: fv.report,
    verdict: fv.verdict,
    ink: fv.ink,
  };
  const separations = await tx
    .select(columns)
    .from(ps)
    .innerJoin(pp, eq(pp.id, ps.piecePageId))
    .innerJoin(p, eq(p.id, pp.pieceId))
    .innerJoin(fv, eq(fv.id, ps.currentVersionId))
    .where(and(eq(p.anthologyId, anthologyId), ne(p.status, "withdrawn")))
    .orderBy(asc(p.id), asc(pp.pageIndex), asc(ps.id));
  const composites = await tx
    .select({
      versionId: fv.id,
      pieceId: p.id,
      pieceTitle: p.title,
      pageIndex: pp.pageIndex,
      fileName: fv.fileName,
      mimeType: fv.mimeType,
      storageKey: fv.storageKey,
      pieceInks: p.inks,
      pieceKind: p.kind,
      report: fv.report,
      verdict: fv.verdict,
      ink: fv.ink,
    })
    .from(pp)
    .innerJoin(p, eq(p.id, pp.pieceId))
    .innerJoin(fv, eq(fv.id, pp.currentVersionId))
    .where(
      and(
        eq(p.anthologyId, anthologyId),
        ne(p.status, "withdrawn"),
        isNotNull(pp.currentVersionId),
      ),
    )
    .orderBy(asc(p.id), asc(pp.pageIndex));
  const rows = [...composites, ...separations].sort(
    (x, y) =>
      x.pieceId - y.pieceId ||
      x.pageIndex - y.pageIndex ||
      Number(x.ink !== null) - Number(y.ink !== null),
  );
  return rows.map((r) => ({
    ...r,
    pieceInks: Array.isArray(r.pieceInks) ? r.pieceInks : [],
    report: r.report as SpecReport,
  }));
}

export type SpecChangeOutcome =
  | { kind: "saved"; change: SpecChange }
  | { kind: "refused"; change: SpecChange }
  | { kind: "needs-confirmation"; change: SpecChange };

/**
 * Weighs a new spec against the anthology as it stands and saves it when nothing is refused and,
 * if something asks for confirmation, the editor confirmed. The anthology row is locked from the
 * reading to the writing, so two editors' changes are weighed one after the other.
 */
export async function changeSpec(
  anthologyId: number,
  wanted: AnthologySpec,
  confirmed: boolean,
): Promise<SpecChangeOutcome> {
  return db.transaction(async (tx) => {
    const [row] = await tx.select().from(a).where(eq(a.id, anthologyId)).for("update");
    if (!row) throw new Error(`anthology ${anthologyId} vanished`);
    const before = anthologySpecOf(row);
    const [call] = await tx
      .select({ allowedInks: schema.calls.allowedInks })
      .from(schema.calls)
      .where(eq(schema.calls.anthologyId, anthologyId));
    const change = analyseSpecChange({
      before,
      after: wanted,
      map: await readMap(tx, row),
      files: await listCurrentFiles(anthologyId, tx),
      callInks: call?.allowedInks ?? null,
    });
    if (change.refused) return { kind: "refused", change };
    if (change.needsConfirmation && !confirmed) return { kind: "needs-confirmation", change };
    await tx.update(a).set(keepUnchangedLengths(before, wanted)).where(eq(a.id, anthologyId));
    return { kind: "saved", change };
  });
}

/** Writes a file version's new report and verdict (after a re-check against a new spec). */
export async function storeReport(versionId: number, report: SpecReport): Promise<void> {
  await db.update(fv).set({ report, verdict: report.verdict }).where(eq(fv.id, versionId));
}

/** Recomputes each piece's verdict from its pages' current files, one piece per transaction. */
export async function refreshPieceVerdicts(
  pieceIds: readonly number[],
): Promise<Map<number, PieceVerdict>> {
  const out = new Map<number, PieceVerdict>();
  for (const pieceId of new Set(pieceIds))
    out.set(
      pieceId,
      await db.transaction(async (tx) => {
        // The piece row first, as every writer takes it.
        await tx.select({ id: p.id }).from(p).where(eq(p.id, pieceId)).for("update");
        return refreshPieceVerdict(tx, pieceId);
      }),
    );
  return out;
}

/** How many pages of the map hold pieces; for the spec screen's summary. */
export async function countPlacedPages(anthologyId: number): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`COUNT(*)` })
    .from(s)
    .where(and(eq(s.anthologyId, anthologyId), isNotNull(s.pieceId)));
  return Number(row?.n ?? 0);
}

/** How many pages of pieces not withdrawn have a current file; for the spec screen's summary. */
export async function countCurrentFiles(anthologyId: number): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`COUNT(*)` })
    .from(pp)
    .innerJoin(p, eq(p.id, pp.pieceId))
    .where(
      and(
        eq(p.anthologyId, anthologyId),
        ne(p.status, "withdrawn"),
        isNotNull(pp.currentVersionId),
      ),
    );
  return Number(row?.n ?? 0);
}
