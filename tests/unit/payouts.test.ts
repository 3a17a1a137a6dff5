import { describe, expect, it } from "vitest";
import { splitCents } from "@/lib/money";
import {
  closePeriod,
  feeOwed,
  ledgerBalance,
  ledgerTotals,
  openOwedLines,
  periodSales,
  sharePool,
  signedAmount,
  splitShare,
  type LedgerLine,
  type PayoutTerms,
} from "@/lib/payouts";

describe("largest remainder (Hamilton's apportionment method)", () => {
  // Electowiki, "Hamilton method" (electowiki.org/wiki/Hamilton_method), worked example: the 1790
  // U.S. census, 15 states, 60 seats. Quota 3 615 920 / 60 = 60 265.333; 52 seats by integer parts,
  // the remaining 8 to New Jersey, Connecticut, Delaware, Massachusetts, North Carolina, Maryland,
  // New York and Virginia.
  const populations = [
    ["Virginia", 630_560, 11],
    ["Massachusetts", 475_327, 8],
    ["Pennsylvania", 432_879, 7],
    ["North Carolina", 353_523, 6],
    ["New York", 331_589, 6],
    ["Maryland", 278_514, 5],
    ["Connecticut", 236_841, 4],
    ["South Carolina", 206_236, 3],
    ["New Jersey", 179_570, 3],
    ["New Hampshire", 141_822, 2],
    ["Vermont", 85_533, 1],
    ["Georgia", 70_835, 1],
    ["Kentucky", 68_705, 1],
    ["Rhode Island", 68_446, 1],
    ["Delaware", 55_540, 1],
  ] as const;

  it("gives the published 1790 apportionment of 60 seats", () => {
    const seats = splitCents(
      60,
      populations.map((p) => p[1]),
    );
    expect(seats).toEqual(populations.map((p) => p[2]));
    expect(seats.reduce((a, b) => a + b, 0)).toBe(60);
  });

  it("gives the same answer through splitShare, with the 8 leftover seats where the example puts them", () => {
    const parts = splitShare(
      60,
      populations.map(([name, pop]) => ({ contributorId: name, pieces: 0, pages: pop })),
      "per-page",
    );
    const extras = parts.filter((p) => p.extraCents === 1).map((p) => p.contributorId);
    expect(extras.sort()).toEqual(
      [
        "New Jersey",
        "Connecticut",
        "Delaware",
        "Massachusetts",
        "North Carolina",
        "Maryland",
        "New York",
        "Virginia",
      ].sort(),
    );
    expect(parts.reduce((a, p) => a + p.floorCents, 0)).toBe(52);
  });
});

describe("a hand-worked period where rounding moves cents", () => {
  // Worked by hand for this test (no outside source):
  //   fair table: 12 copies × $15.00 = $180.00, less $5.00 discounts and a $20.00 table fee = $155.00
  //   bookshop:    7 copies × $12.00 =  $84.00, less the shop's 15 % ($12.60)             =  $71.40
  //   net $226.40; 10 % share = $22.64 = 2264 cents, split by pages 3 : 2 : 2 (7 pages)
  //   Ada 2264×3/7 = 970.29 → 970 (remainder 2/7); Ben and Cy 2264×2/7 = 646.86 → 646 (remainder 6/7)
  //   970 + 646 + 646 = 2262: the 2 leftover cents go to Ben and Cy, the largest remainders.
  const terms: PayoutTerms = {
    feeKind: "per-piece",
    feeCents: 2500,
    salesShareBasisPoints: 1000,
    shareSplit: "per-page",
  };
  const sales = [
    {
      copies: 12,
      unitPriceCents: 1500,
      discountCents: 500,
      channelFeesCents: 0,
      recoverableCostsCents: 2000,
    },
    {
      copies: 7,
      unitPriceCents: 1200,
      discountCents: 0,
      channelFeesCents: 1260,
      recoverableCostsCents: 0,
    },
  ];
  const work = [
    { contributorId: "ada", pieces: 1, pages: 3 },
    { contributorId: "ben", pieces: 2, pages: 2 },
    { contributorId: "cy", pieces: 1, pages: 2 },
  ];

  it("computes net and the pool", () => {
    const p = periodSales(sales);
    expect(p).toMatchObject({ copies: 19, grossCents: 26_400, netCents: 22_640 });
    expect(sharePool(p.shareBaseCents, 1000)).toBe(2264);
  });

  it("splits 2264 as 970 / 647 / 647, the larger share getting no extra cent", () => {
    const parts = splitShare(2264, work, "per-page");
    expect(parts.map((p) => p.cents)).toEqual([970, 647, 647]);
    expect(parts.map((p) => p.extraCents)).toEqual([0, 1, 1]);
  });

  it("closes the period: fees once, shares with their working, summing to the pool", () => {
    const result = closePeriod({
      terms,
      currency: "USD",
      sales,
      work,
      feeAlreadyOwed: new Set(["cy"]),
    });
    const fees = result.lines.filter((l) => l.source === "fee");
    expect(fees.map((l) => [l.contributorId, l.amountCents])).toEqual([
      ["ada", 2500],
      ["ben", 5000],
    ]);
    const shares = result.lines.filter((l) => l.source === "share");
    expect(shares.reduce((a, l) => a + l.amountCents, 0)).toBe(result.poolCents);
    const ben = shares.find((l) => l.contributorId === "ben")!;
    expect(ben.computation.working.join("\n")).toContain("$226.40 net");
    expect(ben.computation.working.join("\n")).toContain("2 pages of 7");
    expect(ben.computation.working.join("\n")).toContain("1 cent left over");
    expect(ben.computation.working.at(-1)).toBe("= $6.47");
  });

  it("splits equally and by pieces", () => {
    expect(splitShare(100, work, "equal").map((p) => p.cents)).toEqual([34, 33, 33]);
    expect(splitShare(100, work, "per-piece").map((p) => p.cents)).toEqual([25, 50, 25]);
  });
});

describe("fees, losses and the ledger", () => {
  it("charges a flat fee per piece or per page", () => {
    const w = { contributorId: "x", pieces: 2, pages: 5 };
    expect(feeOwed({ feeKind: "per-piece", feeCents: 2500 }, w)).toBe(5000);
    expect(feeOwed({ feeKind: "per-page", feeCents: 800 }, w)).toBe(4000);
    expect(feeOwed({ feeKind: "none", feeCents: 800 }, w)).toBe(0);
  });

  it("takes no share from a loss", () => {
    const p = periodSales([
      {
        copies: 2,
        unitPriceCents: 1000,
        discountCents: 0,
        channelFeesCents: 0,
        recoverableCostsCents: 5000,
      },
    ]);
    expect(p.netCents).toBe(-3000);
    expect(p.shareBaseCents).toBe(0);
    expect(sharePool(p.shareBaseCents, 1500)).toBe(0);
  });

  it("refuses a share outside 0-100 %", () => {
    expect(() => sharePool(100, 10_001)).toThrow(RangeError);
    expect(() => sharePool(100, 12.5)).toThrow(RangeError);
  });

  it("sums lines into a balance, with paid and reversed lines settling what they name", () => {
    const lines: LedgerLine[] = [
      {
        id: 1,
        kind: "owed",
        amountCents: signedAmount("owed", 2500),
        settlesEntryId: null,
        reversesEntryId: null,
      },
      {
        id: 2,
        kind: "owed",
        amountCents: signedAmount("owed", 647),
        settlesEntryId: null,
        reversesEntryId: null,
      },
      {
        id: 3,
        kind: "scheduled",
        amountCents: signedAmount("scheduled", 2500),
        settlesEntryId: 1,
        reversesEntryId: null,
      },
      {
        id: 4,
        kind: "paid",
        amountCents: signedAmount("paid", 2500),
        settlesEntryId: 1,
        reversesEntryId: null,
      },
      {
        id: 5,
        kind: "reversed",
        amountCents: signedAmount("reversed", 0, 647),
        settlesEntryId: null,
        reversesEntryId: 2,
      },
    ];
    expect(ledgerBalance(lines)).toBe(0);
    expect(ledgerTotals(lines)).toEqual({ owedCents: 2500, paidCents: 2500, outstandingCents: 0 });
    expect(openOwedLines(lines)).toEqual([]);
    expect(openOwedLines(lines.slice(0, 3)).map((l) => l.id)).toEqual([1, 2]);
  });
});

describe("the call's split rule", () => {
  it("is one of the payment terms, named when it changes and in the call's words", async () => {
    const { changedTerms, DEFAULT_TERMS, callInputSchema } = await import("@/lib/validations/call");
    const { salesShareText } = await import("@/lib/call-terms");
    expect(DEFAULT_TERMS.shareSplit).toBe("per-page");
    expect(changedTerms(DEFAULT_TERMS, { ...DEFAULT_TERMS, shareSplit: "equal" })).toEqual([
      "how the share is split",
    ]);
    expect(salesShareText(1000, "per-piece")).toBe(
      "10 % of net sales, shared among the contributors by pieces in the book",
    );
    expect(salesShareText(1000, "equal")).toBe(
      "10 % of net sales, shared among the contributors equally",
    );
    const shape = callInputSchema as unknown as { shape?: Record<string, unknown> };
    expect(Object.keys(shape.shape ?? {})).toContain("shareSplit");
  });
});
