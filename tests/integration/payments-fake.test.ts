// The payments fake on its own, through the official SDK: the behaviour the app relies on, so a
// fake that drifts from the service fails here (idempotency, refusals, signatures, retries).
import http from "node:http";
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
// @ts-expect-error: plain ESM without types
import { startPaymentsFake } from "../../storage-fake/payments.mjs";

const SECRET = "whsec_fake_test_0123456789";
type Hit = { body: string; signature: string; status: number };
const hits: Hit[] = [];
let failFirst = 0;
let hook: http.Server;
let fake: { port: number; baseUrl: string; close: () => Promise<void> };
let stripe: Stripe;

beforeAll(async () => {
  hook = http.createServer((req, res) => {
    let body = "";
    req.on("data", (c) => (body += c));
    req.on("end", () => {
      // The first transfer.created delivery after failFirst is set gets a 500.
      const fail = failFirst > 0 && body.includes('"transfer.created"');
      if (fail) failFirst--;
      const status = fail ? 500 : 200;
      hits.push({ body, signature: String(req.headers["stripe-signature"]), status });
      res.writeHead(status).end();
    });
  });
  await new Promise<void>((r) => hook.listen(0, "127.0.0.1", r));
  fake = await startPaymentsFake({
    port: 0,
    apiKey: "sk_test_fake_only",
    webhookUrl: `http://127.0.0.1:${(hook.address() as { port: number }).port}/`,
    webhookSecret: SECRET,
    retryBaseMs: 40,
    balanceCents: 10_000,
  });
  stripe = new Stripe("sk_test_fake_only", {
    host: "127.0.0.1",
    port: fake.port,
    protocol: "http",
    maxNetworkRetries: 0,
  });
});

afterAll(async () => {
  await fake.close();
  hook.close();
});

async function onboardedAccount() {
  const account = await stripe.accounts.create({
    type: "express",
    capabilities: { transfers: { requested: true } },
  });
  const link = await stripe.accountLinks.create({
    account: account.id,
    refresh_url: "http://localhost/r",
    return_url: "http://localhost/back",
    type: "account_onboarding",
  });
  const done = await fetch(link.url, {
    method: "POST",
    body: new URLSearchParams({ name: "A", bank: "000123456789" }),
    redirect: "manual",
  });
  expect(done.status).toBe(303);
  expect(done.headers.get("location")).toBe("http://localhost/back");
  // A set-up link works once.
  const again = await fetch(link.url, {
    method: "POST",
    body: new URLSearchParams({ name: "A", bank: "000123456789" }),
    redirect: "manual",
  });
  expect(again.status).toBe(410);
  return account.id;
}

describe("payments fake", () => {
  it("refuses a wrong secret key", async () => {
    const wrong = new Stripe("sk_test_wrong", {
      host: "127.0.0.1",
      port: fake.port,
      protocol: "http",
      maxNetworkRetries: 0,
    });
    await expect(wrong.balance.retrieve()).rejects.toMatchObject({ statusCode: 401 });
  });

  it("refuses a transfer to an account not yet onboarded, then pays it once onboarded", async () => {
    const account = await stripe.accounts.create({
      type: "express",
      capabilities: { transfers: { requested: true } },
    });
    expect(account.capabilities?.transfers).toBe("inactive");
    await expect(
      stripe.transfers.create({ amount: 100, currency: "usd", destination: account.id }),
    ).rejects.toMatchObject({
      code: "insufficient_capabilities_for_transfer",
      statusCode: 400,
    });
    const ready = await onboardedAccount();
    expect((await stripe.accounts.retrieve(ready)).capabilities?.transfers).toBe("active");
  });

  it("keeps idempotency: same key and body → same transfer; other body → 400; refusals are remembered", async () => {
    const destination = await onboardedAccount();
    const body = { amount: 1500, currency: "usd", destination, metadata: { line: "1" } };
    const a = await stripe.transfers.create(body, { idempotencyKey: "same-1" });
    const b = await stripe.transfers.create(
      { ...body, metadata: { line: "1" } },
      { idempotencyKey: "same-1" },
    );
    expect(b.id).toBe(a.id);
    expect(b.lastResponse.headers["idempotent-replayed"]).toBe("true");
    await expect(
      stripe.transfers.create({ ...body, amount: 1600 }, { idempotencyKey: "same-1" }),
    ).rejects.toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    const balance = await stripe.balance.retrieve();
    expect(balance.available.find((x) => x.currency === "usd")?.amount).toBe(10_000 - 1500);
    // More than the balance: refused, and the refusal is what the same key answers afterwards.
    await expect(
      stripe.transfers.create({ ...body, amount: 999_999 }, { idempotencyKey: "big-1" }),
    ).rejects.toMatchObject({ code: "balance_insufficient" });
    await fetch(`${fake.baseUrl}/_fake/balance`, {
      method: "POST",
      body: JSON.stringify({ currency: "usd", amount: 2_000_000 }),
    });
    await expect(
      stripe.transfers.create({ ...body, amount: 999_999 }, { idempotencyKey: "big-1" }),
    ).rejects.toMatchObject({ code: "balance_insufficient" });
  });

  it("signs webhooks so the SDK's constructEvent accepts them, and retries a delivery that got 500", async () => {
    failFirst = 1;
    const destination = await onboardedAccount();
    const before = hits.length;
    const transfer = await stripe.transfers.create({ amount: 700, currency: "usd", destination });
    const ours = () => hits.slice(before).filter((h) => h.body.includes(transfer.id));
    const deadline = Date.now() + 5000;
    while (ours().length < 2 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 20));
    const [first, second] = ours();
    expect(first?.status).toBe(500);
    expect(second?.status).toBe(200);
    const event = stripe.webhooks.constructEvent(second!.body, second!.signature, SECRET);
    expect(event.type).toBe("transfer.created");
    expect((event.data.object as Stripe.Transfer).id).toBe(transfer.id);
    expect(() =>
      stripe.webhooks.constructEvent(second!.body.replace("700", "701"), second!.signature, SECRET),
    ).toThrow(Stripe.errors.StripeSignatureVerificationError);
  });
});
