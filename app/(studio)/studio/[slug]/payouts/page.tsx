import { LedgerLines } from "@/components/ledger-lines";
import { Notice } from "@/components/ui/notice";
import { formatCents } from "@/lib/money";
import { RECORDS_NOTE } from "@/lib/payouts";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { paymentsConfigured } from "@/server/payments";
import { ledgerView } from "@/server/payouts-view";
import { PaidByHandForm } from "./_components/paid-by-hand-form";
import { PeriodForm } from "./_components/period-form";
import { PostButton } from "./_components/post-button";

export const metadata = { title: "Payouts" };

const ACCOUNT_WORDS = {
  none: "No payout account connected: pay by hand",
  started: "Payout account set-up not finished",
  ready: "Payout account connected",
} as const;

export default async function PayoutsPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { anthology } = await requireAnthologyAccess(
    slug,
    "payouts:manage",
    `/studio/${slug}/payouts`,
  );
  const view = await ledgerView(anthology);
  const money = (c: number) => formatCents(c, view.currency);
  const api = `/api/anthologies/${slug}/payouts`;
  const canTransfer = paymentsConfigured();
  const closed = view.periods.filter((p) => p.closedAt);
  return (
    <div className="flex max-w-5xl flex-col gap-8">
      <div className="flex flex-col gap-2">
        <h1 className="text-3xl font-extrabold">Payouts for {anthology.title}</h1>
        <p className="text-sm text-ink-soft">
          The ledger only grows: a correction is a new line. A transfer counts as paid once the
          payments service confirms it.
        </p>
        <Notice tone="caution">{RECORDS_NOTE}</Notice>
      </div>

      <section aria-labelledby="periods-h" className="flex flex-col gap-3">
        <h2 id="periods-h" className="text-xl font-bold">
          Periods
        </h2>
        {view.periods.length === 0 ? (
          <p className="text-sm text-ink-soft">No periods yet.</p>
        ) : null}
        <ul className="flex flex-col gap-2">
          {view.periods.map((p) => (
            <li
              key={p.id}
              className="flex flex-wrap items-center gap-3 border-t border-ink/10 pt-2 text-sm"
            >
              <span className="font-semibold">{p.label}</span>
              <span>
                {p.startsOn} to {p.endsOn}: net {money(p.netCents)}, contributors’ share{" "}
                {money(p.poolCents)}
              </span>
              {p.closedAt ? (
                <PostButton
                  url={`${api}/statements`}
                  body={{ periodId: p.id }}
                  label="E-mail statements"
                  busyLabel="Sending…"
                  done="statements"
                />
              ) : (
                <PostButton
                  url={`${api}/periods/${p.id}/close`}
                  label="Close and share out"
                  busyLabel="Working it out…"
                  confirm={`Close ${p.label}? Its sales are shared out now and no sale can be added to it afterwards.`}
                  done="close"
                  variant="primary"
                />
              )}
            </li>
          ))}
        </ul>
        <PeriodForm slug={slug} />
      </section>

      <section aria-labelledby="exports-h" className="flex flex-col gap-2">
        <h2 id="exports-h" className="text-xl font-bold">
          Downloads
        </h2>
        <p className="flex flex-wrap gap-4 text-sm">
          <a href={`${api}/export?what=ledger`} download>
            Ledger (CSV)
          </a>
          <a href={`${api}/export?what=sales`} download>
            Sales (CSV)
          </a>
        </p>
        <p className="text-xs text-ink-faint">{RECORDS_NOTE}</p>
      </section>

      <section aria-labelledby="people-h" className="flex flex-col gap-4">
        <h2 id="people-h" className="text-xl font-bold">
          Contributors
        </h2>
        {view.people.length === 0 ? (
          <p className="text-sm text-ink-soft">
            No accepted pieces yet, so nobody is owed anything.
          </p>
        ) : null}
        {view.people.map((person) => (
          <article
            key={person.contributorId}
            aria-labelledby={`person-${person.contributorId}`}
            className="flex flex-col gap-2 rounded-lg border border-ink/15 p-4"
            data-testid="person-ledger"
          >
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <h3 id={`person-${person.contributorId}`} className="text-lg font-bold">
                {person.label}
              </h3>
              <span className="text-sm">
                Owed {money(person.owedCents)} · paid {money(person.paidCents)} ·{" "}
                <strong>still to pay {money(person.outstandingCents)}</strong>
              </span>
            </div>
            <p className="text-xs text-ink-faint">
              {person.pieces} {person.pieces === 1 ? "piece" : "pieces"}, {person.pages}{" "}
              {person.pages === 1 ? "page" : "pages"} · {ACCOUNT_WORDS[person.account]}
            </p>
            {closed.length > 0 ? (
              <p className="flex flex-wrap gap-3 text-xs">
                {closed.map((p) => (
                  <a
                    key={p.id}
                    href={`${api}/statement?period=${p.id}&contributor=${person.contributorId}`}
                  >
                    Statement {p.label} (PDF)
                  </a>
                ))}
              </p>
            ) : null}
            <LedgerLines
              lines={person.lines}
              currency={view.currency}
              actions={(line) =>
                line.status === "open" ? (
                  <>
                    {canTransfer && person.account === "ready" ? (
                      <PostButton
                        url={`${api}/entries/${line.id}/pay`}
                        label="Pay by transfer"
                        busyLabel="Sending…"
                        variant="primary"
                        done="pay"
                      />
                    ) : null}
                    <PaidByHandForm slug={slug} entryId={line.id} />
                  </>
                ) : null
              }
            />
          </article>
        ))}
      </section>
    </div>
  );
}
