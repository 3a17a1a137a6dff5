import "server-only";
import { and, asc, count, eq, gt, inArray, isNotNull } from "drizzle-orm";
import { db, schema } from "@/db";
import type { AnthologyStage } from "@/lib/domain";
import { isSlug } from "@/lib/slug";
import type { CallRecord } from "@/lib/validations/call";
import type { Anthology } from "./anthologies";

export type CallRow = typeof schema.calls.$inferSelect;

/** The open call of an anthology (each has at most one), or undefined before it is written. */
export async function findCall(anthologyId: number): Promise<CallRow | undefined> {
  const [row] = await db
    .select()
    .from(schema.calls)
    .where(eq(schema.calls.anthologyId, anthologyId))
    .limit(1);
  return row;
}

/** The stored fields of a call row as the shared record type. */
export function toCallRecord(row: CallRow): CallRecord {
  return {
    theme: row.theme,
    brief: row.brief,
    opensAt: row.opensAt,
    closesAt: row.closesAt,
    timeZone: row.timeZone,
    allowedKinds: row.allowedKinds,
    maxRunPages: row.maxRunPages,
    piecesPerPerson: row.piecesPerPerson,
    allowedInks: row.allowedInks,
    feeKind: row.feeKind,
    feeCents: row.feeCents,
    salesShareBasisPoints: row.salesShareBasisPoints,
    shareSplit: row.shareSplit,
    contributorCopies: row.contributorCopies,
    rightsAsked: row.rightsAsked,
  };
}

/** Writes the anthology's call, creating it the first time. */
export async function saveCall(anthologyId: number, record: CallRecord): Promise<CallRow> {
  await db
    .insert(schema.calls)
    .values({ anthologyId, ...record })
    .onDuplicateKeyUpdate({ set: { ...record, updatedAt: new Date() } });
  const row = await findCall(anthologyId);
  if (!row) throw new Error("the call vanished after saving");
  return row;
}

/** A call anyone may read: the anthology has opened it (stage call-open or later). */
export async function findPublishedCall(
  slug: string,
): Promise<{ anthology: Anthology; call: CallRow } | undefined> {
  // Exactly this slug: see findAnthologyBySlug for why the collation is not trusted.
  if (!isSlug(slug)) return undefined;
  const [row] = await db
    .select({ anthology: schema.anthologies, call: schema.calls })
    .from(schema.anthologies)
    .innerJoin(schema.calls, eq(schema.calls.anthologyId, schema.anthologies.id))
    .where(
      and(
        eq(schema.anthologies.slug, slug),
        isNotNull(schema.calls.publishedAt),
        inArray(schema.anthologies.stage, PUBLISHED_STAGES),
      ),
    )
    .limit(1);
  return row?.anthology.slug === slug ? row : undefined;
}

const PUBLISHED_STAGES: AnthologyStage[] = [
  "call-open",
  "call-closed",
  "laying-out",
  "printing",
  "wrapped-up",
];

/** Calls at the "call open" stage that have not reached their closing time, longest published first. */
export async function listOpenCalls(now: Date, limit = 6) {
  return db
    .select({
      slug: schema.anthologies.slug,
      title: schema.anthologies.title,
      pressName: schema.anthologies.pressName,
      theme: schema.calls.theme,
      opensAt: schema.calls.opensAt,
      closesAt: schema.calls.closesAt,
      timeZone: schema.calls.timeZone,
    })
    .from(schema.calls)
    .innerJoin(schema.anthologies, eq(schema.anthologies.id, schema.calls.anthologyId))
    .where(
      and(
        eq(schema.anthologies.stage, "call-open"),
        isNotNull(schema.calls.publishedAt),
        gt(schema.calls.closesAt, now),
      ),
    )
    .orderBy(asc(schema.calls.publishedAt), asc(schema.calls.closesAt))
    .limit(limit);
}

/** Pieces in the book and pieces nobody has read yet, for the stage rules. */
export async function countPiecesForStage(
  anthologyId: number,
): Promise<{ accepted: number; awaitingReview: number }> {
  const rows = await db
    .select({ status: schema.pieces.status, n: count() })
    .from(schema.pieces)
    .where(
      and(
        eq(schema.pieces.anthologyId, anthologyId),
        inArray(schema.pieces.status, ["accepted", "awaiting-review"]),
      ),
    )
    .groupBy(schema.pieces.status);
  const of = (status: string) => Number(rows.find((r) => r.status === status)?.n ?? 0);
  return { accepted: of("accepted"), awaitingReview: of("awaiting-review") };
}

/**
 * Moves the anthology from `from` to `to` if it is still at `from` (two editors pressing at once
 * move it once). Opening the call publishes it; closing it before its closing time brings the
 * closing time forward to now, so the public page says when it really closed.
 */
export async function moveStage(
  anthologyId: number,
  from: AnthologyStage,
  to: AnthologyStage,
  now: Date,
): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [result] = await tx
      .update(schema.anthologies)
      .set({ stage: to })
      .where(and(eq(schema.anthologies.id, anthologyId), eq(schema.anthologies.stage, from)));
    if (result.affectedRows !== 1) return false;
    const [call] = await tx
      .select()
      .from(schema.calls)
      .where(eq(schema.calls.anthologyId, anthologyId))
      .limit(1);
    if (call && to === "call-open" && !call.publishedAt) {
      await tx.update(schema.calls).set({ publishedAt: now }).where(eq(schema.calls.id, call.id));
    }
    if (call && to === "call-closed" && call.closesAt.getTime() > now.getTime()) {
      const openedYet = call.opensAt.getTime() <= now.getTime();
      await tx
        .update(schema.calls)
        .set(openedYet ? { closesAt: now } : { opensAt: now, closesAt: now })
        .where(eq(schema.calls.id, call.id));
    }
    return true;
  });
}
