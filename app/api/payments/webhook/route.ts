import { HttpError, readTextCapped } from "@/server/api";
import { errorSummary, log } from "@/server/log";
import { PaymentProblem, verifyWebhook } from "@/server/payments";
import { handlePaymentEvent } from "@/server/payouts";

const MAX_EVENT_BYTES = 512 * 1024;

/**
 * The payments service's webhooks. No session: the Stripe-Signature over the raw body is the
 * authority (the SDK's constructEvent). 400 for a bad signature; 200 for a replay (already seen);
 * 500 on a failure, so the service tries again.
 */
export async function POST(request: Request) {
  // Events are a few kilobytes; anything far larger is not one. Reading stops at the cap, with or
  // without a declared length.
  let raw: string;
  try {
    raw = await readTextCapped(request, MAX_EVENT_BYTES);
  } catch (error) {
    if (error instanceof HttpError)
      return Response.json({ error: "The body is too large for an event." }, { status: 413 });
    throw error;
  }
  let event;
  try {
    event = verifyWebhook(raw, request.headers.get("stripe-signature"));
  } catch (error) {
    if (error instanceof PaymentProblem)
      return Response.json({ error: error.message }, { status: error.status });
    throw error;
  }
  try {
    const result = await handlePaymentEvent(event);
    return Response.json({ received: true, ...result });
  } catch (error) {
    log.error({ kind: "payments", error: errorSummary(error) }, "payments webhook failed");
    return Response.json(
      { error: "Could not apply the event; it will be retried." },
      { status: 500 },
    );
  }
}
