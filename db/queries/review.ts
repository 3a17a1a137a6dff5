import "server-only";
import { and, asc, count, desc, eq, inArray, like, or, sql, type SQL } from "drizzle-orm";
import { db, schema } from "@/db";
import { requiredFilesOf } from "@/lib/pieces/separations";
import { fileVersionSummary } from "./submissions";
import { PIECE_KINDS, PIECE_STATUS_LABELS, PIECE_STATUSES, type PieceStatus } from "@/lib/domain";
import { acceptWarning } from "@/lib/pieces/accept-warning";
import { editorMoveRefusal } from "@/lib/pieces/status";
import { PIECE_VERDICT_RANK, PIECE_VERDICTS, type PieceVerdict } from "@/lib/pieces/verdict";
import type { SubmissionSort, SubmissionsQuery } from "@/lib/validations/review";
import type { Anthology } from "./anthologies";

/**
 * Pages with a file: a current composite, or a current master of any ink (a page sent as
 * separations; whether every ink has one is the piece's verdict's business).
 */
const pageHasFile = sql<number>`COALESCE(SUM(CASE WHEN ${schema.piecePages.currentVersionId} IS NOT NULL OR EXISTS (SELECT 1 FROM ${schema.pageSeparations} sep WHERE sep.piece_page_id = ${schema.piecePages.id} AND sep.current_version_id IS NOT NULL) THEN 1 ELSE 0 END), 0)`;

const p = schema.pieces;
const u = schema.users;
const pp = schema.piecePages;

/* ---------- The submissions table ---------- */

export type SubmissionRow = {
  id: number;
  title: string;
  kind: (typeof PIECE_KINDS)[number];
  pageCount: number;
  inks: string[];
  verdict: PieceVerdict;
  status: PieceStatus;
  creditLine: string;
  updatedAt: string;
  contributor: { id: string; name: string | null; email: string | null };
};

export type SubmissionsPage = {
  rows: SubmissionRow[];
  total: number;
  page: number;
  pageSize: number;
};

/** `FIELD(col, 'a', 'b', …)`: the 1-based position of the value in a fixed order. */
const fieldOrder = (column: SQL | typeof p.status, values: readonly string[]) =>
  sql`FIELD(${column}, ${sql.join(
    values.map((v) => sql`${v}`),
    sql`, `,
  )})`;

/** Sort keys per column; each list is compared in turn. */
const SORT_KEYS: Record<SubmissionSort, () => SQL[]> = {
  contributor: () => [sql`COALESCE(${u.name}, ${u.email})`],
  title: () => [sql`${p.title}`],
  kind: () => [fieldOrder(sql`${p.kind}`, PIECE_KINDS)],
  pages: () => [sql`${p.pageCount}`],
  inks: () => [sql`JSON_LENGTH(${p.inks})`, sql`CAST(${p.inks} AS CHAR)`],
  // Worst verdict ranks highest, so "desc" lists the pieces that need attention first.
  verdict: () => [
    sql`CASE ${p.verdict} ${sql.join(
      PIECE_VERDICTS.map((v) => sql`WHEN ${v} THEN ${PIECE_VERDICT_RANK[v]}`),
      sql` `,
    )} ELSE 5 END`,
  ],
  status: () => [fieldOrder(sql`${p.status}`, PIECE_STATUSES)],
  updated: () => [sql`${p.updatedAt}`],
};

/** `%term%` for LIKE, with the wildcard characters in the term taken literally. */
const containing = (term: string) => `%${term.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** One page of an anthology's submissions, filtered, searched and sorted in SQL. */
export async function listSubmissions(
  anthologyId: number,
  query: SubmissionsQuery,
): Promise<SubmissionsPage> {
  const conditions: SQL[] = [eq(p.anthologyId, anthologyId)];
  if (query.status.length) conditions.push(inArray(p.status, query.status));
  if (query.verdict.length) conditions.push(inArray(p.verdict, query.verdict));
  if (query.q) {
    const term = containing(query.q);
    conditions.push(or(like(p.title, term), like(u.name, term), like(p.creditLine, term))!);
  }
  const where = and(...conditions);
  const direction = query.dir === "asc" ? asc : desc;
  const order = [...SORT_KEYS[query.sort]().map((key) => direction(key)), asc(p.id)];

  const [rows, [totals]] = await Promise.all([
    db
      .select({
        id: p.id,
        title: p.title,
        kind: p.kind,
        pageCount: p.pageCount,
        inks: p.inks,
        verdict: p.verdict,
        status: p.status,
        creditLine: p.creditLine,
        updatedAt: p.updatedAt,
        contributorId: u.id,
        contributorName: u.name,
        contributorEmail: u.email,
      })
      .from(p)
      .innerJoin(u, eq(u.id, p.contributorId))
      .where(where)
      .orderBy(...order)
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize),
    db.select({ total: count() }).from(p).innerJoin(u, eq(u.id, p.contributorId)).where(where),
  ]);

  return {
    rows: rows.map((r) => ({
      id: r.id,
      title: r.title,
      kind: r.kind,
      pageCount: r.pageCount,
      inks: r.inks,
      verdict: r.verdict as PieceVerdict,
      status: r.status,
      creditLine: r.creditLine,
      updatedAt: r.updatedAt.toISOString(),
      contributor: { id: r.contributorId, name: r.contributorName, email: r.contributorEmail },
    })),
    total: Number(totals?.total ?? 0),
    page: query.page,
    pageSize: query.pageSize,
  };
}

/** Which anthology a piece belongs to, for authorising requests that name only the piece. */
export async function findPieceAnthologySlug(pieceId: number): Promise<string | undefined> {
  const [row] = await db
    .select({ slug: schema.anthologies.slug })
    .from(p)
    .innerJoin(schema.anthologies, eq(schema.anthologies.id, p.anthologyId))
    .where(eq(p.id, pieceId))
    .limit(1);
  return row?.slug;
}

/* ---------- Status changes ---------- */

export type RecordedMove =
  | { changed: false; reason: string; needsConfirm?: true }
  | {
      changed: true;
      from: PieceStatus;
      title: string;
      contributorId: string;
      eventId: number | undefined;
    };

/**
 * Moves one piece of `anthology` to `to` in its own transaction: row locked, the editors' rule
 * checked (lib/pieces/status.ts), history written. Telling the contributor is the caller's.
 */
export async function recordPieceMove(
  anthology: Anthology,
  actor: { id: string },
  pieceId: number,
  to: PieceStatus,
  options: { message?: string; expectedFrom?: PieceStatus; confirmAccept?: boolean } = {},
): Promise<RecordedMove> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({
        status: p.status,
        title: p.title,
        contributorId: p.contributorId,
        verdict: p.verdict,
        pageCount: p.pageCount,
      })
      .from(p)
      .where(and(eq(p.id, pieceId), eq(p.anthologyId, anthology.id)))
      .for("update");
    if (!row)
      return { changed: false as const, reason: "There is no such piece in this anthology." };
    if (options.expectedFrom && row.status !== options.expectedFrom) {
      return {
        changed: false as const,
        reason: `Someone moved it to "${PIECE_STATUS_LABELS[row.status]}" in the meantime; look again before changing it.`,
      };
    }
    const refused = editorMoveRefusal(row.status, to);
    if (refused) return { changed: false as const, reason: refused };
    if (to === "accepted" && !options.confirmAccept) {
      const [files] = await tx.select({ n: pageHasFile }).from(pp).where(eq(pp.pieceId, pieceId));
      const warning = acceptWarning({ ...row, pagesWithFiles: Number(files?.n ?? 0) });
      if (warning) return { changed: false as const, reason: warning, needsConfirm: true as const };
    }
    await tx.update(p).set({ status: to }).where(eq(p.id, pieceId));
    const [event] = await tx
      .insert(schema.pieceEvents)
      .values({
        pieceId,
        actorId: actor.id,
        fromStatus: row.status,
        toStatus: to,
        message: options.message ?? null,
      })
      .$returningId();
    return {
      changed: true as const,
      from: row.status,
      title: row.title,
      contributorId: row.contributorId,
      eventId: event?.id,
    };
  });
}

/**
 * Why accepting each of these pieces needs confirmation (pieces that can print, or are not in
 * this anthology, are left out). Read before a bulk move so nothing moves until the editor agrees.
 */
export async function acceptWarnings(
  anthologyId: number,
  pieceIds: number[],
): Promise<{ pieceId: number; warning: string }[]> {
  if (pieceIds.length === 0) return [];
  const rows = await db
    .select({
      id: p.id,
      title: p.title,
      status: p.status,
      verdict: p.verdict,
      pageCount: p.pageCount,
      pagesWithFiles: pageHasFile,
    })
    .from(p)
    .leftJoin(pp, eq(pp.pieceId, p.id))
    .where(and(eq(p.anthologyId, anthologyId), inArray(p.id, pieceIds)))
    .groupBy(p.id);
  return rows.flatMap((row) => {
    if (editorMoveRefusal(row.status, "accepted")) return [];
    const warning = acceptWarning({ ...row, pagesWithFiles: Number(row.pagesWithFiles) });
    return warning ? [{ pieceId: row.id, warning }] : [];
  });
}

/** The address and name to write to about a piece, or undefined for an account with no address. */
export async function contributorContact(
  userId: string,
): Promise<{ email: string; name: string | null } | undefined> {
  const [row] = await db
    .select({ name: u.name, email: u.email })
    .from(u)
    .where(eq(u.id, userId))
    .limit(1);
  return row?.email ? { email: row.email, name: row.name } : undefined;
}

/* ---------- One piece in full ---------- */

export type ReviewVersion = {
  id: number;
  /** The ink of a separation; null for the page's composite file. */
  ink: string | null;
  versionNumber: number;
  fileName: string;
  mimeType: string;
  sizeBytes: number;
  verdict: string;
  report: unknown;
  hasThumbnail: boolean;
  thumbnailWidthPx: number | null;
  thumbnailHeightPx: number | null;
  uploadedByName: string | null;
  createdAt: Date;
};

/** One ink's master of a page: the file in use and the earlier ones. */
export type ReviewSeparation = {
  ink: string;
  current: ReviewVersion | null;
  older: ReviewVersion[];
};

export type ReviewPage = {
  pageIndex: number;
  altText: string | null;
  /** The page's composite file (for a page sent as separations, a colour guide, if any). */
  current: ReviewVersion | null;
  older: ReviewVersion[];
  /** One per ink for a page that takes a master per ink (lib/pieces/separations.ts); else empty. */
  separations: ReviewSeparation[];
};

/** A piece with every page, every file version (newest first) and its status history (newest first). */
export async function getPieceForReview(anthologyId: number, pieceId: number) {
  const [head] = await db
    .select({ piece: p, contributor: { id: u.id, name: u.name, email: u.email } })
    .from(p)
    .innerJoin(u, eq(u.id, p.contributorId))
    .where(and(eq(p.id, pieceId), eq(p.anthologyId, anthologyId)))
    .limit(1);
  if (!head) return undefined;

  const pp = schema.piecePages;
  const fv = schema.fileVersions;
  const uploader = sql<
    string | null
  >`(SELECT ${u.name} FROM ${u} WHERE ${u.id} = ${fv.uploadedBy})`;
  const ps = schema.pageSeparations;
  const [anthology] = await db
    .select({ printMethod: schema.anthologies.printMethod })
    .from(schema.anthologies)
    .where(eq(schema.anthologies.id, anthologyId));
  const required = anthology ? requiredFilesOf(anthology, head.piece) : [];
  const [pageRows, versionRows, eventRows, separationRows] = await Promise.all([
    db.select().from(pp).where(eq(pp.pieceId, pieceId)).orderBy(asc(pp.pageIndex)),
    db
      .select({
        ...fileVersionSummary,
        thumbnailWidthPx: fv.thumbnailWidthPx,
        thumbnailHeightPx: fv.thumbnailHeightPx,
        uploadedByName: uploader,
      })
      .from(fv)
      .innerJoin(pp, eq(pp.id, fv.piecePageId))
      .where(eq(pp.pieceId, pieceId))
      .orderBy(desc(fv.versionNumber), desc(fv.id)),
    db
      .select({
        id: schema.pieceEvents.id,
        fromStatus: schema.pieceEvents.fromStatus,
        toStatus: schema.pieceEvents.toStatus,
        message: schema.pieceEvents.message,
        createdAt: schema.pieceEvents.createdAt,
        actorName: u.name,
      })
      .from(schema.pieceEvents)
      .leftJoin(u, eq(u.id, schema.pieceEvents.actorId))
      .where(eq(schema.pieceEvents.pieceId, pieceId))
      .orderBy(desc(schema.pieceEvents.createdAt), desc(schema.pieceEvents.id)),
    db
      .select({ piecePageId: ps.piecePageId, ink: ps.ink, currentVersionId: ps.currentVersionId })
      .from(ps)
      .innerJoin(pp, eq(pp.id, ps.piecePageId))
      .where(eq(pp.pieceId, pieceId)),
  ]);

  const pageCount = Math.max(head.piece.pageCount, ...pageRows.map((r) => r.pageIndex));
  const pages: ReviewPage[] = [];
  for (let index = 1; index <= pageCount; index++) {
    const row = pageRows.find((r) => r.pageIndex === index);
    const versions: ReviewVersion[] = row
      ? versionRows
          .filter((v) => v.piecePageId === row.id)
          .map(({ piecePageId: _page, hasThumbnail, ...v }) => ({
            ...v,
            hasThumbnail: Boolean(Number(hasThumbnail)),
          }))
      : [];
    const composites = versions.filter((v) => v.ink === null);
    const current = composites.find((v) => v.id === row?.currentVersionId) ?? null;
    pages.push({
      pageIndex: index,
      altText: row?.altText ?? null,
      current,
      older: composites.filter((v) => v !== current),
      separations: required.flatMap((file) => {
        if (file.kind !== "separation") return [];
        const own = versions.filter((v) => v.ink === file.ink);
        const sep = separationRows.find((x) => x.piecePageId === row?.id && x.ink === file.ink);
        const inUse = own.find((v) => v.id === sep?.currentVersionId) ?? null;
        return [{ ink: file.ink, current: inUse, older: own.filter((v) => v !== inUse) }];
      }),
    });
  }

  return {
    piece: { ...head.piece, verdict: head.piece.verdict as PieceVerdict },
    contributor: head.contributor,
    pages,
    events: eventRows.map((e) => ({
      ...e,
      fromStatus: e.fromStatus as PieceStatus | null,
      toStatus: e.toStatus as PieceStatus,
    })),
  };
}
export type PieceForReview = NonNullable<Awaited<ReturnType<typeof getPieceForReview>>>;

/* ---------- Editors' notes (never shown to contributors) ---------- */

export type EditorNote = {
  id: number;
  body: string;
  createdAt: string;
  author: { id: string; name: string | null };
};

export async function listEditorNotes(pieceId: number): Promise<EditorNote[]> {
  const n = schema.editorNotes;
  const rows = await db
    .select({
      id: n.id,
      body: n.body,
      createdAt: n.createdAt,
      authorId: n.authorId,
      authorName: u.name,
    })
    .from(n)
    .leftJoin(u, eq(u.id, n.authorId))
    .where(eq(n.pieceId, pieceId))
    .orderBy(desc(n.createdAt), desc(n.id));
  return rows.map((r) => ({
    id: r.id,
    body: r.body,
    createdAt: r.createdAt.toISOString(),
    author: { id: r.authorId, name: r.authorName },
  }));
}

export async function addEditorNote(
  pieceId: number,
  author: { id: string; name: string | null },
  body: string,
): Promise<EditorNote> {
  const createdAt = new Date();
  const [row] = await db
    .insert(schema.editorNotes)
    .values({ pieceId, authorId: author.id, body, createdAt })
    .$returningId();
  if (!row) throw new Error("note insert returned no id");
  return {
    id: row.id,
    body,
    createdAt: createdAt.toISOString(),
    author: { id: author.id, name: author.name },
  };
}
