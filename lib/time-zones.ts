/**
 * Wall-clock times in an IANA time zone and the UTC instants they name. Pure; runs in the
 * browser and on the server alike. Conversions go through Temporal (`temporal-polyfill`, which
 * reads the tz database through the built-in Intl API); zone names and words come from Intl.
 * Calls store UTC instants plus the zone the editor wrote them in, and are shown in that zone
 * (the words for people are written by lib/dates.ts).
 *
 * One rule at a change of clocks (the zone's own DST rule, as the tz database records it):
 * - a wall-clock time the clocks skip when they go forward names no instant and is refused
 *   ("skipped"), as Temporal's `disambiguation: "reject"` would;
 * - a wall-clock time that happens twice when they go back names the earlier instant (the one
 *   still on the old offset, summer time at the end of DST), as Temporal's
 *   `disambiguation: "earlier"` picks, marked `ambiguous`.
 */
import { Temporal } from "temporal-polyfill";

/** A wall-clock time as a `datetime-local` input gives it: "2025-07-01T12:00" (seconds optional). */
export const LOCAL_DATE_TIME = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2}))?$/;

/** True when the built-in tz database knows this zone name (e.g. "Europe/Lisbon", "UTC"). */
export function isValidTimeZone(zone: string): boolean {
  if (!zone || zone.length > 64) return false;
  try {
    new Intl.DateTimeFormat("en-US", { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

/** Every zone the runtime knows, plus UTC, sorted; for the zone picker. */
export function allTimeZones(): string[] {
  const zones =
    typeof Intl.supportedValuesOf === "function" ? Intl.supportedValuesOf("timeZone") : [];
  return Array.from(new Set(["UTC", ...zones])).sort((a, b) => a.localeCompare(b));
}

/** Zones grouped by their region ("Europe", "America", …), regions in order, UTC on its own first. */
export function timeZonesByRegion(
  zones: readonly string[] = allTimeZones(),
): { region: string; zones: string[] }[] {
  const groups = new Map<string, string[]>();
  for (const zone of zones) {
    const region = zone.includes("/") ? zone.slice(0, zone.indexOf("/")) : "Other";
    (groups.get(region) ?? groups.set(region, []).get(region)!).push(zone);
  }
  return [...groups.entries()]
    .sort(([a], [b]) => (a === "Other" ? -1 : b === "Other" ? 1 : a.localeCompare(b)))
    .map(([region, list]) => ({
      region: region === "Other" ? "UTC and others" : region,
      zones: list,
    }));
}

/** The zone's clock at an instant. */
function zoned(instant: Date, zone: string): Temporal.ZonedDateTime {
  return Temporal.Instant.fromEpochMilliseconds(instant.getTime()).toZonedDateTimeISO(zone);
}

/** How far the zone's wall clock is ahead of UTC at an instant, in minutes (Lisbon in July: 60). */
export function zoneOffsetMinutes(instant: Date, zone: string): number {
  return Math.round(zoned(instant, zone).offsetNanoseconds / 60e9);
}

export type ZonedToUtc =
  | {
      ok: true;
      instant: Date;
      /** the wall time occurs twice (clocks went back); the earlier one was taken */ ambiguous: boolean;
    }
  | { ok: false; reason: "bad-format" | "bad-zone" | "skipped" };

/**
 * The UTC instant a wall-clock time in `zone` names. A time the clocks skip when they go forward
 * does not exist and is refused ("skipped"); a time that happens twice when they go back is read
 * as the first one.
 */
export function zonedToUtc(local: string, zone: string): ZonedToUtc {
  const match = LOCAL_DATE_TIME.exec(local);
  if (!match) return { ok: false, reason: "bad-format" };
  if (!isValidTimeZone(zone)) return { ok: false, reason: "bad-zone" };
  const [year, month, day, hour, minute, second] = match.slice(1).map((v) => Number(v ?? 0)) as [
    number,
    number,
    number,
    number,
    number,
    number,
  ];
  let wall: Temporal.PlainDateTime;
  try {
    wall = Temporal.PlainDateTime.from(
      { year, month, day, hour, minute, second },
      { overflow: "reject" },
    );
  } catch {
    return { ok: false, reason: "bad-format" };
  }
  // In a gap no instant shows this wall time, so even the earlier reading lands on another one;
  // in an overlap the earlier and later readings are two instants that both show it.
  const earlier = wall.toZonedDateTime(zone, { disambiguation: "earlier" });
  if (!earlier.toPlainDateTime().equals(wall)) return { ok: false, reason: "skipped" };
  const later = wall.toZonedDateTime(zone, { disambiguation: "later" });
  return {
    ok: true,
    instant: new Date(earlier.epochMilliseconds),
    ambiguous: later.epochMilliseconds !== earlier.epochMilliseconds,
  };
}

/** The wall-clock time of an instant in `zone`, in the `datetime-local` form "2025-07-01T12:00". */
export function utcToZonedLocal(instant: Date, zone: string): string {
  const w = zoned(instant, zone);
  const pad = (n: number, width = 2) => String(n).padStart(width, "0");
  return `${pad(w.year, 4)}-${pad(w.month)}-${pad(w.day)}T${pad(w.hour)}:${pad(w.minute)}`;
}

/** "UTC+1", "UTC−3:30" or "UTC" for a zone at an instant. */
export function offsetLabel(instant: Date, zone: string): string {
  const minutes = zoneOffsetMinutes(instant, zone);
  if (minutes === 0) return "UTC";
  const sign = minutes > 0 ? "+" : "−";
  const abs = Math.abs(minutes);
  const hours = Math.floor(abs / 60);
  const rest = abs % 60;
  return `UTC${sign}${hours}${rest ? `:${String(rest).padStart(2, "0")}` : ""}`;
}
