import { describe, expect, it } from "vitest";
import { daysBetween, minutesUntil, orderByDay, scheduleBatches, todayIn } from "@/lib/run/batches";
import { finishingChecklist, SAFETY_DEFERRAL, timedSteps } from "@/lib/run/checklist";
import { movementOf, movementRefusal, stockCounts, type Movement } from "@/lib/run/stock";
import {
  parseQuantities,
  pricesSchema,
  runEventSchema,
  shopQuoteSchema,
  stockMovementSchema,
} from "@/lib/validations/run";

// Finishing takes 5 + 2q minutes for q copies (5 min set-up, 2 min a copy), as in plan.test.ts.
const steps = [
  { id: "fold", label: "Fold", setupMinutes: 0, minutesPerCopy: 1.5 },
  { id: "staple", label: "Staple", setupMinutes: 5, minutesPerCopy: 0.5 },
];

describe("batches timed to events", () => {
  it("days and minutes between calendar days (ISO 8601 calendar, Temporal.PlainDate)", () => {
    expect(daysBetween("2026-12-02", "2026-12-09")).toBe(7);
    expect(daysBetween("2026-12-30", "2027-01-06")).toBe(7); // across the year end
    expect(daysBetween("2028-02-28", "2028-03-01")).toBe(2); // 2028 is a leap year
    // 2 hours a week for 7 days: 120 minutes; for 10 days ⌊120 × 10 / 7⌋ = 171.
    expect(minutesUntil("2026-12-02", "2026-12-09", 120)).toBe(120);
    expect(minutesUntil("2026-12-02", "2026-12-12", 120)).toBe(171);
    expect(orderByDay("2026-12-16", 10)).toBe("2026-12-06");
  });

  it("today in the anthology's zone: 23:30 UTC on 1 December is already 2 December in Auckland", () => {
    const now = new Date("2026-12-01T23:30:00Z");
    expect(todayIn("UTC", now)).toBe("2026-12-01");
    expect(todayIn("Pacific/Auckland", now)).toBe("2026-12-02");
  });

  it("worked by hand: three events, the last cannot be finished in time", () => {
    // Today 2026-12-02, 2 hours (120 min) a week.
    // Mail-out 12-09, 30 copies: 7 days → 120 min available; needs 5 + 60 = 65. Used 65.
    // Launch 12-16, 40 copies: 14 days → 240; 175 left; needs 85 (85 copies would fit). Used 150.
    // Fair 2027-01-06, 300 copies: 35 days → 600; 450 left; needs 605 → ⌊(450 − 5) / 2⌋ = 222 fit,
    //   78 short.
    const plan = scheduleBatches({
      today: "2026-12-02",
      minutesPerWeek: 120,
      steps,
      sheetsPerCopy: 6,
      events: [
        { id: 3, name: "Saltmarsh Fair", kind: "fair", date: "2027-01-06", copies: 300 },
        { id: 1, name: "the launch", kind: "launch", date: "2026-12-16", copies: 40 },
        { id: 2, name: "the mail-out", kind: "mail-out", date: "2026-12-09", copies: 30 },
      ],
    });
    expect(
      plan.batches.map((b) => [b.eventId, b.minutes, b.availableMinutes, b.shortfallCopies]),
    ).toEqual([
      [2, 65, 120, 0],
      [1, 85, 240, 0],
      [3, 605, 600, 78],
    ]);
    expect(plan.totalCopies).toBe(370);
    expect(plan.warnings).toEqual([
      "Batch 3 for Saltmarsh Fair on 2027-01-06 cannot be finished in time: it needs 10.1 hours and 7.5 hours are left before then, enough for 222 of 300 copies.",
    ]);
  });
});

describe("finishing checklist from the spec", () => {
  const almanac = {
    binding: "saddle-stitch" as const,
    laidOutPages: 24,
    sheetsPerCopy: 6,
    trimWidthMm: 139.7,
    trimHeightMm: 215.9,
    bleedMm: 3.175,
    paperGsm: 90,
    paperCaliperMm: 0.11,
    coverStock: "separate" as const,
    coverPaperGsm: 216,
  };

  it("a 216 g/m² cover is scored (Condat: score from 150 g/m²), 6 sheets are collated and stapled, creep asks for a fore-edge trim", () => {
    const list = finishingChecklist(almanac);
    expect(list.map((s) => s.id)).toEqual([
      "trim-sheets",
      "score-cover",
      "fold",
      "collate",
      "staple",
      "trim-fore-edge",
    ]);
    const staple = list.find((s) => s.id === "staple")!;
    expect(staple.detail).toContain("2 staples");
    expect(staple.detail).toContain("139.7 mm from the sheet's edge");
    expect(staple.detail).toContain("long-reach");
    // Linear creep: 4 text sheets of 0.11 outside the cover's 216 / 750 = 0.288 mm → 0.288 + 4 × 0.11 = 0.728 mm.
    expect(list.find((s) => s.id === "trim-fore-edge")!.detail).toContain("0.73 mm");
    for (const step of list) expect(step.cautions.length).toBeGreaterThan(0);
    expect(SAFETY_DEFERRAL).toContain("workshop's own rules");
  });

  it("a light self-cover fold-only sheet without bleed is only folded", () => {
    const list = finishingChecklist({
      ...almanac,
      binding: "fold-only",
      laidOutPages: 4,
      sheetsPerCopy: 1,
      bleedMm: 0,
      coverStock: "self",
      coverPaperGsm: null,
    });
    expect(list.map((s) => s.id)).toEqual(["fold"]);
  });

  it("untimed steps take no minutes", () => {
    const timed = timedSteps(finishingChecklist(almanac), {
      fold: { setupMinutes: 2, minutesPerCopy: 1 },
    });
    expect(timed.find((s) => s.id === "fold")).toMatchObject({
      setupMinutes: 2,
      minutesPerCopy: 1,
    });
    expect(timed.find((s) => s.id === "collate")).toMatchObject({
      setupMinutes: 0,
      minutesPerCopy: 0,
    });
  });
});

describe("stock as sums of movements", () => {
  const history: Movement[] = [
    movementOf({ kind: "printed", batchId: 1, quantity: 40 }),
    movementOf({ kind: "finished", batchId: 1, quantity: 30 }),
    movementOf({ kind: "sold", batchId: null, quantity: 12 }),
    movementOf({ kind: "contributor-copy", batchId: null, quantity: 3 }),
    movementOf({ kind: "correction", batchId: null, quantity: -1, target: "copies" }),
  ];

  it("40 sets printed, 30 finished, 12 sold, 3 given, 1 corrected away → 10 sets and 14 copies", () => {
    expect(stockCounts(history)).toEqual({ copiesOnHand: 14, sheetSetsByBatch: { 1: 10 } });
  });

  it("counts never go negative", () => {
    const counts = stockCounts(history);
    expect(movementRefusal(counts, movementOf({ kind: "sold", batchId: null, quantity: 15 }))).toBe(
      "There are 14 finished copies on hand; 15 cannot come out.",
    );
    expect(
      movementRefusal(counts, movementOf({ kind: "finished", batchId: 1, quantity: 11 })),
    ).toContain("printed sheets for 10 copies");
    expect(
      movementRefusal(counts, movementOf({ kind: "finished", batchId: 2, quantity: 1 })),
    ).not.toBeNull();
    expect(
      movementRefusal(counts, movementOf({ kind: "spare", batchId: null, quantity: 14 })),
    ).toBeNull();
  });
});

describe("bad input gets a field message", () => {
  it("negative prices", () => {
    const bad = pricesSchema.safeParse({
      insidePaper: { priceCents: -1, perQuantity: 500 },
      coverPaper: { priceCents: 0, perQuantity: 100 },
      copyShopSide: { priceCents: 8, perQuantity: 1 },
      inkPass: { priceCents: 50, perQuantity: 100 },
      master: { priceCents: 200, perQuantity: 1 },
      staples: { priceCents: 500, perQuantity: 0 },
      finishingCentsPerHour: 0,
      spoilageBasisPoints: 500,
    });
    expect(bad.success).toBe(false);
    const paths = bad.error!.issues.map((i) => [i.path.join("."), i.message]);
    expect(paths).toEqual([
      ["insidePaper.priceCents", "Text paper cannot be negative"],
      ["staples.perQuantity", "Staples: a pack holds at least 1"],
    ]);
  });

  it("tiers out of order", () => {
    const bad = shopQuoteSchema.safeParse({
      shopName: "Gullrock Printworks",
      turnaroundDays: 7,
      tiers: [
        { copies: 100, totalCents: 20_000 },
        { copies: 50, totalCents: 12_000 },
      ],
    });
    expect(bad.error?.issues.map((i) => [i.path.join("."), i.message])).toEqual([
      ["tiers.1.copies", "Tiers go up in copies: this one must be more than 100"],
    ]);
  });

  it("an event in the past", () => {
    const schema = runEventSchema("2026-12-02");
    const past = schema.safeParse({
      name: "Winter fair",
      kind: "fair",
      date: "2026-12-01",
      copies: 5,
    });
    expect(past.error?.issues[0]?.message).toBe("That day is in the past (today is 2026-12-02)");
    expect(
      schema.safeParse({ name: "Winter fair", kind: "fair", date: "2026-12-02", copies: 5 })
        .success,
    ).toBe(true);
    expect(
      schema.safeParse({ name: "Winter fair", kind: "fair", date: "2026-02-30", copies: 5 })
        .success,
    ).toBe(false);
  });

  it("a correction needs a reason; quantities parse from a list", () => {
    const bad = stockMovementSchema.safeParse({
      kind: "correction",
      batchId: null,
      quantity: -2,
      target: "copies",
    });
    expect(bad.error?.issues.map((i) => i.path.join("."))).toEqual(["reason"]);
    expect(parseQuantities("10, 25 50;100")).toEqual([10, 25, 50, 100]);
    expect(parseQuantities("10, -5")).toBeUndefined();
  });
});

describe("prices belong to the collective", () => {
  it("one press name however it is spaced or cased; an anthology without one keeps its lead's lists", async () => {
    const { pressKeyOf } = await import("@/lib/run/press");
    expect(pressKeyOf({ pressName: "Marrowbend Print Collective", createdBy: "u1" })).toBe(
      pressKeyOf({ pressName: "  marrowbend  print collective ", createdBy: "u2" }),
    );
    expect(pressKeyOf({ pressName: null, createdBy: "u1" })).toBe("lead:u1");
    expect(pressKeyOf({ pressName: "  ", createdBy: "u1" })).toBe("lead:u1");
  });
});
