/**
 * Money as integer cents (minor units) with a currency; never floats. Amounts are rounded once,
 * where a price is applied to a quantity, and splits use the largest-remainder method so the
 * parts always add up to the whole.
 */

/** An integer number of minor units (cents). */
export type Cents = number;

/** An amount with its currency (ISO 4217 code). */
export interface Money {
  cents: Cents;
  currency: string;
}

/**
 * Currencies a collective may keep its anthology's money in, as ISO 4217 codes. Only currencies
 * whose minor unit is a hundredth (ISO 4217 minor unit 2) are offered, since amounts are stored
 * as integer cents; USD first as the default.
 */
export const CURRENCIES = [
  "USD",
  "CAD",
  "EUR",
  "GBP",
  "AUD",
  "NZD",
  "CHF",
  "SEK",
  "NOK",
  "DKK",
  "MXN",
  "ZAR",
] as const;
export type Currency = (typeof CURRENCIES)[number];
export const DEFAULT_CURRENCY: Currency = "USD";

/** True for a code Quireline offers (upper case, as ISO 4217 writes it). */
export function isCurrency(code: string): code is Currency {
  return (CURRENCIES as readonly string[]).includes(code);
}

/** "Euro (EUR)" for a picker; the name comes from Intl. */
export function currencyLabel(code: Currency, locale = "en"): string {
  const name = new Intl.DisplayNames([locale], { type: "currency" }).of(code) ?? code;
  return `${name} (${code})`;
}

/** Throws unless the value is a safe integer number of cents. */
export function assertCents(value: number, name = "amount"): Cents {
  if (!Number.isSafeInteger(value))
    throw new RangeError(`${name} must be a whole number of cents, got ${value}`);
  return value;
}

/** Parses "12.34", "-0.5", "1,234.50" or "7" into cents exactly, without going through a float. */
export function parseCents(text: string): Cents {
  const cleaned = text.trim().replace(/,/g, "");
  const match = /^([+-])?(\d*)(?:\.(\d{0,2}))?$/.exec(cleaned);
  if (!match || (match[2] === "" && (match[3] ?? "") === ""))
    throw new RangeError(`not an amount: "${text}"`);
  const whole = Number(match[2] || "0");
  const fraction = Number((match[3] ?? "").padEnd(2, "0"));
  const cents = whole * 100 + fraction;
  return assertCents(match[1] === "-" ? -cents : cents);
}

/**
 * Formats cents for people with Intl.NumberFormat, the one place money is written out:
 * 123456 USD in en-US → "$1,234.56", 123450 EUR in en-GB → "€1,234.50".
 */
export function formatCents(cents: Cents, currency = "USD", locale = "en-US"): string {
  assertCents(cents);
  return new Intl.NumberFormat(locale, {
    style: "currency",
    currency,
    minimumFractionDigits: 2,
  }).format(cents / 100);
}

/** Sum of amounts in cents. */
export function sumCents(amounts: readonly Cents[]): Cents {
  return assertCents(amounts.reduce((a, b) => a + b, 0));
}

/**
 * round(quantity × priceCents ÷ perQuantity), half away from zero: the cost of a quantity at a
 * pack price (a ream of 500 sheets for 899 cents). Exact for integer inputs via BigInt.
 */
export function priceOf(quantity: number, priceCents: Cents, perQuantity = 1): Cents {
  assertCents(priceCents, "priceCents");
  if (!(perQuantity > 0)) throw new RangeError(`perQuantity must be positive, got ${perQuantity}`);
  if (Number.isSafeInteger(quantity) && Number.isSafeInteger(perQuantity)) {
    return Number(divRoundHalfAway(BigInt(quantity) * BigInt(priceCents), BigInt(perQuantity)));
  }
  const raw = (quantity * priceCents) / perQuantity;
  return Math.sign(raw) * Math.round(Math.abs(raw));
}

function divRoundHalfAway(numerator: bigint, denominator: bigint): bigint {
  const negative = numerator < 0n !== denominator < 0n;
  const n = numerator < 0n ? -numerator : numerator;
  const d = denominator < 0n ? -denominator : denominator;
  const q = (n * 2n + d) / (2n * d);
  return negative ? -q : q;
}

/** Cents divided by a count, rounded half away from zero (for a per-copy figure). */
export function divideCents(cents: Cents, by: number): Cents {
  if (!Number.isSafeInteger(by) || by <= 0)
    throw new RangeError(`divisor must be a positive integer, got ${by}`);
  return Number(divRoundHalfAway(BigInt(assertCents(cents)), BigInt(by)));
}

/**
 * Splits a total among shares by weight with the largest-remainder method: everyone gets the
 * floor of their exact quota, then the leftover cents go one each to the largest remainders
 * (ties to the earlier share). Parts always add up to the total. Integer weights are exact;
 * fractional weights are scaled to integers first.
 */
export function splitCents(total: Cents, weights: readonly number[]): Cents[] {
  assertCents(total, "total");
  if (weights.length === 0) throw new RangeError("need at least one share");
  for (const w of weights)
    if (!(w >= 0) || !Number.isFinite(w))
      throw new RangeError(`weights must be finite and non-negative, got ${w}`);
  const intWeights = toIntegerWeights(weights);
  const sumW = intWeights.reduce((a, b) => a + b, 0n);
  if (sumW === 0n) throw new RangeError("weights must not all be zero");
  const sign = total < 0 ? -1n : 1n;
  const t = BigInt(Math.abs(total));
  const floors = intWeights.map((w) => (t * w) / sumW);
  const remainders = intWeights.map((w) => (t * w) % sumW);
  let left = t - floors.reduce((a, b) => a + b, 0n);
  const order = remainders
    .map((r, i) => ({ r, i }))
    .sort((a, b) => (a.r === b.r ? a.i - b.i : a.r > b.r ? -1 : 1));
  for (const { i } of order) {
    if (left === 0n) break;
    floors[i] = (floors[i] ?? 0n) + 1n;
    left -= 1n;
  }
  return floors.map((f) => Number(f * sign));
}

function toIntegerWeights(weights: readonly number[]): bigint[] {
  if (weights.every((w) => Number.isSafeInteger(w))) return weights.map((w) => BigInt(w));
  // Scale by the largest number of decimals present (capped) so e.g. 0.5 and 1.25 become 50 and 125.
  const decimals = Math.min(9, Math.max(...weights.map(decimalPlaces)));
  const scale = 10 ** decimals;
  return weights.map((w) => BigInt(Math.round(w * scale)));
}

function decimalPlaces(value: number): number {
  const text = String(value);
  if (text.includes("e-")) return 9;
  const dot = text.indexOf(".");
  return dot === -1 ? 0 : text.length - dot - 1;
}
