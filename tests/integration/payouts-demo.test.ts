// The demo almanac as the seed leaves it on a fresh clone: two events' sales, a closed period,
// Tomasz paid by transfer and confirmed by the payments fake's webhook, Bea paid by hand, and
// statements in the outbox.
import { and, eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { assertTestDatabase } from "../helpers/env";
import { listMessages } from "../helpers/outbox";

const { db, pool, schema } = await import("@/db");
assertTestDatabase(process.env.DATABASE_URL);

afterAll(async () => {
  await pool.end();
});

async function almanac() {
  const [row] = await db
    .select()
    .from(schema.anthologies)
    .where(eq(schema.anthologies.slug, "low-tide-almanac"));
  return row!;
}

async function userId(email: string) {
  const [row] = await db.select().from(schema.users).where(eq(schema.users.email, email));
  return row!.id;
}

describe("the demo almanac's payouts", () => {
  it("has sales at two events and a closed period whose shares add up to the pool", async () => {
    const a = await almanac();
    const sales = await db.select().from(schema.sales).where(eq(schema.sales.anthologyId, a.id));
    expect(new Set(sales.map((s) => s.label))).toEqual(
      new Set(["Harbour Zine Fair", "Kelpie Books"]),
    );
    const [period] = await db
      .select()
      .from(schema.payoutPeriods)
      .where(eq(schema.payoutPeriods.anthologyId, a.id));
    expect(period?.closedAt).toBeInstanceOf(Date);
    const shares = await db
      .select()
      .from(schema.payoutEntries)
      .where(
        and(
          eq(schema.payoutEntries.periodId, period!.id),
          eq(schema.payoutEntries.source, "share"),
        ),
      );
    // Fair: 31 × $12.00 − $6.00 − $25.00 = $341.00; shop: 9 × $14.00 − $44.10 = $81.90;
    // net $422.90, 10 % = $42.29 (the almanac's call: 10 % of net sales).
    expect((period!.computation as { poolCents: number }).poolCents).toBe(4229);
    expect(shares.reduce((sum, l) => sum + l.amountCents, 0)).toBe(4229);
  });

  it("has Tomasz connected on the fake and paid by transfer, confirmed by webhook", async () => {
    const tomasz = await userId("tomasz@lanternfield.test");
    const [account] = await db
      .select()
      .from(schema.payoutAccounts)
      .where(eq(schema.payoutAccounts.userId, tomasz));
    expect(account?.transfersActive).toBe(true);
    const lines = await db
      .select()
      .from(schema.payoutEntries)
      .where(eq(schema.payoutEntries.contributorId, tomasz));
    const owed = lines.filter((l) => l.kind === "owed");
    const paid = lines.filter((l) => l.kind === "paid");
    expect(owed.length).toBeGreaterThan(0);
    expect(paid).toHaveLength(owed.length);
    expect(paid.every((l) => l.source === "transfer" && l.reference?.startsWith("tr_"))).toBe(true);
    for (const p of paid) {
      const [event] = await db
        .select()
        .from(schema.paymentEvents)
        .where(eq(schema.paymentEvents.outcome, `line ${p.settlesEntryId} paid`));
      expect(event?.type).toBe("transfer.created");
    }
  });

  it("has Bea's fee paid by hand with its reference, and statements in the outbox", async () => {
    const bea = await userId("bea@lanternfield.test");
    const [byHand] = await db
      .select()
      .from(schema.payoutEntries)
      .where(
        and(
          eq(schema.payoutEntries.contributorId, bea),
          eq(schema.payoutEntries.source, "by-hand"),
        ),
      );
    expect(byHand?.reference).toBe("Cash at the Harbour Zine Fair table, receipt 3");
    expect(byHand?.createdBy).toBe(await userId("odile@marrowbend.test"));
    const logged = await db
      .select()
      .from(schema.emailLog)
      .where(eq(schema.emailLog.kind, "payout-statement"));
    expect(logged.length).toBeGreaterThanOrEqual(3);
    // The outbox is shared with other tests, which may empty it; the log is the lasting record.
    const mails = await listMessages({ to: "bea@lanternfield.test" });
    if (mails.length > 0)
      expect(mails.some((m) => /statement for Autumn 2026/.test(m.subject))).toBe(true);
  });
});
