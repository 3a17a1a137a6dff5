import { z } from "zod";
import { SALE_CHANNELS } from "@/lib/domain";
import { LENGTH } from "./limits";
import { singleLineText } from "./text";

/** A calendar day as the date input gives it, read as a UTC midnight. */
const day = z
  .string({ error: "Give a date" })
  .regex(/^\d{4}-\d{2}-\d{2}$/, "Give a date as YYYY-MM-DD")
  .transform((text, ctx) => {
    const date = new Date(`${text}T00:00:00Z`);
    if (Number.isNaN(date.getTime()) || date.toISOString().slice(0, 10) !== text) {
      ctx.addIssue({ code: "custom", message: "That is not a real date" });
      return z.NEVER;
    }
    return date;
  });

/** Whole cents, at most 10,000,000.00 either way. */
const cents = (what: string, { signed = false } = {}) =>
  z
    .number({ error: `Give ${what} in cents` })
    .int(`${what[0]!.toUpperCase()}${what.slice(1)} must be whole cents`)
    .min(
      signed ? -1_000_000_000 : 0,
      `${what[0]!.toUpperCase()}${what.slice(1)} cannot be below zero`,
    )
    .max(1_000_000_000, "That is more than Quireline records in one line");

/** One sale, or a batch of sales at one price, as the sales screen sends it. */
export const saleSchema = z.object({
  channel: z.enum(SALE_CHANNELS, { error: "Choose where the copies were sold" }),
  label: singleLineText(LENGTH.saleLabel).pipe(
    z.string().min(1, "Say where, e.g. “Harbour Zine Fair”"),
  ),
  soldOn: day,
  copies: z
    .number({ error: "Give the number of copies" })
    .int("Whole copies only")
    .min(-10_000, "At most 10,000 copies taken back in one line")
    .max(100_000, "At most 100,000 copies in one line")
    .refine((n) => n !== 0, "Give the number of copies (below zero for copies returned)"),
  unitPriceCents: cents("the price"),
  discountCents: cents("the discounts", { signed: true }).default(0),
  channelFeesCents: cents("the channel's fees", { signed: true }).default(0),
  recoverableCostsCents: cents("the costs", { signed: true }).default(0),
  note: singleLineText(LENGTH.saleNote).optional(),
});
export type SaleInput = z.input<typeof saleSchema>;

/** A new period to share sales out over. */
export const periodSchema = z
  .object({
    label: singleLineText(LENGTH.periodLabel).pipe(
      z.string().min(1, "Name the period, e.g. “Autumn 2026”"),
    ),
    startsOn: day,
    endsOn: day,
  })
  .refine((p) => p.endsOn >= p.startsOn, {
    path: ["endsOn"],
    message: "The last day comes after the first",
  });

export const markPaidSchema = z.object({
  reference: singleLineText(LENGTH.paymentReference).pipe(
    z.string().min(3, "Say how it was paid, e.g. “cash at the fair, receipt 14”"),
  ),
});

export const reverseSchema = z.object({
  reason: singleLineText(LENGTH.paymentReference).pipe(
    z.string().min(3, "Say why it is cancelled"),
  ),
});

export const statementsSchema = z.object({ periodId: z.number().int().positive() });

export const statementQuery = z.object({
  period: z.coerce.number().int().positive(),
  contributor: z.string().min(1).max(255).optional(),
});

export const exportQuery = z.object({ what: z.enum(["ledger", "sales"]) });
