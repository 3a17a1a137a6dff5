import { describe, expect, it } from "vitest";
import {
  callInputFromRecord,
  callInputSchema,
  callRecordFromInput,
  callSchemaFor,
  changedTerms,
  DEFAULT_TERMS,
  newCallDefaults,
  percentToBasisPoints,
  stageMoveSchema,
  termsOf,
  type CallInput,
} from "@/lib/validations/call";

const almanac = { inks: ["black", "teal"], maxPages: 40 };

const valid: CallInput = {
  theme: "What the tide leaves",
  brief: "Send drawings of what the water leaves behind on the mudflats.",
  opensAt: "2025-07-01T09:00",
  closesAt: "2025-07-28T23:59",
  timeZone: "Europe/Lisbon",
  allowedKinds: ["single", "spread", "run"],
  maxRunPages: "4",
  piecesPerPerson: "2",
  allowedInks: ["teal", "black"],
  feeKind: "per-piece",
  fee: "25",
  salesSharePercent: "10",
  contributorCopies: "2",
  rightsAsked: "First printing rights for this edition; all rights return to you after printing.",
};

function fieldMessages(input: unknown, schema = callSchemaFor(almanac)) {
  const result = schema.safeParse(input);
  if (result.success) return {};
  const out: Record<string, string> = {};
  for (const issue of result.error.issues) out[issue.path.join(".")] ??= issue.message;
  return out;
}

describe("the call schema", () => {
  it("accepts a complete call and stores UTC instants, cents and basis points", () => {
    const parsed = callSchemaFor(almanac).parse(valid);
    const record = callRecordFromInput(parsed, almanac.inks);
    // Lisbon is UTC+1 in July (EU Directive 2000/84/EC; IANA tz "europe").
    expect(record.opensAt.toISOString()).toBe("2025-07-01T08:00:00.000Z");
    expect(record.closesAt.toISOString()).toBe("2025-07-28T22:59:00.000Z");
    expect(record.feeCents).toBe(2500);
    // 1 % = 100 basis points, so 10 % = 1000 bp.
    expect(record.salesShareBasisPoints).toBe(1000);
    expect(record.contributorCopies).toBe(2);
    expect(record.maxRunPages).toBe(4);
    // Inks keep the anthology's press order.
    expect(record.allowedInks).toEqual(["black", "teal"]);
  });

  it("says the call must close after it opens, on the closing field", () => {
    expect(fieldMessages({ ...valid, closesAt: "2025-06-30T09:00" })).toEqual({
      closesAt: "The call must close after it opens",
    });
    expect(fieldMessages({ ...valid, closesAt: valid.opensAt })).toEqual({
      closesAt: "The call must close after it opens",
    });
  });

  it("refuses a wall time the clocks skip, an unreal date and an unknown zone", () => {
    // Lisbon clocks go from 01:00 to 02:00 on 30 March 2025 (last Sunday of March, EU Directive 2000/84/EC).
    expect(fieldMessages({ ...valid, opensAt: "2025-03-30T01:30" }).opensAt).toMatch(
      /does not exist in Europe\/Lisbon/,
    );
    expect(fieldMessages({ ...valid, opensAt: "2025-02-30T09:00" }).opensAt).toBe(
      "That is not a real date",
    );
    expect(fieldMessages({ ...valid, timeZone: "Lanternfield/Harbour" }).timeZone).toBe(
      "Choose a time zone from the list",
    );
    expect(fieldMessages({ ...valid, opensAt: "" }).opensAt).toBe("Give the opening date and time");
  });

  it("needs a theme, a brief, a kind, an ink and the rights", () => {
    const messages = fieldMessages({
      ...valid,
      theme: "",
      brief: "short",
      allowedKinds: [],
      allowedInks: [],
      rightsAsked: "",
    });
    expect(messages).toMatchObject({
      theme: "Give the call a theme",
      brief: "Write a brief of at least a sentence or two",
      allowedKinds: "Allow at least one kind of piece",
      allowedInks: "Allow at least one ink",
      rightsAsked: "Say which rights you ask for and when they return",
    });
  });

  it("checks the fee and the share as exact amounts", () => {
    expect(fieldMessages({ ...valid, fee: "0" }).fee).toBe(
      "A fee must be more than zero, or choose no fee",
    );
    expect(fieldMessages({ ...valid, fee: "twenty" }).fee).toBe(
      "Write the fee as an amount, e.g. 25 or 25.00",
    );
    expect(fieldMessages({ ...valid, fee: "12.345" }).fee).toMatch(/amount/);
    expect(fieldMessages({ ...valid, feeKind: "none", fee: "whatever" })).toEqual({});
    expect(fieldMessages({ ...valid, salesSharePercent: "100.5" }).salesSharePercent).toBe(
      "A share cannot be more than 100 %",
    );
    expect(fieldMessages({ ...valid, salesSharePercent: "-1" }).salesSharePercent).toMatch(
      /percentage/,
    );
    expect(percentToBasisPoints("12.5")).toBe(1250);
    expect(percentToBasisPoints("7.25")).toBe(725);
    expect(percentToBasisPoints("0")).toBe(0);
  });

  it("keeps inks to the anthology's and runs to the booklet's length", () => {
    expect(
      fieldMessages({ ...valid, allowedInks: ["black", "fluorescent pink"] }).allowedInks,
    ).toBe("fluorescent pink is not among the anthology's inks (black, teal)");
    expect(fieldMessages({ ...valid, maxRunPages: "48" }).maxRunPages).toBe(
      "The booklet has at most 40 pages",
    );
    expect(fieldMessages({ ...valid, allowedKinds: ["single", "single"] }).allowedKinds).toBe(
      "Each kind once",
    );
    // Without the anthology, the shared schema only checks the shape.
    expect(callInputSchema.safeParse({ ...valid, allowedInks: ["fluorescent pink"] }).success).toBe(
      true,
    );
  });

  it("gives the form back the values it was saved from", () => {
    const parsed = callSchemaFor(almanac).parse(valid);
    const again = callInputFromRecord(callRecordFromInput(parsed, almanac.inks));
    expect(again).toMatchObject({
      opensAt: "2025-07-01T09:00",
      closesAt: "2025-07-28T23:59",
      fee: "25.00",
      salesSharePercent: "10",
      allowedInks: ["black", "teal"],
    });
    expect(callSchemaFor(almanac).parse(again)).toEqual({
      ...parsed,
      fee: "25.00",
      allowedInks: ["black", "teal"],
    });
  });

  it("offers defaults that only need a theme and a brief", () => {
    const defaults = newCallDefaults(almanac, new Date("2025-05-20T12:00:00Z"), "America/Halifax");
    expect(defaults).toMatchObject({
      opensAt: "2025-05-21T09:00",
      closesAt: "2025-06-18T23:59",
      allowedInks: ["black", "teal"],
      feeKind: "none",
    });
    expect(fieldMessages(defaults)).toEqual({
      theme: "Give the call a theme",
      brief: "Write a brief of at least a sentence or two",
    });
    const record = callRecordFromInput(
      callSchemaFor(almanac).parse({
        ...defaults,
        theme: "Salt",
        brief: "Anything about salt, salt marsh and salt air.",
      }),
    );
    expect(termsOf(record)).toEqual(DEFAULT_TERMS);
  });

  it("names the terms that changed", () => {
    expect(changedTerms(DEFAULT_TERMS, DEFAULT_TERMS)).toEqual([]);
    expect(
      changedTerms(DEFAULT_TERMS, { ...DEFAULT_TERMS, feeKind: "per-page", feeCents: 800 }),
    ).toEqual(["fee"]);
    expect(
      changedTerms(DEFAULT_TERMS, {
        ...DEFAULT_TERMS,
        salesShareBasisPoints: 500,
        contributorCopies: 3,
      }),
    ).toEqual(["share of sales", "contributor copies"]);
  });

  it("accepts only real stages to move to", () => {
    expect(stageMoveSchema.safeParse({ to: "call-open" }).success).toBe(true);
    expect(stageMoveSchema.safeParse({ to: "opened" }).success).toBe(false);
  });
});
