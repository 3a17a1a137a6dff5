/**
 * How long each stored text may be, in one place. db/schema.ts sizes its varchar columns from
 * LENGTH and the zod schemas in lib/validations cap their fields with LENGTH and TEXT_CAP, so a
 * field can never accept more than its column holds (MariaDB answers "Data too long" otherwise).
 *
 * zod's `.max()` counts UTF-16 code units; MariaDB's varchar(n) counts characters, and a
 * character is one or two code units, so a value within the cap always fits the column.
 */

/** varchar(n) columns the schemas write into: n characters. */
export const LENGTH = {
  email: 255,
  personName: 255,
  anthologyTitle: 200,
  pressName: 200,
  /** A press name, or "lead:" and the lead's user id when the anthology names no press. */
  pressKey: 255,
  callTheme: 200,
  /** IANA zone names are at most 30-odd characters; 64 leaves room. */
  timeZone: 64,
  pieceTitle: 200,
  creditLine: 200,
  saleLabel: 120,
  saleNote: 255,
  periodLabel: 80,
  paymentReference: 120,
} as const;

/**
 * MariaDB `text` holds 65,535 bytes (MariaDB Knowledge Base, "TEXT": "maximum length of 65,535
 * (2^16 - 1) characters. The effective maximum length is less if the value contains multi-byte
 * characters"). utf8mb4 takes up to 4 bytes a character, so 16,383 characters always fit.
 */
export const TEXT_COLUMN_MAX_CHARS = Math.floor(65_535 / 4);

/** Caps on the fields stored in `text` columns; each is at most TEXT_COLUMN_MAX_CHARS. */
export const TEXT_CAP = {
  anthologySummary: 2000,
  callBrief: 10_000,
  callRights: 4000,
  pieceStatement: 1200,
  altText: 1000,
  withdrawReason: 500,
  statusMessage: 2000,
  editorNote: 4000,
} as const satisfies Record<string, number>;

/** Ink names live in json lists (anthology inks, a call's inks, a piece's inks). */
export const INK_NAME_MAX = 40;
/** The most inks an anthology prints with, so the most any list of inks may hold. */
export const INKS_MAX = 8;

/** Not stored: the submissions table's search box. */
export const SEARCH_MAX = 200;
