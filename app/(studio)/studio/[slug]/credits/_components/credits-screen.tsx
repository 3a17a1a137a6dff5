"use client";

import Link from "next/link";
import { useState } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { plural } from "@/lib/map/state";
import { pageReference } from "@/lib/print/credits";
import type { CreditsAnswer, CreditsAskedAnswer } from "@/lib/wire/credits";
import { CreditRow } from "./credit-row";

/** The credits screen: counts, "ask everyone outstanding", one row per piece, and the page preview. */
export function CreditsScreen({ slug, initial }: { slug: string; initial: CreditsAnswer }) {
  const [credits, setCredits] = useState(initial);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ tone: "info" | "error"; text: string } | null>(null);
  const base = `/api/anthologies/${slug}/credits`;

  async function refresh() {
    setCredits(await fetchJson<CreditsAnswer>(base));
  }

  async function ask(json: { scope: "outstanding" } | { scope: "pieces"; pieceIds: number[] }) {
    setBusy(true);
    setMessage(null);
    try {
      const answer = await fetchJson<CreditsAskedAnswer>(base, {
        method: "POST",
        json,
        failure: (status) => `Nothing was sent (error ${status}).`,
      });
      setCredits(answer.credits);
      const parts = [`Asked ${plural(answer.asked, "contributor")} by e-mail.`];
      if (answer.failed)
        parts.push(`${plural(answer.failed, "mail")} could not be sent; try again.`);
      if (answer.skipped) parts.push(`${answer.skipped} skipped (approved, or no address).`);
      setMessage({ tone: answer.failed ? "error" : "info", text: parts.join(" ") });
    } catch (e) {
      setMessage({ tone: "error", text: e instanceof ApiError ? e.message : "Nothing was sent." });
    } finally {
      setBusy(false);
    }
  }

  const { counts, rows, preview, reserved } = credits;
  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="credit-counts" className="flex flex-col gap-3">
        <h2 id="credit-counts" className="sr-only">
          Where the credits stand
        </h2>
        <dl className="grid grid-cols-2 gap-2 rounded-md border border-ink/15 bg-white/50 p-3 text-sm sm:grid-cols-4">
          <div>
            <dt className="text-ink-soft">Outstanding</dt>
            <dd className="text-lg font-semibold" data-testid="credits-outstanding">
              {counts.outstanding}
            </dd>
          </div>
          <div>
            <dt className="text-ink-soft">Approved</dt>
            <dd className="text-lg font-semibold" data-testid="credits-approved">
              {counts.approved}
            </dd>
          </div>
          <div>
            <dt className="text-ink-soft">Asked, waiting</dt>
            <dd className="text-lg font-semibold">{counts.asked}</dd>
          </div>
          <div>
            <dt className="text-ink-soft">Not asked yet</dt>
            <dd className="text-lg font-semibold">{counts.notAsked}</dd>
          </div>
        </dl>
        <div className="flex flex-wrap items-center gap-3">
          <Button
            onClick={() => ask({ scope: "outstanding" })}
            busy={busy}
            disabled={counts.outstanding === 0}
            data-testid="ask-outstanding"
          >
            Ask everyone outstanding ({counts.outstanding})
          </Button>
          <span className="text-xs text-ink-soft">
            Each gets an e-mail with a link to approve or change their line; links last 30 days.
          </span>
        </div>
        {message ? (
          <div aria-live="polite">
            <Notice tone={message.tone} testId="credits-message">
              {message.text}
            </Notice>
          </div>
        ) : null}
      </section>

      <section aria-labelledby="credit-rows" className="flex flex-col gap-3">
        <h2 id="credit-rows" className="text-xl font-semibold">
          Pieces in this issue
        </h2>
        {rows.length === 0 ? (
          <p className="text-sm text-ink-soft" data-testid="credits-empty">
            No accepted pieces yet. Credit lines appear here once pieces are accepted.
          </p>
        ) : (
          <ul className="flex flex-col gap-2" data-testid="credit-rows">
            {rows.map((row) => (
              <CreditRow
                key={row.pieceId}
                slug={slug}
                row={row}
                busy={busy}
                onAsk={() => ask({ scope: "pieces", pieceIds: [row.pieceId] })}
                onChanged={async (text) => {
                  setMessage({ tone: "info", text });
                  await refresh().catch(() => undefined);
                }}
              />
            ))}
          </ul>
        )}
      </section>

      <section aria-labelledby="credit-preview" className="flex flex-col gap-3">
        <h2 id="credit-preview" className="text-xl font-semibold">
          The credits page as it would print now
        </h2>
        <p className="text-sm" data-testid="credits-placement">
          {reserved.credits.length > 0 ? (
            <>
              Goes on {pageReference(reserved.credits)} (kept for the credits on the{" "}
              <Link href={`/studio/${slug}/map`}>page map</Link>).
            </>
          ) : (
            <>
              No page is kept for the credits yet. Keep one on the{" "}
              <Link href={`/studio/${slug}/map`}>page map</Link> (choose a page, then “Keep this
              page for” the credits).
            </>
          )}
        </p>
        <figure
          className="max-w-xl rounded-md border border-ink/20 bg-white p-4"
          data-testid="credits-preview"
        >
          <figcaption className="mb-2 font-display text-lg font-semibold">
            {preview.page.heading}
          </figcaption>
          {preview.page.lines.length ? (
            <ol className="flex flex-col gap-1 whitespace-pre-wrap font-mono text-xs">
              {preview.page.lines.map((line, i) => (
                <li key={i}>{line}</li>
              ))}
            </ol>
          ) : (
            <p className="text-sm text-ink-soft">No approved credit lines on the map yet.</p>
          )}
        </figure>
        {preview.outstanding.length ? (
          <div className="text-sm" data-testid="credits-left-off">
            <p className="font-semibold">Left off until approved:</p>
            <ul className="list-disc pl-5">
              {preview.outstanding.map((o) => (
                <li key={o.pieceId}>
                  {pageReference(o.pages)} “{o.title}”
                </li>
              ))}
            </ul>
          </div>
        ) : null}
      </section>

      <section aria-labelledby="colophon-preview" className="flex flex-col gap-3">
        <h2 id="colophon-preview" className="text-xl font-semibold">
          The colophon
        </h2>
        <p className="text-sm" data-testid="colophon-placement">
          {reserved.colophon.length > 0 ? (
            <>Goes on {pageReference(reserved.colophon.slice(0, 1))}.</>
          ) : (
            <>
              No page is kept for the colophon yet. Keep one on the{" "}
              <Link href={`/studio/${slug}/map`}>page map</Link>.
            </>
          )}
        </p>
        <figure className="max-w-xl rounded-md border border-ink/20 bg-white p-4">
          <figcaption className="mb-2 font-display text-lg font-semibold">
            {credits.colophon.heading}
          </figcaption>
          <ul className="flex flex-col gap-1 text-sm">
            {credits.colophon.lines.map((line, i) => (
              <li key={i}>{line}</li>
            ))}
          </ul>
        </figure>
      </section>
    </div>
  );
}
