import { describe, expect, it } from "vitest";
import {
  breakEven,
  compareWithShop,
  costTable,
  runCost,
  shopPrice,
  type HomeRunInputs,
} from "@/lib/print/costs";
import {
  copiesWithin,
  finishingTime,
  planBatches,
  standardFinishingSteps,
} from "@/lib/print/finishing";
import { planSaddleStitch } from "@/lib/print/imposition";
import { planInkPasses } from "@/lib/print/passes";

// Prices are invented for the examples; every expected figure is worked by hand in the comment beside it.
const steps = [
  { id: "fold", label: "Fold", minutesPerCopy: 0.5 },
  { id: "collate", label: "Collate", minutesPerSheet: 0.1 },
  { id: "staple", label: "Staple", minutesPerCopy: 0.25 },
  { id: "trim-fore-edge", label: "Trim the fore-edge", setupMinutes: 5, minutesPerCopy: 0.2 },
];

// 16-page half-letter on letter, self cover: 4 sheets, 8 sides a copy (a sheet folded once carries 4 pages,
// Jack Lynch, Guide to Literary and Rhetorical Terms, "sheet", andromeda.rutgers.edu/~jlynch/Terms/sheet.html)
const plan = planSaddleStitch({ contentPages: 16, cover: "self" });
const laser: HomeRunInputs = {
  insideSheetsPerCopy: plan.textSheetsPerCopy,
  coverSheetsPerCopy: plan.coverSheetsPerCopy,
  printedSidesPerCopy: plan.sidesPerCopy,
  insidePaper: { priceCents: 900, perQuantity: 500 },
  perSide: { priceCents: 3, perQuantity: 1 },
  staples: { priceCents: 500, perQuantity: 5000 },
  staplesPerCopy: 2,
  spoilageRate: 0.05, // common practice, no source: a configured overs allowance
};

describe("run cost", () => {
  it("100 copies: 400 sheets (4 a copy) plus 5 % overs = 420", () => {
    const run = runCost(laser, 100);
    expect(run.insideSheets).toBe(420);
    // 420 × 900/500 = 756; 840 sides × 3 = 2520; 200 staples × 500/5000 = 20
    expect(run.lines.map((l) => [l.item, l.cents])).toEqual([
      ["inside-paper", 756],
      ["printed-sides", 2520],
      ["staples", 20],
    ]);
    expect(run.totalCents).toBe(3296);
    expect(run.perCopyCents).toBe(33); // 32.96 → 33
  });

  it("without overs the same run uses exactly 400 sheets", () => {
    expect(runCost({ ...laser, spoilageRate: 0 }, 100).insideSheets).toBe(400);
  });

  it("10 copies: 42 sheets → 76, 84 sides → 252, 20 staples → 2", () => {
    const run = runCost(laser, 10);
    expect(run.totalCents).toBe(76 + 252 + 2);
    expect(run.perCopyCents).toBe(33);
  });

  it("a table row per quantity, and the total is the sum of its lines", () => {
    const table = costTable(laser, [1, 5, 10, 25, 50, 100, 250]);
    expect(table.map((r) => r.copies)).toEqual([1, 5, 10, 25, 50, 100, 250]);
    for (const row of table)
      expect(row.totalCents).toBe(row.lines.reduce((n, l) => n + l.cents, 0));
  });

  it("duplicator: masters once per run, passes per copy, with a separate cover", () => {
    const booklet = planSaddleStitch({ contentPages: 8, cover: "separate" });
    const passes = planInkPasses({
      pages: 8,
      copies: 30,
      pieces: [
        { id: "cover", inks: ["black", "red"] },
        { id: "inside", inks: ["black"] },
      ],
      placements: [
        { page: 1, pieceId: "cover" },
        { page: 8, pieceId: "cover" },
        ...[2, 3, 4, 5, 6, 7].map((page) => ({ page, pieceId: "inside" })),
      ],
    });
    // sides: s1 front (8|1) black+red = 2, s1 back (2|7) 1, s2 front 1, s2 back 1 → 5 passes, 5 masters
    expect(passes.passesPerCopy).toBe(5);
    const run = runCost(
      {
        insideSheetsPerCopy: booklet.textSheetsPerCopy,
        coverSheetsPerCopy: booklet.coverSheetsPerCopy,
        passesPerCopy: passes.passesPerCopy,
        mastersPerRun: passes.mastersPerRun,
        insidePaper: { priceCents: 800, perQuantity: 500 },
        coverPaper: { priceCents: 1500, perQuantity: 100 },
        perPass: { priceCents: 1, perQuantity: 2 },
        perMaster: { priceCents: 150, perQuantity: 1 },
        staples: { priceCents: 500, perQuantity: 5000 },
        fixed: [{ label: "Red ink tube", cents: 2400 }],
      },
      30,
    );
    // inside 30 × 800/500 = 48; cover 30 × 1500/100 = 450; passes 150 × 1/2 = 75; masters 5 × 150 = 750;
    // staples 60 × 500/5000 = 6; fixed 2400 → 3729
    expect(run.totalCents).toBe(48 + 450 + 75 + 750 + 6 + 2400);
    expect(run.masters).toBe(5);
  });
});

describe("print shop comparison and break-even", () => {
  const quotes = [
    { copies: 25, totalCents: 2500 },
    { copies: 50, totalCents: 3500 },
    { copies: 100, totalCents: 5000 },
    { copies: 250, totalCents: 8750 },
  ];
  const withLabour: HomeRunInputs = { ...laser, labour: { steps, centsPerHour: 1200 } };

  it("shop price: minimum order below the first tier, tier rate above", () => {
    expect(shopPrice(quotes, 10)).toBe(2500);
    expect(shopPrice(quotes, 99)).toBe(6930); // 99 × 3500/50
    expect(shopPrice(quotes, 100)).toBe(5000);
    expect(shopPrice(quotes, 1000)).toBe(35000);
  });

  it("per-copy price falls steeply with quantity at the shop (common practice, no source)", () => {
    const perCopy = compareWithShop(laser, quotes, [25, 50, 100, 250]).map(
      (r) => r.shopPerCopyCents,
    );
    expect(perCopy).toEqual([100, 70, 50, 35]);
  });

  it("with finishing time at 12.00 an hour, home is cheaper up to 99 copies and the shop from 100", () => {
    // home(99): 416 sheets → 749; 832 sides → 2496; 198 staples → 20; 5 + 99 × 1.35 = 138.65 min → 2773; = 6038
    // home(100): 756 + 2520 + 20 + 140 min → 2800 = 6096; shop(100) = 5000
    const [at99, at100] = compareWithShop(withLabour, quotes, [99, 100]);
    expect(at99).toMatchObject({
      homeCents: 6038,
      shopCents: 6930,
      cheaper: "home",
      savingCents: 892,
    });
    expect(at100).toMatchObject({ homeCents: 6096, shopCents: 5000, cheaper: "shop" });
    expect(breakEven(withLabour, quotes)).toEqual({ cheaperAtOne: "home", copies: 100 });
  });

  it("no break-even when the shop never gets cheaper within the search", () => {
    expect(breakEven(laser, [{ copies: 1, totalCents: 1000 }], 500)).toEqual({
      cheaperAtOne: "home",
      copies: null,
    });
  });
});

describe("finishing time and batches", () => {
  it("minutes per step from per-copy, per-sheet and setup minutes", () => {
    const t = finishingTime(steps, 10, 4);
    // fold 5, collate 10 × 4 × 0.1 = 4, staple 2.5, trim 5 + 2 = 7 → 18.5
    expect(t.perStep.map((s) => s.minutes)).toEqual([5, 4, 2.5, 7]);
    expect(t.totalMinutes).toBeCloseTo(18.5, 9);
    expect(finishingTime(steps, 0, 4).totalMinutes).toBe(0);
  });

  it("copies that fit in the time available", () => {
    // (60 − 5) / 1.35 = 40.7 → 40
    expect(copiesWithin(steps, 60, 4)).toBe(40);
    expect(copiesWithin(steps, 4, 4)).toBe(0);
  });

  it("a first batch for the launch, the rest later in batches of 25", () => {
    const simple = [{ id: "all", label: "Everything", setupMinutes: 5, minutesPerCopy: 1 }];
    const plan = planBatches({
      totalCopies: 100,
      sheetsPerCopy: 4,
      steps: simple,
      first: { copies: 40, minutesAvailable: 45, due: "launch" },
      laterBatchSize: 25,
    });
    expect(plan.batches.map((b) => [b.copies, b.minutes])).toEqual([
      [40, 45],
      [25, 30],
      [25, 30],
      [10, 15],
    ]);
    expect(plan.firstDateShortfall).toBe(0);
    expect(plan.batches[0]?.due).toBe("launch");
    const short = planBatches({
      totalCopies: 100,
      sheetsPerCopy: 4,
      steps: simple,
      first: { copies: 40, minutesAvailable: 30 },
    });
    expect(short.batches.map((b) => b.copies)).toEqual([25, 75]);
    expect(short.firstDateShortfall).toBe(15);
  });

  it("standard steps score the cover only from 150 g/m² (Condat)", () => {
    expect(standardFinishingSteps({ coverGsm: 176 }).map((s) => s.id)).toEqual([
      "trim-sheets",
      "score-cover",
      "fold",
      "collate",
      "staple",
      "trim-fore-edge",
    ]);
    expect(standardFinishingSteps({ coverGsm: 90 }).some((s) => s.id === "score-cover")).toBe(
      false,
    );
  });
});
