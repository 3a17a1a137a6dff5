"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import type { FinishingStep } from "@/lib/print/finishing";
import {
  EVENT_KIND_LABELS,
  EVENT_KINDS,
  orderByDay,
  scheduleBatches,
  type EventKind,
} from "@/lib/run/batches";
import { dayLabel } from "@/lib/run/days";
import { runEventSchema } from "@/lib/validations/run";
import type { OkAnswer, RunPayload } from "@/lib/wire/run";
import { fieldErrorsOf } from "./field-errors";

const hours = (minutes: number) => `${Math.round((minutes / 60) * 10) / 10} h`;

/** Events with the copies wanted for each, the batches they call for, and the warnings. */
export function EventsPanel({
  slug,
  initial,
  steps,
  minutesPerWeek,
  turnaroundDays,
}: {
  slug: string;
  initial: RunPayload;
  steps: FinishingStep[];
  minutesPerWeek: number;
  turnaroundDays: number | null;
}) {
  const router = useRouter();
  const { events, today, canPlan } = initial;
  const [name, setName] = useState("");
  const [kind, setKind] = useState<EventKind>("fair");
  const [date, setDate] = useState("");
  const [copies, setCopies] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<{ tone: "info" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  const schedule = scheduleBatches({
    today,
    events,
    minutesPerWeek,
    steps,
    sheetsPerCopy: initial.counts.sheetsPerCopy,
    formatDay: dayLabel,
  });
  const first = events[0];

  async function act(action: () => Promise<string>) {
    setBusy(true);
    setStatus(null);
    try {
      setStatus({ tone: "info", text: await action() });
      router.refresh();
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      setErrors(Object.fromEntries(Object.entries(error.fields).map(([k, v]) => [k, v[0] ?? ""])));
      setStatus({ tone: "error", text: error.message });
    } finally {
      setBusy(false);
    }
  }

  function add(e: React.FormEvent) {
    e.preventDefault();
    const parsed = runEventSchema(today).safeParse({
      name,
      kind,
      date,
      copies: copies.trim() === "" ? Number.NaN : Number(copies),
    });
    if (!parsed.success) {
      setErrors(fieldErrorsOf(parsed.error));
      return;
    }
    setErrors({});
    void act(async () => {
      await fetchJson(`/api/anthologies/${slug}/run/events`, { method: "POST", json: parsed.data });
      setName("");
      setDate("");
      setCopies("");
      return `${parsed.data.name} added.`;
    });
  }

  return (
    <section aria-labelledby="events-heading" className="flex flex-col gap-4">
      <h2 id="events-heading" className="text-xl font-bold">
        Events and finishing batches
      </h2>
      <p className="text-sm text-ink-soft">
        One finishing batch per event, finished before its day. Days are counted in{" "}
        {initial.timeZone}; today is {dayLabel(today)}.
      </p>
      {events.length === 0 ? (
        <Notice tone="info" testId="events-empty">
          No events yet. Add a fair, a launch or a mail-out with the copies wanted for it.
        </Notice>
      ) : (
        <ol className="flex flex-col gap-2" data-testid="batch-schedule">
          {schedule.batches.map((b) => {
            const event = events.find((e) => e.id === b.eventId)!;
            return (
              <li
                key={b.eventId}
                className="rounded-md border border-ink/15 bg-white/50 px-3 py-2 text-sm"
              >
                <div className="flex flex-wrap items-baseline justify-between gap-2">
                  <span>
                    <span className="font-semibold">Batch {b.index}</span>: {b.copies} copies for{" "}
                    {event.name} ({EVENT_KIND_LABELS[event.kind]}), {dayLabel(event.date)}
                  </span>
                  {canPlan ? (
                    <Button
                      type="button"
                      variant="quiet"
                      disabled={busy}
                      onClick={() =>
                        act(async () => {
                          await fetchJson<OkAnswer>(
                            `/api/anthologies/${slug}/run/events/${event.id}`,
                            {
                              method: "DELETE",
                            },
                          );
                          return `${event.name} removed.`;
                        })
                      }
                    >
                      Remove {event.name}
                    </Button>
                  ) : null}
                </div>
                <p className="text-ink-soft">
                  Finishing {hours(b.minutes)}; {hours(b.availableMinutes)} of finishers&apos; time
                  until then
                  {b.shortfallCopies > 0 ? (
                    <span className="font-semibold text-persimmon-dark">
                      {" "}
                      · {b.shortfallCopies} copies short
                    </span>
                  ) : null}
                </p>
              </li>
            );
          })}
        </ol>
      )}
      {schedule.warnings.length > 0 ? (
        <Notice tone="warn" title="Not enough time" testId="batch-warnings">
          <ul className="list-disc pl-5">
            {schedule.warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </Notice>
      ) : null}
      {first && turnaroundDays !== null ? (
        <p className="text-sm" data-testid="shop-order-by">
          With the shop, send the files by {dayLabel(orderByDay(first.date, turnaroundDays))} to
          have copies for {first.name} ({turnaroundDays} days&apos; turnaround).
        </p>
      ) : null}
      {canPlan && events.length > 0 ? (
        <div className="flex flex-wrap items-center gap-3">
          <Button
            type="button"
            disabled={busy || initial.batchesStarted}
            onClick={() =>
              act(
                async () =>
                  (
                    await fetchJson<OkAnswer>(`/api/anthologies/${slug}/run/batches`, {
                      method: "POST",
                    })
                  ).message,
              )
            }
          >
            {initial.batchCount > 0
              ? "Plan the batches again from these events"
              : "Make these the finishing batches"}
          </Button>
          {initial.batchesStarted ? (
            <span className="text-sm text-ink-soft">
              Finishing has started, so the batches stay as they are.
            </span>
          ) : null}
          {initial.batchCount > 0 ? (
            <Link href={`/studio/${slug}/finishing`} className="text-sm">
              Open the finishing checklists
            </Link>
          ) : null}
        </div>
      ) : null}
      {canPlan ? (
        <form
          onSubmit={add}
          className="grid grid-cols-1 gap-3 rounded-md border border-ink/15 p-3 sm:grid-cols-4"
          noValidate
        >
          <Field id="event-name" label="Event" error={errors.name}>
            <input
              {...describedBy("event-name", errors.name)}
              className={inputClass}
              value={name}
              onChange={(e) => setName(e.target.value)}
            />
          </Field>
          <Field id="event-kind" label="Kind">
            <select
              {...describedBy("event-kind")}
              className={inputClass}
              value={kind}
              onChange={(e) => setKind(e.target.value as EventKind)}
            >
              {EVENT_KINDS.map((k) => (
                <option key={k} value={k}>
                  {EVENT_KIND_LABELS[k]}
                </option>
              ))}
            </select>
          </Field>
          <Field id="event-date" label="Day" error={errors.date}>
            <input
              {...describedBy("event-date", errors.date)}
              type="date"
              min={today}
              className={inputClass}
              value={date}
              onChange={(e) => setDate(e.target.value)}
            />
          </Field>
          <Field id="event-copies" label="Copies wanted" error={errors.copies}>
            <input
              {...describedBy("event-copies", errors.copies)}
              inputMode="numeric"
              className={inputClass}
              value={copies}
              onChange={(e) => setCopies(e.target.value)}
            />
          </Field>
          <div className="sm:col-span-4">
            <Button type="submit" busy={busy}>
              Add the event
            </Button>
          </div>
        </form>
      ) : null}
      {status ? (
        <div role="status">
          <Notice tone={status.tone} testId="events-status">
            {status.text}
          </Notice>
        </div>
      ) : null}
    </section>
  );
}
