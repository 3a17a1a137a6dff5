import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { connection } from "next/server";
import { CallSpecSummaryPanel } from "@/components/call-spec-summary";
import { linkButtonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { findPublishedCall, toCallRecord } from "@/db/queries/open-call";
import { callSpecSummary } from "@/lib/call-spec";
import { specOf } from "@/lib/print/spec";
import { copiesText, feeText, salesShareText } from "@/lib/call-terms";
import { callPhase, kindsText } from "@/lib/stages";
import { formatDateTime } from "@/lib/dates";

type Props = { params: Promise<{ slug: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug } = await params;
  const found = await findPublishedCall(slug);
  if (!found) return { title: "No such call" };
  return {
    title: `${found.call.theme}: open call for ${found.anthology.title}`,
    description:
      found.anthology.summary ??
      `An open call from ${found.anthology.pressName ?? found.anthology.title}.`,
  };
}

/** The public page of an open call, readable without signing in. */
export default async function PublicCallPage({ params }: Props) {
  await connection();
  const { slug } = await params;
  const found = await findPublishedCall(slug);
  if (!found) notFound();
  const { anthology, call: row } = found;
  const call = toCallRecord(row);
  const phase = callPhase(row, anthology.stage, new Date());
  const at = (date: Date) => formatDateTime(date, call.timeZone);
  const paragraphs = call.brief
    .split(/\n\s*\n/)
    .map((p) => p.trim())
    .filter(Boolean);
  const details: [string, string][] = [
    ["Opens", at(call.opensAt)],
    ["Closes", at(call.closesAt)],
    ["A piece may be", kindsText(call.allowedKinds, call.maxRunPages)],
    ["Pieces per person", `Up to ${call.piecesPerPerson}`],
    ["Inks", call.allowedInks.join(", ")],
  ];
  const terms: [string, string][] = [
    ["Fee", feeText(call, anthology.currency)],
    ["Share of sales", salesShareText(call.salesShareBasisPoints, call.shareSplit)],
    ["Contributor copies", copiesText(call.contributorCopies)],
  ];

  return (
    <article className="flex flex-col gap-8" data-testid="public-call">
      <header>
        <p className="text-sm text-ink-soft">
          Open call · {anthology.pressName ? `${anthology.pressName} · ` : ""}
          <span className="font-semibold">{anthology.title}</span>
        </p>
        <h1
          className="mt-1 text-4xl font-extrabold leading-tight sm:text-5xl"
          data-testid="call-theme"
        >
          {call.theme}
        </h1>
        {anthology.summary ? (
          <p className="mt-3 max-w-2xl text-lg text-ink-soft">{anthology.summary}</p>
        ) : null}
      </header>

      <div data-testid="call-status">
        {phase === "open" ? (
          <div className="flex flex-wrap items-center gap-4 rounded-lg border border-teal/40 bg-teal-light/60 p-4">
            <p className="text-sm">
              <strong>Open for work</strong> until {at(call.closesAt)}.
            </p>
            <Link
              href={`/calls/${anthology.slug}/submit`}
              className={linkButtonClass("accent")}
              data-testid="send-work"
            >
              Send your work
            </Link>
          </div>
        ) : phase === "upcoming" ? (
          <Notice tone="warn" title="Not open yet">
            This call opens on {at(call.opensAt)} and closes on {at(call.closesAt)}. Come back then
            to send your work.
          </Notice>
        ) : (
          <Notice tone="caution" title="Closed">
            This call closed on {at(call.closesAt)}. Thank you to everyone who sent work.
          </Notice>
        )}
      </div>

      <div className="grid gap-8 lg:grid-cols-[3fr_2fr]">
        <div className="flex flex-col gap-8">
          <section aria-labelledby="brief-heading">
            <h2 id="brief-heading" className="text-2xl font-semibold">
              The brief
            </h2>
            <div className="mt-2 flex max-w-2xl flex-col gap-3" data-testid="call-brief">
              {paragraphs.map((p, n) => (
                <p key={n} className="whitespace-pre-line">
                  {p}
                </p>
              ))}
            </div>
          </section>

          <section aria-labelledby="details-heading">
            <h2 id="details-heading" className="text-2xl font-semibold">
              What to send, and when
            </h2>
            <dl
              className="mt-3 grid grid-cols-[10rem_1fr] gap-x-4 gap-y-2 text-sm"
              data-testid="call-details"
            >
              {details.map(([label, value]) => (
                <div key={label} className="contents">
                  <dt className="text-ink-soft">{label}</dt>
                  <dd>{value}</dd>
                </div>
              ))}
            </dl>
          </section>

          <section aria-labelledby="terms-heading">
            <h2 id="terms-heading" className="text-2xl font-semibold">
              Terms and rights
            </h2>
            <dl
              className="mt-3 grid grid-cols-[10rem_1fr] gap-x-4 gap-y-2 text-sm"
              data-testid="call-terms"
            >
              {terms.map(([label, value]) => (
                <div key={label} className="contents">
                  <dt className="text-ink-soft">{label}</dt>
                  <dd>{value}</dd>
                </div>
              ))}
              <dt className="text-ink-soft">Rights asked</dt>
              <dd className="whitespace-pre-line" data-testid="call-rights">
                {call.rightsAsked}
              </dd>
            </dl>
            <p className="mt-3 max-w-2xl text-xs text-ink-faint">
              Terms and rights are an agreement between {anthology.pressName ?? "the press"} and
              each contributor. Quireline keeps the records; it is not tax or legal advice.
            </p>
          </section>
        </div>
        <aside>
          <CallSpecSummaryPanel
            slug={anthology.slug}
            spec={callSpecSummary(specOf(anthology, { inks: call.allowedInks }))}
          />
        </aside>
      </div>
    </article>
  );
}
