import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  formatInZone,
  isValidTimeZone,
  offsetLabel,
  timeZonesByRegion,
  utcToZonedLocal,
  zonedToUtc,
  zoneOffsetMinutes,
} from "@/lib/time-zones";

const instantOf = (local: string, zone: string) => {
  const result = zonedToUtc(local, zone);
  if (!result.ok) throw new Error(`${local} in ${zone}: ${result.reason}`);
  return result;
};

// Europe/Lisbon keeps UTC in winter and UTC+1 in summer; summer time runs from 01:00 UTC on the
// last Sunday of March to 01:00 UTC on the last Sunday of October (EU Directive 2000/84/EC,
// Articles 2 and 3; IANA tz database, file "europe", Zone Europe/Lisbon).
describe("Europe/Lisbon", () => {
  it("is UTC in January and UTC+1 in July", () => {
    expect(instantOf("2025-01-15T12:00", "Europe/Lisbon").instant.toISOString()).toBe(
      "2025-01-15T12:00:00.000Z",
    );
    expect(instantOf("2025-07-01T12:00", "Europe/Lisbon").instant.toISOString()).toBe(
      "2025-07-01T11:00:00.000Z",
    );
    expect(zoneOffsetMinutes(new Date("2025-07-01T11:00:00Z"), "Europe/Lisbon")).toBe(60);
  });

  it("refuses 01:30 on 30 March 2025, which the clocks skip", () => {
    expect(zonedToUtc("2025-03-30T01:30", "Europe/Lisbon")).toEqual({
      ok: false,
      reason: "skipped",
    });
    expect(instantOf("2025-03-30T02:00", "Europe/Lisbon").instant.toISOString()).toBe(
      "2025-03-30T01:00:00.000Z",
    );
  });

  it("reads 01:30 on 26 October 2025, which happens twice, as the first one", () => {
    const result = instantOf("2025-10-26T01:30", "Europe/Lisbon");
    expect(result.ambiguous).toBe(true);
    expect(result.instant.toISOString()).toBe("2025-10-26T00:30:00.000Z");
  });
});

// America/Halifax keeps UTC−4 (Atlantic Standard Time) and UTC−3 in summer, from 02:00 local on the
// second Sunday of March to 02:00 local on the first Sunday of November (IANA tz database, file
// "northamerica", Rule Canada from 2007).
describe("America/Halifax", () => {
  it("is UTC−4 in January and UTC−3 in July", () => {
    expect(instantOf("2025-01-15T12:00", "America/Halifax").instant.toISOString()).toBe(
      "2025-01-15T16:00:00.000Z",
    );
    expect(instantOf("2025-07-01T12:00", "America/Halifax").instant.toISOString()).toBe(
      "2025-07-01T15:00:00.000Z",
    );
    expect(offsetLabel(new Date("2025-07-01T15:00:00Z"), "America/Halifax")).toBe("UTC−3");
  });

  it("skips 02:30 on 9 March 2025 and repeats 01:30 on 2 November 2025", () => {
    expect(zonedToUtc("2025-03-09T02:30", "America/Halifax")).toEqual({
      ok: false,
      reason: "skipped",
    });
    const repeated = instantOf("2025-11-02T01:30", "America/Halifax");
    expect(repeated.ambiguous).toBe(true);
    expect(repeated.instant.toISOString()).toBe("2025-11-02T04:30:00.000Z");
  });
});

describe("zone names and formats", () => {
  it("knows real zones and refuses made-up ones", () => {
    expect(isValidTimeZone("Europe/Lisbon")).toBe(true);
    expect(isValidTimeZone("UTC")).toBe(true);
    expect(isValidTimeZone("Atlantis/Lanternfield")).toBe(false);
    expect(isValidTimeZone("")).toBe(false);
  });

  it("refuses dates that do not exist and text that is not a date", () => {
    expect(zonedToUtc("2025-02-30T10:00", "UTC")).toEqual({ ok: false, reason: "bad-format" });
    expect(zonedToUtc("next Tuesday", "UTC")).toEqual({ ok: false, reason: "bad-format" });
    expect(zonedToUtc("2025-02-10T10:00", "Nowhere/Else")).toEqual({
      ok: false,
      reason: "bad-zone",
    });
  });

  it("formats an instant in the zone it was written in", () => {
    expect(formatInZone(new Date("2025-08-03T16:00:00Z"), "Europe/Lisbon")).toBe(
      "Sunday 3 August 2025, 17:00 (Europe/Lisbon, UTC+1)",
    );
    expect(offsetLabel(new Date("2025-01-01T00:00:00Z"), "Asia/Kolkata")).toBe("UTC+5:30");
  });

  it("groups zones by region with UTC first", () => {
    const groups = timeZonesByRegion(["Europe/Lisbon", "UTC", "America/Halifax", "Europe/Oslo"]);
    expect(groups.map((g) => g.region)).toEqual(["UTC and others", "America", "Europe"]);
    expect(groups[2]?.zones).toEqual(["Europe/Lisbon", "Europe/Oslo"]);
  });

  it("turns any minute back into the same wall-clock time (round trip)", () => {
    const zones = [
      "Europe/Lisbon",
      "America/Halifax",
      "Asia/Kolkata",
      "Australia/Lord_Howe",
      "UTC",
    ];
    fc.assert(
      fc.property(
        fc.integer({ min: Date.UTC(2000, 0, 1), max: Date.UTC(2040, 0, 1) }),
        fc.constantFrom(...zones),
        (ms, zone) => {
          const local = utcToZonedLocal(new Date(ms), zone);
          const back = zonedToUtc(local, zone);
          expect(back.ok).toBe(true);
          if (back.ok) expect(utcToZonedLocal(back.instant, zone)).toBe(local);
        },
      ),
      { numRuns: 300 },
    );
  });
});
