import { describe, expect, it } from "vitest";
import { breakEven } from "@/lib/print/costs";
import { copyCounts } from "@/lib/run/counts";
import {
  compareOptions,
  copyShopInputs,
  homeInputs,
  planRun,
  quantityRow,
  searchLimit,
  type CopyCounts,
  type PlanInputs,
} from "@/lib/run/plan";
import type { PriceList } from "@/lib/run/prices";
import { map, single, spread, withPlaced } from "../map/fixtures";

/*
 * The hand-worked example. Every price is invented for the test; the figures below were worked
 * on paper before the engine ran, and the engine must agree with them to the cent.
 *
 * Booklet (per copy): 5 text sheets + 1 cover sheet, 12 printed sides, 14 drum passes on our
 * duplicator (two sides carry two inks), 14 masters a run, 2 staples.
 *
 * Prices:
 *   text paper   1000 ¢ per 500 sheets  → 2 ¢ a sheet
 *   cover stock  3000 ¢ per 100 sheets  → 30 ¢ a sheet
 *   copy shop       8 ¢ per side (its paper included)
 *   ink            50 ¢ per 100 passes  → 0.5 ¢ a pass
 *   master        200 ¢ each
 *   staples       500 ¢ per 1000        → 0.5 ¢ a staple
 *   finishing    1200 ¢ an hour         → 20 ¢ a minute
 *   spoilage        0
 * Finishing steps: fold 1 min a copy; collate 0.5 min a copy; staple 5 min set-up + 0.5 min a copy
 *   → 5 + 2q minutes for q copies → (5 + 2q) × 20 = 100 + 40q cents.
 *
 * 1. Ourselves:  paper 5q × 2 = 10q; cover q × 30 = 30q; ink 14q × 0.5 = 7q; masters 14 × 200 = 2800;
 *    staples 2q × 0.5 = q; finishing 100 + 40q.            Total 2900 + 88q.
 * 2. Copy shop:  sides 12q × 8 = 96q; cover 30q; staples q; finishing 100 + 40q.   Total 100 + 167q.
 * 3. Shop quote: 25 copies 10000 ¢ (the minimum order, 400 ¢ a copy), 100 for 20000 (200 ¢),
 *    250 for 37500 (150 ¢): q ≤ 25 → 10000; 26–99 → 400q; 100–249 → 200q; 250+ → 150q.
 *
 * Copy shop against ourselves: 100 + 167q = 2900 + 88q at q = 2800 / 79 = 35.4, so
 *   q = 35: 5945 against 5980 (copy shop cheaper); q = 36: 6112 against 6068 (ourselves cheaper).
 * The shop against ourselves: 400q > 2900 + 88q for q ≥ 10; 200q > 2900 + 88q for q ≥ 26;
 *   150q > 2900 + 88q for q ≥ 47; below 26 the shop's 10000 is above 2900 + 88 × 25 = 5100.
 *   So the shop is never the cheapest here.
 */
const counts: CopyCounts = {
  insideSheets: 5,
  coverSheets: 1,
  printedSides: 12,
  passes: 14,
  mastersPerRun: 14,
  staples: 2,
  duplicator: true,
};
const prices: PriceList = {
  insidePaper: { priceCents: 1000, perQuantity: 500 },
  coverPaper: { priceCents: 3000, perQuantity: 100 },
  copyShopSide: { priceCents: 8, perQuantity: 1 },
  inkPass: { priceCents: 50, perQuantity: 100 },
  master: { priceCents: 200, perQuantity: 1 },
  staples: { priceCents: 500, perQuantity: 1000 },
  finishingCentsPerHour: 1200,
  spoilageBasisPoints: 0,
};
const steps = [
  { id: "fold", label: "Fold", setupMinutes: 0, minutesPerCopy: 1 },
  { id: "collate", label: "Collate", setupMinutes: 0, minutesPerCopy: 0.5 },
  { id: "staple", label: "Staple", setupMinutes: 5, minutesPerCopy: 0.5 },
];
const quote = {
  shopName: "Gullrock Printworks",
  turnaroundDays: 10,
  tiers: [
    { copies: 25, totalCents: 10_000 },
    { copies: 100, totalCents: 20_000 },
    { copies: 250, totalCents: 37_500 },
  ],
};
const input: PlanInputs = { counts, prices, steps, quote };

const totals = (q: number, i: PlanInputs = input) =>
  quantityRow(i, q).options.map((o) => [o.option, o.totalCents, o.perCopyCents]);

describe("the hand-worked example", () => {
  it("totals and per-copy figures at 10, 25, 50, 100 and 250 copies", () => {
    // Ourselves 2900 + 88q; copy shop 100 + 167q; shop from its tiers (worked above).
    expect(totals(10)).toEqual([
      ["home", 3780, 378],
      ["copy-shop", 1770, 177],
      ["shop", 10_000, 1000],
    ]);
    expect(totals(25)).toEqual([
      ["home", 5100, 204],
      ["copy-shop", 4275, 171],
      ["shop", 10_000, 400],
    ]);
    expect(totals(50)).toEqual([
      ["home", 7300, 146],
      ["copy-shop", 8450, 169],
      ["shop", 20_000, 400],
    ]);
    expect(totals(100)).toEqual([
      ["home", 11_700, 117],
      ["copy-shop", 16_800, 168],
      ["shop", 20_000, 200],
    ]);
    // 24900 / 250 = 99.6 → 100; 41850 / 250 = 167.4 → 167 (half away from zero).
    expect(totals(250)).toEqual([
      ["home", 24_900, 100],
      ["copy-shop", 41_850, 167],
      ["shop", 37_500, 150],
    ]);
  });

  it("the counts behind 50 copies: 250 text sheets, 50 cover sheets, 700 passes, 14 masters, 100 staples, 105 minutes", () => {
    const home = quantityRow(input, 50).options[0]!.run!;
    expect(home).toMatchObject({
      insideSheets: 250,
      coverSheets: 50,
      passes: 700,
      masters: 14,
      staples: 100,
      finishingMinutes: 105, // 5 + 2 × 50
    });
    const copyShop = quantityRow(input, 50).options[1]!.run!;
    expect(copyShop.printedSides).toBe(600); // 12 × 50
  });

  it("5 % spoilage at 50 copies: 263 text sheets, 53 cover sheets, 735 passes, 7434 ¢", () => {
    // ⌈250 × 1.05⌉ = ⌈262.5⌉ = 263 → 526 ¢; ⌈52.5⌉ = 53 → 1590 ¢; ⌈735⌉ = 735 × 0.5 = 367.5 → 368 ¢;
    // masters 2800; staples 100 (no overs) → 50 ¢; finishing 2100 ¢. 526 + 1590 + 368 + 2800 + 50 + 2100 = 7434.
    const spoiled = { ...input, prices: { ...prices, spoilageBasisPoints: 500 } };
    const row = quantityRow(spoiled, 50);
    expect(row.options[0]!.totalCents).toBe(7434);
    expect(row.spoilageSheets).toBe(13);
    expect(row.options[0]!.run!.insideSheets).toBe(263);
  });

  it("the cheapest option changes once, at 36 copies, and the sentence says so", () => {
    const c = compareOptions(input, 320);
    expect(c.segments).toEqual([
      { option: "copy-shop", from: 1, to: 35 },
      { option: "home", from: 36, to: 320 },
    ]);
    expect(c.breakEvens).toEqual([{ copies: 36, from: "copy-shop", to: "home" }]);
    expect(c.summary).toBe(
      "Up to 35 copies, copy-shop sheets finished yourselves is cheapest; above that, printing and finishing it yourselves.",
    );
  });

  it("the shop never beats printing ourselves here: no break-even up to 5,000 copies", () => {
    // Worked above: the shop's line stays over 2900 + 88q at every quantity.
    expect(breakEven(homeInputs(input), quote.tiers, 5000)).toEqual({
      cheaperAtOne: "home",
      copies: null,
    });
  });

  it("never: with a copy shop at 30 ¢ a side and no quote, ourselves is cheaper at every quantity", () => {
    // Copy shop 100 + (12 × 30 + 30 + 1 + 40)q = 100 + 431q; at q = 1, 531 < 2988, so the
    // copy shop is cheaper for one copy; 431q + 100 = 2900 + 88q at q = 8.2 → ourselves from 9.
    // To make "never", the side price must lift the copy shop over 2988 at one copy: 300 ¢ a side
    // → 100 + 3671q, 3771 at q = 1, and its slope 3671 > 88 keeps it above for every q.
    const noShop: PlanInputs = {
      counts,
      steps,
      prices: { ...prices, copyShopSide: { priceCents: 300, perQuantity: 1 } },
      quote: null,
    };
    const c = compareOptions(noShop, 500);
    expect(c.options).toEqual(["home", "copy-shop"]);
    expect(c.segments).toEqual([{ option: "home", from: 1, to: 500 }]);
    expect(c.breakEvens).toEqual([]);
    expect(c.summary).toBe(
      "At every quantity from 1 to 500 copies, printing and finishing it yourselves is cheaper: the others never catch up in that range.",
    );
  });

  it("the tiers cross twice: ourselves, then the shop from 50, then ourselves again from 91", () => {
    // Ourselves 2900 + 88q as above; copy shop at 300 ¢ a side (100 + 3671q) never cheapest.
    // Shop: 20 copies for 6000 (minimum order, 300 ¢ a copy), 50 for 6000 (120 ¢ a copy).
    //   q ≤ 20: 6000 > 2900 + 88 × 20 = 4660 → ourselves.
    //   21–49: 300q against 2900 + 88q: 212q > 2900 for q ≥ 14 → ourselves (q = 49: 14700 vs 7212).
    //   50+: 120q against 2900 + 88q: equal at q = 90.6; q = 90: 10800 vs 10820 → shop;
    //        q = 91: 10920 vs 10908 → ourselves.
    const twice: PlanInputs = {
      counts,
      steps,
      prices: { ...prices, copyShopSide: { priceCents: 300, perQuantity: 1 } },
      quote: {
        shopName: "Gullrock Printworks",
        turnaroundDays: 7,
        tiers: [
          { copies: 20, totalCents: 6000 },
          { copies: 50, totalCents: 6000 },
        ],
      },
    };
    const c = compareOptions(twice, 200);
    expect(c.segments).toEqual([
      { option: "home", from: 1, to: 49 },
      { option: "shop", from: 50, to: 90 },
      { option: "home", from: 91, to: 200 },
    ]);
    expect(c.breakEvens.map((b) => b.copies)).toEqual([50, 91]);
    expect(c.summary).toBe(
      "Up to 49 copies, printing and finishing it yourselves is cheapest; from 50 to 90 copies, the shop; above that, printing and finishing it yourselves.",
    );
    expect(totals(90, twice).map((t) => t[1])).toEqual([10_820, 330_490, 10_800]);
    expect(totals(91, twice).map((t) => t[1])).toEqual([10_908, 334_161, 10_920]);
  });

  it("per-copy prices fall steeply with quantity at a shop (common practice, no source): 400 ¢ at 25, 150 ¢ at 250", () => {
    const at = (q: number) => quantityRow(input, q).options[2]!.perCopyCents;
    expect(at(25)).toBe(400);
    expect(at(100)).toBe(200);
    expect(at(250)).toBe(150);
  });

  it("the chart and the table are one computation: a row's per-copy figure is the chart's at that quantity", () => {
    const plan = planRun(input, [10, 25, 50, 100, 250]);
    expect(plan.comparison.maxCopies).toBe(searchLimit([10, 25, 50, 100, 250], quote));
    for (const row of plan.rows) {
      const point = plan.chart.find((p) => p.copies === row.copies)!;
      expect(point.home).toBe(row.options[0]!.perCopyCents);
      expect(point["copy-shop"]).toBe(row.options[1]!.perCopyCents);
      expect(point.shop).toBe(row.options[2]!.perCopyCents);
    }
    // The break-even and the copy before it are drawn, so the chart shows the change.
    expect(plan.chart.map((p) => p.copies)).toEqual(expect.arrayContaining([35, 36]));
  });

  it("a copy shop is priced on its sides and cover stock only: no text paper, ink or masters", () => {
    const shopRun = copyShopInputs(input);
    expect(shopRun.insidePaper).toBeUndefined();
    expect(shopRun.perPass).toBeUndefined();
    expect(shopRun.mastersPerRun).toBeUndefined();
  });

  it("printing in batches pays for the masters again every run", () => {
    // 2 runs: masters 2 × 14 × 200 = 5600, so 2900 + 88q becomes 5700 + 88q; at 50 copies 10100.
    expect(quantityRow({ ...input, printRuns: 2 }, 50).options[0]!.totalCents).toBe(10_100);
  });
});

describe("counts come from the page map and the print method", () => {
  it("a letter sheet folded once makes 4 half-letter pages, so 24 pages take 6 double-sided sheets (common practice, no source)", () => {
    const c = copyCounts(map(24, []), {
      printMethod: "laser-black",
      coverStock: "self",
      trimHeightMm: 215.9,
    });
    expect(c).toMatchObject({
      insideSheets: 6,
      coverSheets: 0,
      printedSides: 12,
      passes: 12,
      mastersPerRun: 0,
      staples: 2,
      sheetsPerCopy: 6,
    });
  });

  it("a separate cover takes the outer sheet onto cover stock: 5 text sheets and 1 cover sheet", () => {
    const c = copyCounts(map(24, []), {
      printMethod: "laser-black",
      coverStock: "separate",
      trimHeightMm: 215.9,
    });
    expect([c.insideSheets, c.coverSheets]).toEqual([5, 1]);
  });

  it("on a duplicator the passes and masters follow the inks on each side", () => {
    // 8 pages: sheet 1 front 8|1, back 2|7; sheet 2 front 6|3, back 4|5.
    // Piece 1 (black, teal) on page 1 → sheet 1 front: 2 inks. Piece 2 (black) spread 4–5 → sheet 2 back: 1.
    const state = withPlaced(map(8, [single(1, ["black", "teal"]), spread(2, ["black"])]), [
      [1, [1]],
      [2, [4, 5]],
    ]);
    const c = copyCounts(state, {
      printMethod: "duplicator",
      coverStock: "self",
      trimHeightMm: 210,
    });
    expect(c).toMatchObject({ passes: 3, mastersPerRun: 3, printedSides: 4, insideSheets: 2 });
  });

  it("an A4 spine takes 3 staples, a fold-only sheet none (common practice, no source)", () => {
    expect(
      copyCounts(map(8, []), { printMethod: "inkjet", coverStock: "self", trimHeightMm: 297 })
        .staples,
    ).toBe(3);
    expect(
      copyCounts(map(4, [], { binding: "fold-only" }), {
        printMethod: "inkjet",
        coverStock: "self",
        trimHeightMm: 297,
      }).staples,
    ).toBe(0);
  });

  it("a zero-page booklet is refused", () => {
    expect(() =>
      copyCounts(
        { ...map(4, []), pageCount: 0 },
        {
          printMethod: "inkjet",
          coverStock: "self",
          trimHeightMm: 210,
        },
      ),
    ).toThrow(RangeError);
  });
});
