import type { NextRequest } from "next/server";
import { handlers } from "@/auth";
import { addressOf, firstRefusal, tooManyRequests } from "@/server/rate-limit";
import type { LimitName } from "@/lib/rate-limits";

export const { GET } = handlers;

/**
 * Auth.js's own POST endpoints, with the rate limits checked first: a password sign-in or a
 * sign-in link asked for over its limit answers 429 with Retry-After before Auth.js runs.
 * (authorize() and sendVerificationRequest() in auth.ts count the tries.)
 */
export async function POST(request: NextRequest) {
  const path = request.nextUrl.pathname;
  const names: [LimitName, LimitName] | null = path.endsWith("/callback/credentials")
    ? ["signInAccount", "signInAddress"]
    : path.endsWith("/signin/nodemailer")
      ? ["emailLinkAccount", "emailLinkAddress"]
      : null;
  if (names) {
    const form = await request
      .clone()
      .formData()
      .catch(() => null);
    const email = String(form?.get("email") ?? "")
      .trim()
      .toLowerCase();
    const checks: [LimitName, string][] = [[names[1], addressOf(request.headers)]];
    if (email) checks.unshift([names[0], email]);
    const verdict = await firstRefusal(checks);
    if (!verdict.ok) return tooManyRequests(verdict);
  }
  return handlers.POST(request);
}
