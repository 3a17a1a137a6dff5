import { LedgerLines } from "@/components/ledger-lines";
import { Notice } from "@/components/ui/notice";
import { formatCents } from "@/lib/money";
import { RECORDS_NOTE } from "@/lib/payouts";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { paymentsConfigured, PaymentProblem } from "@/server/payments";
import { refreshPayoutAccount } from "@/server/payouts";
import { myPayoutsView } from "@/server/payouts-view";
import { ConnectAccount } from "./_components/connect-account";

export const metadata = { title: "My payouts" };

export default async function MyPayoutsPage({
  params,
  searchParams,
}: {
  params: Promise<{ slug: string }>;
  searchParams: Promise<{ account?: string }>;
}) {
  const { slug } = await params;
  const { account: back } = await searchParams;
  const { anthology, user } = await requireAnthologyAccess(
    slug,
    "payouts:view-own",
    `/studio/${slug}/my-payouts`,
  );
  // Coming back from the service's set-up page does not mean it was finished: ask the service.
  let refreshProblem: string | null = null;
  if (back === "returned") {
    try {
      await refreshPayoutAccount(user.id);
    } catch (error) {
      if (!(error instanceof PaymentProblem)) throw error;
      refreshProblem = error.message;
    }
  }
  const view = await myPayoutsView(anthology, user);
  const me = view.me;
  const money = (c: number) => formatCents(c, view.currency);
  return (
    <div className="flex max-w-3xl flex-col gap-6">
      <div className="flex flex-col gap-2">
        <h1 className="text-3xl font-extrabold">My payouts from {anthology.title}</h1>
        <Notice tone="caution">{RECORDS_NOTE}</Notice>
      </div>
      <section aria-labelledby="totals-h" className="flex flex-col gap-1">
        <h2 id="totals-h" className="text-xl font-bold">
          To date
        </h2>
        <p className="text-sm" data-testid="my-totals">
          Owed {money(me.owedCents)} · paid {money(me.paidCents)} ·{" "}
          <strong>still to pay {money(me.outstandingCents)}</strong>
        </p>
        <p className="text-xs text-ink-faint">
          {me.pieces} {me.pieces === 1 ? "piece" : "pieces"}, {me.pages}{" "}
          {me.pages === 1 ? "page" : "pages"} in the book
        </p>
      </section>

      <section aria-labelledby="account-h" className="flex flex-col gap-2">
        <h2 id="account-h" className="text-xl font-bold">
          Payout account
        </h2>
        {refreshProblem ? <Notice tone="error">{refreshProblem}</Notice> : null}
        {back === "expired" ? (
          <Notice tone="warn">
            The set-up link expired before it was finished. Start again below.
          </Notice>
        ) : null}
        {me.account === "ready" ? (
          <p className="text-sm" data-testid="account-state">
            Connected: the collective can pay you by transfer.
          </p>
        ) : (
          <>
            <p className="text-sm" data-testid="account-state">
              {me.account === "started"
                ? "You started setting up a payout account but it is not finished yet."
                : "No payout account yet. You can connect one to be paid by transfer, or agree another way with the editors: they can record a payment made by hand."}
            </p>
            {paymentsConfigured() ? (
              <ConnectAccount slug={slug} resume={me.account === "started"} />
            ) : (
              <p className="text-sm text-ink-soft">Transfers are not set up for this collective.</p>
            )}
          </>
        )}
      </section>

      <section aria-labelledby="statements-h" className="flex flex-col gap-2">
        <h2 id="statements-h" className="text-xl font-bold">
          Statements
        </h2>
        {view.periods.length === 0 ? (
          <p className="text-sm text-ink-soft">
            No statements yet: one appears when a period is closed.
          </p>
        ) : (
          <ul className="flex flex-wrap gap-4 text-sm">
            {view.periods.map((p) => (
              <li key={p.id}>
                <a href={`/api/anthologies/${slug}/payouts/statement?period=${p.id}`}>
                  {p.label} (PDF)
                </a>
              </li>
            ))}
          </ul>
        )}
      </section>

      <section aria-labelledby="lines-h" className="flex flex-col gap-2">
        <h2 id="lines-h" className="text-xl font-bold">
          Every line
        </h2>
        <LedgerLines lines={me.lines} currency={view.currency} />
      </section>
    </div>
  );
}
