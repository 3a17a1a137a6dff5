import { describe, expect, it } from "vitest";
import { formatDate, formatDateTime, zoneLabel } from "@/lib/dates";

// Summer time in the EU runs from the last Sunday of March to the last Sunday of October
// (Directive 2000/84/EC): Lisbon is UTC+1 in August and UTC+0 in January.
// 3 August 2025 is a Sunday (Gregorian calendar).
const august = new Date("2025-08-03T16:00:00Z");

describe("formatDateTime", () => {
  it("writes a moment in the zone it was written in, the zone named once", () => {
    expect(formatDateTime(august, "Europe/Lisbon")).toBe(
      "Sunday 3 August 2025, 17:00 (Europe/Lisbon, UTC+1)",
    );
  });

  it("names UTC once, under any of its names", () => {
    expect(formatDateTime(august, "UTC")).toBe("Sunday 3 August 2025, 16:00 (UTC)");
    expect(formatDateTime(august, "Etc/UTC")).toBe("Sunday 3 August 2025, 16:00 (UTC)");
    expect(formatDateTime(august)).toBe("Sunday 3 August 2025, 16:00 (UTC)");
  });

  it("keeps a zone that sits on UTC for part of the year by its name", () => {
    // Lisbon in winter is on UTC+0 (WET) but is still Lisbon.
    expect(formatDateTime(new Date("2025-01-15T09:30:00Z"), "Europe/Lisbon")).toBe(
      "Wednesday 15 January 2025, 09:30 (Europe/Lisbon, UTC)",
    );
  });
});

describe("zoneLabel", () => {
  it("gives the zone and its offset, or UTC alone", () => {
    // India Standard Time is UTC+5:30 all year (no daylight saving).
    expect(zoneLabel(august, "Asia/Kolkata")).toBe("Asia/Kolkata, UTC+5:30");
    expect(zoneLabel(august, "UTC")).toBe("UTC");
    expect(zoneLabel(august, "GMT")).toBe("UTC");
    expect(zoneLabel(august, "UTC")).not.toContain("UTC, UTC");
  });
});

describe("formatDate", () => {
  it("writes the day alone, day month year", () => {
    expect(formatDate(august, "Europe/Lisbon")).toBe("3 August 2025");
  });

  it("takes the day in the zone, not in UTC", () => {
    // New Zealand summer time is UTC+13: 23:30 UTC on 31 December is already 1 January there.
    const newYear = new Date("2025-12-31T23:30:00Z");
    expect(formatDate(newYear, "Pacific/Auckland")).toBe("1 January 2026");
    expect(formatDate(newYear)).toBe("31 December 2025");
  });
});
