"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { formatDateTime } from "@/lib/dates";
import { dayLabel } from "@/lib/run/days";
import type { BatchView, FinishingPayload, OkAnswer } from "@/lib/wire/run";

/** Batches with their checklists: finishers tick steps, editors follow the progress. */
export function FinishingBoard({
  slug,
  initial,
  planHref,
}: {
  slug: string;
  initial: FinishingPayload;
  planHref: string | null;
}) {
  const router = useRouter();
  const [busy, setBusy] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const { checklist, batches, canTick } = initial;

  async function tick(batch: BatchView, stepId: string, done: boolean) {
    const key = `${batch.id}:${stepId}`;
    setBusy(key);
    setError(null);
    try {
      await fetchJson<OkAnswer>(`/api/anthologies/${slug}/finishing/${batch.id}`, {
        method: "POST",
        json: { stepId, done },
      });
      router.refresh();
    } catch (e) {
      if (!(e instanceof ApiError)) throw e;
      setError(e.message);
    } finally {
      setBusy(null);
    }
  }

  if (batches.length === 0)
    return (
      <Notice tone="info" testId="finishing-empty">
        No finishing batches yet.{" "}
        {planHref ? (
          <>
            Add events on the <Link href={planHref}>print run</Link> page and make batches from
            them.
          </>
        ) : (
          "An editor makes them from the events on the print run page."
        )}
      </Notice>
    );

  return (
    <div className="flex flex-col gap-6">
      <Notice tone="caution" title="Safety first" testId="finishing-safety">
        {initial.safety}
      </Notice>
      {error ? (
        <div role="alert">
          <Notice tone="error" testId="finishing-error">
            {error}
          </Notice>
        </div>
      ) : null}
      <section aria-labelledby="progress-heading" className="flex flex-col gap-2">
        <h2 id="progress-heading" className="text-xl font-bold">
          Progress
        </h2>
        <ul className="flex flex-col gap-1 text-sm" data-testid="finishing-progress">
          {batches.map((b) => {
            const done = checklist.filter((s) => b.ticks[s.id]).length;
            return (
              <li key={b.id}>
                <a href={`#batch-${b.id}`}>
                  Batch {b.position}: {b.label}
                </a>{" "}
                — {b.doneAt ? "finished" : `${done} of ${checklist.length} steps`}, {b.copies}{" "}
                copies
                {b.due ? `, by ${dayLabel(b.due)}` : ""}
              </li>
            );
          })}
        </ul>
      </section>
      {batches.map((b) => {
        const allTicked = checklist.every((s) => b.ticks[s.id]);
        return (
          <section
            key={b.id}
            id={`batch-${b.id}`}
            aria-labelledby={`batch-${b.id}-heading`}
            className="flex flex-col gap-3 rounded-md border border-ink/15 bg-white/50 p-4"
            data-testid="batch"
          >
            <h2 id={`batch-${b.id}-heading`} className="text-lg font-bold">
              Batch {b.position}: {b.label}
            </h2>
            <p className="text-sm text-ink-soft">
              {b.copies} copies{b.due ? `, wanted by ${dayLabel(b.due)}` : ""}
              {b.eventName ? ` for ${b.eventName}` : ""}. Printed sheets on hand for {b.sheetSets}{" "}
              {b.sheetSets === 1 ? "copy" : "copies"}.
            </p>
            <ol className="flex flex-col gap-3">
              {checklist.map((s) => {
                const t = b.ticks[s.id];
                const id = `tick-${b.id}-${s.id}`;
                return (
                  <li key={s.id} className="flex flex-col gap-1">
                    <div className="flex items-start gap-2">
                      <input
                        id={id}
                        type="checkbox"
                        className="mt-1 h-5 w-5"
                        checked={Boolean(t)}
                        disabled={!canTick || Boolean(b.doneAt) || busy !== null}
                        aria-describedby={`${id}-detail`}
                        onChange={(e) => tick(b, s.id, e.target.checked)}
                      />
                      <label htmlFor={id} className="font-semibold">
                        {s.label}
                        {t ? (
                          <span className="ml-2 text-xs font-normal text-ink-soft">
                            done by {t.by}, {formatDateTime(new Date(t.at))}
                          </span>
                        ) : null}
                      </label>
                    </div>
                    <div id={`${id}-detail`} className="pl-7 text-sm">
                      <p>{s.detail}</p>
                      <ul className="mt-1 list-disc pl-5 text-xs text-ink-soft">
                        {s.cautions.map((c) => (
                          <li key={c}>{c}</li>
                        ))}
                      </ul>
                    </div>
                  </li>
                );
              })}
            </ol>
            {b.doneAt ? (
              <p className="text-sm font-semibold text-teal-dark" data-testid="batch-done">
                Finished by {b.doneBy}, {formatDateTime(new Date(b.doneAt))}; its copies are in
                stock.
              </p>
            ) : null}
            {canTick ? (
              <div>
                {b.doneAt ? (
                  <Button
                    type="button"
                    variant="quiet"
                    busy={busy === `${b.id}:batch`}
                    onClick={() => tick(b, "batch", false)}
                  >
                    Reopen batch {b.position}
                  </Button>
                ) : (
                  <Button
                    type="button"
                    busy={busy === `${b.id}:batch`}
                    disabled={!allTicked}
                    onClick={() => tick(b, "batch", true)}
                  >
                    Batch {b.position} is finished: put {b.copies} copies in stock
                  </Button>
                )}
              </div>
            ) : null}
          </section>
        );
      })}
    </div>
  );
}
