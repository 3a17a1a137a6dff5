// Signed webhook delivery, the way the payments service signs it:
//   Stripe-Signature: t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<raw JSON body>" keyed with the endpoint secret>
// A delivery that gets no 2xx answer (or no answer) is tried again after a growing delay.

import crypto from "node:crypto";

/** The signature header for a payload at a time (seconds). */
export function signatureHeader(payload, secret, timestamp = Math.floor(Date.now() / 1000)) {
  const v1 = crypto.createHmac("sha256", secret).update(`${timestamp}.${payload}`).digest("hex");
  return `t=${timestamp},v1=${v1}`;
}

/**
 * Delivers events to the registered endpoints. `retryBaseMs` doubles each time, up to
 * `maxAttempts` tries per endpoint. `log` keeps every attempt for tests (GET /_fake/deliveries).
 */
export function createDeliverer({ retryBaseMs = 1000, maxAttempts = 6, log = () => {} } = {}) {
  const attempts = [];
  const timers = new Set();

  async function attempt(endpoint, event, payload, n) {
    const header = signatureHeader(payload, endpoint.secret);
    let status = 0;
    let error = null;
    try {
      const res = await fetch(endpoint.url, {
        method: "POST",
        headers: {
          "content-type": "application/json; charset=utf-8",
          "stripe-signature": header,
          "user-agent": "payments-fake/1.0",
        },
        body: payload,
        signal: AbortSignal.timeout(10_000),
      });
      status = res.status;
      await res.arrayBuffer().catch(() => undefined);
    } catch (e) {
      error = e?.cause?.code ?? e?.message ?? String(e);
    }
    const ok = status >= 200 && status < 300;
    attempts.push({
      endpoint: endpoint.id,
      event: event.id,
      type: event.type,
      attempt: n,
      status,
      error,
      at: new Date().toISOString(),
    });
    log(`webhook ${event.type} ${event.id} → ${endpoint.url}: ${status || error} (try ${n})`);
    if (!ok && n < maxAttempts) {
      const timer = setTimeout(
        () => {
          timers.delete(timer);
          void attempt(endpoint, event, payload, n + 1);
        },
        retryBaseMs * 2 ** (n - 1),
      );
      timer.unref();
      timers.add(timer);
    }
    return ok;
  }

  return {
    attempts,
    /** Sends one event to each endpoint that listens for its type; resolves after the first tries. */
    async deliver(endpoints, event) {
      const payload = JSON.stringify(event, null, 2);
      const targets = endpoints.filter(
        (e) =>
          e.status !== "disabled" &&
          (e.enabled_events.includes("*") || e.enabled_events.includes(event.type)),
      );
      await Promise.all(targets.map((e) => attempt(e, event, payload, 1)));
    },
    close() {
      for (const t of timers) clearTimeout(t);
      timers.clear();
    },
  };
}
