/**
 * The link a contributor follows to approve their credit line. The token is its own key (the
 * page works signed out), so it is signed: HMAC-SHA256 (RFC 2104, FIPS 198-1) with the app's
 * secret over the piece id, the time the request was made and a hash of the credit line as it
 * was when the mail went out. A changed line, an approval since, or age makes it no longer good;
 * nothing about the piece is stored for the token beyond `piece.credit_requested_at`.
 *
 * Pure: the caller passes the secret and the piece's current state.
 */
import { createHash, createHmac, timingSafeEqual } from "node:crypto";

/** How long a request link stays good: 30 days (common practice for such links, no source). */
export const CREDIT_TOKEN_TTL_MS = 30 * 24 * 60 * 60 * 1000;

const VERSION = "c1";
const PURPOSE = "quireline credit approval";

/** A short hash of a credit line: 96 bits of SHA-256 (FIPS 180-4), base64url. */
export function creditLineHash(creditLine: string): string {
  return createHash("sha256").update(creditLine, "utf8").digest("base64url").slice(0, 16);
}

function signature(secret: string, pieceId: number, requestedAtMs: number, lineHash: string) {
  return createHmac("sha256", secret)
    .update(`${PURPOSE}|${pieceId}|${requestedAtMs}|${lineHash}`, "utf8")
    .digest("base64url");
}

function assertSecret(secret: string) {
  if (secret.length < 16) throw new Error("the signing secret must be at least 16 characters");
}

/** The token for one request: "c1.<piece>.<requested at, base 36 ms>.<line hash>.<signature>". */
export function signCreditToken(
  input: { pieceId: number; creditLine: string; requestedAt: Date },
  secret: string,
): string {
  assertSecret(secret);
  const ms = input.requestedAt.getTime();
  if (!Number.isSafeInteger(input.pieceId) || input.pieceId <= 0 || !Number.isFinite(ms))
    throw new Error("a credit token needs a piece id and a request time");
  const lineHash = creditLineHash(input.creditLine);
  return [
    VERSION,
    input.pieceId,
    ms.toString(36),
    lineHash,
    signature(secret, input.pieceId, ms, lineHash),
  ].join(".");
}

/** What a genuine token says. */
export interface CreditTokenClaims {
  pieceId: number;
  requestedAt: Date;
  lineHash: string;
}

const SHAPE =
  /^c1\.([1-9][0-9]{0,15})\.([0-9a-z]{1,12})\.([A-Za-z0-9_-]{16})\.([A-Za-z0-9_-]{43})$/;

/** The claims of a token signed with `secret`, or null for anything else (malformed, forged, cut short). */
export function readCreditToken(token: string, secret: string): CreditTokenClaims | null {
  assertSecret(secret);
  const match = SHAPE.exec(token);
  if (!match) return null;
  const [, idText, msText, lineHash, given] = match as unknown as [
    string,
    string,
    string,
    string,
    string,
  ];
  const pieceId = Number(idText);
  const ms = parseInt(msText, 36);
  if (!Number.isSafeInteger(pieceId) || !Number.isSafeInteger(ms)) return null;
  const expected = Buffer.from(signature(secret, pieceId, ms, lineHash));
  const actual = Buffer.from(given);
  if (expected.length !== actual.length || !timingSafeEqual(expected, actual)) return null;
  return { pieceId, requestedAt: new Date(ms), lineHash };
}

/** The piece as it stands now, for judging a token. */
export interface CreditState {
  creditLine: string;
  creditApprovedAt: Date | null;
  creditRequestedAt: Date | null;
}

/**
 * Whether a genuine token may still approve: "approved" (done already, by this link or another),
 * "changed" (the line changed since the mail, or the request was withdrawn), "expired" (older than
 * the TTL), else "good". An earlier mail for the same line stays good while the request is open,
 * so asking again does not strand a contributor who opens the first mail.
 */
export type CreditTokenState = "good" | "approved" | "changed" | "expired";

export function creditTokenState(
  claims: CreditTokenClaims,
  piece: CreditState,
  now: Date,
  ttlMs: number = CREDIT_TOKEN_TTL_MS,
): CreditTokenState {
  if (piece.creditApprovedAt !== null) return "approved";
  if (creditLineHash(piece.creditLine) !== claims.lineHash) return "changed";
  if (
    piece.creditRequestedAt === null ||
    piece.creditRequestedAt.getTime() < claims.requestedAt.getTime()
  )
    return "changed";
  if (now.getTime() - claims.requestedAt.getTime() > ttlMs) return "expired";
  return "good";
}

/** Plain words for each state a link can be in (the page shows them). */
export const CREDIT_TOKEN_MESSAGES: Record<Exclude<CreditTokenState, "good"> | "invalid", string> =
  {
    invalid:
      "This link is not one we sent, or it was cut short when it was copied. Open the link from the e-mail again, or ask the editors for a new one.",
    approved: "This credit line is already approved. There is nothing more to do.",
    changed:
      "The credit line changed after this e-mail was sent, so this link no longer applies. A newer e-mail has the line as it stands now; or ask the editors.",
    expired:
      "This link has expired (links last 30 days). Ask the editors to send a new one; nothing was changed.",
  };
