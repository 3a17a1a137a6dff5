import "server-only";
import { and, asc, desc, eq, inArray, isNull, sql } from "drizzle-orm";
import { db, schema } from "@/db";
import type { PrintMethod, PrintOutputKind } from "@/lib/domain";
import { pieceVerdictOverFiles, requiredFilesOf } from "@/lib/pieces/separations";
import type { PreflightPiece } from "@/lib/print/preflight";

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

const o = schema.printOutputs;
const a = schema.anthologies;
const p = schema.pieces;
const pp = schema.piecePages;
const fv = schema.fileVersions;
const s = schema.pageSlots;
const ps = schema.pageSeparations;

export type PrintOutput = typeof o.$inferSelect;

/** The outputs an anthology has, newest first (at most `limit`). */
export async function listOutputs(anthologyId: number, limit = 60): Promise<PrintOutput[]> {
  return db
    .select()
    .from(o)
    .where(eq(o.anthologyId, anthologyId))
    .orderBy(desc(o.createdAt), desc(o.id))
    .limit(limit);
}

export async function findOutput(id: number): Promise<PrintOutput | undefined> {
  const [row] = await db.select().from(o).where(eq(o.id, id)).limit(1);
  return row;
}

export interface NewOutput {
  kind: PrintOutputKind;
  ink: string | null;
  mapVersion: number;
  sheet: { name: string; widthMm: number; heightMm: number } | null;
  pagesTotal: number;
}

/** Inserts queued outputs and returns their ids in the same order. */
export async function createOutputs(
  anthologyId: number,
  requestedBy: string,
  outputs: NewOutput[],
): Promise<number[]> {
  const ids: number[] = [];
  await db.transaction(async (tx) => {
    for (const out of outputs) {
      const [row] = await tx
        .insert(o)
        .values({
          anthologyId,
          kind: out.kind,
          ink: out.ink,
          state: "queued",
          mapVersion: out.mapVersion,
          sheetName: out.sheet?.name ?? null,
          sheetWidthMm: out.sheet?.widthMm ?? null,
          sheetHeightMm: out.sheet?.heightMm ?? null,
          pagesTotal: out.pagesTotal,
          requestedBy,
        })
        .$returningId();
      if (!row) throw new Error("print output insert returned no id");
      ids.push(row.id);
    }
  });
  return ids;
}

export async function setJobId(id: number, jobId: string): Promise<void> {
  await db.update(o).set({ jobId }).where(eq(o.id, id));
}

/**
 * Claims a queued output for a worker; false when another worker has it or it is finished.
 * `retake` also takes a running one: the queue hands a job again only when its worker stopped
 * answering (a stalled job), so the row's run is abandoned.
 */
export async function claimOutput(id: number, { retake = false } = {}): Promise<boolean> {
  const [result] = await db
    .update(o)
    .set({ state: "running", pagesDone: 0, error: null })
    .where(
      and(eq(o.id, id), retake ? inArray(o.state, ["queued", "running"]) : eq(o.state, "queued")),
    );
  return (result as { affectedRows?: number }).affectedRows === 1;
}

export async function saveProgress(id: number, done: number, total: number): Promise<void> {
  await db
    .update(o)
    .set({ pagesDone: done, pagesTotal: total })
    .where(and(eq(o.id, id), eq(o.state, "running")));
}

export async function markFailed(id: number, message: string): Promise<void> {
  await db
    .update(o)
    .set({ state: "failed", error: message.slice(0, 4000), finishedAt: new Date() })
    .where(eq(o.id, id));
}

/**
 * Marks an output done, under the anthology's row lock (which every map change takes), so a map
 * change cannot slip between the last check and the finish: false when the map moved on.
 * Stale at once when a file it used stopped being current meanwhile.
 */
export async function markDone(
  id: number,
  anthologyId: number,
  mapVersion: number,
  file: { storageKey: string; fileName: string; sizeBytes: number; pageCount: number },
  usedVersionIds: number[],
): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({ version: a.mapVersion })
      .from(a)
      .where(eq(a.id, anthologyId))
      .for("update");
    if (!row || row.version !== mapVersion) return false;
    let stillCurrent = 0;
    if (usedVersionIds.length) {
      const [n] = await tx
        .select({ n: sql<number>`count(*)` })
        .from(pp)
        .where(inArray(pp.currentVersionId, usedVersionIds));
      stillCurrent = Number(n?.n ?? 0);
    }
    const now = new Date();
    await tx
      .update(o)
      .set({
        state: "done",
        ...file,
        finishedAt: now,
        error: null,
        staleAt: stillCurrent === usedVersionIds.length ? null : now,
        pagesDone: sql`${o.pagesTotal}`,
      })
      .where(eq(o.id, id));
    return true;
  });
}

/**
 * Marks every finished, fresh output of the anthology stale: the map or a file changed since it
 * was made. Runs inside the caller's transaction when given one.
 */
export async function markOutputsStale(
  anthologyId: number,
  tx: Tx | typeof db = db,
): Promise<void> {
  await tx
    .update(o)
    .set({ staleAt: new Date() })
    .where(and(eq(o.anthologyId, anthologyId), eq(o.state, "done"), isNull(o.staleAt)));
}

/** The anthology a piece belongs to (for marking outputs stale after a file changes). */
export async function anthologyOfPiece(pieceId: number, tx: Tx | typeof db = db) {
  const [row] = await tx.select({ id: p.anthologyId }).from(p).where(eq(p.id, pieceId));
  return row?.id ?? null;
}

/** One placed page's current file, for the producer. */
export interface PlacedFile {
  pieceId: number;
  pageIndex: number;
  versionId: number;
  storageKey: string;
  fileName: string;
  mimeType: string;
}

export interface PieceForPrint {
  id: number;
  title: string;
  inks: string[];
  creditLine: string;
  creditApprovedAt: Date | null;
  pages: {
    pageIndex: number;
    /** The page's one file (for a piece sent as masters: a colour guide, not printed). */
    file: PlacedFile | null;
    /** Worst verdict over the files the page needs: its one file, or one master per ink. */
    verdict: string | null;
    /** The current master of each ink, for pieces sent as one file per ink. */
    separations: Record<string, PlacedFile>;
  }[];
}

/** The pieces on the map with their pages' current files, masters and verdicts. */
export async function piecesOnMap(anthology: {
  id: number;
  printMethod: PrintMethod;
}): Promise<PieceForPrint[]> {
  const onMap = db
    .select({ id: s.pieceId })
    .from(s)
    .where(and(eq(s.anthologyId, anthology.id), sql`${s.pieceId} IS NOT NULL`));
  const file = {
    versionId: fv.id,
    storageKey: fv.storageKey,
    fileName: fv.fileName,
    mimeType: fv.mimeType,
    verdict: fv.verdict,
  };
  const rows = await db
    .select({
      id: p.id,
      title: p.title,
      inks: p.inks,
      creditLine: p.creditLine,
      creditApprovedAt: p.creditApprovedAt,
      pageId: pp.id,
      pageIndex: pp.pageIndex,
      ...file,
    })
    .from(p)
    .innerJoin(pp, eq(pp.pieceId, p.id))
    .leftJoin(fv, eq(fv.id, pp.currentVersionId))
    .where(and(eq(p.anthologyId, anthology.id), inArray(p.id, onMap)))
    .orderBy(asc(p.id), asc(pp.pageIndex));
  const masters = rows.length
    ? await db
        .select({ pageId: ps.piecePageId, ink: ps.ink, ...file })
        .from(ps)
        .innerJoin(fv, eq(fv.id, ps.currentVersionId))
        .where(
          inArray(
            ps.piecePageId,
            rows.map((r) => r.pageId),
          ),
        )
    : [];
  const placedFile = (
    pieceId: number,
    pageIndex: number,
    r: {
      versionId: number | null;
      storageKey: string | null;
      fileName: string | null;
      mimeType: string | null;
    },
  ): PlacedFile | null =>
    r.versionId === null
      ? null
      : {
          pieceId,
          pageIndex,
          versionId: r.versionId,
          storageKey: r.storageKey!,
          fileName: r.fileName!,
          mimeType: r.mimeType!,
        };
  const byId = new Map<number, PieceForPrint>();
  for (const r of rows) {
    const inks = Array.isArray(r.inks) ? r.inks : [];
    const piece = byId.get(r.id) ?? {
      id: r.id,
      title: r.title,
      inks,
      creditLine: r.creditLine,
      creditApprovedAt: r.creditApprovedAt,
      pages: [],
    };
    const own = masters.filter((m) => m.pageId === r.pageId);
    const required = requiredFilesOf(anthology, { inks });
    piece.pages.push({
      pageIndex: r.pageIndex,
      file: placedFile(r.id, r.pageIndex, r),
      verdict: pieceVerdictOverFiles(required, [
        {
          composite: r.versionId === null ? null : r.verdict,
          separations: Object.fromEntries(own.map((m) => [m.ink, m.verdict])),
        },
      ]),
      separations: Object.fromEntries(own.map((m) => [m.ink, placedFile(r.id, r.pageIndex, m)!])),
    });
    byId.set(r.id, piece);
  }
  return [...byId.values()];
}

/** The preflight's view of the pieces on the map. */
export function preflightPieces(pieces: PieceForPrint[]): PreflightPiece[] {
  return pieces.map((x) => ({
    id: x.id,
    title: x.title,
    creditApprovedAt: x.creditApprovedAt,
    pages: x.pages.map((pg) => ({
      pageIndex: pg.pageIndex,
      verdict: pg.verdict,
      fileName: Object.keys(pg.separations).length
        ? Object.values(pg.separations)
            .map((f) => f.fileName)
            .join(", ")
        : (pg.file?.fileName ?? null),
    })),
  }));
}
