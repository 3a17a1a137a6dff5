import { z } from "zod";
import { PIECE_STATUSES, PIECE_STATUS_LABELS, type PieceStatus } from "@/lib/domain";
import { PIECE_VERDICTS } from "@/lib/pieces/verdict";
import { SEARCH_MAX, TEXT_CAP } from "./limits";
import { multiLineText, singleLineText } from "./text";

/** Columns of the submissions table the server can sort by; the table's column ids are these. */
export const SUBMISSION_SORTS = [
  "contributor",
  "title",
  "kind",
  "pages",
  "inks",
  "verdict",
  "status",
  "updated",
] as const;
export type SubmissionSort = (typeof SUBMISSION_SORTS)[number];

export const PAGE_SIZES = [10, 25, 50, 100] as const;

export const SUBMISSIONS_DEFAULTS = {
  page: 1,
  pageSize: 25,
  sort: "updated",
  dir: "desc",
} as const;

const listOf = <T extends readonly [string, ...string[]]>(values: T, noun: string) =>
  z
    .array(
      z.enum(values, {
        error: (issue) => `"${String(issue.input)}" is not a ${noun}; use ${values.join(", ")}`,
      }),
    )
    .max(values.length)
    .transform((list) => [...new Set(list)]);

/** The submissions table's query: paging, one sort column, a search and two multi-value filters. */
export const submissionsQuerySchema = z.object({
  page: z.coerce
    .number({ error: "page must be a number" })
    .int("page must be a whole number")
    .min(1, "page starts at 1")
    .default(1),
  pageSize: z.coerce
    .number({ error: "pageSize must be a number" })
    .int("pageSize must be a whole number")
    .min(1, "pageSize must be at least 1")
    .max(100, "pageSize must be at most 100")
    .default(SUBMISSIONS_DEFAULTS.pageSize),
  sort: z
    .enum(SUBMISSION_SORTS, { error: `sort must be one of ${SUBMISSION_SORTS.join(", ")}` })
    .default(SUBMISSIONS_DEFAULTS.sort),
  dir: z
    .enum(["asc", "desc"], { error: "dir must be asc or desc" })
    .default(SUBMISSIONS_DEFAULTS.dir),
  q: singleLineText(SEARCH_MAX).default(""),
  status: listOf(PIECE_STATUSES, "status").default([]),
  verdict: listOf(PIECE_VERDICTS, "verdict").default([]),
});
export type SubmissionsQuery = z.output<typeof submissionsQuerySchema>;

/**
 * Turns URL search params into the raw object the schema reads. Multi-value filters may repeat
 * (`status=a&status=b`) or be comma-separated (`status=a,b`); empty values are ignored.
 */
export function searchParamsToQueryInput(params: URLSearchParams): Record<string, unknown> {
  const single = (key: string) => {
    const value = params.get(key);
    return value === null || value === "" ? undefined : value;
  };
  const multi = (key: string) =>
    params
      .getAll(key)
      .flatMap((v) => v.split(","))
      .map((v) => v.trim())
      .filter(Boolean);
  return {
    page: single("page"),
    pageSize: single("pageSize"),
    sort: single("sort"),
    dir: single("dir"),
    q: params.get("q") ?? undefined,
    status: multi("status"),
    verdict: multi("verdict"),
  };
}

/** The URL search string for a query, leaving out values that equal the defaults. */
export function queryToSearchParams(query: SubmissionsQuery): URLSearchParams {
  const out = new URLSearchParams();
  if (query.q) out.set("q", query.q);
  if (query.status.length) out.set("status", query.status.join(","));
  if (query.verdict.length) out.set("verdict", query.verdict.join(","));
  if (query.sort !== SUBMISSIONS_DEFAULTS.sort || query.dir !== SUBMISSIONS_DEFAULTS.dir) {
    out.set("sort", query.sort);
    out.set("dir", query.dir);
  }
  if (query.pageSize !== SUBMISSIONS_DEFAULTS.pageSize) out.set("pageSize", String(query.pageSize));
  if (query.page !== 1) out.set("page", String(query.page));
  return out;
}

/** "Fix asked" must tell the contributor what to fix; other moves may carry an optional message. */
function requireFixMessage(v: { to: PieceStatus; message?: string }, ctx: z.RefinementCtx) {
  if (v.to === "fix-requested" && !v.message) {
    ctx.addIssue({
      code: "custom",
      path: ["message"],
      message: `Say what to fix: "${PIECE_STATUS_LABELS["fix-requested"]}" sends this message to the contributor`,
    });
  }
}

const optionalMessage = multiLineText(TEXT_CAP.statusMessage)
  .optional()
  .transform((m) => (m ? m : undefined));

const targetStatus = z.enum(PIECE_STATUSES, { error: "Choose a status" });

/** `true` once the editor has seen a warning (accepting a piece that cannot print) and goes ahead. */
const confirmFlag = z.boolean({ error: "confirm is true or false" }).default(false);

/** One piece: POST /api/pieces/[id]/status. `from` guards against a change someone made meanwhile. */
export const pieceStatusChangeSchema = z
  .object({
    to: targetStatus,
    message: optionalMessage,
    from: z.enum(PIECE_STATUSES).optional(),
    confirm: confirmFlag,
  })
  .superRefine(requireFixMessage);
export type PieceStatusChangeInput = z.input<typeof pieceStatusChangeSchema>;

/** Many pieces at once: POST /api/anthologies/[slug]/submissions/status. */
export const bulkStatusChangeSchema = z
  .object({
    pieceIds: z
      .array(z.number({ error: "Piece ids are numbers" }).int().positive(), {
        error: "Choose pieces",
      })
      .min(1, "Choose at least one piece")
      .max(200, "At most 200 pieces at once")
      .transform((ids) => [...new Set(ids)]),
    to: targetStatus,
    message: optionalMessage,
    confirm: confirmFlag,
  })
  .superRefine(requireFixMessage);
export type BulkStatusChangeInput = z.input<typeof bulkStatusChangeSchema>;

/** The signed-in editor's own notice setting: PUT /api/anthologies/[slug]/notifications. */
export const notificationSettingsSchema = z.object({
  newPieces: z.boolean({ error: "newPieces is true or false" }),
});
export type NotificationSettingsInput = z.input<typeof notificationSettingsSchema>;

/** An editors' note on a piece. */
export const editorNoteSchema = z.object({
  body: multiLineText(TEXT_CAP.editorNote).min(1, "Write the note first"),
});
export type EditorNoteInput = z.input<typeof editorNoteSchema>;
