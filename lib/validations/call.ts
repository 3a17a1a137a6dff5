import { z } from "zod";
import {
  ANTHOLOGY_STAGES,
  FEE_KINDS,
  PIECE_KINDS,
  SHARE_SPLITS,
  type FeeKind,
  type PieceKind,
  type ShareSplit,
} from "@/lib/domain";
import { parseCents } from "@/lib/money";
import { isValidTimeZone, LOCAL_DATE_TIME, utcToZonedLocal, zonedToUtc } from "@/lib/time-zones";
import { INK_NAME_MAX, INKS_MAX, LENGTH, TEXT_CAP } from "./limits";
import { multiLineText, singleLineText } from "./text";

/** The open call as stored (UTC instants, integer cents and basis points). */
export interface CallRecord {
  theme: string;
  brief: string;
  opensAt: Date;
  closesAt: Date;
  timeZone: string;
  allowedKinds: PieceKind[];
  maxRunPages: number;
  piecesPerPerson: number;
  allowedInks: string[];
  feeKind: FeeKind;
  feeCents: number;
  salesShareBasisPoints: number;
  /** How the share is divided among the contributors. */
  shareSplit: ShareSplit;
  contributorCopies: number;
  rightsAsked: string;
}

/** The payment terms only the lead editor may change (`call:edit-terms`). */
export type CallTerms = Pick<
  CallRecord,
  "feeKind" | "feeCents" | "salesShareBasisPoints" | "shareSplit" | "contributorCopies"
>;

/** Terms of a call nobody has written yet: no fee, no share, one contributor copy. */
export const DEFAULT_TERMS: CallTerms = {
  feeKind: "none",
  feeCents: 0,
  salesShareBasisPoints: 0,
  shareSplit: "per-page",
  contributorCopies: 1,
};

/** The most a flat fee may be: 100,000.00 in the anthology's currency. */
export const MAX_FEE_CENTS = 10_000_000;

const wholeNumber = (label: string, min: number, max: number) =>
  z.coerce
    .number({ error: `${label} must be a number` })
    .int(`${label} must be a whole number`)
    .min(min, `${label} must be at least ${min}`)
    .max(max, `${label} must be at most ${max}`);

/** "12.50" → 1250 cents; undefined when it is not an amount. */
export function amountToCents(text: string): number | undefined {
  try {
    return parseCents(text);
  } catch {
    return undefined;
  }
}

/** "10", "12.5" or "7.25" (percent, up to two decimals) → basis points (1 % = 100), exactly. */
export function percentToBasisPoints(text: string): number | undefined {
  const match = /^(\d{1,3})(?:\.(\d{1,2}))?$/.exec(text.trim());
  if (!match) return undefined;
  return Number(match[1]) * 100 + Number((match[2] ?? "").padEnd(2, "0"));
}

/** 1250 → "12.50"; 0 → "0". */
export function centsToAmount(cents: number): string {
  if (cents === 0) return "0";
  const sign = cents < 0 ? "-" : "";
  const abs = Math.abs(cents);
  return `${sign}${Math.floor(abs / 100)}.${String(abs % 100).padStart(2, "0")}`;
}

/** 1000 → "10"; 1250 → "12.5". */
export function basisPointsToPercent(bp: number): string {
  return String(bp / 100);
}

const zoneDateTime = (label: string) =>
  z
    .string({ error: `Give the ${label} date and time` })
    .trim()
    .regex(LOCAL_DATE_TIME, `Give the ${label} date and time`);

/**
 * What the call form sends and the route handler accepts. Dates are wall-clock times in
 * `timeZone`; the fee is an amount in the anthology's currency ("25.00"); the sales share is a
 * percentage ("10"). `callRecordFromInput` turns it into the stored record.
 */
export const callInputSchema = z
  .object({
    theme: singleLineText(LENGTH.callTheme).min(2, "Give the call a theme"),
    brief: multiLineText(TEXT_CAP.callBrief).min(20, "Write a brief of at least a sentence or two"),
    opensAt: zoneDateTime("opening"),
    closesAt: zoneDateTime("closing"),
    timeZone: singleLineText(LENGTH.timeZone).refine(
      isValidTimeZone,
      "Choose a time zone from the list",
    ),
    allowedKinds: z
      .array(z.enum(PIECE_KINDS, { error: "Unknown kind of piece" }), {
        error: "Say what a piece may be",
      })
      .min(1, "Allow at least one kind of piece")
      .max(PIECE_KINDS.length, `At most ${PIECE_KINDS.length} kinds`),
    maxRunPages: wholeNumber("The longest run", 2, 64),
    piecesPerPerson: wholeNumber("Pieces per person", 1, 20),
    allowedInks: z
      .array(singleLineText(INK_NAME_MAX).min(1), { error: "Choose the inks a piece may use" })
      .min(1, "Allow at least one ink")
      .max(INKS_MAX, `At most ${INKS_MAX} inks`),
    feeKind: z.enum(FEE_KINDS, { error: "Choose how the fee is paid" }),
    fee: z.coerce.string().trim().default("0"),
    salesSharePercent: z.coerce.string().trim().default("0"),
    shareSplit: z
      .enum(SHARE_SPLITS, { error: "Choose how the share is divided" })
      .default("per-page"),
    contributorCopies: wholeNumber("Contributor copies", 0, 50),
    rightsAsked: multiLineText(TEXT_CAP.callRights).min(
      10,
      "Say which rights you ask for and when they return",
    ),
  })
  .superRefine((v, ctx) => {
    const opens = zonedToUtc(v.opensAt, v.timeZone);
    const closes = zonedToUtc(v.closesAt, v.timeZone);
    for (const [key, result] of [
      ["opensAt", opens],
      ["closesAt", closes],
    ] as const) {
      if (!result.ok && result.reason === "skipped")
        ctx.addIssue({
          code: "custom",
          path: [key],
          message: `That time does not exist in ${v.timeZone} (the clocks skip it); pick another`,
        });
      if (!result.ok && result.reason === "bad-format")
        ctx.addIssue({ code: "custom", path: [key], message: "That is not a real date" });
    }
    if (opens.ok && closes.ok && closes.instant.getTime() <= opens.instant.getTime()) {
      ctx.addIssue({
        code: "custom",
        path: ["closesAt"],
        message: "The call must close after it opens",
      });
    }
    if (new Set(v.allowedKinds).size !== v.allowedKinds.length)
      ctx.addIssue({ code: "custom", path: ["allowedKinds"], message: "Each kind once" });
    if (new Set(v.allowedInks.map((i) => i.toLowerCase())).size !== v.allowedInks.length)
      ctx.addIssue({ code: "custom", path: ["allowedInks"], message: "Each ink once" });
    if (v.feeKind !== "none") {
      const cents = amountToCents(v.fee);
      if (cents === undefined)
        ctx.addIssue({
          code: "custom",
          path: ["fee"],
          message: "Write the fee as an amount, e.g. 25 or 25.00",
        });
      else if (cents <= 0)
        ctx.addIssue({
          code: "custom",
          path: ["fee"],
          message: "A fee must be more than zero, or choose no fee",
        });
      else if (cents > MAX_FEE_CENTS)
        ctx.addIssue({
          code: "custom",
          path: ["fee"],
          message: "A fee over 100,000 is out of range: check the amount",
        });
    }
    const bp = percentToBasisPoints(v.salesSharePercent);
    if (bp === undefined)
      ctx.addIssue({
        code: "custom",
        path: ["salesSharePercent"],
        message: "Write the share as a percentage, e.g. 10 or 12.5",
      });
    else if (bp > 10_000)
      ctx.addIssue({
        code: "custom",
        path: ["salesSharePercent"],
        message: "A share cannot be more than 100 %",
      });
  });

export type CallInput = z.input<typeof callInputSchema>;
export type CallParsed = z.output<typeof callInputSchema>;

/** The shared schema plus what depends on the anthology: inks it prints with, most pages it allows. */
export function callSchemaFor(anthology: { inks: readonly string[]; maxPages: number }) {
  return callInputSchema.superRefine((v, ctx) => {
    const unknown = v.allowedInks.filter(
      (ink) => !anthology.inks.some((i) => i.toLowerCase() === ink.toLowerCase()),
    );
    if (unknown.length) {
      ctx.addIssue({
        code: "custom",
        path: ["allowedInks"],
        message: `${unknown.join(", ")} ${unknown.length === 1 ? "is" : "are"} not among the anthology's inks (${anthology.inks.join(", ")})`,
      });
    }
    if (v.allowedKinds.includes("run") && v.maxRunPages > anthology.maxPages) {
      ctx.addIssue({
        code: "custom",
        path: ["maxRunPages"],
        message: `The booklet has at most ${anthology.maxPages} pages`,
      });
    }
  });
}

/** The stored record from validated input: UTC instants, cents and basis points. */
export function callRecordFromInput(
  v: CallParsed,
  anthologyInks: readonly string[] = [],
): CallRecord {
  const opens = zonedToUtc(v.opensAt, v.timeZone);
  const closes = zonedToUtc(v.closesAt, v.timeZone);
  if (!opens.ok || !closes.ok) throw new Error("call dates were not validated");
  // Inks keep the anthology's spelling and press order.
  const wanted = new Set(v.allowedInks.map((i) => i.toLowerCase()));
  const ordered = anthologyInks.filter((ink) => wanted.has(ink.toLowerCase()));
  return {
    theme: v.theme,
    brief: v.brief,
    opensAt: opens.instant,
    closesAt: closes.instant,
    timeZone: v.timeZone,
    allowedKinds: [...v.allowedKinds].sort(
      (a, b) => PIECE_KINDS.indexOf(a) - PIECE_KINDS.indexOf(b),
    ),
    maxRunPages: v.maxRunPages,
    piecesPerPerson: v.piecesPerPerson,
    allowedInks: ordered.length === v.allowedInks.length ? ordered : v.allowedInks,
    feeKind: v.feeKind,
    feeCents: v.feeKind === "none" ? 0 : (amountToCents(v.fee) ?? 0),
    salesShareBasisPoints: percentToBasisPoints(v.salesSharePercent) ?? 0,
    shareSplit: v.shareSplit,
    contributorCopies: v.contributorCopies,
    rightsAsked: v.rightsAsked,
  };
}

/** The form's values for a stored record, dates shown in the call's own zone. */
export function callInputFromRecord(r: CallRecord): CallParsed {
  return {
    theme: r.theme,
    brief: r.brief,
    opensAt: utcToZonedLocal(r.opensAt, r.timeZone),
    closesAt: utcToZonedLocal(r.closesAt, r.timeZone),
    timeZone: r.timeZone,
    allowedKinds: r.allowedKinds,
    maxRunPages: r.maxRunPages,
    piecesPerPerson: r.piecesPerPerson,
    allowedInks: r.allowedInks,
    feeKind: r.feeKind,
    fee: r.feeKind === "none" ? "0" : centsToAmount(r.feeCents),
    salesSharePercent: basisPointsToPercent(r.salesShareBasisPoints),
    shareSplit: r.shareSplit,
    contributorCopies: r.contributorCopies,
    rightsAsked: r.rightsAsked,
  };
}

/** The terms part of a record. */
export function termsOf(r: CallTerms): CallTerms {
  return {
    feeKind: r.feeKind,
    feeCents: r.feeCents,
    salesShareBasisPoints: r.salesShareBasisPoints,
    shareSplit: r.shareSplit,
    contributorCopies: r.contributorCopies,
  };
}

/** Names of the terms that differ, e.g. ["fee", "sales share"]; empty when the terms are the same. */
export function changedTerms(before: CallTerms, after: CallTerms): string[] {
  const changed: string[] = [];
  if (before.feeKind !== after.feeKind || before.feeCents !== after.feeCents) changed.push("fee");
  if (before.salesShareBasisPoints !== after.salesShareBasisPoints) changed.push("share of sales");
  if (before.shareSplit !== after.shareSplit) changed.push("how the share is split");
  if (before.contributorCopies !== after.contributorCopies) changed.push("contributor copies");
  return changed;
}

/**
 * Form values for a call nobody has written yet: opens tomorrow at 09:00, closes four weeks later
 * at 23:59 (wall clock in `timeZone`), every kind and ink allowed, default terms.
 */
export function newCallDefaults(
  anthology: { inks: readonly string[] },
  now: Date,
  timeZone = "UTC",
): CallParsed {
  const today = utcToZonedLocal(now, timeZone).slice(0, 10);
  const day = (offsetDays: number) => {
    const d = new Date(`${today}T12:00:00Z`);
    d.setUTCDate(d.getUTCDate() + offsetDays);
    return d.toISOString().slice(0, 10);
  };
  return {
    theme: "",
    brief: "",
    opensAt: `${day(1)}T09:00`,
    closesAt: `${day(29)}T23:59`,
    timeZone,
    allowedKinds: ["single", "spread", "run"],
    maxRunPages: 4,
    piecesPerPerson: 2,
    allowedInks: [...anthology.inks],
    feeKind: DEFAULT_TERMS.feeKind,
    fee: "0",
    salesSharePercent: "0",
    shareSplit: DEFAULT_TERMS.shareSplit,
    contributorCopies: DEFAULT_TERMS.contributorCopies,
    rightsAsked: "One-time printing rights for this edition; every other right stays with you.",
  };
}

/** The stage move a route handler accepts. */
export const stageMoveSchema = z.object({
  to: z.enum(ANTHOLOGY_STAGES, { error: "Choose the stage to move to" }),
});
