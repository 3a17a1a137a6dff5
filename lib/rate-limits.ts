/**
 * How often each guarded action may be tried, and the words a refusal uses. Pure: the server's
 * limiter (server/rate-limit.ts) stores the counts; these are the rules.
 *
 * Sign-in counts failures only, so a person who types their password right is never slowed by
 * their own earlier successes; a success clears their account's count. The figures follow the
 * usual guidance of a small number of failures per account before a pause and a larger budget
 * per network address, which many people may share (from memory: OWASP Authentication Cheat
 * Sheet, "Login Throttling"; no figure there is normative).
 */

export interface LimitRule {
  /** Tries allowed in the window. */
  points: number;
  /** The window, in seconds. */
  durationSec: number;
  /** What the person was doing, for the refusal message. */
  doing: string;
}

export const LIMITS = {
  /** Wrong passwords for one account. */
  signInAccount: { points: 10, durationSec: 15 * 60, doing: "signing in" },
  /** Wrong passwords from one network address, over all accounts. */
  signInAddress: { points: 50, durationSec: 15 * 60, doing: "signing in" },
  /** New accounts from one network address. */
  signUpAddress: { points: 30, durationSec: 60 * 60, doing: "creating accounts" },
  /** Sign-in links sent to one e-mail address. */
  emailLinkAccount: { points: 5, durationSec: 60 * 60, doing: "asking for sign-in links" },
  /** Sign-in links asked for from one network address. */
  emailLinkAddress: { points: 40, durationSec: 60 * 60, doing: "asking for sign-in links" },
  /** Uploads started by one person. */
  uploadStart: { points: 120, durationSec: 10 * 60, doing: "starting uploads" },
} as const satisfies Record<string, LimitRule>;

export type LimitName = keyof typeof LIMITS;

/** Whole seconds to wait, at least 1, for a Retry-After header (RFC 9110 §10.2.3: delay-seconds). */
export function retryAfterSeconds(msBeforeNext: number): number {
  return Math.max(1, Math.ceil(msBeforeNext / 1000));
}

/** "Too many tries at signing in. Try again in 4 minutes." */
export function refusalMessage(name: LimitName, retryAfterSec: number): string {
  const minutes = Math.ceil(retryAfterSec / 60);
  const wait =
    retryAfterSec < 60
      ? `${retryAfterSec} ${retryAfterSec === 1 ? "second" : "seconds"}`
      : `${minutes} ${minutes === 1 ? "minute" : "minutes"}`;
  return `Too many tries at ${LIMITS[name].doing}. Try again in ${wait}.`;
}

/**
 * The client's network address from X-Forwarded-For: the last entry, which the app's own HTTP
 * server appends from the connection; earlier entries are whatever the client sent and can be forged.
 */
export function clientAddress(forwardedFor: string | null | undefined): string {
  const last = (forwardedFor ?? "")
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean)
    .at(-1);
  return last && last.length <= 64 ? last : "unknown";
}
