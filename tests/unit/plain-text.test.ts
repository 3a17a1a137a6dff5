// Free text is stored only when it is plain text: no NUL, no other invisible control characters
// (multi-line fields keep tab, line feed and carriage return), no lone surrogate (half of a UTF-16
// pair, which no UTF-8 column can hold as written). Each refusal is a message on the field.
import { describe, expect, it } from "vitest";
import type { z } from "zod";
import { emailLinkSchema, signUpSchema } from "@/lib/validations/account";
import { anthologyInputSchema, inviteSchema } from "@/lib/validations/anthology";
import { callInputSchema } from "@/lib/validations/call";
import { pieceActionSchema, pieceInputSchema } from "@/lib/validations/piece";
import {
  bulkStatusChangeSchema,
  editorNoteSchema,
  pieceStatusChangeSchema,
  submissionsQuerySchema,
} from "@/lib/validations/review";
import { multiLineText, singleLineText } from "@/lib/validations/text";

const NUL = "Remove the invisible control character (NUL) from this text.";
const LONE_SURROGATE = "This text has a broken character (a lone surrogate); retype it.";
const ONE_LINE = "Keep this on one line.";
const control = (name: string) =>
  `Remove the invisible control character (${name}) from this text.`;

/** The messages a parse gives for one dotted path (empty when that field is fine). */
function messagesAt(schema: z.ZodType, input: unknown, path = ""): string[] {
  const parsed = schema.safeParse(input);
  if (parsed.success) return [];
  return parsed.error.issues.filter((i) => i.path.join(".") === path).map((i) => i.message);
}

describe("the text rules themselves", () => {
  const line = singleLineText(200);
  const block = multiLineText(2000);

  it("refuse NUL (U+0000) anywhere, in one-line and multi-line text", () => {
    for (const text of ["\u0000", "Heron\u0000", "\u0000Heron", "He\u0000ron"]) {
      expect(messagesAt(line, text)).toEqual([NUL]);
      expect(messagesAt(block, text)).toEqual([NUL]);
    }
  });

  it("refuse a lone surrogate: a high half without its low half, or a low half alone", () => {
    // The Unicode Standard, ch. 3 (D91): a high surrogate U+D800..U+DBFF must be followed by a
    // low surrogate U+DC00..U+DFFF; either alone is ill-formed UTF-16.
    for (const text of [
      "\ud800",
      "Heron \ud800",
      "\ud83d and a fish",
      "\udc00",
      "x\udfff",
      "\udc1f\ud83d",
    ]) {
      expect(messagesAt(line, text), JSON.stringify(text)).toEqual([LONE_SURROGATE]);
      expect(messagesAt(block, text), JSON.stringify(text)).toEqual([LONE_SURROGATE]);
    }
  });

  it("keep a well-formed pair (U+1F41F FISH is \\ud83d\\udc1f) and other non-ASCII letters", () => {
    for (const text of ["\ud83d\udc1f", "Ørsted’s 🐟 Ærø", "Łódź", "東京の鷺", "Café"]) {
      expect(line.safeParse(text).success).toBe(true);
      expect(block.safeParse(text).success).toBe(true);
    }
  });

  it("multi-line text keeps tab, line feed and carriage return, and refuses other C0 controls and DEL", () => {
    expect(block.parse("Dear Ada,\r\n\tthe heron is lovely.\nBest")).toBe(
      "Dear Ada,\r\n\tthe heron is lovely.\nBest",
    );
    expect(messagesAt(block, "bell\u0007")).toEqual([control("U+0007")]);
    expect(messagesAt(block, "escape\u001b[31m")).toEqual([control("U+001B")]);
    expect(messagesAt(block, "delete\u007f")).toEqual([control("U+007F")]);
  });

  it("one-line text refuses line breaks and tabs as well", () => {
    expect(messagesAt(line, "Heron\nStreet")).toEqual([ONE_LINE]);
    expect(messagesAt(line, "Heron\rStreet")).toEqual([ONE_LINE]);
    expect(messagesAt(line, "Heron\tStreet")).toEqual([control("tab")]);
    expect(messagesAt(line, "bell\u0007")).toEqual([control("U+0007")]);
    // Leading and trailing white space (line breaks too) is trimmed, not refused.
    expect(line.parse("  Heron Street\n")).toBe("Heron Street");
  });

  it("report each kind of problem once", () => {
    expect(messagesAt(block, "\u0000\u0000\ud800\u0007\u0007")).toEqual([
      NUL,
      LONE_SURROGATE,
      control("U+0007"),
    ]);
  });
});

describe("every free-text field of the shared schemas uses them", () => {
  const signUp = { name: "Wren Halloway", email: "wren@example.org", password: "tidepool2031" };
  const anthology = {
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
  const call = {
    theme: "What the tide leaves",
    brief: "Send drawings of what the water leaves behind on the mudflats.",
    opensAt: "2025-07-01T09:00",
    closesAt: "2025-07-28T23:59",
    timeZone: "Europe/Lisbon",
    allowedKinds: ["single"],
    maxRunPages: "4",
    piecesPerPerson: "2",
    allowedInks: ["black"],
    feeKind: "none",
    contributorCopies: "2",
    rightsAsked: "First printing rights for this edition; all rights return to you after printing.",
  };
  const piece = {
    title: "Heron",
    kind: "single",
    pageCount: 1,
    inks: ["black"],
    creditLine: "Bea Marsh",
    statement: "",
    altTexts: [],
  };

  /** [family and field, schema, input with the text in place, path of the field]. */
  const fields: [string, z.ZodType, (text: string) => unknown, string][] = [
    ["account: name", signUpSchema, (name) => ({ ...signUp, name }), "name"],
    [
      "account: e-mail",
      signUpSchema,
      (t) => ({ ...signUp, email: `wren${t}@example.org` }),
      "email",
    ],
    ["account: e-mail link", emailLinkSchema, (t) => ({ email: `wren${t}@example.org` }), "email"],
    [
      "anthology: title",
      anthologyInputSchema,
      (title) => ({ ...anthology, title: `Salt ${title}` }),
      "title",
    ],
    [
      "anthology: press name",
      anthologyInputSchema,
      (pressName) => ({ ...anthology, pressName }),
      "pressName",
    ],
    [
      "anthology: summary",
      anthologyInputSchema,
      (summary) => ({ ...anthology, summary }),
      "summary",
    ],
    [
      "anthology: an ink",
      anthologyInputSchema,
      (ink) => ({ ...anthology, inks: [`teal${ink}`] }),
      "inks.0",
    ],
    [
      "anthology: invitation e-mail",
      inviteSchema,
      (t) => ({ email: `ada${t}@example.org`, role: "editor" }),
      "email",
    ],
    ["call: theme", callInputSchema, (theme) => ({ ...call, theme: `Tide ${theme}` }), "theme"],
    [
      "call: brief",
      callInputSchema,
      (brief) => ({ ...call, brief: `${call.brief}${brief}` }),
      "brief",
    ],
    [
      "call: rights",
      callInputSchema,
      (r) => ({ ...call, rightsAsked: `${call.rightsAsked}${r}` }),
      "rightsAsked",
    ],
    [
      "call: an ink",
      callInputSchema,
      (ink) => ({ ...call, allowedInks: [`black${ink}`] }),
      "allowedInks.0",
    ],
    ["piece: title", pieceInputSchema, (title) => ({ ...piece, title: `Heron ${title}` }), "title"],
    [
      "piece: credit line",
      pieceInputSchema,
      (c) => ({ ...piece, creditLine: `Bea ${c}` }),
      "creditLine",
    ],
    ["piece: statement", pieceInputSchema, (statement) => ({ ...piece, statement }), "statement"],
    ["piece: an ink", pieceInputSchema, (ink) => ({ ...piece, inks: [`black${ink}`] }), "inks.0"],
    [
      "piece: a page description",
      pieceInputSchema,
      (alt) => ({ ...piece, altTexts: [alt] }),
      "altTexts.0",
    ],
    [
      "piece: description later",
      pieceActionSchema,
      (altText) => ({ action: "alt-text", pageIndex: 1, altText }),
      "altText",
    ],
    [
      "piece: withdraw reason",
      pieceActionSchema,
      (reason) => ({ action: "withdraw", reason }),
      "reason",
    ],
    [
      "review: status message",
      pieceStatusChangeSchema,
      (m) => ({ to: "declined", message: `No ${m}` }),
      "message",
    ],
    [
      "review: bulk message",
      bulkStatusChangeSchema,
      (m) => ({ pieceIds: [1], to: "declined", message: `No ${m}` }),
      "message",
    ],
    ["review: note", editorNoteSchema, (body) => ({ body: `Lovely ${body}` }), "body"],
    ["review: search", submissionsQuerySchema, (q) => ({ q: `heron${q}` }), "q"],
  ];

  for (const [name, schema, input, path] of fields) {
    it(`${name}: refuses "\\u0000" and "\\ud800" with a message on ${path}, takes plain text`, () => {
      expect(messagesAt(schema, input("\u0000"), path)).toContain(NUL);
      expect(messagesAt(schema, input("\ud800"), path)).toContain(LONE_SURROGATE);
      expect(messagesAt(schema, input("ok"), path)).toEqual([]);
    });
  }
});
