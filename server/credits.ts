import "server-only";
import type { Anthology } from "@/db/queries/anthologies";
import {
  approveCreditLine,
  findCreditPiece,
  listIssueCredits,
  markCreditRequested,
  undoCreditRequest,
  writeCreditLine,
  type CreditRow,
} from "@/db/queries/credits";
import { readMapState } from "@/db/queries/page-map";
import {
  CREDIT_TOKEN_MESSAGES,
  CREDIT_TOKEN_TTL_MS,
  creditTokenState,
  readCreditToken,
  signCreditToken,
  type CreditTokenState,
} from "@/lib/credits/token";
import { env } from "@/lib/env";
import { creditRequestMail } from "@/lib/mail/templates/credit-request";
import { piecePages } from "@/lib/map/state";
import { personLabel } from "@/lib/people";
import {
  colophonContent,
  creditsContent,
  linesPerPage,
  reservedTextPages,
  type ReservedTextPages,
} from "@/lib/print/credits";
import { Refusal } from "@/lib/refusal";
import type { CreditRowView, CreditsAnswer } from "@/lib/wire/credits";
import { appUrl, sendLoggedMail } from "@/server/mail";

/**
 * Credit approval: asking contributors by e-mail, the signed link that approves, changes that ask
 * again, and the editors' view with the credits page and colophon as they would print.
 */

const TTL_DAYS = Math.round(CREDIT_TOKEN_TTL_MS / 86_400_000);

/** The app's signing secret (the one Auth.js uses); a missing one is a set-up error. */
function secret(): string {
  const value = env().AUTH_SECRET;
  if (!value) throw new Error("AUTH_SECRET is not set: credit links cannot be signed.");
  return value;
}

/** The approval page a request mail links to. */
export function creditLink(row: Pick<CreditRow, "pieceId" | "creditLine">, requestedAt: Date) {
  return appUrl(
    `/credits/${signCreditToken({ pieceId: row.pieceId, creditLine: row.creditLine, requestedAt }, secret())}`,
  );
}

function inIssue(row: Pick<CreditRow, "status" | "leftOut">): boolean {
  return row.status === "accepted" && !row.leftOut;
}

type AskOutcome = "asked" | "failed" | "skipped";

/** Asks one contributor to approve one line: records the request, mails the link (once per request). */
async function askOne(row: CreditRow, anthologyTitle: string, again: boolean): Promise<AskOutcome> {
  if (row.creditApprovedAt !== null || !inIssue(row) || !row.contributorEmail) return "skipped";
  const at = new Date();
  if (!(await markCreditRequested(row.pieceId, at))) return "skipped";
  const mail = creditRequestMail({
    anthologyTitle,
    greeting: personLabel(
      { name: row.contributorName, email: row.contributorEmail },
      { mayShowEmail: false, unnamed: "there" },
    ),
    pieceTitle: row.title,
    creditLine: row.creditLine,
    link: creditLink(row, at),
    days: TTL_DAYS,
    again,
  });
  const outcome = await sendLoggedMail(
    {
      anthologyId: row.anthologyId,
      pieceId: row.pieceId,
      kind: "credit-request",
      to: row.contributorEmail,
      dedupeKey: `credit-request:${row.pieceId}:${at.getTime()}`,
    },
    mail,
  );
  if (outcome.sent || outcome.duplicate) return "asked";
  // The mail did not go: the screen should not say the contributor was asked.
  await undoCreditRequest(row.pieceId, at, row.creditRequestedAt);
  return "failed";
}

/** Asks every outstanding piece of the issue, or the pieces named (those in the issue, not approved). */
export async function askForCredits(
  anthology: Anthology,
  which: "outstanding" | number[],
): Promise<{ asked: number; failed: number; skipped: number }> {
  const rows = await listIssueCredits(anthology.id);
  const wanted =
    which === "outstanding"
      ? rows.filter((r) => r.creditApprovedAt === null)
      : rows.filter((r) => which.includes(r.pieceId));
  const answer = {
    asked: 0,
    failed: 0,
    skipped: which === "outstanding" ? 0 : which.length - wanted.length,
  };
  for (const row of wanted) answer[await askOne(row, anthology.title, false)]++;
  return answer;
}

/**
 * Changes a piece's credit line (the contributor on their piece page, or an editor). A change
 * clears the approval; when the line had been approved or asked about and the piece is in the
 * issue, the contributor is asked again with the new wording.
 */
export async function changeCreditLine(
  pieceId: number,
  creditLine: string,
): Promise<{ changed: boolean; asked: boolean }> {
  const written = await writeCreditLine(pieceId, creditLine);
  if (!written) throw new Refusal(404, "There is no such piece.");
  if (!written.changed) return { changed: false, asked: false };
  const wasInProgress =
    written.before.creditApprovedAt !== null || written.before.creditRequestedAt !== null;
  const row = await findCreditPiece(pieceId);
  if (!row || !wasInProgress || !inIssue(row)) return { changed: true, asked: false };
  const outcome = await askOne(row, row.anthologyTitle, written.before.creditApprovedAt !== null);
  return { changed: true, asked: outcome === "asked" };
}

/** What a link shows: the state, and for a genuine link the anthology, piece and line. */
export type CreditLinkView =
  | { state: "invalid"; message: string }
  | {
      state: CreditTokenState;
      message: string | null;
      anthologyTitle: string;
      pieceTitle: string;
      creditLine: string;
      approvedAt: Date | null;
    };

/** Reads a link for the approval page; nothing is changed. */
export async function inspectCreditLink(token: string, now = new Date()): Promise<CreditLinkView> {
  const claims = readCreditToken(token, secret());
  const row = claims ? await findCreditPiece(claims.pieceId) : undefined;
  if (!claims || !row) return { state: "invalid", message: CREDIT_TOKEN_MESSAGES.invalid };
  // A piece no longer in the issue has nothing to approve; say so as for a changed line.
  const state = inIssue(row) ? creditTokenState(claims, row, now) : "changed";
  return {
    state,
    message: state === "good" ? null : CREDIT_TOKEN_MESSAGES[state],
    anthologyTitle: row.anthologyTitle,
    pieceTitle: row.title,
    creditLine: row.creditLine,
    approvedAt: row.creditApprovedAt,
  };
}

/**
 * Approves through a link, as the contributor wrote it (unchanged, or edited). A link that is no
 * longer good is refused with its plain message (409; 404 when it is not one we sent), and nothing
 * is written.
 */
export async function approveByLink(
  token: string,
  creditLine: string,
  now = new Date(),
): Promise<{ creditLine: string; approvedAt: Date }> {
  const claims = readCreditToken(token, secret());
  if (!claims) throw new Refusal(404, CREDIT_TOKEN_MESSAGES.invalid);
  const piece = await findCreditPiece(claims.pieceId);
  if (!piece) throw new Refusal(404, CREDIT_TOKEN_MESSAGES.invalid);
  if (!inIssue(piece)) throw new Refusal(409, CREDIT_TOKEN_MESSAGES.changed);
  // Stored to the second (credit_approved_at has no fraction), as the screens show it.
  const at = new Date(Math.floor(now.getTime() / 1000) * 1000);
  const verdict = await approveCreditLine(
    claims.pieceId,
    creditLine,
    (current) => creditTokenState(claims, current, now),
    at,
  );
  if (verdict === undefined) throw new Refusal(404, CREDIT_TOKEN_MESSAGES.invalid);
  if (verdict !== "good") throw new Refusal(409, CREDIT_TOKEN_MESSAGES[verdict]);
  return { creditLine, approvedAt: at };
}

/** The credits screen: each piece in the issue with its state, the counts, the preview and where it goes. */
export async function creditsOverview(
  anthology: Anthology,
  { mayShowEmail }: { mayShowEmail: boolean },
): Promise<CreditsAnswer> {
  const [rows, { state }] = await Promise.all([
    listIssueCredits(anthology.id),
    readMapState(anthology),
  ]);
  const where = piecePages(state);
  const views: CreditRowView[] = rows.map((r) => ({
    pieceId: r.pieceId,
    title: r.title,
    contributorName: personLabel(
      { name: r.contributorName, email: r.contributorEmail },
      { mayShowEmail },
    ),
    creditLine: r.creditLine,
    state: r.creditApprovedAt ? "approved" : r.creditRequestedAt ? "asked" : "not-asked",
    approvedAt: r.creditApprovedAt?.toISOString() ?? null,
    requestedAt: r.creditRequestedAt?.toISOString() ?? null,
    pages: (where.get(r.pieceId) ?? []).map((w) => w.page),
    hasAddress: Boolean(r.contributorEmail),
  }));
  const count = (s: CreditRowView["state"]) => views.filter((v) => v.state === s).length;
  const preview = creditsContent(
    state,
    rows.map((r) => ({
      pieceId: r.pieceId,
      title: r.title,
      creditLine: r.creditLine,
      approved: r.creditApprovedAt !== null,
    })),
  );
  const reserved = (kind: "credits" | "colophon") =>
    state.slots.filter((s) => s.reservation === kind).map((s) => s.page);
  return {
    rows: views,
    counts: {
      approved: count("approved"),
      asked: count("asked"),
      notAsked: count("not-asked"),
      outstanding: count("asked") + count("not-asked"),
    },
    preview: { page: preview.page, outstanding: preview.outstanding },
    colophon: colophonContent({
      ...anthology,
      copies: anthology.plannedCopies,
      year: new Date().getUTCFullYear(),
    }),
    reserved: { credits: reserved("credits"), colophon: reserved("colophon") },
  };
}

/**
 * For the print job: the type for the map's reserved "credits" and "colophon" pages, from the
 * approved credit lines as they stand now (unapproved lines never print). Give each
 * `pages[i].content` to the builder as that reader page's `PageContent`.
 */
export async function reservedTextPagesFor(
  anthology: Anthology,
  { copies = anthology.plannedCopies, year = new Date().getUTCFullYear() } = {},
): Promise<ReservedTextPages & { outstanding: number }> {
  const [rows, { state }] = await Promise.all([
    listIssueCredits(anthology.id),
    readMapState(anthology),
  ]);
  const credits = creditsContent(
    state,
    rows.map((r) => ({
      pieceId: r.pieceId,
      title: r.title,
      creditLine: r.creditLine,
      approved: r.creditApprovedAt !== null,
    })),
  );
  const colophon = colophonContent({ ...anthology, copies, year });
  return {
    ...reservedTextPages(
      state,
      { credits: credits.page, colophon },
      { maxLines: linesPerPage(anthology.trimHeightMm, anthology.safeMarginMm) },
    ),
    outstanding: credits.outstanding.length,
  };
}
