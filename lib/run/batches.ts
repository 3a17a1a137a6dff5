/**
 * Finishing batches timed to events: one batch per event (a fair, a launch, a mail-out), in date
 * order, each finished before its day. The finishers' hours per week spread evenly over the days
 * until an event are the time available; earlier batches use it first. Dates are calendar days
 * (ISO 8601, YYYY-MM-DD) in the anthology's time zone; the caller says which day today is there.
 */
import { Temporal } from "temporal-polyfill";
import { copiesWithin, finishingTime, type FinishingStep } from "@/lib/print/finishing";

export const EVENT_KINDS = ["fair", "launch", "mail-out", "reading", "other"] as const;
export type EventKind = (typeof EVENT_KINDS)[number];
export const EVENT_KIND_LABELS: Record<EventKind, string> = {
  fair: "Fair",
  launch: "Launch",
  "mail-out": "Mail-out",
  reading: "Reading",
  other: "Other",
};

export const PRINT_MODES = ["all-at-once", "per-batch"] as const;
export type PrintMode = (typeof PRINT_MODES)[number];
export const PRINT_MODE_LABELS: Record<PrintMode, string> = {
  "all-at-once": "Print all sheets at once, finish in batches",
  "per-batch": "Print and finish each batch in turn",
};

export interface RunEvent {
  id: number;
  name: string;
  kind: EventKind;
  /** YYYY-MM-DD in the anthology's zone. */
  date: string;
  copies: number;
}

export interface PlannedBatch {
  index: number;
  eventId: number;
  label: string;
  due: string;
  copies: number;
  minutes: number;
  /** Finishing minutes the finishers have from today until the due day, for all batches so far. */
  availableMinutes: number;
  /** Minutes all batches up to and including this one need. */
  cumulativeMinutes: number;
  /** Copies of this batch that the time left cannot finish (0 when it fits). */
  shortfallCopies: number;
}

export interface BatchSchedule {
  batches: PlannedBatch[];
  totalCopies: number;
  totalMinutes: number;
  warnings: string[];
}

/** Whole days from one calendar day to another (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  return Temporal.PlainDate.from(from).until(Temporal.PlainDate.from(to), { largestUnit: "days" })
    .days;
}

/** Today's calendar day in a zone, as YYYY-MM-DD. */
export function todayIn(zone: string, now: Date = new Date()): string {
  return Temporal.Instant.fromEpochMilliseconds(now.getTime())
    .toZonedDateTimeISO(zone)
    .toPlainDate()
    .toString();
}

/** Adds days to a calendar day. */
export function addDays(day: string, days: number): string {
  return Temporal.PlainDate.from(day).add({ days }).toString();
}

/** Minutes of finishing time between today and the start of `day`: hours per week spread evenly over the days, rounded down. */
export function minutesUntil(today: string, day: string, minutesPerWeek: number): number {
  const days = Math.max(0, daysBetween(today, day));
  return Math.floor((minutesPerWeek * days) / 7);
}

function hours(minutes: number): string {
  const h = Math.round((minutes / 60) * 10) / 10;
  return `${h} ${h === 1 ? "hour" : "hours"}`;
}

/** One batch per event, in date order (ties by id), each warned about when the time before its day is too short. */
export function scheduleBatches(input: {
  today: string;
  events: readonly RunEvent[];
  minutesPerWeek: number;
  steps: readonly FinishingStep[];
  sheetsPerCopy: number;
  formatDay?: (day: string) => string;
}): BatchSchedule {
  const fmt = input.formatDay ?? ((d: string) => d);
  const events = [...input.events].sort((a, b) => a.date.localeCompare(b.date) || a.id - b.id);
  const warnings: string[] = [];
  let used = 0;
  const batches = events.map((event, i): PlannedBatch => {
    const minutes = finishingTime(input.steps, event.copies, input.sheetsPerCopy).totalMinutes;
    const available = minutesUntil(input.today, event.date, input.minutesPerWeek);
    const left = Math.max(0, available - used);
    const fits = Math.min(event.copies, copiesWithin(input.steps, left, input.sheetsPerCopy));
    used += minutes;
    const shortfall = event.copies - fits;
    if (daysBetween(input.today, event.date) < 0)
      warnings.push(`${event.name} on ${fmt(event.date)} is already past.`);
    else if (shortfall > 0)
      warnings.push(
        `Batch ${i + 1} for ${event.name} on ${fmt(event.date)} cannot be finished in time: it needs ${hours(minutes)} and ${hours(left)} are left before then, enough for ${fits} of ${event.copies} copies.`,
      );
    return {
      index: i + 1,
      eventId: event.id,
      label: `For ${event.name}`,
      due: event.date,
      copies: event.copies,
      minutes,
      availableMinutes: available,
      cumulativeMinutes: used,
      shortfallCopies: shortfall,
    };
  });
  return {
    batches,
    totalCopies: batches.reduce((n, b) => n + b.copies, 0),
    totalMinutes: used,
    warnings,
  };
}

/** The day by which files must go to a shop to collect copies before an event. */
export function orderByDay(eventDay: string, turnaroundDays: number): string {
  return addDays(eventDay, -turnaroundDays);
}
