import "server-only";
/**
 * Sales, the ledger and paying: the services the payouts routes, the webhook and the seed call.
 * Nothing here edits a ledger line; every change is a new line under a dedupe key, so a retried
 * request, a racing one or a replayed webhook cannot pay anyone twice.
 */
import type { Anthology } from "@/db/queries/anthologies";
import {
  appendEntry,
  claimPaymentEvent,
  claimTransferAttempt,
  closePeriodWithLines,
  contributorWork,
  feeHolders,
  findEntry,
  findEntryById,
  findPayoutAccount,
  findPayoutAccountByProviderId,
  findPayoutTerms,
  findPeriod,
  insertPayoutAccount,
  isDuplicateKey,
  linesAbout,
  listPeriods,
  listSales,
  releasePaymentEvent,
  setPaymentEventOutcome,
  settleTransferAttempt,
  transfersFor,
  updatePayoutAccountStatus,
  type EntryRow,
  type NewEntry,
} from "@/db/queries/payouts";
import { closePeriod, signedAmount } from "@/lib/payouts";
import { Refusal } from "@/lib/refusal";
import {
  createConnectedAccount,
  createTransfer,
  onboardingLink,
  PaymentProblem,
  retrieveAccount,
  type PaymentEvent,
} from "@/server/payments";

const refuse = (status: Refusal["status"], message: string) => new Refusal(status, message);

/** The inclusive date range of a period: its first day at 00:00 to its last day's end. */
export function periodRange(period: { startsOn: Date; endsOn: Date }) {
  return { from: period.startsOn, to: new Date(period.endsOn.getTime() + 86_400_000 - 1) };
}

/** A sale may not land in a period already shared out: put it in a later one. */
export async function assertSaleDateOpen(anthologyId: number, soldOn: Date) {
  for (const p of await listPeriods(anthologyId)) {
    const { from, to } = periodRange(p);
    if (p.closedAt && soldOn >= from && soldOn <= to)
      throw refuse(
        409,
        `The period “${p.label}” is already closed and shared out; date the sale in a later period, or record a correction there.`,
      );
  }
}

/** Works out the period's shares and fees and appends them as owed lines, once. */
export async function closePayoutPeriod(anthology: Anthology, periodId: number, userId: string) {
  const period = await findPeriod(anthology.id, periodId);
  if (!period) throw refuse(404, "There is no such period.");
  if (period.closedAt) throw refuse(409, `The period “${period.label}” is already closed.`);
  const terms = await findPayoutTerms(anthology.id);
  if (!terms)
    throw refuse(409, "This anthology has no open call, so there are no terms to pay by.");
  const sales = await listSales(anthology.id, periodRange(period));
  const work = await contributorWork(anthology.id);
  const result = closePeriod({
    terms,
    currency: anthology.currency,
    sales,
    work,
    feeAlreadyOwed: await feeHolders(anthology.id),
  });
  const lines: NewEntry[] = result.lines.map((l) => ({
    anthologyId: anthology.id,
    contributorId: l.contributorId,
    periodId,
    kind: "owed",
    source: l.source,
    amountCents: signedAmount("owed", l.amountCents),
    currency: anthology.currency,
    computation: l.computation,
    dedupeKey:
      l.source === "fee"
        ? `fee:${anthology.id}:${l.contributorId}`
        : `share:${periodId}:${l.contributorId}`,
    createdBy: userId,
  }));
  let closed: boolean;
  try {
    closed = await closePeriodWithLines(
      periodId,
      userId,
      { sales: result.sales, poolCents: result.poolCents, terms, saleIds: sales.map((s) => s.id) },
      lines,
    );
  } catch (error) {
    if (isDuplicateKey(error))
      throw refuse(409, "Another request has just written these lines; reload.");
    throw error;
  }
  if (!closed) throw refuse(409, `The period “${period.label}” is already closed.`);
  return { ...result, linesWritten: lines.length };
}

/** What has happened to an owed line: settled, reversed, or a transfer on its way. */
async function owedLineState(entry: EntryRow) {
  const about = await linesAbout(entry.id);
  const paid = about.find((l) => l.kind === "paid" && l.settlesEntryId === entry.id);
  const paidReversed = paid
    ? (await linesAbout(paid.id)).some((l) => l.kind === "reversed")
    : false;
  const reversed = about.some((l) => l.kind === "reversed" && l.reversesEntryId === entry.id);
  return { paid: paid && !paidReversed ? paid : null, reversed };
}

async function owedLineOrRefuse(anthologyId: number, entryId: number) {
  const entry = await findEntry(anthologyId, entryId);
  if (!entry) throw refuse(404, "There is no such ledger line.");
  if (entry.kind !== "owed") throw refuse(409, "Only an owed line can be paid.");
  const state = await owedLineState(entry);
  if (state.reversed) throw refuse(409, "This line was cancelled, so there is nothing to pay.");
  if (state.paid) throw refuse(409, "This line is already paid.");
  return entry;
}

export type PayOutcome = {
  state: "sent" | "paid";
  transferId: string;
  attempt: number;
  /** The service had already confirmed this transfer before the request: nothing more was paid. */
  alreadyPaid?: boolean;
};

/**
 * The transfer that paid an owed line, once the service has confirmed it; undefined while the line
 * is unpaid, cancelled or paid by hand.
 */
async function confirmedTransferOf(anthologyId: number, entryId: number) {
  const entry = await findEntry(anthologyId, entryId);
  if (!entry || entry.kind !== "owed") return undefined;
  const state = await owedLineState(entry);
  if (!state.paid || state.reversed) return undefined;
  return (await transfersFor(entry.id)).find((a) => a.state === "sent" && a.providerTransferId);
}

/**
 * Pays one owed line by transfer. The idempotency key is the line and the attempt, so a retried
 * request (or two at once) reaches the same transfer; a refused attempt lets a later one start.
 * The line is "paid" only when the service's signed webhook says so.
 */
export async function payEntryByTransfer(
  anthology: Anthology,
  entryId: number,
  userId: string,
): Promise<PayOutcome> {
  // A second click that the service's confirmation overtook learns the transfer that paid it.
  const confirmed = await confirmedTransferOf(anthology.id, entryId);
  if (confirmed)
    return {
      state: "paid",
      transferId: confirmed.providerTransferId!,
      attempt: confirmed.attempt,
      alreadyPaid: true,
    };
  const entry = await owedLineOrRefuse(anthology.id, entryId);
  if (entry.amountCents <= 0) throw refuse(409, "Nothing is owed on this line.");
  const account = await findPayoutAccount(entry.contributorId);
  if (!account)
    throw refuse(409, "This contributor has not connected a payout account; pay by hand instead.");
  const attempts = await transfersFor(entry.id);
  const latest = attempts[0];
  if (latest?.state === "sent")
    return { state: "sent", transferId: latest.providerTransferId!, attempt: latest.attempt };
  let attempt = latest && latest.state === "requesting" ? latest : null;
  if (!attempt) {
    const number = (latest?.attempt ?? 0) + 1;
    const key = `quireline-entry-${entry.id}-${number}`;
    const id = await claimTransferAttempt({
      anthologyId: anthology.id,
      entryId: entry.id,
      attempt: number,
      idempotencyKey: key,
      destination: account.providerAccountId,
      amountCents: entry.amountCents,
      currency: entry.currency,
      createdBy: userId,
    });
    // A racing request claimed this attempt: go on with it, the key makes it one transfer.
    attempt = (await transfersFor(entry.id)).find((a) => a.attempt === number) ?? null;
    if (!attempt || (id === null && attempt.state !== "requesting")) {
      if (attempt?.state === "sent")
        return { state: "sent", transferId: attempt.providerTransferId!, attempt: attempt.attempt };
      throw refuse(409, "Another request is paying this line; reload in a moment.");
    }
  }
  let transferId: string;
  try {
    ({ id: transferId } = await createTransfer({
      amountCents: attempt.amountCents,
      currency: attempt.currency,
      destination: attempt.destination,
      idempotencyKey: attempt.idempotencyKey,
      description: `${anthology.title}: ledger line ${entry.id}`,
      metadata: { quireline_entry: String(entry.id), quireline_attempt: String(attempt.attempt) },
    }));
  } catch (error) {
    if (error instanceof PaymentProblem && error.status !== 502) {
      await settleTransferAttempt(attempt.id, { state: "failed", error: error.message });
      throw new Refusal(409, error.message);
    }
    // No answer: the transfer may or may not exist. The attempt stays open and a retry reuses its key.
    throw new PaymentProblem(
      "The payments service did not answer. Nothing is marked paid; try again and the same transfer will be reused.",
      502,
    );
  }
  await settleTransferAttempt(attempt.id, { state: "sent", providerTransferId: transferId });
  await appendEntry({
    anthologyId: anthology.id,
    contributorId: entry.contributorId,
    periodId: entry.periodId,
    kind: "scheduled",
    source: "transfer",
    amountCents: signedAmount("scheduled", attempt.amountCents),
    currency: entry.currency,
    settlesEntryId: entry.id,
    computation: {
      inputs: { transferCents: attempt.amountCents, attempt: attempt.attempt },
      working: [
        `Transfer ${transferId} of line ${entry.id} sent; paid once the service confirms it.`,
      ],
    },
    reference: transferId,
    dedupeKey: `scheduled:${transferId}`,
    createdBy: userId,
  });
  const { paid } = await owedLineState(entry);
  return { state: paid ? "paid" : "sent", transferId, attempt: attempt.attempt };
}

/** For someone paid outside the service (cash at a fair, a bank transfer): a paid line by hand. */
export async function markPaidByHand(
  anthology: Anthology,
  entryId: number,
  input: { reference: string; userId: string; userLabel: string },
) {
  const entry = await owedLineOrRefuse(anthology.id, entryId);
  const inFlight = (await transfersFor(entry.id)).find(
    (a) => a.state === "requesting" || a.state === "sent",
  );
  if (inFlight)
    throw refuse(
      409,
      "A transfer for this line is already on its way; wait for it to be confirmed rather than paying twice.",
    );
  const result = await appendEntry({
    anthologyId: anthology.id,
    contributorId: entry.contributorId,
    periodId: entry.periodId,
    kind: "paid",
    source: "by-hand",
    amountCents: signedAmount("paid", entry.amountCents),
    currency: entry.currency,
    settlesEntryId: entry.id,
    computation: {
      inputs: { paidCents: entry.amountCents, by: input.userLabel },
      working: [`Paid by hand, recorded by ${input.userLabel}: ${input.reference}`],
    },
    reference: input.reference,
    dedupeKey: `paid:${entry.id}`,
    createdBy: input.userId,
  });
  if (result.duplicate) throw refuse(409, "This line is already paid.");
  return { id: result.id };
}

/** Cancels an owed line that was wrong (a correction is a new line; nothing is edited). */
export async function reverseOwedLine(
  anthology: Anthology,
  entryId: number,
  input: { reason: string; userId: string },
) {
  const entry = await owedLineOrRefuse(anthology.id, entryId);
  if ((await transfersFor(entry.id)).some((a) => a.state !== "failed"))
    throw refuse(409, "A transfer was made for this line; it cannot be cancelled here.");
  const result = await appendEntry({
    anthologyId: anthology.id,
    contributorId: entry.contributorId,
    periodId: entry.periodId,
    kind: "reversed",
    source: "correction",
    amountCents: signedAmount("reversed", 0, entry.amountCents),
    currency: entry.currency,
    reversesEntryId: entry.id,
    computation: {
      inputs: { reversedCents: entry.amountCents },
      working: [`Cancelled: ${input.reason}`],
    },
    dedupeKey: `reversed:${entry.id}`,
    createdBy: input.userId,
  });
  if (result.duplicate) throw refuse(409, "This line is already cancelled.");
  return { id: result.id };
}

/* ---------- Connecting a payout account ---------- */

/** The onboarding page for the signed-in contributor (making their connected account first). */
export async function startOnboarding(
  user: { id: string; email: string | null },
  urls: { returnUrl: string; refreshUrl: string },
) {
  let account = await findPayoutAccount(user.id);
  if (!account) {
    const created = await createConnectedAccount({ email: user.email, userId: user.id });
    account = await insertPayoutAccount(user.id, created.id);
  }
  if (account.transfersActive) throw refuse(409, "Your payout account is already connected.");
  return { url: await onboardingLink({ accountId: account.providerAccountId, ...urls }) };
}

/** Reads the account's state back from the service (after the return from onboarding). */
export async function refreshPayoutAccount(userId: string) {
  const account = await findPayoutAccount(userId);
  if (!account) return null;
  const fresh = await retrieveAccount(account.providerAccountId);
  await updatePayoutAccountStatus(account.providerAccountId, fresh);
  return { ...account, ...fresh };
}

/* ---------- Webhooks ---------- */

export type WebhookOutcome = { duplicate: boolean; outcome: string };

/**
 * Applies one verified event, once: the event id is claimed first, so a replay does nothing.
 * A failure releases the claim, answers 500 and the service tries again later.
 */
export async function handlePaymentEvent(event: PaymentEvent): Promise<WebhookOutcome> {
  if (!(await claimPaymentEvent(event.id, event.type, "handling")))
    return { duplicate: true, outcome: "seen before" };
  try {
    const outcome = await applyEvent(event);
    await setPaymentEventOutcome(event.id, outcome);
    return { duplicate: false, outcome };
  } catch (error) {
    await releasePaymentEvent(event.id);
    throw error;
  }
}

async function applyEvent(event: PaymentEvent): Promise<string> {
  if (event.type === "account.updated") {
    const a = event.data.object;
    await updatePayoutAccountStatus(a.id, {
      detailsSubmitted: Boolean(a.details_submitted),
      transfersActive: a.capabilities?.transfers === "active",
    });
    return "account updated";
  }
  if (event.type === "transfer.created") return transferConfirmed(event.data.object);
  if (event.type === "transfer.reversed") return transferReversed(event.data.object);
  return "ignored";
}

async function entryOfTransfer(transfer: { metadata?: Record<string, string> | null }) {
  const id = Number(transfer.metadata?.quireline_entry ?? "");
  return Number.isSafeInteger(id) && id > 0 ? findEntryById(id) : undefined;
}

async function transferConfirmed(transfer: {
  id: string;
  amount: number;
  currency: string;
  destination: string | { id: string } | null;
  metadata?: Record<string, string> | null;
}): Promise<string> {
  const entry = await entryOfTransfer(transfer);
  if (!entry || entry.kind !== "owed") return "not one of ours";
  const destination =
    typeof transfer.destination === "string" ? transfer.destination : transfer.destination?.id;
  const account = destination ? await findPayoutAccountByProviderId(destination) : null;
  // A signed event still has to match the line it names before anyone is marked paid.
  if (
    transfer.amount !== entry.amountCents ||
    transfer.currency.toUpperCase() !== entry.currency.toUpperCase() ||
    account?.userId !== entry.contributorId
  ) {
    const outcome = `refused: transfer ${transfer.id} does not match line ${entry.id} (amount, currency or account)`;
    console.error(`payments webhook ${outcome}`);
    return outcome;
  }
  const result = await appendEntry({
    anthologyId: entry.anthologyId,
    contributorId: entry.contributorId,
    periodId: entry.periodId,
    kind: "paid",
    source: "transfer",
    amountCents: signedAmount("paid", transfer.amount),
    currency: entry.currency,
    settlesEntryId: entry.id,
    computation: {
      inputs: { paidCents: transfer.amount, transfer: transfer.id },
      working: [`Paid by transfer ${transfer.id}, confirmed by the payments service.`],
    },
    reference: transfer.id,
    dedupeKey: `paid:${entry.id}`,
    createdBy: null,
  });
  return result.duplicate ? `line ${entry.id} was already paid` : `line ${entry.id} paid`;
}

async function transferReversed(transfer: {
  id: string;
  metadata?: Record<string, string> | null;
}): Promise<string> {
  const entry = await entryOfTransfer(transfer);
  if (!entry) return "not one of ours";
  const paid = (await linesAbout(entry.id)).find(
    (l) => l.kind === "paid" && l.reference === transfer.id,
  );
  if (!paid) return "no paid line for this transfer";
  const result = await appendEntry({
    anthologyId: entry.anthologyId,
    contributorId: entry.contributorId,
    periodId: entry.periodId,
    kind: "reversed",
    source: "transfer",
    amountCents: signedAmount("reversed", 0, paid.amountCents),
    currency: entry.currency,
    reversesEntryId: paid.id,
    settlesEntryId: entry.id,
    computation: {
      inputs: { transfer: transfer.id },
      working: [`Transfer ${transfer.id} was reversed by the service; the line is owed again.`],
    },
    reference: transfer.id,
    dedupeKey: `reversed:${paid.id}`,
    createdBy: null,
  });
  return result.duplicate ? "already reversed" : `paid line ${paid.id} reversed`;
}
