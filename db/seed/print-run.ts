/**
 * The demo almanac's print run: the Marrowbend collective's price list and a quote from an
 * invented print shop, three events counted from today, a plan with finishing timings, a batch
 * per event, the first batch printed and partly ticked by the demo finisher, and copies that
 * have moved. Every price is invented. Idempotent: once the almanac has events, nothing is added.
 */
import { eq } from "drizzle-orm";
import type { Db } from "@/db";
import { schema } from "@/db";
import {
  anthologyZone,
  planBatchesFromEvents,
  recordMovement,
  saveRunPlan,
  savePriceList,
  saveShopQuote,
  addEvent,
  tickStep,
} from "@/db/queries/run";
import { addDays, todayIn } from "@/lib/run/batches";
import demoAccounts from "../demo-accounts.json";

export async function seedPrintRun(db: Db): Promise<{ events: number; batches: number } | null> {
  const [almanac] = await db
    .select()
    .from(schema.anthologies)
    .where(eq(schema.anthologies.slug, "low-tide-almanac"))
    .limit(1);
  if (!almanac) return null;
  const [existing] = await db
    .select({ id: schema.runEvents.id })
    .from(schema.runEvents)
    .where(eq(schema.runEvents.anthologyId, almanac.id))
    .limit(1);
  if (existing) return null;

  const person = async (role: string) => {
    const account = demoAccounts.find((a) => a.role === role)!;
    const [row] = await db
      .select({ id: schema.users.id, name: schema.users.name, email: schema.users.email })
      .from(schema.users)
      .where(eq(schema.users.email, account.email));
    if (!row) throw new Error(`demo ${role} missing`);
    return row;
  };
  const lead = await person("lead");
  const finisher = await person("finisher");

  const listId = await savePriceList(almanac, lead, null, {
    name: "Marrowbend studio prices",
    prices: {
      insidePaper: { priceCents: 1199, perQuantity: 500 },
      coverPaper: { priceCents: 2450, perQuantity: 100 },
      copyShopSide: { priceCents: 9, perQuantity: 1 },
      inkPass: { priceCents: 40, perQuantity: 100 },
      master: { priceCents: 185, perQuantity: 1 },
      staples: { priceCents: 499, perQuantity: 1000 },
      finishingCentsPerHour: 0,
      spoilageBasisPoints: 500,
    },
  }).catch(async () => {
    const [row] = await db
      .select({ id: schema.priceLists.id })
      .from(schema.priceLists)
      .where(eq(schema.priceLists.name, "Marrowbend studio prices"));
    return row!.id;
  });
  const quoteId = await saveShopQuote(almanac, lead, null, {
    shopName: "Gullrock Printworks",
    turnaroundDays: 12,
    tiers: [
      { copies: 50, totalCents: 21_000 },
      { copies: 100, totalCents: 30_000 },
      { copies: 250, totalCents: 52_500 },
      { copies: 500, totalCents: 80_000 },
    ],
  }).catch(async () => {
    const [row] = await db
      .select({ id: schema.shopQuotes.id })
      .from(schema.shopQuotes)
      .where(eq(schema.shopQuotes.shopName, "Gullrock Printworks"));
    return row!.id;
  });
  await saveRunPlan(almanac, {
    quantities: [25, 50, 100, 150, 250],
    priceListId: listId,
    shopQuoteId: quoteId,
    timings: {
      "trim-sheets": { setupMinutes: 10, minutesPerCopy: 0.5 },
      "score-cover": { setupMinutes: 5, minutesPerCopy: 0.25 },
      fold: { setupMinutes: 0, minutesPerCopy: 1.5 },
      collate: { setupMinutes: 5, minutesPerCopy: 1 },
      staple: { setupMinutes: 5, minutesPerCopy: 0.5 },
      "trim-fore-edge": { setupMinutes: 10, minutesPerCopy: 0.25 },
    },
    minutesPerWeek: 6 * 60,
    printMode: "all-at-once",
  });

  const today = todayIn(await anthologyZone(almanac.id));
  await addEvent(almanac, {
    name: "the launch at the Tidewater Room",
    kind: "launch",
    date: addDays(today, 14),
    copies: 40,
  });
  await addEvent(almanac, {
    name: "the mail-out to subscribers",
    kind: "mail-out",
    date: addDays(today, 21),
    copies: 35,
  });
  await addEvent(almanac, {
    name: "Lanternfield Small Press Fair",
    kind: "fair",
    date: addDays(today, 45),
    copies: 60,
  });
  const batches = await planBatchesFromEvents(almanac);

  const [first] = await db
    .select()
    .from(schema.finishingBatches)
    .where(eq(schema.finishingBatches.anthologyId, almanac.id))
    .orderBy(schema.finishingBatches.position)
    .limit(1);
  if (first) {
    await recordMovement(almanac, lead, {
      kind: "printed",
      batchId: first.id,
      quantity: first.copies,
      reason: "First batch printed on the duplicator",
    });
    // The demo finisher has trimmed and scored the first batch; folding and the rest are left to tick.
    for (const step of ["trim-sheets", "score-cover"])
      await tickStep(almanac, finisher, first.id, step, true);
    await recordMovement(almanac, lead, {
      kind: "correction",
      batchId: first.id,
      quantity: -2,
      target: "sheets",
      reason: "Two sets smudged in the drum",
    });
    await recordMovement(almanac, lead, {
      kind: "correction",
      batchId: null,
      quantity: 6,
      target: "copies",
      reason: "Proof copies finished by hand before the run",
    });
    await recordMovement(almanac, lead, {
      kind: "spare",
      batchId: null,
      quantity: 2,
      reason: "Kept for the collective's archive",
    });
  }
  return { events: 3, batches };
}
