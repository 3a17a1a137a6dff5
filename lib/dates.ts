/**
 * How Quireline writes dates and times for people; the one place they are formatted. Pure; runs
 * in the browser and on the server alike, so a client table and a server page agree.
 *
 * Two forms, one per context:
 * - a day (an invitation's expiry, a call's closing day in a list): "3 August 2025";
 * - a moment (a call's opening and closing, a status change, a note, an upload):
 *   "Sunday 3 August 2025, 17:00 (Europe/Lisbon, UTC+1)", always with its zone named once.
 * Day-month-year with the month in words cannot be misread across countries (3/8 or 8/3);
 * 24-hour time needs no am/pm. Common practice, no source.
 * Call times are shown in the call's own zone; records (uploads, notes, status changes) in UTC.
 */
import { offsetLabel, utcToZonedLocal } from "@/lib/time-zones";

/** The zone records are shown in: the server and the database run in UTC. */
export const RECORD_ZONE = "UTC";

/** Named parts of an instant's date in a zone, read from Intl so ICU punctuation does not leak in. */
function dateWords(instant: Date, zone: string) {
  const parts: Record<string, string> = {};
  const formatter = new Intl.DateTimeFormat("en-GB", {
    timeZone: zone,
    weekday: "long",
    day: "numeric",
    month: "long",
    year: "numeric",
  });
  for (const part of formatter.formatToParts(instant))
    if (part.type !== "literal") parts[part.type] = part.value;
  return {
    weekday: parts.weekday ?? "",
    day: parts.day ?? "",
    month: parts.month ?? "",
    year: parts.year ?? "",
  };
}

/** True for UTC under any of its names ("UTC", "Etc/UTC", "GMT", "Zulu"…), as Intl resolves them. */
function isUtcZone(zone: string): boolean {
  try {
    return (
      new Intl.DateTimeFormat("en-US", { timeZone: zone }).resolvedOptions().timeZone === "UTC"
    );
  } catch {
    return false;
  }
}

/**
 * The zone named once: "Europe/Lisbon, UTC+1" for a named zone, plain "UTC" for UTC itself
 * (never "UTC, UTC").
 */
export function zoneLabel(instant: Date, zone: string): string {
  const offset = offsetLabel(instant, zone);
  if (isUtcZone(zone) || zone === offset) return offset;
  return `${zone}, ${offset}`;
}

/** A day in a zone: "3 August 2025". */
export function formatDate(instant: Date, zone: string = RECORD_ZONE): string {
  const d = dateWords(instant, zone);
  return `${d.day} ${d.month} ${d.year}`;
}

/** A moment in a zone: "Sunday 3 August 2025, 17:00 (Europe/Lisbon, UTC+1)"; "… (UTC)" in UTC. */
export function formatDateTime(instant: Date, zone: string = RECORD_ZONE): string {
  const d = dateWords(instant, zone);
  const time = utcToZonedLocal(instant, zone).slice(11, 16);
  return `${d.weekday} ${d.day} ${d.month} ${d.year}, ${time} (${zoneLabel(instant, zone)})`;
}
