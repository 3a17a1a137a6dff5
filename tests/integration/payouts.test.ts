// Sales, the ledger and paying, against the real MariaDB, the SMTP sink and the payments fake,
// through the official payments SDK. The webhooks the fake sends reach the route handler through
// a small local listener registered as a webhook endpoint, exactly as the service would call it.
import { execFileSync } from "node:child_process";
import fs from "node:fs";
import http from "node:http";
import os from "node:os";
import path from "node:path";
import { eq } from "drizzle-orm";
import Papa from "papaparse";
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { assertTestDatabase } from "../helpers/env";
import { listMessages, waitForMessage } from "../helpers/outbox";
import {
  makeAnthologyWithCall,
  makePerson,
  makePiece,
  type TestPerson,
} from "../helpers/submissions";

const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/auth", () => ({
  auth: vi.fn(async () =>
    session.userId ? { user: { id: session.userId, name: "Test person", email: null } } : null,
  ),
}));

const { db, pool, schema } = await import("@/db");
const salesRoute = await import("@/app/api/anthologies/[slug]/sales/route");
const ledgerRoute = await import("@/app/api/anthologies/[slug]/payouts/route");
const periodsRoute = await import("@/app/api/anthologies/[slug]/payouts/periods/route");
const closeRoute = await import("@/app/api/anthologies/[slug]/payouts/periods/[id]/close/route");
const payRoute = await import("@/app/api/anthologies/[slug]/payouts/entries/[id]/pay/route");
const byHandRoute =
  await import("@/app/api/anthologies/[slug]/payouts/entries/[id]/paid-by-hand/route");
const cancelRoute = await import("@/app/api/anthologies/[slug]/payouts/entries/[id]/cancel/route");
const statementsRoute = await import("@/app/api/anthologies/[slug]/payouts/statements/route");
const statementRoute = await import("@/app/api/anthologies/[slug]/payouts/statement/route");
const exportRoute = await import("@/app/api/anthologies/[slug]/payouts/export/route");
const myRoute = await import("@/app/api/anthologies/[slug]/my-payouts/route");
const accountRoute = await import("@/app/api/anthologies/[slug]/my-payouts/account/route");
const webhookRoute = await import("@/app/api/payments/webhook/route");
const { addWebhookEndpoint, removeWebhookEndpoint } = await import("@/server/payments");
const { payEntryByTransfer, refreshPayoutAccount } = await import("@/server/payouts");

assertTestDatabase(process.env.DATABASE_URL);

const fakeUrl = `http://127.0.0.1:${process.env.STRIPE_API_PORT ?? "4612"}`;
const stripe = new Stripe(process.env.STRIPE_SECRET_KEY ?? "", {
  host: "127.0.0.1",
  port: Number(process.env.STRIPE_API_PORT ?? 4612),
  protocol: "http",
});
const WEBHOOK_SECRET = process.env.STRIPE_WEBHOOK_SECRET ?? "";

let lead: TestPerson, editor: TestPerson, finisher: TestPerson, outsider: TestPerson;
let ada: TestPerson, ben: TestPerson, cy: TestPerson;
let anthology: Awaited<ReturnType<typeof makeAnthologyWithCall>>;
let slug: string;

const as = (who: TestPerson | null) => {
  session.userId = who?.id ?? null;
};

const jsonRequest = (url: string, method: string, body?: unknown) =>
  new Request(`http://localhost${url}`, {
    method,
    headers: { "content-type": "application/json" },
    body: body === undefined ? undefined : JSON.stringify(body),
  });

const ctx = (extra: { id?: string } = {}) => ({
  params: Promise.resolve({ slug, id: extra.id ?? "" }),
});

// The listener the fake delivers to: it hands each delivery to the webhook route as-is.
type Delivery = {
  body: string;
  signature: string;
  status: number;
  answer: Record<string, unknown>;
};
const deliveries: Delivery[] = [];
let listener: http.Server;
let endpointId = "";

async function waitFor<T>(
  what: string,
  fn: () => Promise<T | undefined | null | false>,
  ms = 10_000,
) {
  const deadline = Date.now() + ms;
  for (;;) {
    const value = await fn();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

async function ledger(contributor?: TestPerson) {
  const rows = await db
    .select()
    .from(schema.payoutEntries)
    .where(eq(schema.payoutEntries.anthologyId, anthology.id));
  return contributor ? rows.filter((r) => r.contributorId === contributor.id) : rows;
}

async function owedLine(who: TestPerson, source: "fee" | "share") {
  const line = (await ledger(who)).find((l) => l.kind === "owed" && l.source === source);
  if (!line) throw new Error(`no ${source} line for ${who.name}`);
  return line;
}

const pay = (entryId: number) =>
  payRoute.POST(jsonRequest(`/x/${entryId}/pay`, "POST"), ctx({ id: String(entryId) }));

async function connect(who: TestPerson, finish: boolean) {
  as(who);
  const res = await accountRoute.POST(jsonRequest("/account", "POST"), ctx());
  expect(res.status).toBe(200);
  const { url } = (await res.json()) as { url: string };
  expect(url.startsWith(`${fakeUrl}/onboarding/`)).toBe(true);
  const page = await fetch(url);
  expect(page.status).toBe(200);
  expect(await page.text()).toContain("Finish and go back");
  if (!finish) return;
  const done = await fetch(url, {
    method: "POST",
    body: new URLSearchParams({ name: who.name, bank: "000123456789", action: "complete" }),
    redirect: "manual",
  });
  expect(done.status).toBe(303);
  expect(done.headers.get("location")).toMatch(
    new RegExp(`/studio/${slug}/my-payouts\\?account=returned$`),
  );
  const account = await refreshPayoutAccount(who.id);
  expect(account?.transfersActive).toBe(true);
}

beforeAll(async () => {
  const made = await Promise.all(
    ["lead", "editor", "finisher", "outsider", "ada", "ben", "cy"].map((l) =>
      makePerson(`pay-${l}`),
    ),
  );
  [lead, editor, finisher, outsider, ada, ben, cy] = made as [
    TestPerson,
    TestPerson,
    TestPerson,
    TestPerson,
    TestPerson,
    TestPerson,
    TestPerson,
  ];
  anthology = await makeAnthologyWithCall([
    { person: lead, role: "lead" },
    { person: editor, role: "editor" },
    { person: finisher, role: "finisher" },
    { person: ada, role: "contributor" },
    { person: ben, role: "contributor" },
    { person: cy, role: "contributor" },
  ]);
  slug = anthology.slug;
  await db
    .update(schema.calls)
    .set({
      feeKind: "per-piece",
      feeCents: 2500,
      salesShareBasisPoints: 1000,
      shareSplit: "per-page",
    })
    .where(eq(schema.calls.anthologyId, anthology.id));
  // The hand-worked example of tests/unit/payouts.test.ts: pages 3 : 2 : 2.
  await makePiece(anthology.id, ada.id, {
    kind: "run",
    pageCount: 3,
    status: "accepted",
    title: "Salt Ledger",
  });
  await makePiece(anthology.id, ben.id, {
    kind: "single",
    status: "accepted",
    title: "Gull Weather",
  });
  await makePiece(anthology.id, ben.id, { kind: "single", status: "accepted", title: "Low Water" });
  await makePiece(anthology.id, cy.id, { kind: "spread", status: "accepted", title: "Ropewalk" });

  listener = http.createServer((req, res) => {
    let body = "";
    req.setEncoding("utf8");
    req.on("data", (c) => (body += c));
    req.on("end", async () => {
      const signature = String(req.headers["stripe-signature"] ?? "");
      const answer = await webhookRoute.POST(
        new Request("http://localhost/api/payments/webhook", {
          method: "POST",
          headers: { "content-type": "application/json", "stripe-signature": signature },
          body,
        }),
      );
      const json = (await answer.json()) as Record<string, unknown>;
      deliveries.push({ body, signature, status: answer.status, answer: json });
      res.writeHead(answer.status, { "content-type": "application/json" });
      res.end(JSON.stringify(json));
    });
  });
  await new Promise<void>((r) => listener.listen(0, "127.0.0.1", r));
  const port = (listener.address() as { port: number }).port;
  const endpoint = await addWebhookEndpoint(`http://127.0.0.1:${port}/`);
  endpointId = endpoint.id;
  expect(endpoint.secret).toBe(WEBHOOK_SECRET);
});

afterAll(async () => {
  await fetch(`${fakeUrl}/_fake/settings`, {
    method: "POST",
    body: JSON.stringify({ webhookBeforeResponse: false }),
  });
  if (endpointId) await removeWebhookEndpoint(endpointId).catch(() => undefined);
  listener?.close();
  await pool.end();
});

describe("sales and the share", () => {
  it("records sales at two events and refuses a bad one with field messages", async () => {
    as(editor);
    const fair = await salesRoute.POST(
      jsonRequest("/sales", "POST", {
        channel: "event",
        label: "Harbour Zine Fair",
        soldOn: "2026-10-03",
        copies: 12,
        unitPriceCents: 1500,
        discountCents: 500,
        recoverableCostsCents: 2000,
      }),
      ctx(),
    );
    expect(fair.status).toBe(201);
    const shop = await salesRoute.POST(
      jsonRequest("/sales", "POST", {
        channel: "consignment",
        label: "Kelpie Books",
        soldOn: "2026-10-20",
        copies: 7,
        unitPriceCents: 1200,
        channelFeesCents: 1260,
      }),
      ctx(),
    );
    expect(shop.status).toBe(201);
    const bad = await salesRoute.POST(
      jsonRequest("/sales", "POST", {
        channel: "event",
        label: "",
        soldOn: "2026-02-30",
        copies: 1.5,
        unitPriceCents: 12.5,
      }),
      ctx(),
    );
    expect(bad.status).toBe(400);
    const { fields } = (await bad.json()) as { fields: Record<string, string[]> };
    expect(Object.keys(fields).sort()).toEqual(["copies", "label", "soldOn", "unitPriceCents"]);
  });

  it("closes a period into owed lines that match the hand-worked split, once", async () => {
    as(lead);
    const created = await periodsRoute.POST(
      jsonRequest("/periods", "POST", {
        label: "Autumn 2026",
        startsOn: "2026-09-01",
        endsOn: "2026-11-30",
      }),
      ctx(),
    );
    expect(created.status).toBe(201);
    const { id } = (await created.json()) as { id: number };
    const again = await periodsRoute.POST(
      jsonRequest("/periods", "POST", {
        label: "Autumn 2026",
        startsOn: "2026-09-01",
        endsOn: "2026-11-30",
      }),
      ctx(),
    );
    expect(again.status).toBe(409);
    const closed = await closeRoute.POST(jsonRequest("/close", "POST"), ctx({ id: String(id) }));
    expect(closed.status).toBe(200);
    // Net $226.40, 10 % = $22.64, split 970 / 647 / 647 (see tests/unit/payouts.test.ts).
    expect(await closed.json()).toEqual({ linesWritten: 6, poolCents: 2264, netCents: 22_640 });
    const twice = await Promise.all([
      closeRoute.POST(jsonRequest("/close", "POST"), ctx({ id: String(id) })),
      closeRoute.POST(jsonRequest("/close", "POST"), ctx({ id: String(id) })),
    ]);
    expect(twice.map((r) => r.status)).toEqual([409, 409]);
    expect((await owedLine(ada, "share")).amountCents).toBe(970);
    expect((await owedLine(ben, "share")).amountCents).toBe(647);
    expect((await owedLine(cy, "share")).amountCents).toBe(647);
    expect((await owedLine(ben, "fee")).amountCents).toBe(5000);
    expect((await owedLine(ben, "share")).computation.working.join("\n")).toContain("2 pages of 7");
  });

  it("refuses a sale dated inside a closed period", async () => {
    as(editor);
    const late = await salesRoute.POST(
      jsonRequest("/sales", "POST", {
        channel: "shop",
        label: "Online shop",
        soldOn: "2026-11-02",
        copies: 1,
        unitPriceCents: 1500,
      }),
      ctx(),
    );
    expect(late.status).toBe(409);
    expect(((await late.json()) as { error: string }).error).toContain("Autumn 2026");
  });
});

describe("paying by transfer", () => {
  it("checks the fake's webhook signature with the SDK's own constructEvent", async () => {
    await connect(ada, true);
    const delivered = await waitFor("the account.updated webhook", async () =>
      deliveries.find(
        (d) => d.body.includes('"account.updated"') && d.body.includes(ada.id) && d.status === 200,
      ),
    );
    const event = stripe.webhooks.constructEvent(
      delivered.body,
      delivered.signature,
      WEBHOOK_SECRET,
    );
    expect(event.type).toBe("account.updated");
    expect(() =>
      stripe.webhooks.constructEvent(delivered.body, delivered.signature, "whsec_someone_else"),
    ).toThrow(Stripe.errors.StripeSignatureVerificationError);
    const [t, v1] = delivered.signature.split(",");
    expect(t).toMatch(/^t=\d+$/);
    expect(v1).toMatch(/^v1=[0-9a-f]{64}$/);
  });

  it("pays a line once: a second click, a retried request and a replayed webhook pay nothing more", async () => {
    as(lead);
    const fee = await owedLine(ada, "fee");
    const [first, second] = await Promise.all([pay(fee.id), pay(fee.id)]);
    const answers = (await Promise.all([first.json(), second.json()])) as { transferId: string }[];
    expect(answers[0]!.transferId).toBe(answers[1]!.transferId);
    const paid = await waitFor("the paid line", async () =>
      (await ledger(ada)).find((l) => l.kind === "paid" && l.settlesEntryId === fee.id),
    );
    expect(paid.amountCents).toBe(-2500);
    expect(paid.source).toBe("transfer");
    const again = await pay(fee.id);
    expect(again.status).toBe(409);
    // Nothing more is paid, and the answer names the transfer that paid it.
    expect(((await again.json()) as { transferId?: string }).transferId).toBe(
      answers[0]!.transferId,
    );
    // Retried request: the same call again reaches the same transfer through its idempotency key.
    const [attempt] = await db
      .select()
      .from(schema.payoutTransfers)
      .where(eq(schema.payoutTransfers.entryId, fee.id));
    const replay = await stripe.transfers.create(
      {
        amount: 2500,
        currency: "usd",
        destination: attempt!.destination,
        description: `${anthology.title}: ledger line ${fee.id}`,
        metadata: { quireline_entry: String(fee.id), quireline_attempt: "1" },
      },
      { idempotencyKey: attempt!.idempotencyKey },
    );
    expect(replay.id).toBe(attempt!.providerTransferId);
    // Same key, another body: refused as the real service does.
    await expect(
      stripe.transfers.create(
        { amount: 2600, currency: "usd", destination: attempt!.destination },
        { idempotencyKey: attempt!.idempotencyKey },
      ),
    ).rejects.toMatchObject({ type: "StripeIdempotencyError", statusCode: 400 });
    // Replayed webhook: the same signed delivery posted again is seen and skipped.
    const original = deliveries.find(
      (d) =>
        d.body.includes('"transfer.created"') && d.body.includes(`"quireline_entry": "${fee.id}"`),
    )!;
    const replayed = await webhookRoute.POST(
      new Request("http://localhost/api/payments/webhook", {
        method: "POST",
        headers: { "stripe-signature": original.signature },
        body: original.body,
      }),
    );
    expect(replayed.status).toBe(200);
    expect(await replayed.json()).toMatchObject({ duplicate: true });
    const lines = (await ledger(ada)).filter((l) => l.settlesEntryId === fee.id);
    expect(lines.filter((l) => l.kind === "paid")).toHaveLength(1);
    expect(lines.filter((l) => l.kind === "scheduled")).toHaveLength(1);
  });

  it("refuses a forged webhook: altered body, wrong secret, no signature", async () => {
    const share = await owedLine(ada, "share");
    const forged = JSON.stringify({
      id: "evt_forged_1",
      object: "event",
      type: "transfer.created",
      data: {
        object: {
          id: "tr_forged",
          amount: share.amountCents,
          currency: "usd",
          destination: "acct_x",
          metadata: { quireline_entry: String(share.id) },
        },
      },
    });
    const wrongSecret = stripe.webhooks.generateTestHeaderString({
      payload: forged,
      secret: "whsec_not_the_one",
    });
    const post = (body: string, signature?: string) =>
      webhookRoute.POST(
        new Request("http://localhost/api/payments/webhook", {
          method: "POST",
          headers: signature ? { "stripe-signature": signature } : {},
          body,
        }),
      );
    expect((await post(forged, wrongSecret)).status).toBe(400);
    expect((await post(forged)).status).toBe(400);
    const genuine = deliveries.find((d) => d.body.includes('"transfer.created"'))!;
    expect(
      (await post(genuine.body.replace(/"amount": \d+/, '"amount": 999999'), genuine.signature))
        .status,
    ).toBe(400);
    // A stale signature (older than the SDK's five-minute tolerance) is refused too.
    const stale = stripe.webhooks.generateTestHeaderString({
      payload: forged,
      secret: WEBHOOK_SECRET,
      timestamp: Math.floor(Date.now() / 1000) - 3600,
    });
    expect((await post(forged, stale)).status).toBe(400);
    expect(
      (await ledger(ada)).some((l) => l.kind === "paid" && l.settlesEntryId === share.id),
    ).toBe(false);
  });

  it("survives the webhook arriving before the transfer's answer", async () => {
    const share = await owedLine(ada, "share");
    await fetch(`${fakeUrl}/_fake/settings`, {
      method: "POST",
      body: JSON.stringify({ webhookBeforeResponse: true }),
    });
    try {
      as(lead);
      const res = await pay(share.id);
      expect(res.status).toBe(200);
      expect(await res.json()).toMatchObject({ state: "paid" });
    } finally {
      await fetch(`${fakeUrl}/_fake/settings`, {
        method: "POST",
        body: JSON.stringify({ webhookBeforeResponse: false }),
      });
    }
    const lines = (await ledger(ada)).filter((l) => l.settlesEntryId === share.id);
    expect(lines.map((l) => l.kind).sort()).toEqual(["paid", "scheduled"]);
  });

  it("refuses to pay an account that has not finished onboarding, and then pays by hand", async () => {
    await connect(ben, false);
    as(lead);
    const fee = await owedLine(ben, "fee");
    const res = await pay(fee.id);
    expect(res.status).toBe(409);
    expect(((await res.json()) as { error: string }).error).toMatch(/not finished setting up/);
    const bad = await byHandRoute.POST(
      jsonRequest("/h", "POST", { reference: "" }),
      ctx({ id: String(fee.id) }),
    );
    expect(bad.status).toBe(400);
    const byHand = await byHandRoute.POST(
      jsonRequest("/h", "POST", { reference: "Cash at the Harbour Zine Fair, receipt 14" }),
      ctx({ id: String(fee.id) }),
    );
    expect(byHand.status).toBe(201);
    const twice = await byHandRoute.POST(
      jsonRequest("/h", "POST", { reference: "again, by mistake" }),
      ctx({ id: String(fee.id) }),
    );
    expect(twice.status).toBe(409);
    const paid = (await ledger(ben)).filter(
      (l) => l.kind === "paid" && l.settlesEntryId === fee.id,
    );
    expect(paid).toHaveLength(1);
    expect(paid[0]).toMatchObject({
      source: "by-hand",
      reference: "Cash at the Harbour Zine Fair, receipt 14",
      createdBy: lead.id,
    });
  });

  it("refuses a transfer the balance cannot cover, and a hand payment while a transfer is on its way", async () => {
    await connect(cy, true);
    as(lead);
    const fee = await owedLine(cy, "fee");
    await fetch(`${fakeUrl}/_fake/balance`, {
      method: "POST",
      body: JSON.stringify({ currency: "usd", amount: 100 }),
    });
    try {
      const res = await pay(fee.id);
      expect(res.status).toBe(409);
      expect(((await res.json()) as { error: string }).error).toMatch(/balance is too low/);
    } finally {
      await fetch(`${fakeUrl}/_fake/balance`, {
        method: "POST",
        body: JSON.stringify({ currency: "usd", amount: 5_000_000 }),
      });
    }
    // The next attempt has its own key, so the refusal remembered under the first is not replayed.
    const share = await owedLine(cy, "share");
    const [sent] = await Promise.all([payEntryByTransfer(anthology, fee.id, lead.id)]);
    expect(sent.attempt).toBe(2);
    const [handShare] = await Promise.all([pay(share.id)]);
    expect([200, 202]).toContain(handShare.status);
    const inFlight = await byHandRoute.POST(
      jsonRequest("/h", "POST", { reference: "bank transfer 2211" }),
      ctx({ id: String(share.id) }),
    );
    expect(inFlight.status).toBe(409);
    await waitFor("cy's fee paid", async () =>
      (await ledger(cy)).find((l) => l.kind === "paid" && l.settlesEntryId === fee.id),
    );
  });

  it("cancels a wrong line with a reversing line, leaving the original", async () => {
    as(lead);
    const share = await owedLine(ben, "share");
    const res = await cancelRoute.POST(
      jsonRequest("/c", "POST", { reason: "Counted a withdrawn page" }),
      ctx({ id: String(share.id) }),
    );
    expect(res.status).toBe(201);
    const lines = await ledger(ben);
    expect(lines.find((l) => l.id === share.id)?.amountCents).toBe(647);
    expect(lines.find((l) => l.reversesEntryId === share.id)?.amountCents).toBe(-647);
    expect((await pay(share.id)).status).toBe(409);
  });
});

describe("statements and exports", () => {
  it("mails each contributor their statement once and serves the PDF to them alone", async () => {
    as(lead);
    const [period] = await db
      .select()
      .from(schema.payoutPeriods)
      .where(eq(schema.payoutPeriods.anthologyId, anthology.id));
    const first = await statementsRoute.POST(
      jsonRequest("/s", "POST", { periodId: period!.id }),
      ctx(),
    );
    expect(await first.json()).toEqual({ sent: 3, alreadySent: 0, failed: 0 });
    const second = await statementsRoute.POST(
      jsonRequest("/s", "POST", { periodId: period!.id }),
      ctx(),
    );
    expect(await second.json()).toEqual({ sent: 0, alreadySent: 3, failed: 0 });
    const mail = await waitForMessage({ to: ada.email, subject: /statement for Autumn 2026/ });
    expect(mail.text).toContain("Salt Ledger");
    expect(mail.text).toContain("Still to pay: $0.00");
    expect(mail.text).toContain("not tax");
    expect(
      (await listMessages({ to: ada.email })).filter((m) => /statement/.test(m.subject)),
    ).toHaveLength(1);

    as(ben);
    const own = await statementRoute.GET(
      new Request(`http://localhost/x?period=${period!.id}`),
      ctx(),
    );
    expect(own.status).toBe(200);
    expect(own.headers.get("content-type")).toBe("application/pdf");
    const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), "stmt-")), "s.pdf");
    fs.writeFileSync(file, Buffer.from(await own.arrayBuffer()));
    // poppler's pdftotext reads the file independently of pdf-lib.
    const text = execFileSync("pdftotext", ["-layout", file, "-"], { encoding: "utf8" });
    expect(text).toContain("Gull Weather");
    expect(text).toContain("Paid by hand");
    expect(text).toContain("Cash at the Harbour Zine Fair, receipt 14");
    const others = await statementRoute.GET(
      new Request(`http://localhost/x?period=${period!.id}&contributor=${ada.id}`),
      ctx(),
    );
    expect(others.status).toBe(404);
  });

  it("exports the ledger and sales as CSV that papaparse reads back to the same cents", async () => {
    as(lead);
    const res = await exportRoute.GET(new Request("http://localhost/x?what=ledger"), ctx());
    expect(res.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    const parsed = Papa.parse<Record<string, string>>(await res.text(), {
      header: true,
      skipEmptyLines: true,
    });
    expect(parsed.errors).toEqual([]);
    const rows = await ledger();
    expect(parsed.data).toHaveLength(rows.length);
    const cents = (s: string) => Math.round(Number(s) * 100);
    for (const row of rows) {
      const line = parsed.data.find((d) => Number(d.line) === row.id)!;
      expect(cents(line.amount!)).toBe(row.amountCents);
      expect(line.kind).toBe(row.kind);
    }
    const sales = await exportRoute.GET(new Request("http://localhost/x?what=sales"), ctx());
    const saleRows = Papa.parse<Record<string, string>>(await sales.text(), {
      header: true,
      skipEmptyLines: true,
    }).data;
    expect(saleRows.map((r) => [r.where, r.net])).toEqual([
      ["Harbour Zine Fair", "155.00"],
      ["Kelpie Books", "71.40"],
    ]);
  });

  it("shows contributors their own lines only", async () => {
    as(ben);
    const res = await myRoute.GET(jsonRequest("/my", "GET"), ctx());
    const body = (await res.json()) as { me: { contributorId: string; lines: { id: number }[] } };
    expect(body.me.contributorId).toBe(ben.id);
    const benLines = (await ledger(ben)).map((l) => l.id).sort();
    expect(body.me.lines.map((l) => l.id).sort()).toEqual(benLines);
  });
});

describe("who may use each route", () => {
  type Who =
    | "signed out"
    | "outsider"
    | "contributor"
    | "other contributor"
    | "finisher"
    | "editor"
    | "lead";
  const people = (): Record<Who, TestPerson | null> => ({
    "signed out": null,
    outsider,
    contributor: ada,
    "other contributor": ben,
    finisher,
    editor,
    lead,
  });
  // Expected status per role, in the order above. Writes use bodies that fail validation, so an
  // allowed role gets 400 (the route got past the check) and nothing is written.
  const routes: { name: string; call: () => Promise<Response>; expected: number[] }[] = [
    {
      name: "GET sales",
      call: () => salesRoute.GET(jsonRequest("/s", "GET"), ctx()),
      expected: [401, 403, 403, 403, 403, 200, 200],
    },
    {
      name: "POST sales",
      call: () => salesRoute.POST(jsonRequest("/s", "POST", {}), ctx()),
      expected: [401, 403, 403, 403, 403, 400, 400],
    },
    {
      name: "GET ledger",
      call: () => ledgerRoute.GET(jsonRequest("/l", "GET"), ctx()),
      expected: [401, 403, 403, 403, 403, 403, 200],
    },
    {
      name: "POST period",
      call: () => periodsRoute.POST(jsonRequest("/p", "POST", {}), ctx()),
      expected: [401, 403, 403, 403, 403, 403, 400],
    },
    {
      name: "POST close",
      call: () => closeRoute.POST(jsonRequest("/c", "POST"), ctx({ id: "999999999" })),
      expected: [401, 403, 403, 403, 403, 403, 404],
    },
    {
      name: "POST pay",
      call: () => payRoute.POST(jsonRequest("/p", "POST"), ctx({ id: "999999999" })),
      expected: [401, 403, 403, 403, 403, 403, 404],
    },
    {
      name: "POST paid by hand",
      call: () => byHandRoute.POST(jsonRequest("/h", "POST", {}), ctx({ id: "999999999" })),
      expected: [401, 403, 403, 403, 403, 403, 400],
    },
    {
      name: "POST cancel",
      call: () => cancelRoute.POST(jsonRequest("/c", "POST", {}), ctx({ id: "999999999" })),
      expected: [401, 403, 403, 403, 403, 403, 400],
    },
    {
      name: "POST statements",
      call: () => statementsRoute.POST(jsonRequest("/s", "POST", {}), ctx()),
      expected: [401, 403, 403, 403, 403, 403, 400],
    },
    {
      name: "GET statement",
      call: () => statementRoute.GET(new Request("http://localhost/x?period=999999999"), ctx()),
      expected: [401, 403, 404, 404, 403, 403, 404],
    },
    {
      name: "GET export",
      call: () => exportRoute.GET(new Request("http://localhost/x?what=nothing"), ctx()),
      expected: [401, 403, 403, 403, 403, 403, 400],
    },
    {
      name: "GET my payouts",
      call: () => myRoute.GET(jsonRequest("/m", "GET"), ctx()),
      expected: [401, 403, 200, 200, 403, 403, 403],
    },
  ];
  for (const route of routes) {
    it(`${route.name}: ${route.expected.join(" ")}`, async () => {
      const got: number[] = [];
      for (const who of Object.values(people())) {
        as(who);
        got.push((await route.call()).status);
      }
      expect(got).toEqual(route.expected);
    });
  }

  it("POST my-payouts/account: only contributors start onboarding", async () => {
    const got: number[] = [];
    for (const who of [null, outsider, finisher, editor, lead]) {
      as(who);
      got.push((await accountRoute.POST(jsonRequest("/a", "POST"), ctx())).status);
    }
    expect(got).toEqual([401, 403, 403, 403, 403]);
    as(ada); // already connected
    expect((await accountRoute.POST(jsonRequest("/a", "POST"), ctx())).status).toBe(409);
  });

  it("POST webhook: no session is asked for, only a valid signature", async () => {
    as(lead);
    const res = await webhookRoute.POST(
      new Request("http://localhost/api/payments/webhook", { method: "POST", body: "{}" }),
    );
    expect(res.status).toBe(400);
  });

  it("POST webhook: a body past the cap is refused with 413 even without a declared length", async () => {
    const chunk = new Uint8Array(64 * 1024).fill(0x7b);
    let pulled = 0;
    const endless = new ReadableStream<Uint8Array>({
      pull(controller) {
        pulled += chunk.byteLength;
        if (pulled > 64 * 1024 * 1024) controller.close();
        else controller.enqueue(chunk);
      },
    });
    const res = await webhookRoute.POST(
      new Request("http://localhost/api/payments/webhook", {
        method: "POST",
        body: endless,
        duplex: "half",
      } as RequestInit),
    );
    expect(res.status).toBe(413);
    // Reading stopped soon after 512 KB, not at the end of the stream.
    expect(pulled).toBeLessThan(1024 * 1024);
  });
});
