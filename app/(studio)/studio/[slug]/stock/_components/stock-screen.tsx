"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { formatDateTime } from "@/lib/dates";
import { dayLabel } from "@/lib/run/days";
import { STOCK_KIND_LABELS, STOCK_KINDS, type StockKind } from "@/lib/run/stock";
import { stockMovementSchema } from "@/lib/validations/run";
import type { ContributorCopyView, OkAnswer, StockPayload } from "@/lib/wire/run";

function firstMessages(fields: Record<string, string[]>): Record<string, string> {
  return Object.fromEntries(Object.entries(fields).map(([k, v]) => [k, v[0] ?? ""]));
}

/** Counts, a form for one movement, the movement list and contributor copies. */
export function StockScreen({ slug, initial }: { slug: string; initial: StockPayload }) {
  const router = useRouter();
  const { batches, canMove } = initial;
  const [kind, setKind] = useState<StockKind>("sold");
  const [batchId, setBatchId] = useState<string>(batches[0] ? String(batches[0].id) : "");
  const [quantity, setQuantity] = useState("");
  const [target, setTarget] = useState<"copies" | "sheets">("copies");
  const [reason, setReason] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<{ tone: "info" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  const needsBatch =
    kind === "printed" || kind === "finished" || (kind === "correction" && target === "sheets");

  async function act(action: () => Promise<string>) {
    setBusy(true);
    setStatus(null);
    try {
      setStatus({ tone: "info", text: await action() });
      router.refresh();
    } catch (e) {
      if (!(e instanceof ApiError)) throw e;
      setErrors(firstMessages(e.fields));
      setStatus({ tone: "error", text: e.message });
    } finally {
      setBusy(false);
    }
  }

  function submit(e: React.FormEvent) {
    e.preventDefault();
    const parsed = stockMovementSchema.safeParse({
      kind,
      batchId: needsBatch && batchId !== "" ? Number(batchId) : null,
      quantity: /^-?\d+$/.test(quantity.trim()) ? Number(quantity) : Number.NaN,
      target: kind === "correction" ? target : undefined,
      reason,
    });
    if (!parsed.success) {
      const out: Record<string, string> = {};
      for (const i of parsed.error.issues) out[String(i.path[0] ?? "_")] ??= i.message;
      setErrors(out);
      return;
    }
    setErrors({});
    void act(async () => {
      await fetchJson<OkAnswer>(`/api/anthologies/${slug}/stock`, {
        method: "POST",
        json: parsed.data,
      });
      setQuantity("");
      setReason("");
      return `${STOCK_KIND_LABELS[kind]}: recorded.`;
    });
  }

  const updateCopy = (
    c: ContributorCopyView,
    change: Partial<Pick<ContributorCopyView, "delivery" | "eventId">> & { done?: boolean },
  ) =>
    act(async () => {
      await fetchJson<OkAnswer>(`/api/anthologies/${slug}/stock/contributor-copies/${c.id}`, {
        method: "PATCH",
        json: {
          delivery: change.delivery ?? c.delivery,
          eventId: change.eventId !== undefined ? change.eventId : c.eventId,
          done: change.done ?? c.doneAt !== null,
        },
      });
      return `Copies for ${c.name} saved.`;
    });

  const unfinished = batches.reduce((n, b) => n + b.sheetSets, 0);

  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="counts-heading" className="flex flex-col gap-2">
        <h2 id="counts-heading" className="text-xl font-bold">
          On hand
        </h2>
        <dl
          className="grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:max-w-md"
          data-testid="stock-counts"
        >
          <dt className="text-ink-soft">Finished copies</dt>
          <dd data-testid="copies-on-hand" className="font-semibold">
            {initial.copiesOnHand}
          </dd>
          <dt className="text-ink-soft">Printed, unfinished (copies&apos; worth of sheets)</dt>
          <dd data-testid="sheets-unfinished">{unfinished}</dd>
        </dl>
        {batches.length === 0 ? (
          <Notice tone="info" testId="stock-no-batches">
            No batches yet: printed sheets are counted per finishing batch, made on the print run
            page.
          </Notice>
        ) : (
          <ul className="flex flex-col gap-1 text-sm" data-testid="stock-batches">
            {batches.map((b) => (
              <li key={b.id}>
                {b.label}: printed sheets for {b.sheetSets} of {b.copies} copies
                {b.done ? " · finished" : ""}
              </li>
            ))}
          </ul>
        )}
        {canMove && batches.some((b) => !b.done && b.sheetSets < b.copies) ? (
          <div>
            <Button
              type="button"
              variant="quiet"
              disabled={busy}
              onClick={() =>
                act(
                  async () =>
                    (
                      await fetchJson<OkAnswer>(`/api/anthologies/${slug}/stock/printed`, {
                        method: "POST",
                      })
                    ).message,
                )
              }
            >
              All sheets are printed: record them for every batch
            </Button>
          </div>
        ) : null}
      </section>

      {canMove ? (
        <section aria-labelledby="move-heading" className="flex flex-col gap-3">
          <h2 id="move-heading" className="text-xl font-bold">
            Record a movement
          </h2>
          <form onSubmit={submit} noValidate className="grid grid-cols-1 gap-3 sm:grid-cols-2">
            <Field id="move-kind" label="What happened">
              <select
                {...describedBy("move-kind")}
                className={inputClass}
                value={kind}
                onChange={(e) => setKind(e.target.value as StockKind)}
              >
                {STOCK_KINDS.filter((k) => k !== "contributor-copy").map((k) => (
                  <option key={k} value={k}>
                    {STOCK_KIND_LABELS[k]}
                  </option>
                ))}
              </select>
            </Field>
            {kind === "correction" ? (
              <Field id="move-target" label="Correct" error={errors.target}>
                <select
                  {...describedBy("move-target", errors.target)}
                  className={inputClass}
                  value={target}
                  onChange={(e) => setTarget(e.target.value as "copies" | "sheets")}
                >
                  <option value="copies">Finished copies</option>
                  <option value="sheets">A batch&apos;s printed sheets</option>
                </select>
              </Field>
            ) : null}
            {needsBatch ? (
              <Field id="move-batch" label="Batch" error={errors.batchId}>
                <select
                  {...describedBy("move-batch", errors.batchId)}
                  className={inputClass}
                  value={batchId}
                  onChange={(e) => setBatchId(e.target.value)}
                >
                  {batches.map((b) => (
                    <option key={b.id} value={b.id}>
                      {b.label}
                    </option>
                  ))}
                </select>
              </Field>
            ) : null}
            <Field
              id="move-quantity"
              label={
                kind === "correction"
                  ? "Change (+ or −)"
                  : kind === "printed" || kind === "finished"
                    ? "Copies' worth"
                    : "Copies"
              }
              hint={kind === "correction" ? "A negative number takes away, e.g. -2" : undefined}
              error={errors.quantity}
            >
              <input
                {...describedBy("move-quantity", errors.quantity)}
                className={inputClass}
                inputMode="numeric"
                value={quantity}
                onChange={(e) => setQuantity(e.target.value)}
              />
            </Field>
            <Field
              id="move-reason"
              label={kind === "correction" ? "Why (required)" : "Note"}
              error={errors.reason}
            >
              <input
                {...describedBy("move-reason", errors.reason)}
                className={inputClass}
                value={reason}
                onChange={(e) => setReason(e.target.value)}
              />
            </Field>
            <div className="sm:col-span-2">
              <Button type="submit" busy={busy}>
                Record
              </Button>
            </div>
          </form>
        </section>
      ) : null}

      {status ? (
        <div role="status">
          <Notice tone={status.tone} testId="stock-status">
            {status.text}
          </Notice>
        </div>
      ) : null}

      <section aria-labelledby="copies-heading" className="flex flex-col gap-3">
        <h2 id="copies-heading" className="text-xl font-bold">
          Contributor copies
        </h2>
        {initial.copiesPerContributor === null ? (
          <Notice tone="info" testId="contributor-copies-empty">
            The open call has no terms yet, so no contributor copies are owed.
          </Notice>
        ) : initial.contributorCopies.length === 0 ? (
          <Notice tone="info" testId="contributor-copies-empty">
            No accepted pieces yet: each contributor in the book gets {initial.copiesPerContributor}{" "}
            {initial.copiesPerContributor === 1 ? "copy" : "copies"} under the call&apos;s terms.
          </Notice>
        ) : (
          <>
            <p className="text-sm text-ink-soft">
              {initial.copiesPerContributor}{" "}
              {initial.copiesPerContributor === 1 ? "copy" : "copies"} for each contributor in the
              book, under the call&apos;s terms. Marking them handed over takes them out of stock.
            </p>
            <ul className="flex flex-col gap-2" data-testid="contributor-copies">
              {initial.contributorCopies.map((c) => (
                <li
                  key={c.id}
                  className="flex flex-wrap items-end gap-3 rounded-md border border-ink/15 p-2 text-sm"
                >
                  <span className="min-w-[10rem] font-semibold">
                    {c.name}: {c.quantity}
                  </span>
                  <Field
                    id={`copy-${c.id}-delivery`}
                    label="How"
                    className="w-full min-w-0 sm:w-80"
                  >
                    <select
                      {...describedBy(`copy-${c.id}-delivery`)}
                      className={`${inputClass} w-full`}
                      value={c.delivery === "post" ? "post" : (c.eventId ?? "collect")}
                      disabled={!canMove || busy || c.doneAt !== null}
                      onChange={(e) =>
                        updateCopy(
                          c,
                          e.target.value === "post"
                            ? { delivery: "post", eventId: null }
                            : e.target.value === "collect"
                              ? { delivery: "collect", eventId: null }
                              : { delivery: "collect", eventId: Number(e.target.value) },
                        )
                      }
                    >
                      <option value="collect">Collected (no event chosen)</option>
                      {initial.events.map((ev) => (
                        <option key={ev.id} value={ev.id}>
                          Collected at {ev.name}, {dayLabel(ev.date)}
                        </option>
                      ))}
                      <option value="post">Posted</option>
                    </select>
                  </Field>
                  <label className="flex items-center gap-2">
                    <input
                      type="checkbox"
                      className="h-5 w-5"
                      checked={c.doneAt !== null}
                      disabled={!canMove || busy}
                      onChange={(e) => updateCopy(c, { done: e.target.checked })}
                    />
                    {c.delivery === "post" ? "Posted" : "Handed over"}
                    {c.doneAt ? ` (${formatDateTime(new Date(c.doneAt))})` : ""}
                  </label>
                </li>
              ))}
            </ul>
          </>
        )}
      </section>

      <section aria-labelledby="movements-heading" className="flex flex-col gap-2">
        <h2 id="movements-heading" className="text-xl font-bold">
          Movements
        </h2>
        {initial.movements.length === 0 ? (
          <Notice tone="info" testId="movements-empty">
            Nothing has moved yet.
          </Notice>
        ) : (
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Stock movements">
            <table className="w-full min-w-[36rem] text-left text-sm" data-testid="movements">
              <thead className="border-b border-ink/20 text-xs uppercase tracking-wide text-ink-soft">
                <tr>
                  <th scope="col" className="py-2 pr-3">
                    When
                  </th>
                  <th scope="col" className="py-2 pr-3">
                    What
                  </th>
                  <th scope="col" className="py-2 pr-3">
                    Sheets
                  </th>
                  <th scope="col" className="py-2 pr-3">
                    Copies
                  </th>
                  <th scope="col" className="py-2 pr-3">
                    Reason
                  </th>
                  <th scope="col" className="py-2 pr-3">
                    By
                  </th>
                </tr>
              </thead>
              <tbody>
                {initial.movements.map((m) => (
                  <tr key={m.id} className="border-b border-ink/10">
                    <td className="py-1 pr-3">{formatDateTime(new Date(m.at))}</td>
                    <td className="py-1 pr-3">
                      {STOCK_KIND_LABELS[m.kind]}
                      {m.batchLabel ? ` · ${m.batchLabel}` : ""}
                    </td>
                    <td className="py-1 pr-3">
                      {m.sheetSets === 0 ? "" : m.sheetSets > 0 ? `+${m.sheetSets}` : m.sheetSets}
                    </td>
                    <td className="py-1 pr-3">
                      {m.copies === 0 ? "" : m.copies > 0 ? `+${m.copies}` : m.copies}
                    </td>
                    <td className="py-1 pr-3">{m.reason}</td>
                    <td className="py-1 pr-3">{m.by}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
    </div>
  );
}
