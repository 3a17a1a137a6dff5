/**
 * The run planner's inputs, shared by its forms and route handlers: price lists, a shop's quote,
 * the plan (quantities, timings, finishers' hours), events, finishing ticks and stock movements.
 * Money arrives as integer cents; a form turns "12.50" into cents first.
 */
import { z } from "zod";
import { EVENT_KINDS, PRINT_MODES } from "@/lib/run/batches";
import { FINISHING_STEP_IDS } from "@/lib/run/checklist";
import { STOCK_KINDS } from "@/lib/run/stock";
import { singleLineText } from "./text";

/** Most cents any one price may be: 100,000.00. */
export const MAX_PRICE_CENTS = 10_000_000;
export const MAX_COPIES = 5000;
export const QUANTITIES_MAX = 12;
export const PLAN_NAME_MAX = 120;
export const REASON_MAX = 500;

export const centsSchema = (label: string) =>
  z
    .number({ error: `${label}: give an amount` })
    .int(`${label}: whole cents only`)
    .min(0, `${label} cannot be negative`)
    .max(MAX_PRICE_CENTS, `${label} is too large`);

export const packPriceSchema = (label: string) =>
  z.object({
    priceCents: centsSchema(label),
    perQuantity: z
      .number({ error: `${label}: say how many the price is for` })
      .int(`${label}: a whole number per pack`)
      .min(1, `${label}: a pack holds at least 1`)
      .max(1_000_000, `${label}: at most 1,000,000 per pack`),
  });

export const pricesSchema = z.object({
  insidePaper: packPriceSchema("Text paper"),
  coverPaper: packPriceSchema("Cover stock"),
  copyShopSide: packPriceSchema("Copy shop's price per side"),
  inkPass: packPriceSchema("Ink per pass"),
  master: packPriceSchema("Masters"),
  staples: packPriceSchema("Staples"),
  finishingCentsPerHour: centsSchema("Finishing rate"),
  spoilageBasisPoints: z
    .number({ error: "Spoilage: give a percentage" })
    .int("Spoilage: at most two decimals")
    .min(0, "Spoilage cannot be negative")
    .max(5000, "Spoilage of more than 50 % is not a plan"),
});

export const priceListSchema = z.object({
  name: singleLineText(PLAN_NAME_MAX).min(1, "Give the list a name"),
  prices: pricesSchema,
});
export type PriceListInput = z.infer<typeof priceListSchema>;

export const quoteTierSchema = z.object({
  copies: z
    .number({ error: "Give the copies of this tier" })
    .int("Whole copies only")
    .min(1, "A tier starts at 1 copy or more")
    .max(MAX_COPIES, `At most ${MAX_COPIES} copies`),
  totalCents: centsSchema("Tier total"),
});

export const shopQuoteSchema = z.object({
  shopName: singleLineText(PLAN_NAME_MAX).min(1, "Give the shop's name"),
  tiers: z
    .array(quoteTierSchema)
    .min(1, "Enter at least one price tier")
    .max(20, "At most 20 tiers")
    .superRefine((tiers, ctx) => {
      for (let i = 1; i < tiers.length; i++)
        if (tiers[i]!.copies <= tiers[i - 1]!.copies)
          ctx.addIssue({
            code: "custom",
            path: [i, "copies"],
            message: `Tiers go up in copies: this one must be more than ${tiers[i - 1]!.copies}`,
          });
    }),
  turnaroundDays: z
    .number({ error: "Give the shop's turnaround in days" })
    .int("Whole days only")
    .min(0, "Turnaround cannot be negative")
    .max(365, "At most 365 days"),
});
export type ShopQuoteInput = z.infer<typeof shopQuoteSchema>;

export const stepTimingSchema = z.object({
  setupMinutes: z.number().min(0, "Minutes cannot be negative").max(600, "At most 600 minutes"),
  minutesPerCopy: z
    .number()
    .min(0, "Minutes cannot be negative")
    .max(120, "At most 120 minutes a copy"),
});

export const runPlanSchema = z.object({
  quantities: z
    .array(
      z
        .number({ error: "Quantities are numbers" })
        .int("Whole copies only")
        .min(1, "At least 1 copy")
        .max(MAX_COPIES, `At most ${MAX_COPIES} copies`),
    )
    .min(1, "Weigh at least one quantity")
    .max(QUANTITIES_MAX, `At most ${QUANTITIES_MAX} quantities`)
    .refine((q) => new Set(q).size === q.length, "Each quantity once"),
  priceListId: z.number().int().positive().nullable(),
  shopQuoteId: z.number().int().positive().nullable(),
  timings: z.partialRecord(z.enum(FINISHING_STEP_IDS), stepTimingSchema),
  minutesPerWeek: z
    .number({ error: "Give the finishers' hours a week" })
    .int()
    .min(0, "Hours cannot be negative")
    .max(7 * 24 * 60, "A week has 168 hours"),
  printMode: z.enum(PRINT_MODES),
});
export type RunPlanInput = z.infer<typeof runPlanSchema>;

/** "10, 25, 50" → [10, 25, 50]; undefined when a part is not a whole number. */
export function parseQuantities(text: string): number[] | undefined {
  const parts = text
    .split(/[\s,;]+/)
    .map((p) => p.trim())
    .filter(Boolean);
  if (parts.length === 0) return [];
  const out: number[] = [];
  for (const p of parts) {
    if (!/^\d+$/.test(p)) return undefined;
    out.push(Number(p));
  }
  return out;
}

const DAY = /^\d{4}-\d{2}-\d{2}$/;

/** An event: its day must be today or later in the anthology's zone (`today`, YYYY-MM-DD). */
export function runEventSchema(today: string) {
  return z.object({
    name: singleLineText(PLAN_NAME_MAX).min(1, "Give the event a name"),
    kind: z.enum(EVENT_KINDS),
    date: z
      .string({ error: "Give the day" })
      .regex(DAY, "Give the day as YYYY-MM-DD")
      .refine((d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)), "That day does not exist")
      .refine((d) => d >= today, `That day is in the past (today is ${today})`),
    copies: z
      .number({ error: "Give the copies wanted" })
      .int("Whole copies only")
      .min(1, "At least 1 copy")
      .max(MAX_COPIES, `At most ${MAX_COPIES} copies`),
  });
}
export type RunEventInput = z.infer<ReturnType<typeof runEventSchema>>;

export const tickSchema = z.object({
  stepId: z.enum([...FINISHING_STEP_IDS, "batch"]),
  done: z.boolean(),
});

export const stockMovementSchema = z
  .object({
    kind: z.enum(STOCK_KINDS),
    batchId: z.number().int().positive().nullable(),
    quantity: z
      .number({ error: "Give a quantity" })
      .int("Whole numbers only")
      .min(-100_000)
      .max(100_000),
    target: z.enum(["copies", "sheets"]).optional(),
    reason: singleLineText(REASON_MAX).default(""),
  })
  .superRefine((m, ctx) => {
    if (m.kind === "correction") {
      if (m.quantity === 0)
        ctx.addIssue({
          code: "custom",
          path: ["quantity"],
          message: "A correction changes a count",
        });
      if (m.reason === "")
        ctx.addIssue({
          code: "custom",
          path: ["reason"],
          message: "Say why the count is corrected",
        });
      if (!m.target)
        ctx.addIssue({ code: "custom", path: ["target"], message: "Correct copies or sheets" });
    } else if (m.quantity < 1)
      ctx.addIssue({ code: "custom", path: ["quantity"], message: "At least 1" });
    if ((m.kind === "printed" || m.kind === "finished" || m.target === "sheets") && !m.batchId)
      ctx.addIssue({ code: "custom", path: ["batchId"], message: "Choose the batch" });
  });
export type StockMovementInput = z.infer<typeof stockMovementSchema>;

export const contributorCopyUpdateSchema = z.object({
  delivery: z.enum(["collect", "post"]),
  eventId: z.number().int().positive().nullable(),
  done: z.boolean(),
});
