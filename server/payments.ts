import "server-only";
/**
 * The one module that talks to the payments service's SDK (`stripe`). Where it goes (the hosted
 * service, or the local fake in storage-fake/payments.mjs over http) is configuration read here
 * from lib/env.ts: STRIPE_API_HOST and STRIPE_API_PORT point it at the fake.
 */
import Stripe from "stripe";
import { env } from "@/lib/env";

let client: Stripe | null = null;

/** True when a secret key is configured. */
export function paymentsConfigured(): boolean {
  return Boolean(env().STRIPE_SECRET_KEY);
}

function payments(): Stripe {
  const e = env();
  if (!e.STRIPE_SECRET_KEY)
    throw new PaymentProblem("Payments are not set up here (STRIPE_SECRET_KEY is missing).", 503);
  client ??= new Stripe(e.STRIPE_SECRET_KEY, {
    ...(e.STRIPE_API_HOST
      ? {
          host: e.STRIPE_API_HOST,
          port: e.STRIPE_API_PORT ?? 443,
          protocol: e.STRIPE_API_PORT && e.STRIPE_API_HOST === "127.0.0.1" ? "http" : "https",
        }
      : {}),
    maxNetworkRetries: 2,
    timeout: 20_000,
    appInfo: { name: "Quireline" },
  });
  return client;
}

/** A refusal from the payments service, in words an editor can act on. */
export class PaymentProblem extends Error {
  constructor(
    message: string,
    readonly status = 502,
    readonly code: string | null = null,
  ) {
    super(message);
  }
}

const PLAIN_CODES: Record<string, string> = {
  insufficient_capabilities_for_transfer:
    "This contributor has not finished setting up their payout account yet, so nothing was sent.",
  balance_insufficient:
    "The collective’s payments balance is too low for this transfer, so nothing was sent. Add funds and try again.",
  resource_missing: "The payments service does not know this payout account.",
};

function explain(error: unknown): never {
  if (error instanceof Stripe.errors.StripeError) {
    const code = error.code ?? null;
    const message = (code && PLAIN_CODES[code]) || `The payments service refused: ${error.message}`;
    const status = error instanceof Stripe.errors.StripeConnectionError ? 502 : 409;
    throw new PaymentProblem(message, status, code ?? error.type);
  }
  throw error;
}

export type ProviderAccount = { id: string; detailsSubmitted: boolean; transfersActive: boolean };

function accountOf(a: Stripe.Account): ProviderAccount {
  return {
    id: a.id,
    detailsSubmitted: Boolean(a.details_submitted),
    transfersActive: a.capabilities?.transfers === "active",
  };
}

/** A connected account for a contributor, asking for the transfers capability. */
export async function createConnectedAccount(input: {
  email: string | null;
  userId: string;
}): Promise<ProviderAccount> {
  try {
    const account = await payments().accounts.create(
      {
        type: "express",
        ...(input.email ? { email: input.email } : {}),
        capabilities: { transfers: { requested: true } },
        metadata: { quireline_user: input.userId },
      },
      { idempotencyKey: `account-${input.userId}` },
    );
    return accountOf(account);
  } catch (e) {
    explain(e);
  }
}

export async function retrieveAccount(id: string): Promise<ProviderAccount> {
  try {
    return accountOf(await payments().accounts.retrieve(id));
  } catch (e) {
    explain(e);
  }
}

/** The service's onboarding page for an account, coming back to returnUrl. */
export async function onboardingLink(input: {
  accountId: string;
  returnUrl: string;
  refreshUrl: string;
}): Promise<string> {
  try {
    const link = await payments().accountLinks.create({
      account: input.accountId,
      return_url: input.returnUrl,
      refresh_url: input.refreshUrl,
      type: "account_onboarding",
    });
    return link.url;
  } catch (e) {
    explain(e);
  }
}

/** A transfer to a connected account; the same key and body always reach the same transfer. */
export async function createTransfer(input: {
  amountCents: number;
  currency: string;
  destination: string;
  idempotencyKey: string;
  metadata: Record<string, string>;
  description: string;
}): Promise<{ id: string }> {
  try {
    const transfer = await payments().transfers.create(
      {
        amount: input.amountCents,
        currency: input.currency.toLowerCase(),
        destination: input.destination,
        description: input.description,
        metadata: input.metadata,
      },
      { idempotencyKey: input.idempotencyKey },
    );
    return { id: transfer.id };
  } catch (e) {
    explain(e);
  }
}

/** For the seed and tests: points the service's webhooks at a URL; returns its id and signing secret. */
export async function addWebhookEndpoint(url: string) {
  const endpoint = await payments().webhookEndpoints.create({
    url,
    enabled_events: ["transfer.created", "transfer.reversed", "account.updated"],
  });
  return { id: endpoint.id, secret: endpoint.secret ?? "" };
}

export async function removeWebhookEndpoint(id: string) {
  await payments().webhookEndpoints.del(id);
}

export type PaymentEvent = Stripe.Event;

/**
 * Checks a webhook's Stripe-Signature over the raw body with the SDK's own verifier (HMAC-SHA256,
 * five minutes' tolerance); throws for a forged, altered or stale one.
 */
export function verifyWebhook(
  rawBody: string,
  signature: string | null,
  secret?: string,
): Stripe.Event {
  const key = secret ?? env().STRIPE_WEBHOOK_SECRET;
  if (!key)
    throw new PaymentProblem(
      "Webhooks are not set up here (STRIPE_WEBHOOK_SECRET is missing).",
      503,
    );
  if (!signature) throw new PaymentProblem("The webhook has no signature.", 400);
  try {
    return payments().webhooks.constructEvent(rawBody, signature, key);
  } catch (e) {
    throw new PaymentProblem(
      `The webhook signature does not check out: ${e instanceof Error ? e.message : String(e)}`,
      400,
    );
  }
}
