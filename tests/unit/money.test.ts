import { describe, expect, it } from "vitest";
import {
  CURRENCIES,
  currencyLabel,
  DEFAULT_CURRENCY,
  divideCents,
  formatCents,
  isCurrency,
  parseCents,
  priceOf,
  splitCents,
  sumCents,
} from "@/lib/money";

describe("largest-remainder split", () => {
  it("the Hare-quota example: 10 seats among 47000/16000/15800/12000/6100/3100 votes → 5 2 1 1 1 0", () => {
    // Wikipedia "Largest remainder method", worked example (from memory, re-derived by hand:
    // quotas 4.7, 1.6, 1.58, 1.2, 0.61, 0.31; the 3 leftover seats go to .7, .61, .6)
    expect(splitCents(10, [47000, 16000, 15800, 12000, 6100, 3100])).toEqual([5, 2, 1, 1, 1, 0]);
  });

  it("100 cents in three equal shares is 34 + 33 + 33 (ties go to the earlier share)", () => {
    expect(splitCents(100, [1, 1, 1])).toEqual([34, 33, 33]);
  });

  it("exact quotas are paid exactly", () => {
    expect(splitCents(1000, [1, 2, 3, 4])).toEqual([100, 200, 300, 400]);
  });

  it("parts always add up to the total, for awkward totals and weights", () => {
    for (const total of [1, 7, 99, 1001, 123457, -250]) {
      for (const weights of [
        [1, 1, 1],
        [3, 5, 7, 11],
        [0.5, 0.25, 0.25],
        [1, 0, 2],
        [2.5, 1.5, 3.333],
      ]) {
        const parts = splitCents(total, weights);
        expect(sumCents(parts)).toBe(total);
        expect(parts.every(Number.isInteger)).toBe(true);
      }
    }
  });

  it("zero-weight shares get nothing; negative totals split as negatives", () => {
    expect(splitCents(10, [1, 0, 1])).toEqual([5, 0, 5]);
    expect(splitCents(-100, [1, 1, 1])).toEqual([-34, -33, -33]);
  });

  it("refuses bad input", () => {
    expect(() => splitCents(10.5, [1])).toThrow(RangeError);
    expect(() => splitCents(10, [])).toThrow(RangeError);
    expect(() => splitCents(10, [0, 0])).toThrow(RangeError);
    expect(() => splitCents(10, [-1, 2])).toThrow(RangeError);
  });
});

describe("cents arithmetic", () => {
  it("parses amounts without floating point", () => {
    expect(parseCents("12.34")).toBe(1234);
    expect(parseCents("0.1")).toBe(10);
    expect(parseCents("-1.05")).toBe(-105);
    expect(parseCents("1,234.5")).toBe(123450);
    expect(parseCents("7")).toBe(700);
    expect(() => parseCents("1.234")).toThrow(RangeError);
    expect(() => parseCents("abc")).toThrow(RangeError);
  });

  it("prices a quantity at a pack price, rounding once half away from zero", () => {
    // 400 sheets from a 500-sheet ream at 899 cents = 719.2 → 719
    expect(priceOf(400, 899, 500)).toBe(719);
    // 1 sheet at 899 per 500 = 1.798 → 2; 5 staples at 500 per 5000 = 0.5 → 1
    expect(priceOf(1, 899, 500)).toBe(2);
    expect(priceOf(5, 500, 5000)).toBe(1);
    expect(priceOf(-5, 500, 5000)).toBe(-1);
  });

  it("divides for a per-copy figure", () => {
    expect(divideCents(1000, 3)).toBe(333);
    expect(divideCents(1001, 2)).toBe(501);
  });

  it("formats for people", () => {
    expect(formatCents(123456, "USD", "en-US")).toBe("$1,234.56");
    expect(formatCents(-5, "USD", "en-US")).toBe("-$0.05");
  });

  // Unicode CLDR locale data, as Node's Intl.NumberFormat carries it.
  it("formats the collective's currency in the reader's locale", () => {
    expect(formatCents(123450, "EUR", "en-GB")).toBe("€1,234.50");
    expect(formatCents(123450, "GBP", "en-GB")).toBe("£1,234.50");
    expect(formatCents(123450, "CAD", "en-CA")).toBe("$1,234.50");
    // Outside Canada a Canadian dollar is told apart from the US dollar.
    expect(formatCents(123450, "CAD", "en-US")).toBe("CA$1,234.50");
    expect(formatCents(2500, "NZD", "en-NZ")).toBe("$25.00");
  });
});

describe("currencies", () => {
  it("offers only ISO 4217 codes with two-decimal minor units, USD first", () => {
    expect(CURRENCIES[0]).toBe(DEFAULT_CURRENCY);
    for (const code of CURRENCIES) {
      expect(code).toMatch(/^[A-Z]{3}$/);
      const digits = new Intl.NumberFormat("en", {
        style: "currency",
        currency: code,
      }).resolvedOptions().maximumFractionDigits;
      expect(digits, code).toBe(2);
    }
  });

  it("knows its codes and names them", () => {
    expect(isCurrency("EUR")).toBe(true);
    expect(isCurrency("eur")).toBe(false);
    // ISO 4217: JPY has no minor unit, so it cannot be kept as cents.
    expect(isCurrency("JPY")).toBe(false);
    expect(currencyLabel("EUR")).toBe("Euro (EUR)");
    expect(currencyLabel("NZD")).toBe("New Zealand Dollar (NZD)");
  });
});
