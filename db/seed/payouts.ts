/**
 * The demo almanac's money: sales at the Harbour Zine Fair and on consignment at Kelpie Books, an
 * autumn period closed into everyone's share and fee, Tomasz's payout account connected on the
 * payments fake and his lines paid by transfer (confirmed by the fake's signed webhook), Bea's fee
 * paid by hand, and every contributor's statement in the outbox. Needs the payments fake and the
 * SMTP sink running. Idempotent: once the almanac has any sale it is left as it is.
 */
import http from "node:http";
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db";
import { schema } from "@/db";
import { findPayoutAccount, insertSale, insertPeriod, ledgerFor } from "@/db/queries/payouts";
import { appUrl } from "@/server/mail";
import { addWebhookEndpoint, removeWebhookEndpoint, verifyWebhook } from "@/server/payments";
import {
  closePayoutPeriod,
  handlePaymentEvent,
  markPaidByHand,
  payEntryByTransfer,
  refreshPayoutAccount,
  startOnboarding,
} from "@/server/payouts";
import { sendStatements } from "@/server/statements";

async function person(db: Db, email: string) {
  const [row] = await db.select().from(schema.users).where(eq(schema.users.email, email));
  if (!row) throw new Error(`seed the demo press first (${email} missing)`);
  return row;
}

/** A listener for the fake's webhooks, only while the seed runs (the app is not up yet). */
async function webhookListener() {
  let secret = "";
  const server = http.createServer((req, res) => {
    let body = "";
    req.setEncoding("utf8");
    req.on("data", (c) => (body += c));
    req.on("end", async () => {
      try {
        const event = verifyWebhook(body, String(req.headers["stripe-signature"] ?? ""), secret);
        await handlePaymentEvent(event);
        res.writeHead(200).end("ok");
      } catch (error) {
        console.error("seed webhook failed:", error);
        res.writeHead(400).end("refused");
      }
    });
  });
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  const port = (server.address() as { port: number }).port;
  const endpoint = await addWebhookEndpoint(`http://127.0.0.1:${port}/`);
  secret = endpoint.secret;
  return {
    close: async () => {
      await removeWebhookEndpoint(endpoint.id).catch(() => undefined);
      await new Promise((r) => server.close(r));
    },
  };
}

export async function seedPayouts(db: Db) {
  const [almanac] = await db
    .select()
    .from(schema.anthologies)
    .where(eq(schema.anthologies.slug, "low-tide-almanac"));
  if (!almanac) throw new Error("seed the demo press first");
  const [anySale] = await db
    .select({ id: schema.sales.id })
    .from(schema.sales)
    .where(eq(schema.sales.anthologyId, almanac.id))
    .limit(1);
  if (anySale) return null;

  const odile = await person(db, "odile@marrowbend.test");
  const tomasz = await person(db, "tomasz@lanternfield.test");
  const bea = await person(db, "bea@lanternfield.test");
  const currency = almanac.currency;
  const sale = (fields: Partial<Parameters<typeof insertSale>[0]>) =>
    insertSale({
      anthologyId: almanac.id,
      channel: "event",
      label: "",
      soldOn: new Date(),
      copies: 0,
      unitPriceCents: 0,
      discountCents: 0,
      channelFeesCents: 0,
      recoverableCostsCents: 0,
      currency,
      note: null,
      recordedBy: odile.id,
      ...fields,
    });
  await sale({
    channel: "event",
    label: "Harbour Zine Fair",
    soldOn: new Date("2026-10-10T00:00:00Z"),
    copies: 31,
    unitPriceCents: 1200,
    discountCents: 600,
    recoverableCostsCents: 2500,
    note: "Table shared with the Heron Street jam; $25 table fee",
  });
  await sale({
    channel: "consignment",
    label: "Kelpie Books",
    soldOn: new Date("2026-11-14T00:00:00Z"),
    copies: 9,
    unitPriceCents: 1400,
    channelFeesCents: 4410,
    note: "35 % to the shop",
  });
  const periodId = await insertPeriod({
    anthologyId: almanac.id,
    label: "Autumn 2026",
    startsOn: new Date("2026-09-01T00:00:00Z"),
    endsOn: new Date("2026-11-30T00:00:00Z"),
  });
  if (periodId === null) return null;
  const closed = await closePayoutPeriod(almanac, periodId, odile.id);

  // Tomasz connects a payout account: the onboarding page of the fake, filled in as he would.
  const back = appUrl(`/studio/${almanac.slug}/my-payouts`);
  const { url } = await startOnboarding(tomasz, {
    returnUrl: `${back}?account=returned`,
    refreshUrl: `${back}?account=expired`,
  });
  const filled = await fetch(url, {
    method: "POST",
    body: new URLSearchParams({ name: "Tomasz Vireo", bank: "000123456789", action: "complete" }),
    redirect: "manual",
  });
  if (filled.status !== 303)
    throw new Error(`the payments fake's onboarding answered ${filled.status}`);
  await refreshPayoutAccount(tomasz.id);
  if (!(await findPayoutAccount(tomasz.id))?.transfersActive)
    throw new Error("Tomasz's payout account is not active after onboarding");

  const listener = await webhookListener();
  try {
    const owed = (await ledgerFor(almanac.id, tomasz.id)).filter((l) => l.kind === "owed");
    for (const line of owed) await payEntryByTransfer(almanac, line.id, odile.id);
    const deadline = Date.now() + 15_000;
    for (;;) {
      const lines = await ledgerFor(almanac.id, tomasz.id);
      const paid = lines.filter((l) => l.kind === "paid").length;
      if (paid === owed.length) break;
      if (Date.now() > deadline) throw new Error("the transfers' webhooks did not arrive");
      await new Promise((r) => setTimeout(r, 150));
    }
  } finally {
    await listener.close();
  }

  const [beaFee] = await db
    .select()
    .from(schema.payoutEntries)
    .where(
      and(
        eq(schema.payoutEntries.anthologyId, almanac.id),
        eq(schema.payoutEntries.contributorId, bea.id),
        eq(schema.payoutEntries.source, "fee"),
      ),
    );
  if (beaFee)
    await markPaidByHand(almanac, beaFee.id, {
      reference: "Cash at the Harbour Zine Fair table, receipt 3",
      userId: odile.id,
      userLabel: odile.name ?? "the lead editor",
    });

  const mailed = await sendStatements(almanac, periodId);
  return { lines: closed.linesWritten, poolCents: closed.poolCents, statements: mailed.sent };
}
