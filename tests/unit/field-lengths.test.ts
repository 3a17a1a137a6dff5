// Every text field of the shared schemas fits the column it is stored in: a value one over the
// column's length is refused with a field message, a value at the length is accepted. The
// varchar lengths are read from db/schema.ts itself, so a test here fails if the two drift.
import { describe, expect, it } from "vitest";
import type { z } from "zod";
import {
  anthologies,
  calls,
  editorNotes,
  invitations,
  pieceEvents,
  piecePages,
  pieces,
  users,
} from "@/db/schema";
import { emailLinkSchema, signInSchema, signUpSchema } from "@/lib/validations/account";
import { anthologyInputSchema, inviteSchema } from "@/lib/validations/anthology";
import { callInputSchema } from "@/lib/validations/call";
import { pieceActionSchema, pieceInputSchema } from "@/lib/validations/piece";
import {
  bulkStatusChangeSchema,
  editorNoteSchema,
  pieceStatusChangeSchema,
} from "@/lib/validations/review";

type Column = { getSQLType(): string; length?: number };

/** The messages a parse gives for one dotted path (empty when that field is fine). */
function messagesAt(schema: z.ZodType, input: unknown, path: string): string[] {
  const parsed = schema.safeParse(input);
  if (parsed.success) return [];
  return parsed.error.issues.filter((i) => i.path.join(".") === path).map((i) => i.message);
}

const letters = (n: number) => "a".repeat(n);
const emailOfLength = (n: number) => `${letters(n - "@example.org".length)}@example.org`;
const atMost = (n: number) => `At most ${n.toLocaleString("en-US")} characters`;

/** A field stored in a varchar(n) column: n characters fit, n + 1 do not. */
type VarcharCase = {
  name: string;
  schema: z.ZodType;
  input: (value: string) => unknown;
  path: string;
  column: Column;
  value?: (length: number) => string;
  /** False when no value of exactly the column's length can be valid (a time zone name). */
  acceptsAtLength?: boolean;
};

function checkVarchar(c: VarcharCase) {
  it(`${c.name}: varchar(${c.column.length}) — one over is refused, at the length accepted`, () => {
    const length = c.column.length!;
    expect(c.column.getSQLType()).toBe(`varchar(${length})`);
    const make = c.value ?? letters;
    expect(messagesAt(c.schema, c.input(make(length + 1)), c.path)).toContain(atMost(length));
    if (c.acceptsAtLength !== false) {
      const parsed = c.schema.safeParse(c.input(make(length)));
      expect(parsed.error?.issues ?? []).toEqual([]);
    }
  });
}

/**
 * A field stored in a MariaDB `text` column, which holds 65,535 bytes: utf8mb4 takes up to 4
 * bytes a character, so a cap of at most 16,383 characters always fits (MariaDB Knowledge Base,
 * "TEXT": "A TEXT column with a maximum length of 65,535 (2^16 - 1) characters. The effective
 * maximum length is less if the value contains multi-byte characters").
 */
type TextCase = {
  name: string;
  schema: z.ZodType;
  input: (value: string) => unknown;
  path: string;
  column: Column;
  cap: number;
};

function checkText(c: TextCase) {
  it(`${c.name}: text column, capped at ${c.cap} characters`, () => {
    expect(c.column.getSQLType()).toBe("text");
    expect(c.cap * 4).toBeLessThanOrEqual(65_535);
    expect(messagesAt(c.schema, c.input(letters(c.cap + 1)), c.path)).toContain(atMost(c.cap));
    const parsed = c.schema.safeParse(c.input(letters(c.cap)));
    expect(parsed.error?.issues ?? []).toEqual([]);
  });
}

describe("account", () => {
  const signUp = { name: "Wren Halloway", email: "wren@example.org", password: "tidepool2031" };
  checkVarchar({
    name: "sign-up name",
    schema: signUpSchema,
    input: (name) => ({ ...signUp, name }),
    path: "name",
    column: users.name,
  });
  for (const [name, schema, base] of [
    ["sign-up e-mail", signUpSchema, signUp],
    ["sign-in e-mail", signInSchema, { email: "", password: "anything" }],
    ["e-mail link", emailLinkSchema, { email: "" }],
  ] as const) {
    checkVarchar({
      name,
      schema,
      input: (email) => ({ ...base, email }),
      path: "email",
      column: users.email,
      value: emailOfLength,
    });
  }
});

describe("anthology", () => {
  const base = {
    title: "Salt and Static",
    trimChoice: "half-letter",
    unit: "in",
    bleed: 0.125,
    safeMargin: 0.25,
    binding: "saddle-stitch",
    pageCountTarget: 24,
    maxPages: 48,
    coverStock: "self",
    paperGsm: 90,
    printMethod: "duplicator",
    inks: ["black", "teal"],
    minPpi: 300,
  };
  const anthology = (patch: Record<string, unknown>) => ({ ...base, ...patch });
  checkVarchar({
    name: "title",
    schema: anthologyInputSchema,
    input: (title) => anthology({ title }),
    path: "title",
    column: anthologies.title,
  });
  checkVarchar({
    name: "press name",
    schema: anthologyInputSchema,
    input: (pressName) => anthology({ pressName }),
    path: "pressName",
    column: anthologies.pressName,
  });
  checkText({
    name: "summary",
    schema: anthologyInputSchema,
    input: (summary) => anthology({ summary }),
    path: "summary",
    column: anthologies.summary,
    cap: 2000,
  });
  checkVarchar({
    name: "invitation e-mail",
    schema: inviteSchema,
    input: (email) => ({ email, role: "contributor" }),
    path: "email",
    column: invitations.email,
    value: emailOfLength,
  });

  it("inks (a json list): each name at most 40 characters, at most 8 names", () => {
    expect(messagesAt(anthologyInputSchema, anthology({ inks: [letters(41)] }), "inks.0")).toEqual([
      atMost(40),
    ]);
    expect(anthologyInputSchema.safeParse(anthology({ inks: [letters(40)] })).success).toBe(true);
    const nine = Array.from({ length: 9 }, (_, i) => `ink ${i + 1}`);
    expect(messagesAt(anthologyInputSchema, anthology({ inks: nine }), "inks")).toEqual([
      "At most 8 inks",
    ]);
    expect(anthologyInputSchema.safeParse(anthology({ inks: nine.slice(0, 8) })).success).toBe(
      true,
    );
  });
});

describe("open call", () => {
  const valid = {
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
  const call = (patch: Record<string, unknown>) => ({ ...valid, ...patch });
  checkVarchar({
    name: "theme",
    schema: callInputSchema,
    input: (theme) => call({ theme }),
    path: "theme",
    column: calls.theme,
  });
  checkVarchar({
    name: "time zone",
    schema: callInputSchema,
    input: (timeZone) => call({ timeZone }),
    path: "timeZone",
    column: calls.timeZone,
    acceptsAtLength: false,
  });
  checkText({
    name: "brief",
    schema: callInputSchema,
    input: (brief) => call({ brief }),
    path: "brief",
    column: calls.brief,
    cap: 10_000,
  });
  checkText({
    name: "rights asked",
    schema: callInputSchema,
    input: (rightsAsked) => call({ rightsAsked }),
    path: "rightsAsked",
    column: calls.rightsAsked,
    cap: 4000,
  });

  it("allowed inks (a json list): each name at most 40 characters, at most 8 names", () => {
    expect(
      messagesAt(callInputSchema, call({ allowedInks: [letters(41)] }), "allowedInks.0"),
    ).toEqual([atMost(40)]);
    const nine = Array.from({ length: 9 }, (_, i) => `ink ${i + 1}`);
    expect(messagesAt(callInputSchema, call({ allowedInks: nine }), "allowedInks")).toEqual([
      "At most 8 inks",
    ]);
    expect(callInputSchema.safeParse(call({ allowedInks: nine.slice(0, 8) })).success).toBe(true);
  });

  it("allowed kinds (a json list): each kind at most once, so at most 3 entries", () => {
    const four = ["single", "spread", "run", "single"];
    expect(messagesAt(callInputSchema, call({ allowedKinds: four }), "allowedKinds")).toContain(
      "At most 3 kinds",
    );
  });
});

describe("piece", () => {
  const base = {
    title: "Heron",
    kind: "single",
    pageCount: 1,
    inks: ["black"],
    creditLine: "Bea Marsh",
    statement: "",
    altTexts: [],
  };
  const piece = (patch: Record<string, unknown>) => ({ ...base, ...patch });
  checkVarchar({
    name: "title",
    schema: pieceInputSchema,
    input: (title) => piece({ title }),
    path: "title",
    column: pieces.title,
  });
  checkVarchar({
    name: "credit line",
    schema: pieceInputSchema,
    input: (creditLine) => piece({ creditLine }),
    path: "creditLine",
    column: pieces.creditLine,
  });
  checkText({
    name: "statement",
    schema: pieceInputSchema,
    input: (statement) => piece({ statement }),
    path: "statement",
    column: pieces.statement,
    cap: 1200,
  });
  checkText({
    name: "page description on the form",
    schema: pieceInputSchema,
    input: (altText) => piece({ altTexts: [altText] }),
    path: "altTexts.0",
    column: piecePages.altText,
    cap: 1000,
  });
  checkText({
    name: "page description changed later",
    schema: pieceActionSchema,
    input: (altText) => ({ action: "alt-text", pageIndex: 1, altText }),
    path: "altText",
    column: piecePages.altText,
    cap: 1000,
  });
  checkText({
    name: "reason for withdrawing (kept in the piece's history)",
    schema: pieceActionSchema,
    input: (reason) => ({ action: "withdraw", reason }),
    path: "reason",
    column: pieceEvents.message,
    cap: 500,
  });

  it("inks and page descriptions (json lists / one row a page) are counted", () => {
    expect(messagesAt(pieceInputSchema, piece({ inks: [letters(41)] }), "inks.0")).toEqual([
      atMost(40),
    ]);
    const nine = Array.from({ length: 9 }, (_, i) => `ink ${i + 1}`);
    expect(messagesAt(pieceInputSchema, piece({ inks: nine }), "inks")).toEqual(["At most 8 inks"]);
    const descriptions = (n: number) => Array.from({ length: n }, () => "A heron");
    expect(messagesAt(pieceInputSchema, piece({ altTexts: descriptions(65) }), "altTexts")).toEqual(
      ["At most 64 page descriptions"],
    );
    expect(pieceInputSchema.safeParse(piece({ altTexts: descriptions(64) })).success).toBe(true);
  });
});

describe("review", () => {
  checkText({
    name: "status message (one piece)",
    schema: pieceStatusChangeSchema,
    input: (message) => ({ to: "fix-requested", message }),
    path: "message",
    column: pieceEvents.message,
    cap: 2000,
  });
  checkText({
    name: "status message (many pieces)",
    schema: bulkStatusChangeSchema,
    input: (message) => ({ pieceIds: [1, 2], to: "declined", message }),
    path: "message",
    column: pieceEvents.message,
    cap: 2000,
  });
  checkText({
    name: "editors' note",
    schema: editorNoteSchema,
    input: (body) => ({ body }),
    path: "body",
    column: editorNotes.body,
    cap: 4000,
  });
});
