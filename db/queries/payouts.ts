import "server-only";
import { and, asc, desc, eq, gte, inArray, lte, sql } from "drizzle-orm";
import { db, schema } from "@/db";
import type { LedgerKind, LedgerSource, SaleChannel, TransferState } from "@/lib/domain";
import type { LedgerComputation, PayoutTerms } from "@/lib/payouts";

/** MariaDB's error number for a duplicate key (ER_DUP_ENTRY). */
const ER_DUP_ENTRY = 1062;

export function isDuplicateKey(error: unknown): boolean {
  for (let e: unknown = error; e && typeof e === "object"; e = (e as { cause?: unknown }).cause) {
    const { errno, code } = e as { errno?: number; code?: unknown };
    if (errno === ER_DUP_ENTRY || code === "ER_DUP_ENTRY") return true;
  }
  return false;
}

export type SaleRow = typeof schema.sales.$inferSelect;
export type PeriodRow = typeof schema.payoutPeriods.$inferSelect;
export type EntryRow = typeof schema.payoutEntries.$inferSelect;
export type TransferRow = typeof schema.payoutTransfers.$inferSelect;
export type PayoutAccountRow = typeof schema.payoutAccounts.$inferSelect;

/* ---------- Sales and periods ---------- */

export async function listSales(anthologyId: number, range?: { from: Date; to: Date }) {
  const where = range
    ? and(
        eq(schema.sales.anthologyId, anthologyId),
        gte(schema.sales.soldOn, range.from),
        lte(schema.sales.soldOn, range.to),
      )
    : eq(schema.sales.anthologyId, anthologyId);
  return db
    .select()
    .from(schema.sales)
    .where(where)
    .orderBy(asc(schema.sales.soldOn), asc(schema.sales.id));
}

export async function insertSale(row: {
  anthologyId: number;
  channel: SaleChannel;
  label: string;
  soldOn: Date;
  copies: number;
  unitPriceCents: number;
  discountCents: number;
  channelFeesCents: number;
  recoverableCostsCents: number;
  currency: string;
  note: string | null;
  recordedBy: string;
}): Promise<number> {
  const [inserted] = await db.insert(schema.sales).values(row).$returningId();
  return inserted!.id;
}

export async function listPeriods(anthologyId: number) {
  return db
    .select()
    .from(schema.payoutPeriods)
    .where(eq(schema.payoutPeriods.anthologyId, anthologyId))
    .orderBy(asc(schema.payoutPeriods.startsOn), asc(schema.payoutPeriods.id));
}

export async function findPeriod(anthologyId: number, periodId: number) {
  const [row] = await db
    .select()
    .from(schema.payoutPeriods)
    .where(
      and(eq(schema.payoutPeriods.anthologyId, anthologyId), eq(schema.payoutPeriods.id, periodId)),
    );
  return row;
}

/** A new open period; null when one with that label exists. */
export async function insertPeriod(row: {
  anthologyId: number;
  label: string;
  startsOn: Date;
  endsOn: Date;
}): Promise<number | null> {
  try {
    const [inserted] = await db.insert(schema.payoutPeriods).values(row).$returningId();
    return inserted!.id;
  } catch (error) {
    if (isDuplicateKey(error)) return null;
    throw error;
  }
}

/** The call's money terms (null when the anthology has no call). */
export async function findPayoutTerms(anthologyId: number): Promise<PayoutTerms | null> {
  const [row] = await db
    .select({
      feeKind: schema.calls.feeKind,
      feeCents: schema.calls.feeCents,
      salesShareBasisPoints: schema.calls.salesShareBasisPoints,
      shareSplit: schema.calls.shareSplit,
      contributorCopies: schema.calls.contributorCopies,
    })
    .from(schema.calls)
    .where(eq(schema.calls.anthologyId, anthologyId));
  if (!row) return null;
  return {
    feeKind: row.feeKind,
    feeCents: row.feeCents,
    salesShareBasisPoints: row.salesShareBasisPoints,
    shareSplit: row.shareSplit,
  };
}

/** Each contributor with accepted work: pieces, pages, name and address, in a stable order. */
export async function contributorWork(anthologyId: number) {
  const rows = await db
    .select({
      contributorId: schema.pieces.contributorId,
      pieces: sql<number>`count(*)`.mapWith(Number),
      pages: sql<number>`sum(${schema.pieces.pageCount})`.mapWith(Number),
      name: schema.users.name,
      email: schema.users.email,
      creditLines: sql<string>`group_concat(distinct ${schema.pieces.creditLine} separator '; ')`,
      titles: sql<string>`group_concat(${schema.pieces.title} order by ${schema.pieces.id} separator '\n')`,
    })
    .from(schema.pieces)
    .innerJoin(schema.users, eq(schema.users.id, schema.pieces.contributorId))
    .where(and(eq(schema.pieces.anthologyId, anthologyId), eq(schema.pieces.status, "accepted")))
    .groupBy(schema.pieces.contributorId, schema.users.name, schema.users.email)
    .orderBy(asc(sql`min(${schema.pieces.id})`));
  return rows;
}

/** Copies given to a contributor (the contributor_copy table; read only here). */
export async function copiesGiven(anthologyId: number, contributorId: string) {
  const [row] = await db
    .select({
      quantity: schema.contributorCopies.quantity,
      handedOverAt: schema.contributorCopies.handedOverAt,
    })
    .from(schema.contributorCopies)
    .where(
      and(
        eq(schema.contributorCopies.anthologyId, anthologyId),
        eq(schema.contributorCopies.contributorId, contributorId),
      ),
    );
  return row ?? null;
}

/* ---------- The ledger ---------- */

export type NewEntry = {
  anthologyId: number;
  contributorId: string;
  periodId: number | null;
  kind: LedgerKind;
  source: LedgerSource;
  amountCents: number;
  currency: string;
  settlesEntryId?: number | null;
  reversesEntryId?: number | null;
  computation: LedgerComputation;
  reference?: string | null;
  dedupeKey: string;
  createdBy: string | null;
};

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/** Appends a line; "duplicate" when its dedupe key is already in the ledger (nothing written). */
export async function appendEntry(entry: NewEntry, tx: Tx | typeof db = db) {
  try {
    const [inserted] = await tx.insert(schema.payoutEntries).values(entry).$returningId();
    return { id: inserted!.id, duplicate: false as const };
  } catch (error) {
    if (isDuplicateKey(error)) return { id: null, duplicate: true as const };
    throw error;
  }
}

export async function ledgerFor(anthologyId: number, contributorId?: string) {
  return db
    .select()
    .from(schema.payoutEntries)
    .where(
      contributorId
        ? and(
            eq(schema.payoutEntries.anthologyId, anthologyId),
            eq(schema.payoutEntries.contributorId, contributorId),
          )
        : eq(schema.payoutEntries.anthologyId, anthologyId),
    )
    .orderBy(asc(schema.payoutEntries.id));
}

export async function findEntry(anthologyId: number, entryId: number) {
  const [row] = await db
    .select()
    .from(schema.payoutEntries)
    .where(
      and(eq(schema.payoutEntries.anthologyId, anthologyId), eq(schema.payoutEntries.id, entryId)),
    );
  return row;
}

export async function findEntryById(entryId: number) {
  const [row] = await db
    .select()
    .from(schema.payoutEntries)
    .where(eq(schema.payoutEntries.id, entryId));
  return row;
}

/** Lines that settle or reverse this owed line. */
export async function linesAbout(entryId: number) {
  return db
    .select()
    .from(schema.payoutEntries)
    .where(
      sql`${schema.payoutEntries.settlesEntryId} = ${entryId} or ${schema.payoutEntries.reversesEntryId} = ${entryId}`,
    );
}

/** Whose fee is already in this anthology's ledger. */
export async function feeHolders(anthologyId: number): Promise<Set<string>> {
  const rows = await db
    .select({ contributorId: schema.payoutEntries.contributorId })
    .from(schema.payoutEntries)
    .where(
      and(
        eq(schema.payoutEntries.anthologyId, anthologyId),
        eq(schema.payoutEntries.source, "fee"),
        eq(schema.payoutEntries.kind, "owed"),
      ),
    );
  return new Set(rows.map((r) => r.contributorId));
}

/**
 * Closes a period once: locks its row, appends every owed line and stamps it closed, in one
 * transaction. False when it was already closed (by a racing request, say).
 */
export async function closePeriodWithLines(
  periodId: number,
  closedBy: string,
  computation: unknown,
  lines: NewEntry[],
): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [period] = await tx
      .select({ closedAt: schema.payoutPeriods.closedAt })
      .from(schema.payoutPeriods)
      .where(eq(schema.payoutPeriods.id, periodId))
      .for("update");
    if (!period || period.closedAt) return false;
    for (const line of lines) await tx.insert(schema.payoutEntries).values(line);
    await tx
      .update(schema.payoutPeriods)
      .set({ closedAt: new Date(), closedBy, computation })
      .where(eq(schema.payoutPeriods.id, periodId));
    return true;
  });
}

/* ---------- Payout accounts and transfers ---------- */

export async function findPayoutAccount(userId: string) {
  const [row] = await db
    .select()
    .from(schema.payoutAccounts)
    .where(eq(schema.payoutAccounts.userId, userId));
  return row ?? null;
}

export async function findPayoutAccountByProviderId(providerAccountId: string) {
  const [row] = await db
    .select()
    .from(schema.payoutAccounts)
    .where(eq(schema.payoutAccounts.providerAccountId, providerAccountId));
  return row ?? null;
}

export async function payoutAccountsFor(userIds: string[]) {
  if (userIds.length === 0) return [];
  return db
    .select()
    .from(schema.payoutAccounts)
    .where(inArray(schema.payoutAccounts.userId, userIds));
}

/** Keeps the first account a person connects; a racing second one is dropped. */
export async function insertPayoutAccount(userId: string, providerAccountId: string) {
  try {
    await db.insert(schema.payoutAccounts).values({ userId, providerAccountId });
  } catch (error) {
    if (!isDuplicateKey(error)) throw error;
  }
  return (await findPayoutAccount(userId))!;
}

export async function updatePayoutAccountStatus(
  providerAccountId: string,
  status: { detailsSubmitted: boolean; transfersActive: boolean },
) {
  await db
    .update(schema.payoutAccounts)
    .set(status)
    .where(eq(schema.payoutAccounts.providerAccountId, providerAccountId));
}

export async function transfersFor(entryId: number) {
  return db
    .select()
    .from(schema.payoutTransfers)
    .where(eq(schema.payoutTransfers.entryId, entryId))
    .orderBy(desc(schema.payoutTransfers.attempt));
}

export async function transfersIn(anthologyId: number) {
  return db
    .select()
    .from(schema.payoutTransfers)
    .where(eq(schema.payoutTransfers.anthologyId, anthologyId))
    .orderBy(asc(schema.payoutTransfers.id));
}

/** Claims an attempt number for an owed line; null when another request holds it. */
export async function claimTransferAttempt(row: {
  anthologyId: number;
  entryId: number;
  attempt: number;
  idempotencyKey: string;
  destination: string;
  amountCents: number;
  currency: string;
  createdBy: string;
}): Promise<number | null> {
  try {
    const [inserted] = await db
      .insert(schema.payoutTransfers)
      .values({ ...row, state: "requesting" })
      .$returningId();
    return inserted!.id;
  } catch (error) {
    if (isDuplicateKey(error)) return null;
    throw error;
  }
}

export async function settleTransferAttempt(
  id: number,
  outcome: { state: TransferState; providerTransferId?: string | null; error?: string | null },
) {
  await db
    .update(schema.payoutTransfers)
    .set({
      state: outcome.state,
      providerTransferId: outcome.providerTransferId ?? null,
      error: outcome.error?.slice(0, 500) ?? null,
    })
    .where(eq(schema.payoutTransfers.id, id));
}

/* ---------- Webhook events ---------- */

/** Records an event id as handled; false when it was seen before (a replay). */
export async function claimPaymentEvent(id: string, type: string, outcome: string) {
  try {
    await db.insert(schema.paymentEvents).values({ id, type, outcome: outcome.slice(0, 255) });
    return true;
  } catch (error) {
    if (isDuplicateKey(error)) return false;
    throw error;
  }
}

export async function releasePaymentEvent(id: string) {
  await db.delete(schema.paymentEvents).where(eq(schema.paymentEvents.id, id));
}

export async function setPaymentEventOutcome(id: string, outcome: string) {
  await db
    .update(schema.paymentEvents)
    .set({ outcome: outcome.slice(0, 255) })
    .where(eq(schema.paymentEvents.id, id));
}
