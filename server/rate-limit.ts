import "server-only";
import { RateLimiterMySQL, RateLimiterRes } from "rate-limiter-flexible";
import { pool } from "@/db";
import { env } from "@/lib/env";
import {
  clientAddress,
  LIMITS,
  refusalMessage,
  retryAfterSeconds,
  type LimitName,
} from "@/lib/rate-limits";

/**
 * Rate limits kept in the database (table rate_limit), so every app instance sharing the
 * database shares the counts. The rules and words are in lib/rate-limits.ts.
 */

const limiters = new Map<LimitName, RateLimiterMySQL>();

function limiter(name: LimitName): RateLimiterMySQL {
  let found = limiters.get(name);
  if (!found) {
    const rule = LIMITS[name];
    found = new RateLimiterMySQL({
      // The callback pool under the app's promise pool: the library speaks mysql2's callback API.
      storeClient: pool.pool,
      storeType: "pool",
      dbName: decodeURIComponent(new URL(env().DATABASE_URL).pathname.slice(1)),
      tableName: "rate_limit",
      tableCreated: true,
      clearExpiredByTimeout: false,
      keyPrefix: name,
      points: rule.points,
      duration: rule.durationSec,
    });
    limiters.set(name, found);
  }
  return found;
}

export type LimitVerdict = { ok: true } | { ok: false; retryAfterSec: number; message: string };

const refused = (name: LimitName, msBeforeNext: number): LimitVerdict => {
  const retryAfterSec = retryAfterSeconds(msBeforeNext);
  return { ok: false, retryAfterSec, message: refusalMessage(name, retryAfterSec) };
};

/** Counts one try; refused once the window's tries are used up. */
export async function consume(name: LimitName, key: string): Promise<LimitVerdict> {
  try {
    await limiter(name).consume(key.toLowerCase());
    return { ok: true };
  } catch (error) {
    if (error instanceof RateLimiterRes) return refused(name, error.msBeforeNext);
    throw error as Error;
  }
}

/** Whether the key is over its limit now, without counting a try. */
export async function check(name: LimitName, key: string): Promise<LimitVerdict> {
  const res = await limiter(name).get(key.toLowerCase());
  if (res && res.consumedPoints >= LIMITS[name].points) return refused(name, res.msBeforeNext);
  return { ok: true };
}

/** Forgets a key's count (a successful sign-in clears its account's failures). */
export async function reset(name: LimitName, key: string): Promise<void> {
  await limiter(name).delete(key.toLowerCase());
}

/** The first refusal of several checks, or ok. */
export async function firstRefusal(
  checks: readonly (readonly [LimitName, string])[],
  how: (name: LimitName, key: string) => Promise<LimitVerdict> = check,
): Promise<LimitVerdict> {
  for (const [name, key] of checks) {
    const verdict = await how(name, key);
    if (!verdict.ok) return verdict;
  }
  return { ok: true };
}

/** The client's address from a request's headers (see lib/rate-limits.ts clientAddress). */
export function addressOf(headers: Headers): string {
  return clientAddress(headers.get("x-forwarded-for"));
}

/** A 429 answer with Retry-After (RFC 6585 §4) and the plain message. */
export function tooManyRequests(verdict: Extract<LimitVerdict, { ok: false }>): Response {
  return Response.json(
    { error: verdict.message },
    { status: 429, headers: { "Retry-After": String(verdict.retryAfterSec) } },
  );
}
