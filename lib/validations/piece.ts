import { z } from "zod";
import { PIECE_KINDS, type PieceKind } from "@/lib/domain";
import { INK_NAME_MAX, INKS_MAX, LENGTH, TEXT_CAP } from "./limits";
import { multiLineText, singleLineText } from "./text";
import { creditLineField } from "./credits";

/** What an open call allows a piece to be; the form and the route handler check against it. */
export type CallRules = { allowedKinds: PieceKind[]; maxRunPages: number; allowedInks: string[] };

/** The most pages any run may have, whatever a call says (a booklet page count cap). */
export const MAX_PIECE_PAGES = 64;

const pieceFields = z.object({
  title: singleLineText(LENGTH.pieceTitle).min(1, "Give the piece a title"),
  kind: z.enum(PIECE_KINDS, { error: "Choose what kind of piece this is" }),
  pageCount: z.coerce
    .number({ error: "Page count must be a number" })
    .int("Whole pages only")
    .min(1, "At least one page")
    .max(MAX_PIECE_PAGES, `At most ${MAX_PIECE_PAGES} pages`),
  inks: z
    .array(singleLineText(INK_NAME_MAX).min(1))
    .max(INKS_MAX, `At most ${INKS_MAX} inks`)
    .default([]),
  creditLine: singleLineText(LENGTH.creditLine).min(
    2,
    "Say how your name should appear in the credits",
  ),
  statement: multiLineText(TEXT_CAP.pieceStatement).optional().default(""),
  altTexts: z
    .array(multiLineText(TEXT_CAP.altText))
    .max(MAX_PIECE_PAGES, `At most ${MAX_PIECE_PAGES} page descriptions`)
    .default([]),
});

/** The piece form's shape without any call's rules (for types and the first parse). */
export const pieceInputSchema = pieceFields;
export type PieceInput = z.input<typeof pieceFields>;
export type PieceParsed = z.output<typeof pieceFields>;

/** The pages a kind of piece has: a single page, a spread of two, a run of 2 up to the call's limit. */
export function pageCountRange(kind: PieceKind, maxRunPages: number): { min: number; max: number } {
  if (kind === "single") return { min: 1, max: 1 };
  if (kind === "spread") return { min: 2, max: 2 };
  return { min: 2, max: Math.max(2, Math.min(maxRunPages, MAX_PIECE_PAGES)) };
}

/** Problems with a parsed piece against a call's rules, keyed by field. Empty when it fits. */
export function pieceProblems(
  piece: PieceParsed,
  rules: CallRules,
): { path: string; message: string }[] {
  const out: { path: string; message: string }[] = [];
  if (!rules.allowedKinds.includes(piece.kind)) {
    out.push({ path: "kind", message: "This call does not take that kind of piece" });
  } else {
    const range = pageCountRange(piece.kind, rules.maxRunPages);
    if (piece.pageCount < range.min || piece.pageCount > range.max) {
      out.push({
        path: "pageCount",
        message:
          range.min === range.max
            ? `This kind of piece has ${range.min} page${range.min > 1 ? "s" : ""}`
            : `A run has ${range.min} to ${range.max} pages in this call`,
      });
    }
  }
  const allowed = new Map(rules.allowedInks.map((ink) => [ink.toLowerCase(), ink]));
  const unknown = piece.inks.filter((ink) => !allowed.has(ink.toLowerCase()));
  if (unknown.length > 0) {
    out.push({
      path: "inks",
      message: `This call prints in ${rules.allowedInks.join(", ") || "process colour"}; ${unknown.join(", ")} is not one of them`,
    });
  } else if (new Set(piece.inks.map((i) => i.toLowerCase())).size !== piece.inks.length) {
    out.push({ path: "inks", message: "Each ink once" });
  } else if (rules.allowedInks.length > 0 && piece.inks.length === 0) {
    out.push({ path: "inks", message: "Tick the inks your piece uses" });
  }
  if (piece.altTexts.length > piece.pageCount) {
    out.push({ path: "altTexts", message: "One description per page at most" });
  }
  return out;
}

/** The schema the form and the route handler use for one call: fields plus that call's rules. */
export function pieceSchemaFor(rules: CallRules) {
  return pieceFields.superRefine((piece, ctx) => {
    for (const problem of pieceProblems(piece, rules)) {
      ctx.addIssue({ code: "custom", path: [problem.path], message: problem.message });
    }
  });
}

/** The contributor's actions on their own piece. */
export const pieceActionSchema = z.discriminatedUnion("action", [
  z.object({
    action: z.literal("withdraw"),
    reason: multiLineText(TEXT_CAP.withdrawReason).optional(),
  }),
  z.object({
    action: z.literal("use-version"),
    pageIndex: z.number().int().min(1),
    versionId: z.number().int().positive(),
    expectedRevision: z.number().int().min(0),
  }),
  z.object({
    action: z.literal("alt-text"),
    pageIndex: z.number().int().min(1),
    altText: multiLineText(TEXT_CAP.altText),
  }),
  z.object({ action: z.literal("credit-line"), creditLine: creditLineField }),
]);
export type PieceAction = z.infer<typeof pieceActionSchema>;

/** What the upload route accepts with each file. */
export const artworkUploadInputSchema = z.object({
  pieceId: z.number().int().positive(),
  pageIndex: z.number().int().min(1).max(MAX_PIECE_PAGES),
  /** The page revision the contributor's screen showed; a stale one means another tab replaced it. */
  expectedRevision: z.number().int().min(0),
  /**
   * The ink this file is the separation (master) for, on a duplicator piece in two or more inks;
   * absent for a page's composite file. The revision is then that separation's.
   */
  ink: z.string().trim().min(1).max(INK_NAME_MAX).optional(),
});
export type ArtworkUploadInput = z.infer<typeof artworkUploadInputSchema>;
