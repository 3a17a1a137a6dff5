// A local stand-in for the payments service's REST API, for its official Node SDK pointed here with
// { host: "127.0.0.1", port, protocol: "http" }. It keeps connected accounts, an onboarding page,
// transfers with idempotency keys, the platform balance and signed webhooks with retries.
// State is kept in <dataDir>/payments.json so `npm start` finds its accounts again after a restart.
//
// Fake-only routes for tests start with /_fake/ (see storage-fake/README.md).

import crypto from "node:crypto";
import fs from "node:fs";
import http from "node:http";
import path from "node:path";

import { canonical, parseForm } from "./payments/form.mjs";
import { createDeliverer } from "./payments/webhooks.mjs";

const API_VERSION = "2026-10-28.endive";

class ApiError extends Error {
  constructor(status, type, message, { code, param } = {}) {
    super(message);
    this.status = status;
    this.body = {
      error: { type, message, ...(code ? { code } : {}), ...(param ? { param } : {}) },
    };
  }
}
const invalid = (message, extra) => new ApiError(400, "invalid_request_error", message, extra);

const newId = (prefix) =>
  `${prefix}_${crypto.randomBytes(12).toString("base64url").replace(/[-_]/g, "x")}`;
const now = () => Math.floor(Date.now() / 1000);

function escapeHtml(text) {
  return String(text).replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

function emptyState(balanceCents) {
  return {
    accounts: {},
    links: {},
    transfers: {},
    idempotency: {},
    events: {},
    endpoints: [],
    balance: { usd: balanceCents, eur: balanceCents, gbp: balanceCents, cad: balanceCents },
  };
}

export function paymentOptionsFromEnv(env = process.env) {
  const balance = Number(env.FAKE_PAYMENTS_BALANCE_CENTS ?? 5_000_000);
  if (!Number.isSafeInteger(balance) || balance < 0)
    throw new Error(
      `FAKE_PAYMENTS_BALANCE_CENTS must be a whole number of cents, got "${env.FAKE_PAYMENTS_BALANCE_CENTS}"`,
    );
  return {
    apiKey: env.FAKE_PAYMENTS_API_KEY || env.STRIPE_SECRET_KEY || "sk_test_local_fake",
    webhookUrl: env.FAKE_PAYMENTS_WEBHOOK_URL || null,
    webhookSecret: env.FAKE_PAYMENTS_WEBHOOK_SECRET || env.STRIPE_WEBHOOK_SECRET || null,
    retryBaseMs: Number(env.FAKE_PAYMENTS_RETRY_MS ?? 1000),
    balanceCents: balance,
  };
}

/**
 * Starts the fake. options: port, dataDir, apiKey (the secret key the SDK must send),
 * webhookUrl + webhookSecret (an endpoint registered from the start), retryBaseMs, balanceCents, log.
 */
export async function startPaymentsFake(options) {
  const file = options.dataDir ? path.join(options.dataDir, "payments.json") : null;
  let state = emptyState(options.balanceCents ?? 5_000_000);
  if (file && fs.existsSync(file)) {
    try {
      state = { ...state, ...JSON.parse(fs.readFileSync(file, "utf8")) };
    } catch {
      // a damaged file starts the fake afresh
    }
  }
  const save = () => {
    if (!file) return;
    fs.mkdirSync(path.dirname(file), { recursive: true });
    fs.writeFileSync(`${file}.tmp`, JSON.stringify(state));
    fs.renameSync(`${file}.tmp`, file);
  };
  if (options.webhookUrl && options.webhookSecret) {
    state.endpoints = state.endpoints.filter((e) => e.id !== "we_default");
    state.endpoints.push({
      id: "we_default",
      object: "webhook_endpoint",
      url: options.webhookUrl,
      enabled_events: ["*"],
      status: "enabled",
      secret: options.webhookSecret,
    });
  }
  const log = options.log ? (line) => process.stderr.write(`payments-fake: ${line}\n`) : () => {};
  const deliverer = createDeliverer({ retryBaseMs: options.retryBaseMs ?? 1000, log });
  // Fake-only switch: deliver a request's webhook before answering it (the race the app must survive).
  let webhookBeforeResponse = false;
  let baseUrl = "";

  async function emit(type, object, request = {}) {
    const event = {
      id: newId("evt"),
      object: "event",
      api_version: API_VERSION,
      created: now(),
      type,
      livemode: false,
      pending_webhooks: state.endpoints.length,
      request: { id: request.id ?? null, idempotency_key: request.idempotencyKey ?? null },
      data: { object },
    };
    state.events[event.id] = event;
    save();
    const delivery = deliverer.deliver(state.endpoints, event);
    if (webhookBeforeResponse) await delivery;
  }

  const accountLink = (accountId, body) => {
    if (body.type !== "account_onboarding" && body.type !== "account_update")
      throw invalid("Invalid type: must be one of account_onboarding or account_update", {
        param: "type",
      });
    for (const param of ["refresh_url", "return_url"])
      if (!/^https?:\/\//.test(body[param] ?? ""))
        throw invalid(`Invalid URL: ${param} must be an absolute URL`, { param });
    const token = crypto.randomBytes(18).toString("base64url");
    const created = now();
    state.links[token] = {
      account: accountId,
      refresh_url: body.refresh_url,
      return_url: body.return_url,
      expires_at: created + 300,
      used: false,
    };
    return {
      object: "account_link",
      created,
      expires_at: created + 300,
      url: `${baseUrl}/onboarding/${token}`,
    };
  };

  const routes = [
    [
      "POST",
      /^\/v1\/accounts$/,
      async (body, req) => {
        const id = newId("acct");
        const account = {
          id,
          object: "account",
          type: body.type ?? "express",
          country: body.country ?? "US",
          email: body.email ?? null,
          business_type: body.business_type ?? "individual",
          created: now(),
          details_submitted: false,
          charges_enabled: false,
          payouts_enabled: false,
          capabilities: {
            transfers: body.capabilities?.transfers?.requested === "true" ? "inactive" : undefined,
          },
          requirements: {
            currently_due: [
              "individual.first_name",
              "individual.last_name",
              "external_account",
              "tos_acceptance.date",
            ],
            disabled_reason: "requirements.past_due",
          },
          metadata: body.metadata ?? {},
        };
        state.accounts[id] = account;
        await emit("account.created", account, req);
        return account;
      },
    ],
    [
      "GET",
      /^\/v1\/accounts\/(acct_[\w]+)$/,
      async (_b, _r, [id]) => {
        const account = state.accounts[id];
        if (!account)
          throw invalid(`No such account: '${id}'`, { code: "resource_missing", param: "account" });
        return account;
      },
    ],
    [
      "POST",
      /^\/v1\/account_links$/,
      async (body) => {
        if (!state.accounts[body.account])
          throw invalid(`No such account: '${body.account}'`, {
            code: "resource_missing",
            param: "account",
          });
        return accountLink(body.account, body);
      },
    ],
    [
      "POST",
      /^\/v1\/transfers$/,
      async (body, req) => {
        const amount = Number(body.amount);
        if (!/^\d+$/.test(body.amount ?? "") || amount < 1)
          throw invalid("Invalid positive integer", { param: "amount" });
        const currency = String(body.currency ?? "").toLowerCase();
        if (!/^[a-z]{3}$/.test(currency)) throw invalid("Invalid currency", { param: "currency" });
        const destination = state.accounts[body.destination];
        if (!destination)
          throw invalid(`No such destination: '${body.destination}'`, {
            code: "resource_missing",
            param: "destination",
          });
        if (destination.capabilities.transfers !== "active")
          throw invalid(
            "Your destination account needs to have at least one of the following capabilities enabled: transfers, crypto_transfers, legacy_payments",
            { code: "insufficient_capabilities_for_transfer", param: "destination" },
          );
        const available = state.balance[currency] ?? 0;
        if (available < amount)
          throw invalid(
            "You have insufficient available funds in your account to make this transfer.",
            { code: "balance_insufficient" },
          );
        state.balance[currency] = available - amount;
        const transfer = {
          id: newId("tr"),
          object: "transfer",
          amount,
          amount_reversed: 0,
          currency,
          created: now(),
          description: body.description ?? null,
          destination: destination.id,
          livemode: false,
          metadata: body.metadata ?? {},
          reversals: { object: "list", data: [], has_more: false, total_count: 0, url: "" },
          reversed: false,
          source_transaction: null,
          source_type: "card",
          transfer_group: body.transfer_group ?? null,
        };
        state.transfers[transfer.id] = transfer;
        await emit("transfer.created", transfer, req);
        return transfer;
      },
    ],
    [
      "GET",
      /^\/v1\/transfers\/(tr_[\w]+)$/,
      async (_b, _r, [id]) => {
        const transfer = state.transfers[id];
        if (!transfer)
          throw invalid(`No such transfer: '${id}'`, { code: "resource_missing", param: "id" });
        return transfer;
      },
    ],
    [
      "GET",
      /^\/v1\/balance$/,
      async () => ({
        object: "balance",
        livemode: false,
        available: Object.entries(state.balance).map(([currency, amount]) => ({
          amount,
          currency,
          source_types: { card: amount },
        })),
        pending: Object.keys(state.balance).map((currency) => ({
          amount: 0,
          currency,
          source_types: { card: 0 },
        })),
      }),
    ],
    [
      "POST",
      /^\/v1\/webhook_endpoints$/,
      async (body) => {
        if (!/^https?:\/\//.test(body.url ?? "")) throw invalid("Invalid URL", { param: "url" });
        const events = Array.isArray(body.enabled_events) ? body.enabled_events : [];
        if (events.length === 0)
          throw invalid("Missing required param: enabled_events.", { param: "enabled_events" });
        const endpoint = {
          id: newId("we"),
          object: "webhook_endpoint",
          url: body.url,
          enabled_events: events,
          status: "enabled",
          created: now(),
          secret: options.webhookSecret ?? `whsec_${crypto.randomBytes(24).toString("hex")}`,
        };
        state.endpoints.push(endpoint);
        return endpoint;
      },
    ],
    [
      "DELETE",
      /^\/v1\/webhook_endpoints\/(we_[\w]+)$/,
      async (_b, _r, [id]) => {
        const before = state.endpoints.length;
        state.endpoints = state.endpoints.filter((e) => e.id !== id);
        if (state.endpoints.length === before)
          throw invalid(`No such webhook endpoint: '${id}'`, { code: "resource_missing" });
        return { id, object: "webhook_endpoint", deleted: true };
      },
    ],
    [
      "GET",
      /^\/v1\/events\/(evt_[\w]+)$/,
      async (_b, _r, [id]) => {
        const event = state.events[id];
        if (!event)
          throw invalid(`No such event: '${id}'`, { code: "resource_missing", param: "id" });
        return event;
      },
    ],
  ];

  function authorised(req) {
    const auth = req.headers.authorization ?? "";
    const basic = auth.startsWith("Basic ")
      ? Buffer.from(auth.slice(6), "base64").toString().replace(/:$/, "")
      : null;
    const key = auth.startsWith("Bearer ") ? auth.slice(7) : basic;
    return key === options.apiKey;
  }

  async function readBody(req) {
    const chunks = [];
    let size = 0;
    for await (const chunk of req) {
      size += chunk.length;
      if (size > 1024 * 1024) throw invalid("Request body too large");
      chunks.push(chunk);
    }
    return Buffer.concat(chunks).toString("utf8");
  }

  const send = (res, status, body, headers = {}) => {
    const text = typeof body === "string" ? body : JSON.stringify(body);
    res.writeHead(status, {
      "content-type": typeof body === "string" ? "text/html; charset=utf-8" : "application/json",
      "request-id": newId("req"),
      "stripe-version": API_VERSION,
      ...headers,
    });
    res.end(text);
  };

  function onboardingPage(token, link, account, message = "") {
    const expired = !link || link.used || link.expires_at < now();
    const body = expired
      ? `<h1>This set-up link has expired</h1><p>Go back to the app and ask for a new link.</p>${link ? `<p><a href="${escapeHtml(link.refresh_url)}">Get a new link</a></p>` : ""}`
      : `<h1>Set up payouts (local test service)</h1>
<p>This page stands in for the payment service's own sign-up. Nothing here is real money.</p>
${message ? `<p role="alert">${escapeHtml(message)}</p>` : ""}
<form method="post" action="/onboarding/${escapeHtml(token)}">
<p><label>Name on the account <input name="name" required autocomplete="name" value="${escapeHtml(account?.email ?? "")}"></label></p>
<p><label>Test bank account number <input name="bank" required inputmode="numeric" value="000123456789"></label></p>
<p><button type="submit" name="action" value="complete">Finish and go back</button></p>
</form>`;
    return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Set up payouts</title></head><body style="font-family:system-ui,sans-serif;max-width:34rem;margin:2rem auto;padding:0 1rem;color:#1d1b16">${body}</body></html>`;
  }

  async function handleOnboarding(req, res, token) {
    const link = state.links[token];
    const account = link ? state.accounts[link.account] : null;
    if (req.method === "GET")
      return send(res, link ? 200 : 404, onboardingPage(token, link, account));
    const form = parseForm(await readBody(req));
    if (!link || link.used || link.expires_at < now())
      return send(res, 410, onboardingPage(token, link, account));
    if (!form.name?.trim() || !/^\d{6,17}$/.test(form.bank ?? ""))
      return send(
        res,
        400,
        onboardingPage(
          token,
          link,
          account,
          "Give a name and a bank account number of 6 to 17 digits.",
        ),
      );
    link.used = true;
    Object.assign(account, {
      details_submitted: true,
      charges_enabled: true,
      payouts_enabled: true,
      requirements: { currently_due: [], disabled_reason: null },
      capabilities: { ...account.capabilities, transfers: "active" },
    });
    await emit("account.updated", account);
    res.writeHead(303, { location: link.return_url });
    res.end();
  }

  async function handleFake(req, res, route) {
    if (route === "/_fake/deliveries" && req.method === "GET")
      return send(res, 200, { data: deliverer.attempts });
    if (route === "/_fake/balance" && req.method === "POST") {
      const body = JSON.parse((await readBody(req)) || "{}");
      if (
        !/^[a-z]{3}$/.test(body.currency ?? "") ||
        !Number.isSafeInteger(body.amount) ||
        body.amount < 0
      )
        return send(res, 400, { error: { message: "give { currency: 'usd', amount: <cents> }" } });
      state.balance[body.currency] = body.amount;
      save();
      return send(res, 200, { currency: body.currency, amount: body.amount });
    }
    if (route === "/_fake/settings" && req.method === "POST") {
      const body = JSON.parse((await readBody(req)) || "{}");
      webhookBeforeResponse = Boolean(body.webhookBeforeResponse);
      return send(res, 200, { webhookBeforeResponse });
    }
    if (route === "/_fake/resend" && req.method === "POST") {
      const body = JSON.parse((await readBody(req)) || "{}");
      const event = state.events[body.event];
      if (!event) return send(res, 404, { error: { message: "no such event" } });
      await deliverer.deliver(state.endpoints, event);
      return send(res, 200, { resent: event.id });
    }
    return send(res, 404, { error: { message: "no such fake route" } });
  }

  async function handle(req, res) {
    const url = new URL(req.url ?? "/", "http://127.0.0.1");
    const route = url.pathname;
    if (options.log) log(`${req.method} ${route}`);
    const onboarding = /^\/onboarding\/([\w-]+)$/.exec(route);
    if (onboarding) return handleOnboarding(req, res, onboarding[1]);
    if (route.startsWith("/_fake/")) return handleFake(req, res, route);
    if (route === "/health") return send(res, 200, { ok: true });
    if (!authorised(req))
      return send(res, 401, {
        error: { type: "invalid_request_error", message: "Invalid API Key provided." },
      });
    const match = routes
      .map(([method, re, fn]) => ({ method, m: re.exec(route), fn }))
      .find((r) => r.m && r.method === req.method);
    if (!match)
      return send(res, 404, {
        error: {
          type: "invalid_request_error",
          message: `Unrecognized request URL (${req.method}: ${route}).`,
        },
      });
    const raw = await readBody(req);
    const body = req.method === "GET" ? Object.fromEntries(url.searchParams) : parseForm(raw);
    const key = req.headers["idempotency-key"];
    const requestId = newId("req");
    if (req.method === "POST" && key) {
      const signature = canonical({ method: req.method, path: route, body });
      const seen = state.idempotency[key];
      if (seen) {
        if (seen.signature !== signature)
          return send(res, 400, {
            error: {
              type: "idempotency_error",
              message: `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
            },
          });
        return send(res, seen.status, seen.body, {
          "idempotent-replayed": "true",
          "original-request": seen.requestId,
        });
      }
    }
    let status = 200;
    let answer;
    try {
      answer = await match.fn(
        body,
        { id: requestId, idempotencyKey: key ?? null },
        match.m.slice(1),
      );
    } catch (e) {
      if (!(e instanceof ApiError)) throw e;
      status = e.status;
      answer = e.body;
    }
    // Like the real service, a request that ran is remembered under its key, a refusal included.
    if (req.method === "POST" && key)
      state.idempotency[key] = {
        signature: canonical({ method: req.method, path: route, body }),
        status,
        body: answer,
        requestId,
      };
    save();
    send(res, status, answer, { "request-id": requestId });
  }

  const server = http.createServer((req, res) => {
    handle(req, res).catch((e) => {
      if (!res.headersSent)
        send(res, 500, { error: { type: "api_error", message: e?.message ?? String(e) } });
      else res.end();
    });
  });
  await new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port ?? 0, "127.0.0.1", resolve);
  });
  const port = server.address().port;
  baseUrl = `http://127.0.0.1:${port}`;
  return {
    port,
    baseUrl,
    close: () =>
      new Promise((resolve) => {
        deliverer.close();
        server.close(() => resolve());
        server.closeAllConnections?.();
      }),
  };
}
