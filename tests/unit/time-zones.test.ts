import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
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

// America/New_York keeps UTC−5 (EST) and UTC−4 (EDT) in summer: DST starts at 02:00 local on the
// second Sunday of March and ends at 02:00 local on the first Sunday of November (US Energy Policy
// Act of 2005, §110, amending 15 U.S.C. 260a; IANA tz database, file "northamerica",
// Rule US 2007 max: "Mar Sun>=8 2:00" and "Nov Sun>=1 2:00"). In 2026 those are 8 March and 1 November.
describe("America/New_York", () => {
  it("refuses the spring-forward gap 02:00–02:59 on 8 March 2026 and keeps the minutes around it", () => {
    for (const local of ["2026-03-08T02:00", "2026-03-08T02:30", "2026-03-08T02:59"])
      expect(zonedToUtc(local, "America/New_York")).toEqual({ ok: false, reason: "skipped" });
    expect(instantOf("2026-03-08T01:59", "America/New_York")).toEqual({
      ok: true,
      instant: new Date("2026-03-08T06:59:00.000Z"),
      ambiguous: false,
    });
    expect(instantOf("2026-03-08T03:00", "America/New_York")).toEqual({
      ok: true,
      instant: new Date("2026-03-08T07:00:00.000Z"),
      ambiguous: false,
    });
  });

  it("reads the fall-back overlap 01:00–01:59 on 1 November 2026 as the earlier, EDT, instant", () => {
    const first = instantOf("2026-11-01T01:30", "America/New_York");
    expect(first.ambiguous).toBe(true);
    expect(first.instant.toISOString()).toBe("2026-11-01T05:30:00.000Z");
    // The same wall time an hour later (EST) shows the same clock: that is the overlap.
    expect(utcToZonedLocal(new Date("2026-11-01T06:30:00Z"), "America/New_York")).toBe(
      "2026-11-01T01:30",
    );
    expect(instantOf("2026-11-01T00:59", "America/New_York")).toEqual({
      ok: true,
      instant: new Date("2026-11-01T04:59:00.000Z"),
      ambiguous: false,
    });
    expect(instantOf("2026-11-01T02:00", "America/New_York")).toEqual({
      ok: true,
      instant: new Date("2026-11-01T07:00:00.000Z"),
      ambiguous: false,
    });
  });
});

// Pacific/Apia kept UTC+13 and UTC+14 in summer until 2021; summer time ended at 04:00 local on
// the first Sunday of April, 5 April 2020, when clocks went back to 03:00 (IANA tz database, file
// "australasia", Rule WS "Apr Sun>=1 4:00" and Zone Pacific/Apia "13:00 WS +13/+14").
// A zone more than 12 hours ahead of UTC at a change of clocks.
describe("Pacific/Apia", () => {
  it("finds 02:00 on 5 April 2020 at UTC+14 and reads 03:30, which happens twice, as the first", () => {
    expect(instantOf("2020-04-05T02:00", "Pacific/Apia")).toEqual({
      ok: true,
      instant: new Date("2020-04-04T12:00:00.000Z"),
      ambiguous: false,
    });
    const repeated = instantOf("2020-04-05T03:30", "Pacific/Apia");
    expect(repeated.ambiguous).toBe(true);
    expect(repeated.instant.toISOString()).toBe("2020-04-04T13:30:00.000Z");
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

  it("labels a zone's offset from UTC", () => {
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

  it("reads any wall-clock minute on a change-of-clocks night as an instant showing it, or refuses it only where clocks jump", () => {
    const zones = ["Europe/Lisbon", "America/New_York", "Australia/Lord_Howe", "Pacific/Apia"];
    const pad = (n: number) => String(n).padStart(2, "0");
    fc.assert(
      fc.property(
        fc.integer({ min: 2000, max: 2039 }),
        fc.constantFrom(3, 4, 9, 10, 11),
        fc.integer({ min: 0, max: 4 }),
        fc.integer({ min: 0, max: 4 * 60 - 1 }),
        fc.constantFrom(...zones),
        (year, month, sunday, minuteOfNight, zone) => {
          // The first to fifth Sunday of the month (the fifth falls back to the fourth if missing),
          // where the zones in this list change their clocks, between 00:00 and 03:59.
          const firstSunday = 1 + ((7 - new Date(Date.UTC(year, month - 1, 1)).getUTCDay()) % 7);
          const daysInMonth = new Date(Date.UTC(year, month, 0)).getUTCDate();
          let day = firstSunday + 7 * sunday;
          if (day > daysInMonth) day -= 7;
          const local = `${year}-${pad(month)}-${pad(day)}T${pad(Math.floor(minuteOfNight / 60))}:${pad(minuteOfNight % 60)}`;
          const wallAsUtc = Date.UTC(
            year,
            month - 1,
            day,
            Math.floor(minuteOfNight / 60),
            minuteOfNight % 60,
          );
          const result = zonedToUtc(local, zone);
          if (result.ok) expect(utcToZonedLocal(result.instant, zone)).toBe(local);
          else {
            expect(result.reason).toBe("skipped");
            // A gap lies where the offset changes: a day either side shows different offsets.
            expect(zoneOffsetMinutes(new Date(wallAsUtc - 86_400_000), zone)).not.toBe(
              zoneOffsetMinutes(new Date(wallAsUtc + 86_400_000), zone),
            );
          }
        },
      ),
      { numRuns: 500 },
    );
  });
});
