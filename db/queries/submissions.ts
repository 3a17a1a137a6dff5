import "server-only";
import { Refusal } from "@/lib/refusal";
/** What contributors do with their own pieces: create, list, read, withdraw, pick a version. */
import { and, asc, desc, eq, inArray, isNull, ne, sql } from "drizzle-orm";
import { db, schema } from "@/db";
import type { PieceStatus, Role } from "@/lib/domain";
import type { SpecReport } from "@/lib/print/check";
import { canMove } from "@/lib/pieces/status";
import type { PieceVerdict } from "@/lib/pieces/verdict";
import { pieceVerdictOverFiles, requiredFilesOf } from "@/lib/pieces/separations";
import { shouldBecomeCurrent } from "@/lib/pieces/versions";
import { submitRefusal } from "@/lib/pieces/submission-rules";
import type { PieceParsed } from "@/lib/validations/piece";
import type { Anthology } from "./anthologies";
import { findCall, type CallRow } from "./open-call";

export { findCall };

const p = schema.pieces;
const pp = schema.piecePages;
const fv = schema.fileVersions;
const ps = schema.pageSeparations;

/** The columns a screen shows for one file version: everything but the stored bytes. */
export const fileVersionSummary = {
  id: fv.id,
  piecePageId: fv.piecePageId,
  ink: fv.ink,
  versionNumber: fv.versionNumber,
  fileName: fv.fileName,
  mimeType: fv.mimeType,
  sizeBytes: fv.sizeBytes,
  verdict: fv.verdict,
  report: fv.report,
  hasThumbnail: sql<number>`${fv.thumbnailWebp} IS NOT NULL`,
  createdAt: fv.createdAt,
};

export type Call = CallRow;
export type Piece = typeof p.$inferSelect;

/** Pieces a person has in an anthology that count against the call's limit (withdrawn ones do not). */
export async function countActivePieces(anthologyId: number, userId: string): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`COUNT(*)` })
    .from(p)
    .where(
      and(eq(p.anthologyId, anthologyId), eq(p.contributorId, userId), ne(p.status, "withdrawn")),
    );
  return Number(row?.n ?? 0);
}

/**
 * Creates a piece with its pages. Makes the person a contributor member first if they are not a
 * member; their membership row is locked while the pieces are counted, so two quick submits
 * cannot pass the per-person limit together.
 */
export async function createPiece(
  anthology: Anthology,
  call: Call,
  userId: string,
  input: PieceParsed,
): Promise<Piece> {
  return db.transaction(async (tx) => {
    await tx
      .insert(schema.memberships)
      .values({ anthologyId: anthology.id, userId, role: "contributor" })
      .onDuplicateKeyUpdate({ set: { userId: sql`${schema.memberships.userId}` } });
    const [member] = await tx
      .select({ role: schema.memberships.role })
      .from(schema.memberships)
      .where(
        and(
          eq(schema.memberships.anthologyId, anthology.id),
          eq(schema.memberships.userId, userId),
        ),
      )
      .for("update");
    const [counted] = await tx
      .select({ n: sql<number>`COUNT(*)` })
      .from(p)
      .where(
        and(
          eq(p.anthologyId, anthology.id),
          eq(p.contributorId, userId),
          ne(p.status, "withdrawn"),
        ),
      );
    const refused = submitRefusal(member?.role ?? null, Number(counted?.n ?? 0), call);
    if (refused) throw refused;
    // Inks are stored with the call's spelling, whatever case the form sent.
    const inks = input.inks.map(
      (ink) => call.allowedInks.find((a) => a.toLowerCase() === ink.toLowerCase()) ?? ink,
    );
    const [inserted] = await tx
      .insert(p)
      .values({
        anthologyId: anthology.id,
        contributorId: userId,
        title: input.title,
        kind: input.kind,
        pageCount: input.pageCount,
        inks,
        creditLine: input.creditLine,
        statement: input.statement || null,
        status: "awaiting-review",
        verdict: "missing",
      })
      .$returningId();
    if (!inserted) throw new Error("piece insert returned no id");
    await tx.insert(pp).values(
      Array.from({ length: input.pageCount }, (_, i) => ({
        pieceId: inserted.id,
        pageIndex: i + 1,
        altText: input.altTexts[i] || null,
      })),
    );
    await tx.insert(schema.pieceEvents).values({
      pieceId: inserted.id,
      actorId: userId,
      fromStatus: null,
      toStatus: "awaiting-review",
      message: "Submitted",
    });
    const [row] = await tx.select().from(p).where(eq(p.id, inserted.id));
    if (!row) throw new Error("piece vanished after insert");
    return row;
  });
}

export type OwnPieceRow = {
  id: number;
  title: string;
  kind: Piece["kind"];
  pageCount: number;
  inks: string[];
  status: PieceStatus;
  verdict: string;
  pagesWithFiles: number;
  /** The current version of page 1, for a thumbnail. */
  firstVersionId: number | null;
  updatedAt: string;
};

/** A contributor's own pieces in one anthology, newest first. */
export async function listOwnPieces(anthologyId: number, userId: string): Promise<OwnPieceRow[]> {
  const rows = await db
    .select({
      id: p.id,
      title: p.title,
      kind: p.kind,
      pageCount: p.pageCount,
      inks: p.inks,
      status: p.status,
      verdict: p.verdict,
      updatedAt: p.updatedAt,
      // Spelled out: inside a subquery drizzle leaves columns unqualified, and "id" would mean the page's.
      pagesWithFiles: sql<number>`(SELECT COUNT(*) FROM piece_page pg WHERE pg.piece_id = piece.id AND (pg.current_version_id IS NOT NULL OR EXISTS (SELECT 1 FROM page_separation sep WHERE sep.piece_page_id = pg.id AND sep.current_version_id IS NOT NULL)))`,
      firstVersionId: sql<
        number | null
      >`(SELECT pg.current_version_id FROM piece_page pg WHERE pg.piece_id = piece.id AND pg.page_index = 1)`,
    })
    .from(p)
    .where(and(eq(p.anthologyId, anthologyId), eq(p.contributorId, userId)))
    .orderBy(desc(p.createdAt), desc(p.id));
  return rows.map((r) => ({
    ...r,
    pagesWithFiles: Number(r.pagesWithFiles),
    firstVersionId: r.firstVersionId === null ? null : Number(r.firstVersionId),
    updatedAt: r.updatedAt.toISOString(),
  }));
}

export type VersionView = {
  id: number;
  /** The ink of a separation; null for the page's composite file. */
  ink: string | null;
  versionNumber: number;
  fileName: string;
  mimeType: string;
  sizeBytes: number;
  verdict: string;
  report: SpecReport;
  hasThumbnail: boolean;
  uploadedAt: string;
};

/** One ink's separation of a page: its current master, revision guard and every version. */
export type SeparationView = {
  ink: string;
  revision: number;
  currentVersionId: number | null;
  versions: VersionView[];
};

export type PageView = {
  pageIndex: number;
  altText: string | null;
  revision: number;
  currentVersionId: number | null;
  /** The page's composite files (newest first); separations are in `separations`. */
  versions: VersionView[];
  /**
   * One entry per ink the page needs a separation for (lib/pieces/separations.ts), in the
   * piece's ink order, with a file or not; empty for a page that takes one composite file.
   */
  separations: SeparationView[];
};

export type PieceEventView = {
  fromStatus: string | null;
  toStatus: string;
  message: string | null;
  at: string;
};

export type PieceDetail = {
  piece: Omit<Piece, "createdAt" | "updatedAt" | "creditApprovedAt"> & {
    createdAt: string;
    updatedAt: string;
  };
  contributor: { id: string; name: string | null; email: string | null };
  pages: PageView[];
  events: PieceEventView[];
};

function versionView(v: {
  id: number;
  ink: string | null;
  versionNumber: number;
  fileName: string;
  mimeType: string;
  sizeBytes: number;
  verdict: string;
  report: unknown;
  hasThumbnail: number;
  createdAt: Date;
}): VersionView {
  return {
    id: v.id,
    ink: v.ink,
    versionNumber: v.versionNumber,
    fileName: v.fileName,
    mimeType: v.mimeType,
    sizeBytes: v.sizeBytes,
    verdict: v.verdict,
    report: v.report as SpecReport,
    hasThumbnail: Boolean(Number(v.hasThumbnail)),
    uploadedAt: v.createdAt.toISOString(),
  };
}

/** A piece with every page, every version (newest first, with its report) and its history. */
export async function getPieceDetail(pieceId: number): Promise<PieceDetail | undefined> {
  const [row] = await db
    .select({ piece: p, name: schema.users.name, email: schema.users.email })
    .from(p)
    .innerJoin(schema.users, eq(schema.users.id, p.contributorId))
    .where(eq(p.id, pieceId))
    .limit(1);
  if (!row) return undefined;
  const pages = await db
    .select()
    .from(pp)
    .where(eq(pp.pieceId, pieceId))
    .orderBy(asc(pp.pageIndex));
  const versions = pages.length
    ? await db
        .select(fileVersionSummary)
        .from(fv)
        .where(
          inArray(
            fv.piecePageId,
            pages.map((pg) => pg.id),
          ),
        )
        .orderBy(desc(fv.versionNumber))
    : [];
  const separations = pages.length
    ? await db
        .select()
        .from(ps)
        .where(
          inArray(
            ps.piecePageId,
            pages.map((pg) => pg.id),
          ),
        )
    : [];
  const [anthology] = await db
    .select({ printMethod: schema.anthologies.printMethod })
    .from(schema.anthologies)
    .where(eq(schema.anthologies.id, row.piece.anthologyId));
  const required = anthology ? requiredFilesOf(anthology, row.piece) : [];
  const events = await db
    .select()
    .from(schema.pieceEvents)
    .where(eq(schema.pieceEvents.pieceId, pieceId))
    .orderBy(asc(schema.pieceEvents.createdAt), asc(schema.pieceEvents.id));
  const { createdAt, updatedAt, creditApprovedAt: _approved, ...piece } = row.piece;
  return {
    piece: { ...piece, createdAt: createdAt.toISOString(), updatedAt: updatedAt.toISOString() },
    contributor: { id: row.piece.contributorId, name: row.name, email: row.email },
    pages: pages.map((pg) => {
      const own = versions.filter((v) => v.piecePageId === pg.id).map(versionView);
      return {
        pageIndex: pg.pageIndex,
        altText: pg.altText,
        revision: pg.revision,
        currentVersionId: pg.currentVersionId,
        versions: own.filter((v) => v.ink === null),
        separations: required.flatMap((file) => {
          if (file.kind !== "separation") return [];
          const sep = separations.find((x) => x.piecePageId === pg.id && x.ink === file.ink);
          return [
            {
              ink: file.ink,
              revision: sep?.revision ?? 0,
              currentVersionId: sep?.currentVersionId ?? null,
              versions: own.filter((v) => v.ink === file.ink),
            },
          ];
        }),
      };
    }),
    events: events.map((e) => ({
      fromStatus: e.fromStatus,
      toStatus: e.toStatus,
      message: e.message,
      at: e.createdAt.toISOString(),
    })),
  };
}

export type PieceAccess = {
  piece: Piece;
  anthology: Anthology;
  role: Role | null;
  isOwner: boolean;
};

/** The piece, its anthology and the person's role there; undefined for an unknown piece. */
export async function findPieceAccess(
  pieceId: number,
  userId: string,
): Promise<PieceAccess | undefined> {
  const [row] = await db
    .select({ piece: p, anthology: schema.anthologies, role: schema.memberships.role })
    .from(p)
    .innerJoin(schema.anthologies, eq(schema.anthologies.id, p.anthologyId))
    .leftJoin(
      schema.memberships,
      and(eq(schema.memberships.anthologyId, p.anthologyId), eq(schema.memberships.userId, userId)),
    )
    .where(eq(p.id, pieceId))
    .limit(1);
  if (!row) return undefined;
  return {
    piece: row.piece,
    anthology: row.anthology,
    role: row.role ?? null,
    isOwner: row.piece.contributorId === userId,
  };
}

/** The contributor withdraws their piece; refused when the status rules do not allow it. */
export async function withdrawPiece(
  pieceId: number,
  userId: string,
  reason?: string,
): Promise<PieceStatus> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({ status: p.status, contributorId: p.contributorId })
      .from(p)
      .where(eq(p.id, pieceId))
      .for("update");
    if (!row) throw new Refusal(404, "There is no such piece.");
    if (row.contributorId !== userId)
      throw new Refusal(403, "Only the person who sent a piece can withdraw it.");
    if (row.status === "withdrawn")
      throw new Refusal(409, "You have already withdrawn this piece.");
    if (!canMove(row.status, "withdrawn", "contributor"))
      throw new Refusal(
        409,
        "This piece can no longer be withdrawn: the editors have already decided on it.",
      );
    await tx.update(p).set({ status: "withdrawn" }).where(eq(p.id, pieceId));
    await tx.insert(schema.pieceEvents).values({
      pieceId,
      actorId: userId,
      fromStatus: row.status,
      toStatus: "withdrawn",
      message: reason || "Withdrawn by the contributor",
    });
    return "withdrawn" as const;
  });
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/** Recomputes and stores a piece's verdict inside a transaction that holds the piece's row lock. */
export async function refreshPieceVerdict(tx: Tx, pieceId: number): Promise<PieceVerdict> {
  const [piece] = await tx
    .select({ inks: p.inks, printMethod: schema.anthologies.printMethod })
    .from(p)
    .innerJoin(schema.anthologies, eq(schema.anthologies.id, p.anthologyId))
    .where(eq(p.id, pieceId));
  const rows = await tx
    .select({ id: pp.id, verdict: fv.verdict })
    .from(pp)
    .leftJoin(fv, eq(fv.id, pp.currentVersionId))
    .where(eq(pp.pieceId, pieceId))
    .orderBy(asc(pp.pageIndex))
    .for("update");
  const seps = rows.length
    ? await tx
        .select({ piecePageId: ps.piecePageId, ink: ps.ink, verdict: fv.verdict })
        .from(ps)
        .leftJoin(fv, eq(fv.id, ps.currentVersionId))
        .where(
          inArray(
            ps.piecePageId,
            rows.map((r) => r.id),
          ),
        )
    : [];
  const required = piece
    ? requiredFilesOf(piece, { inks: Array.isArray(piece.inks) ? piece.inks : [] })
    : [{ kind: "composite" as const }];
  const verdict = pieceVerdictOverFiles(
    required,
    rows.map((r) => ({
      composite: r.verdict ?? null,
      separations: Object.fromEntries(
        seps.filter((x) => x.piecePageId === r.id).map((x) => [x.ink, x.verdict ?? null]),
      ),
    })),
  );
  await tx.update(p).set({ verdict }).where(eq(p.id, pieceId));
  return verdict;
}

/**
 * Makes an older (or parked) version the page's current file. Guarded by the page revision the
 * contributor saw, so a choice made on a stale screen is refused rather than silently applied.
 */
export async function useVersion(
  pieceId: number,
  userId: string,
  choice: { pageIndex: number; versionId: number; expectedRevision: number },
  uploadsAllowed: (status: PieceStatus) => boolean,
): Promise<{ revision: number; verdict: PieceVerdict }> {
  return db.transaction(async (tx) => {
    const [piece] = await tx
      .select({ status: p.status, contributorId: p.contributorId })
      .from(p)
      .where(eq(p.id, pieceId))
      .for("update");
    if (!piece) throw new Refusal(404, "There is no such piece.");
    if (piece.contributorId !== userId)
      throw new Refusal(403, "Only the person who sent a piece can change its files.");
    if (!uploadsAllowed(piece.status))
      throw new Refusal(409, "Files of this piece can no longer be changed.");
    const [page] = await tx
      .select()
      .from(pp)
      .where(and(eq(pp.pieceId, pieceId), eq(pp.pageIndex, choice.pageIndex)))
      .for("update");
    if (!page) throw new Refusal(404, `This piece has no page ${choice.pageIndex}.`);
    if (page.revision !== choice.expectedRevision)
      throw new Refusal(
        409,
        "This page changed in another window since you opened it; reload to see its current file.",
      );
    const [version] = await tx
      .select({ id: fv.id, report: fv.report })
      .from(fv)
      .where(and(eq(fv.id, choice.versionId), eq(fv.piecePageId, page.id), isNull(fv.ink)));
    if (!version) throw new Refusal(404, "That version does not belong to this page.");
    const [inUse] =
      page.currentVersionId === null
        ? []
        : await tx.select({ report: fv.report }).from(fv).where(eq(fv.id, page.currentVersionId));
    // Chosen by hand or not, a file the check could not read never displaces a readable one.
    if (
      !shouldBecomeCurrent(
        version.report as SpecReport,
        (inUse?.report ?? null) as SpecReport | null,
      )
    )
      throw new Refusal(
        409,
        "That version could not be read by the check, so it cannot replace a file that can; the file in use stays.",
      );
    await tx
      .update(pp)
      .set({ currentVersionId: version.id, revision: page.revision + 1 })
      .where(eq(pp.id, page.id));
    const verdict = await refreshPieceVerdict(tx, pieceId);
    return { revision: page.revision + 1, verdict };
  });
}

/** Sets one page's description for readers who cannot see the artwork. */
export async function setAltText(
  pieceId: number,
  userId: string,
  pageIndex: number,
  altText: string,
): Promise<void> {
  const [piece] = await db
    .select({ contributorId: p.contributorId })
    .from(p)
    .where(eq(p.id, pieceId));
  if (!piece) throw new Refusal(404, "There is no such piece.");
  if (piece.contributorId !== userId)
    throw new Refusal(403, "Only the person who sent a piece can describe its pages.");
  const result = await db
    .update(pp)
    .set({ altText: altText || null })
    .where(and(eq(pp.pieceId, pieceId), eq(pp.pageIndex, pageIndex)));
  if (result[0].affectedRows === 0) throw new Refusal(404, `This piece has no page ${pageIndex}.`);
}

/** A version's thumbnail bytes with what is needed to decide who may see it. */
export async function findThumbnail(versionId: number) {
  const [row] = await db
    .select({
      webp: fv.thumbnailWebp,
      md5: fv.md5,
      pieceId: p.id,
      anthologyId: p.anthologyId,
      contributorId: p.contributorId,
    })
    .from(fv)
    .innerJoin(pp, eq(pp.id, fv.piecePageId))
    .innerJoin(p, eq(p.id, pp.pieceId))
    .where(eq(fv.id, versionId))
    .limit(1);
  return row;
}
