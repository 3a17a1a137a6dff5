import "server-only";
import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import { db, schema } from "@/db";
import type { SessionUser } from "@/lib/domain";
import { personLabel } from "@/lib/people";
import { Refusal } from "@/lib/refusal";
import { scheduleBatches, todayIn, type RunEvent } from "@/lib/run/batches";
import { finishingChecklist, SAFETY_DEFERRAL, timedSteps } from "@/lib/run/checklist";
import { copyCounts } from "@/lib/run/counts";
import { pressKeyOf } from "@/lib/run/press";
import {
  movementOf,
  movementRefusal,
  stockCounts,
  type Movement,
  type MovementRequest,
} from "@/lib/run/stock";
import type {
  BatchView,
  FinishingPayload,
  RunPayload,
  RunPlanSettings,
  StockPayload,
} from "@/lib/wire/run";
import type {
  PriceListInput,
  RunEventInput,
  RunPlanInput,
  ShopQuoteInput,
} from "@/lib/validations/run";
import type { Anthology } from "./anthologies";
import { readMapState } from "./page-map";

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

const pl = schema.priceLists;
const sq = schema.shopQuotes;
const rp = schema.runPlans;
const ev = schema.runEvents;
const fb = schema.finishingBatches;
const ft = schema.finishingTicks;
const sm = schema.stockMovements;
const cc = schema.contributorCopies;
const u = schema.users;

const ER_DUP_ENTRY = 1062;
function isDuplicateKey(error: unknown): boolean {
  for (let e: unknown = error; e && typeof e === "object"; e = (e as { cause?: unknown }).cause) {
    const { errno, code } = e as { errno?: number; code?: unknown };
    if (errno === ER_DUP_ENTRY || code === "ER_DUP_ENTRY") return true;
  }
  return false;
}

/** The zone the anthology's days are counted in: its call's zone, UTC before there is a call. */
export async function anthologyZone(anthologyId: number): Promise<string> {
  const [call] = await db
    .select({ timeZone: schema.calls.timeZone })
    .from(schema.calls)
    .where(eq(schema.calls.anthologyId, anthologyId))
    .limit(1);
  return call?.timeZone ?? "UTC";
}

const DEFAULT_SETTINGS: RunPlanSettings = {
  quantities: [10, 25, 50, 100, 250],
  priceListId: null,
  shopQuoteId: null,
  timings: {},
  minutesPerWeek: 0,
  printMode: "all-at-once",
};

async function planSettings(anthologyId: number): Promise<RunPlanSettings> {
  const [row] = await db.select().from(rp).where(eq(rp.anthologyId, anthologyId)).limit(1);
  if (!row) return DEFAULT_SETTINGS;
  return {
    quantities: row.quantities,
    priceListId: row.priceListId,
    shopQuoteId: row.shopQuoteId,
    timings: row.timings,
    minutesPerWeek: row.minutesPerWeek,
    printMode: row.printMode,
  };
}

/** The booklet as the planner counts it: from the page map, the print method and the stock. */
export async function bookletOf(anthology: Anthology) {
  const { state } = await readMapState(anthology);
  const counts = copyCounts(state, anthology);
  const checklist = finishingChecklist({
    binding: anthology.binding,
    laidOutPages: counts.laidOutPages,
    sheetsPerCopy: counts.sheetsPerCopy,
    trimWidthMm: anthology.trimWidthMm,
    trimHeightMm: anthology.trimHeightMm,
    bleedMm: anthology.bleedMm,
    paperGsm: anthology.paperGsm,
    paperCaliperMm: anthology.paperCaliperMm,
    coverStock: anthology.coverStock,
    coverPaperGsm: anthology.coverPaperGsm,
  });
  return { counts, checklist };
}

async function listEvents(anthologyId: number): Promise<RunEvent[]> {
  const rows = await db
    .select()
    .from(ev)
    .where(eq(ev.anthologyId, anthologyId))
    .orderBy(asc(ev.onDate), asc(ev.id));
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    kind: r.kind,
    date: r.onDate,
    copies: r.copies,
  }));
}

/** Whether any batch has a tick, is done or has stock: then it is under way and cannot be re-planned. */
async function batchesStarted(anthologyId: number): Promise<{ count: number; started: boolean }> {
  const batches = await db
    .select({ id: fb.id, doneAt: fb.doneAt })
    .from(fb)
    .where(eq(fb.anthologyId, anthologyId));
  if (batches.length === 0) return { count: 0, started: false };
  const ids = batches.map((b) => b.id);
  const [ticks] = await db
    .select({ n: sql<number>`count(*)` })
    .from(ft)
    .where(inArray(ft.batchId, ids));
  const [moves] = await db
    .select({ n: sql<number>`count(*)` })
    .from(sm)
    .where(inArray(sm.batchId, ids));
  return {
    count: batches.length,
    started:
      batches.some((b) => b.doneAt !== null) ||
      Number(ticks?.n ?? 0) > 0 ||
      Number(moves?.n ?? 0) > 0,
  };
}

/** Everything the run planner screen needs for its first paint. */
export async function loadRunPlan(anthology: Anthology, canPlan: boolean): Promise<RunPayload> {
  const key = pressKeyOf(anthology);
  const [{ counts, checklist }, plan, lists, quotes, events, zone, batches] = await Promise.all([
    bookletOf(anthology),
    planSettings(anthology.id),
    db.select().from(pl).where(eq(pl.pressKey, key)).orderBy(asc(pl.name)),
    db.select().from(sq).where(eq(sq.pressKey, key)).orderBy(asc(sq.shopName)),
    listEvents(anthology.id),
    anthologyZone(anthology.id),
    batchesStarted(anthology.id),
  ]);
  return {
    currency: anthology.currency,
    timeZone: zone,
    today: todayIn(zone),
    pressName: anthology.pressName,
    counts,
    checklist,
    plan,
    priceLists: lists.map((l) => ({ id: l.id, name: l.name, prices: l.prices })),
    quotes: quotes.map((q) => ({
      id: q.id,
      shopName: q.shopName,
      tiers: q.tiers,
      turnaroundDays: q.turnaroundDays,
    })),
    events,
    batchCount: batches.count,
    batchesStarted: batches.started,
    canPlan,
  };
}

/* ---------- Prices and quotes ---------- */

/** Saves a price list for the anthology's collective: a new one (id null) or an existing one of the same collective. */
export async function savePriceList(
  anthology: Anthology,
  user: SessionUser,
  id: number | null,
  input: PriceListInput,
): Promise<number> {
  const key = pressKeyOf(anthology);
  try {
    if (id === null) {
      const [res] = await db.insert(pl).values({
        pressKey: key,
        name: input.name,
        currency: anthology.currency,
        prices: input.prices,
        updatedBy: user.id,
      });
      return res.insertId;
    }
    const [res] = await db
      .update(pl)
      .set({ name: input.name, prices: input.prices, updatedBy: user.id })
      .where(and(eq(pl.id, id), eq(pl.pressKey, key)));
    if (res.affectedRows === 0)
      throw new Refusal(404, "There is no such price list for this press.");
    return id;
  } catch (error) {
    if (isDuplicateKey(error))
      throw new Refusal(409, `This press already has a price list called "${input.name}".`);
    throw error;
  }
}

/** Saves a shop's quote for the anthology's collective. */
export async function saveShopQuote(
  anthology: Anthology,
  user: SessionUser,
  id: number | null,
  input: ShopQuoteInput,
): Promise<number> {
  const key = pressKeyOf(anthology);
  const values = {
    shopName: input.shopName,
    tiers: input.tiers,
    turnaroundDays: input.turnaroundDays,
  };
  try {
    if (id === null) {
      const [res] = await db
        .insert(sq)
        .values({ pressKey: key, currency: anthology.currency, updatedBy: user.id, ...values });
      return res.insertId;
    }
    const [res] = await db
      .update(sq)
      .set({ ...values, updatedBy: user.id })
      .where(and(eq(sq.id, id), eq(sq.pressKey, key)));
    if (res.affectedRows === 0) throw new Refusal(404, "There is no such quote for this press.");
    return id;
  } catch (error) {
    if (isDuplicateKey(error))
      throw new Refusal(409, `This press already has a quote from "${input.shopName}".`);
    throw error;
  }
}

/** Keeps the plan's settings; the price list and quote must be this collective's. */
export async function saveRunPlan(
  anthology: Anthology,
  input: RunPlanInput,
): Promise<RunPlanSettings> {
  const key = pressKeyOf(anthology);
  if (input.priceListId !== null) {
    const [row] = await db
      .select({ id: pl.id })
      .from(pl)
      .where(and(eq(pl.id, input.priceListId), eq(pl.pressKey, key)));
    if (!row) throw new Refusal(404, "There is no such price list for this press.");
  }
  if (input.shopQuoteId !== null) {
    const [row] = await db
      .select({ id: sq.id })
      .from(sq)
      .where(and(eq(sq.id, input.shopQuoteId), eq(sq.pressKey, key)));
    if (!row) throw new Refusal(404, "There is no such quote for this press.");
  }
  const values = {
    quantities: input.quantities,
    priceListId: input.priceListId,
    shopQuoteId: input.shopQuoteId,
    timings: input.timings,
    minutesPerWeek: input.minutesPerWeek,
    printMode: input.printMode,
  };
  await db
    .insert(rp)
    .values({ anthologyId: anthology.id, ...values })
    .onDuplicateKeyUpdate({ set: values });
  return planSettings(anthology.id);
}

/* ---------- Events and batches ---------- */

export async function addEvent(anthology: Anthology, input: RunEventInput): Promise<number> {
  const [res] = await db.insert(ev).values({
    anthologyId: anthology.id,
    name: input.name,
    kind: input.kind,
    onDate: input.date,
    copies: input.copies,
  });
  return res.insertId;
}

export async function deleteEvent(anthology: Anthology, eventId: number): Promise<void> {
  const [res] = await db
    .delete(ev)
    .where(and(eq(ev.id, eventId), eq(ev.anthologyId, anthology.id)));
  if (res.affectedRows === 0) throw new Refusal(404, "There is no such event.");
}

/**
 * Makes one finishing batch per event, replacing batches not yet under way. Refused once a batch
 * has a tick, is done or holds stock: those records stay as they are.
 */
export async function planBatchesFromEvents(anthology: Anthology): Promise<number> {
  const started = await batchesStarted(anthology.id);
  if (started.started)
    throw new Refusal(409, "Finishing has started on these batches, so they stay as they are.");
  const [events, plan, { counts, checklist }, zone] = await Promise.all([
    listEvents(anthology.id),
    planSettings(anthology.id),
    bookletOf(anthology),
    anthologyZone(anthology.id),
  ]);
  if (events.length === 0)
    throw new Refusal(409, "Add an event first: batches are timed to events.");
  const schedule = scheduleBatches({
    today: todayIn(zone),
    events,
    minutesPerWeek: plan.minutesPerWeek,
    steps: timedSteps(checklist, plan.timings),
    sheetsPerCopy: counts.sheetsPerCopy,
  });
  await db.transaction(async (tx) => {
    // Two re-plans at once would each delete and insert the same positions: the anthology's row
    // lock makes the second wait and then replace the first's batches.
    await tx
      .select({ id: schema.anthologies.id })
      .from(schema.anthologies)
      .where(eq(schema.anthologies.id, anthology.id))
      .for("update");
    await tx.delete(fb).where(eq(fb.anthologyId, anthology.id));
    await tx.insert(fb).values(
      schedule.batches.map((b) => ({
        anthologyId: anthology.id,
        label: b.label,
        copies: b.copies,
        position: b.index,
        eventId: b.eventId,
        dueOn: b.due,
      })),
    );
  });
  return schedule.batches.length;
}

async function readBatches(anthologyId: number, mayShowEmail: boolean): Promise<BatchView[]> {
  const rows = await db
    .select({
      id: fb.id,
      position: fb.position,
      label: fb.label,
      copies: fb.copies,
      due: fb.dueOn,
      doneAt: fb.doneAt,
      eventName: ev.name,
      doneByName: u.name,
      doneByEmail: u.email,
    })
    .from(fb)
    .leftJoin(ev, eq(ev.id, fb.eventId))
    .leftJoin(u, eq(u.id, fb.doneBy))
    .where(eq(fb.anthologyId, anthologyId))
    .orderBy(asc(fb.position), asc(fb.id));
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const ticks = await db
    .select({ batchId: ft.batchId, stepId: ft.stepId, at: ft.doneAt, name: u.name, email: u.email })
    .from(ft)
    .innerJoin(u, eq(u.id, ft.doneBy))
    .where(inArray(ft.batchId, ids));
  const sets = await db
    .select({ batchId: sm.batchId, n: sql<number>`coalesce(sum(${sm.sheetSets}), 0)` })
    .from(sm)
    .where(and(eq(sm.anthologyId, anthologyId), inArray(sm.batchId, ids)))
    .groupBy(sm.batchId);
  const label = (name: string | null, email: string | null) =>
    personLabel({ name, email }, { mayShowEmail, unnamed: "A team member" });
  return rows.map((r) => ({
    id: r.id,
    position: r.position,
    label: r.label,
    copies: r.copies,
    due: r.due,
    eventName: r.eventName,
    doneAt: r.doneAt?.toISOString() ?? null,
    doneBy: r.doneAt ? label(r.doneByName, r.doneByEmail) : null,
    sheetSets: Number(sets.find((s) => s.batchId === r.id)?.n ?? 0),
    ticks: Object.fromEntries(
      ticks
        .filter((t) => t.batchId === r.id)
        .map((t) => [t.stepId, { at: t.at.toISOString(), by: label(t.name, t.email) }]),
    ),
  }));
}

export async function loadFinishing(
  anthology: Anthology,
  opts: { canTick: boolean; mayShowEmail: boolean },
): Promise<FinishingPayload> {
  const [{ checklist }, batches, zone] = await Promise.all([
    bookletOf(anthology),
    readBatches(anthology.id, opts.mayShowEmail),
    anthologyZone(anthology.id),
  ]);
  return { timeZone: zone, checklist, safety: SAFETY_DEFERRAL, batches, canTick: opts.canTick };
}

/* ---------- Stock: one locked row per anthology, movements summed under the lock ---------- */

/**
 * Creates the anthology's stock row outside any transaction. Inside one, INSERT IGNORE of an
 * existing row takes a shared lock, and two movements holding it while both ask for the
 * exclusive lock would deadlock; on its own it commits at once.
 */
async function ensureStockRow(anthologyId: number): Promise<void> {
  await db.insert(schema.runStock).ignore().values({ anthologyId, movementCount: 0 });
}

/** Locks the anthology's stock row (ensureStockRow first) and reads the counts under the lock. */
async function lockStock(tx: Tx, anthologyId: number) {
  await tx
    .select()
    .from(schema.runStock)
    .where(eq(schema.runStock.anthologyId, anthologyId))
    .for("update");
  const rows = await tx
    .select({ kind: sm.kind, batchId: sm.batchId, sheetSets: sm.sheetSets, copies: sm.copies })
    .from(sm)
    .where(eq(sm.anthologyId, anthologyId))
    // A locking read (MariaDB has no FOR SHARE) sees the latest committed movements, not the
    // snapshot an earlier plain read in this transaction may have fixed (repeatable read).
    .for("update");
  return stockCounts(rows as Movement[]);
}

interface MovementContext {
  reason: string;
  eventId?: number | null;
  contributorCopyId?: number | null;
}

async function appendMovement(
  tx: Tx,
  anthologyId: number,
  user: SessionUser,
  movement: Movement,
  context: MovementContext,
): Promise<void> {
  const counts = await lockStock(tx, anthologyId);
  const refusal = movementRefusal(counts, movement);
  if (refusal) throw new Refusal(409, refusal);
  await tx.insert(sm).values({
    anthologyId,
    batchId: movement.batchId,
    kind: movement.kind,
    sheetSets: movement.sheetSets,
    copies: movement.copies,
    reason: context.reason,
    eventId: context.eventId ?? null,
    contributorCopyId: context.contributorCopyId ?? null,
    actorId: user.id,
  });
  await tx
    .update(schema.runStock)
    .set({ movementCount: sql`${schema.runStock.movementCount} + 1` })
    .where(eq(schema.runStock.anthologyId, anthologyId));
}

async function assertBatch(tx: Tx, anthologyId: number, batchId: number | null) {
  if (batchId === null) return null;
  const [row] = await tx
    .select()
    .from(fb)
    .where(and(eq(fb.id, batchId), eq(fb.anthologyId, anthologyId)));
  if (!row) throw new Refusal(404, "There is no such batch.");
  return row;
}

/** Records one stock movement; a movement that would take a count below zero is refused (409). */
export async function recordMovement(
  anthology: Anthology,
  user: SessionUser,
  request: MovementRequest & { reason: string },
): Promise<void> {
  await ensureStockRow(anthology.id);
  await db.transaction(async (tx) => {
    await assertBatch(tx, anthology.id, request.batchId);
    await appendMovement(tx, anthology.id, user, movementOf(request), { reason: request.reason });
  });
}

/** "Print all sheets at once": every batch's sheet sets recorded as printed, in one go. */
export async function recordAllPrinted(anthology: Anthology, user: SessionUser): Promise<number> {
  await ensureStockRow(anthology.id);
  return db.transaction(async (tx) => {
    const batches = await tx.select().from(fb).where(eq(fb.anthologyId, anthology.id));
    const have = await lockStock(tx, anthology.id);
    let n = 0;
    for (const b of batches) {
      const missing = b.copies - (have.sheetSetsByBatch[b.id] ?? 0);
      if (b.doneAt || missing <= 0) continue;
      await appendMovement(
        tx,
        anthology.id,
        user,
        movementOf({ kind: "printed", batchId: b.id, quantity: missing }),
        {
          reason: "All sheets printed at once",
        },
      );
      n += missing;
    }
    if (n === 0) throw new Refusal(409, "Every batch already has its printed sheets.");
    return n;
  });
}

/**
 * Ticks a checklist step of a batch (or clears it). Ticking "batch" marks the whole batch done
 * once every step is ticked, and moves its copies from printed sheets to finished stock in the
 * same transaction; clearing it moves them back.
 */
export async function tickStep(
  anthology: Anthology,
  user: SessionUser,
  batchId: number,
  stepId: string,
  done: boolean,
): Promise<void> {
  const { checklist } = await bookletOf(anthology);
  await ensureStockRow(anthology.id);
  await db.transaction(async (tx) => {
    const batch = await assertBatch(tx, anthology.id, batchId);
    if (!batch) throw new Refusal(404, "There is no such batch.");
    if (stepId !== "batch") {
      if (!checklist.some((s) => s.id === stepId))
        throw new Refusal(400, "That step is not on this booklet's checklist.");
      if (batch.doneAt) throw new Refusal(409, "This batch is marked done; reopen it first.");
      if (done)
        await tx
          .insert(ft)
          .ignore()
          .values({ batchId, stepId, doneBy: user.id, doneAt: new Date() });
      else await tx.delete(ft).where(and(eq(ft.batchId, batchId), eq(ft.stepId, stepId)));
      return;
    }
    if (done === Boolean(batch.doneAt)) return;
    if (done) {
      const ticks = await tx.select({ stepId: ft.stepId }).from(ft).where(eq(ft.batchId, batchId));
      const open = checklist.filter((s) => !ticks.some((t) => t.stepId === s.id));
      if (open.length > 0)
        throw new Refusal(
          409,
          `Tick every step first: ${open.map((s) => s.label.toLowerCase()).join(", ")} still open.`,
        );
      await appendMovement(
        tx,
        anthology.id,
        user,
        movementOf({ kind: "finished", batchId, quantity: batch.copies }),
        {
          reason: `${batch.label}: finished`,
        },
      );
      await tx.update(fb).set({ doneAt: new Date(), doneBy: user.id }).where(eq(fb.id, batchId));
    } else {
      await appendMovement(
        tx,
        anthology.id,
        user,
        { kind: "correction", batchId, sheetSets: batch.copies, copies: -batch.copies },
        { reason: `${batch.label}: reopened` },
      );
      await tx.update(fb).set({ doneAt: null, doneBy: null }).where(eq(fb.id, batchId));
    }
  });
}

/**
 * Contributor copies from the call's terms: every contributor with a piece in the book is owed
 * the call's number of copies. Rows not yet handed over follow the terms; handed-over rows stay.
 */
export async function syncContributorCopies(anthology: Anthology): Promise<number | null> {
  const [call] = await db
    .select({ copies: schema.calls.contributorCopies })
    .from(schema.calls)
    .where(eq(schema.calls.anthologyId, anthology.id));
  if (!call) return null;
  const people = await db
    .selectDistinct({ id: schema.pieces.contributorId })
    .from(schema.pieces)
    .where(
      and(
        eq(schema.pieces.anthologyId, anthology.id),
        eq(schema.pieces.status, "accepted"),
        eq(schema.pieces.leftOut, false),
      ),
    );
  const owed = new Set(people.map((p) => p.id));
  const rows = await db.select().from(cc).where(eq(cc.anthologyId, anthology.id));
  for (const row of rows) {
    if (row.handedOverAt) continue;
    if (!owed.has(row.contributorId) || call.copies === 0)
      await db.delete(cc).where(eq(cc.id, row.id));
    else if (row.quantity !== call.copies)
      await db.update(cc).set({ quantity: call.copies }).where(eq(cc.id, row.id));
  }
  if (call.copies > 0)
    for (const id of owed)
      if (!rows.some((r) => r.contributorId === id))
        await db
          .insert(cc)
          .ignore()
          .values({ anthologyId: anthology.id, contributorId: id, quantity: call.copies });
  return call.copies;
}

/** Changes how a contributor's copies reach them, or marks them handed over (taking them out of stock). */
export async function updateContributorCopy(
  anthology: Anthology,
  user: SessionUser,
  id: number,
  input: { delivery: "collect" | "post"; eventId: number | null; done: boolean },
): Promise<void> {
  await ensureStockRow(anthology.id);
  await db.transaction(async (tx) => {
    const [row] = await tx
      .select()
      .from(cc)
      .where(and(eq(cc.id, id), eq(cc.anthologyId, anthology.id)))
      .for("update");
    if (!row) throw new Refusal(404, "There is no such contributor copy.");
    if (input.eventId !== null) {
      const [event] = await tx
        .select({ id: ev.id })
        .from(ev)
        .where(and(eq(ev.id, input.eventId), eq(ev.anthologyId, anthology.id)));
      if (!event) throw new Refusal(404, "There is no such event.");
    }
    const wasDone = row.handedOverAt !== null;
    if (input.done && !wasDone)
      await appendMovement(
        tx,
        anthology.id,
        user,
        movementOf({ kind: "contributor-copy", batchId: null, quantity: row.quantity }),
        {
          reason: input.delivery === "post" ? "Posted to a contributor" : "Handed to a contributor",
          eventId: input.eventId,
          contributorCopyId: row.id,
        },
      );
    if (!input.done && wasDone)
      await appendMovement(
        tx,
        anthology.id,
        user,
        movementOf({ kind: "correction", batchId: null, quantity: row.quantity, target: "copies" }),
        {
          reason: "Contributor copy marked not handed over",
          contributorCopyId: row.id,
        },
      );
    await tx
      .update(cc)
      .set({
        delivery: input.delivery,
        eventId: input.delivery === "collect" ? input.eventId : null,
        handedOverAt: input.done ? (row.handedOverAt ?? new Date()) : null,
        doneBy: input.done ? (row.doneBy ?? user.id) : null,
      })
      .where(eq(cc.id, row.id));
  });
}

/** The stock screen: counts, batches, the latest movements and contributor copies. */
export async function loadStock(
  anthology: Anthology,
  opts: { canMove: boolean; mayShowEmail: boolean },
): Promise<StockPayload> {
  const copiesPerContributor = await syncContributorCopies(anthology);
  const [movements, batches, copies, events, zone] = await Promise.all([
    db
      .select({
        id: sm.id,
        kind: sm.kind,
        batchId: sm.batchId,
        sheetSets: sm.sheetSets,
        copies: sm.copies,
        reason: sm.reason,
        at: sm.createdAt,
        name: u.name,
        email: u.email,
      })
      .from(sm)
      .innerJoin(u, eq(u.id, sm.actorId))
      .where(eq(sm.anthologyId, anthology.id))
      .orderBy(desc(sm.id)),
    db
      .select()
      .from(fb)
      .where(eq(fb.anthologyId, anthology.id))
      .orderBy(asc(fb.position), asc(fb.id)),
    db
      .select({ row: cc, name: u.name, email: u.email })
      .from(cc)
      .innerJoin(u, eq(u.id, cc.contributorId))
      .where(eq(cc.anthologyId, anthology.id))
      .orderBy(asc(u.name), asc(cc.id)),
    listEvents(anthology.id),
    anthologyZone(anthology.id),
  ]);
  const counts = stockCounts(movements as Movement[]);
  const label = (name: string | null, email: string | null, unnamed = "A team member") =>
    personLabel({ name, email }, { mayShowEmail: opts.mayShowEmail, unnamed });
  const batchLabel = new Map(batches.map((b) => [b.id, b.label]));
  return {
    timeZone: zone,
    copiesOnHand: counts.copiesOnHand,
    batches: batches.map((b) => ({
      id: b.id,
      label: b.label,
      copies: b.copies,
      sheetSets: counts.sheetSetsByBatch[b.id] ?? 0,
      done: b.doneAt !== null,
    })),
    movements: movements.slice(0, 100).map((m) => ({
      id: m.id,
      kind: m.kind,
      batchLabel: m.batchId ? (batchLabel.get(m.batchId) ?? null) : null,
      sheetSets: m.sheetSets,
      copies: m.copies,
      reason: m.reason,
      by: label(m.name, m.email),
      at: m.at.toISOString(),
    })),
    contributorCopies: copies.map((c) => ({
      id: c.row.id,
      name: label(c.name, c.email, "Unnamed contributor"),
      quantity: c.row.quantity,
      delivery: c.row.delivery === "post" ? "post" : "collect",
      eventId: c.row.eventId,
      doneAt: c.row.handedOverAt?.toISOString() ?? null,
    })),
    copiesPerContributor,
    events: events.map((e) => ({ id: e.id, name: e.name, date: e.date, kind: e.kind })),
    canMove: opts.canMove,
  };
}
