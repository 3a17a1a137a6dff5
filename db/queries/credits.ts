import "server-only";
/** Credit lines of an anthology's pieces: who approved, who was asked, and the changes to them. */
import { and, asc, eq, inArray, isNull, sql } from "drizzle-orm";
import { db, schema } from "@/db";

const p = schema.pieces;
const u = schema.users;
const a = schema.anthologies;

/** A piece's credit as the credits screen and the request mail need it. */
export type CreditRow = {
  pieceId: number;
  anthologyId: number;
  title: string;
  status: string;
  leftOut: boolean;
  creditLine: string;
  creditApprovedAt: Date | null;
  creditRequestedAt: Date | null;
  contributorId: string;
  contributorName: string | null;
  contributorEmail: string | null;
};

const columns = {
  pieceId: p.id,
  anthologyId: p.anthologyId,
  title: p.title,
  status: p.status,
  leftOut: p.leftOut,
  creditLine: p.creditLine,
  creditApprovedAt: p.creditApprovedAt,
  creditRequestedAt: p.creditRequestedAt,
  contributorId: p.contributorId,
  contributorName: u.name,
  contributorEmail: u.email,
};

/** Pieces in this issue: accepted and not left out, oldest first. */
export async function listIssueCredits(anthologyId: number): Promise<CreditRow[]> {
  return db
    .select(columns)
    .from(p)
    .innerJoin(u, eq(u.id, p.contributorId))
    .where(and(eq(p.anthologyId, anthologyId), eq(p.status, "accepted"), eq(p.leftOut, false)))
    .orderBy(asc(p.id));
}

/** One piece's credit, with its anthology's title and slug; undefined for an unknown piece. */
export async function findCreditPiece(
  pieceId: number,
): Promise<(CreditRow & { anthologyTitle: string; anthologySlug: string }) | undefined> {
  const [row] = await db
    .select({ ...columns, anthologyTitle: a.title, anthologySlug: a.slug })
    .from(p)
    .innerJoin(u, eq(u.id, p.contributorId))
    .innerJoin(a, eq(a.id, p.anthologyId))
    .where(eq(p.id, pieceId))
    .limit(1);
  return row;
}

/** Records a request made at `at`, unless the line was approved meanwhile; false when it was. */
export async function markCreditRequested(pieceId: number, at: Date): Promise<boolean> {
  const [result] = await db
    .update(p)
    .set({ creditRequestedAt: at })
    .where(and(eq(p.id, pieceId), isNull(p.creditApprovedAt)));
  return result.affectedRows > 0;
}

/** Puts back the request time a failed mail replaced (only if nothing else changed it since). */
export async function undoCreditRequest(
  pieceId: number,
  at: Date,
  previous: Date | null,
): Promise<void> {
  await db
    .update(p)
    .set({ creditRequestedAt: previous })
    .where(and(eq(p.id, pieceId), eq(p.creditRequestedAt, at)));
}

export type CreditSnapshot = Pick<
  CreditRow,
  "creditLine" | "creditApprovedAt" | "creditRequestedAt"
>;

/**
 * Approves a piece's credit line in one transaction: the row is locked, `decide` judges the
 * state it finds (the token check) and only a "good" answer writes the line, the approval time
 * and clears the open request.
 */
export async function approveCreditLine<S extends string>(
  pieceId: number,
  creditLine: string,
  decide: (current: CreditSnapshot) => S,
  now: Date,
): Promise<S | undefined> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({
        creditLine: p.creditLine,
        creditApprovedAt: p.creditApprovedAt,
        creditRequestedAt: p.creditRequestedAt,
      })
      .from(p)
      .where(eq(p.id, pieceId))
      .for("update");
    if (!row) return undefined;
    const verdict = decide(row);
    if (verdict !== "good") return verdict;
    await tx
      .update(p)
      .set({ creditLine, creditApprovedAt: now, creditRequestedAt: null })
      .where(eq(p.id, pieceId));
    return verdict;
  });
}

/**
 * Changes a credit line; a change clears any approval (the contributor is asked again). Returns
 * the state before, or undefined for an unknown piece. Writing the same line changes nothing.
 */
export async function writeCreditLine(
  pieceId: number,
  creditLine: string,
): Promise<{ before: CreditSnapshot; changed: boolean } | undefined> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({
        creditLine: p.creditLine,
        creditApprovedAt: p.creditApprovedAt,
        creditRequestedAt: p.creditRequestedAt,
      })
      .from(p)
      .where(eq(p.id, pieceId))
      .for("update");
    if (!row) return undefined;
    if (row.creditLine === creditLine) return { before: row, changed: false };
    await tx
      .update(p)
      .set({ creditLine, creditApprovedAt: null, creditRequestedAt: null })
      .where(eq(p.id, pieceId));
    return { before: row, changed: true };
  });
}

/** Whether each piece's credit is approved (public for proofs), by piece id. */
export async function creditApprovals(pieceIds: number[]): Promise<Map<number, Date | null>> {
  if (pieceIds.length === 0) return new Map();
  const rows = await db
    .select({ id: p.id, approvedAt: p.creditApprovedAt })
    .from(p)
    .where(inArray(p.id, pieceIds));
  return new Map(rows.map((r) => [r.id, r.approvedAt]));
}

/** The current file of each page of these pieces: version id, thumbnail present, alt text. */
export async function currentPageArt(pieceIds: number[]): Promise<
  {
    pieceId: number;
    pageIndex: number;
    altText: string | null;
    versionId: number | null;
    hasThumbnail: boolean;
    md5: string | null;
  }[]
> {
  if (pieceIds.length === 0) return [];
  const pp = schema.piecePages;
  const fv = schema.fileVersions;
  const rows = await db
    .select({
      pieceId: pp.pieceId,
      pageIndex: pp.pageIndex,
      altText: pp.altText,
      versionId: fv.id,
      hasThumbnail: sql<number>`${fv.thumbnailWebp} IS NOT NULL`,
      md5: fv.md5,
    })
    .from(pp)
    .leftJoin(fv, eq(fv.id, pp.currentVersionId))
    .where(inArray(pp.pieceId, pieceIds))
    .orderBy(asc(pp.pieceId), asc(pp.pageIndex));
  return rows.map((r) => ({ ...r, hasThumbnail: Boolean(Number(r.hasThumbnail)) }));
}

/** One version's thumbnail bytes and md5. */
export async function thumbnailBytes(
  versionId: number,
): Promise<{ webp: Buffer | null; md5: string | null } | undefined> {
  const fv = schema.fileVersions;
  const [row] = await db
    .select({ webp: fv.thumbnailWebp, md5: fv.md5 })
    .from(fv)
    .where(eq(fv.id, versionId))
    .limit(1);
  return row;
}
