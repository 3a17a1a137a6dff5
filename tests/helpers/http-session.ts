// Signing in over HTTP, as a browser or a script does: Auth.js's CSRF token, then its credentials
// callback, keeping the cookies it sets. Used by the tests and the bench that call the running app.
import { testEnv } from "./env";

/** Cookies by name, as a browser keeps them for one site. */
export type CookieJar = Map<string, string>;

/** Adds a response's Set-Cookie lines to the jar and returns the jar as a Cookie header. */
export function cookiesOf(response: Response, jar: CookieJar): string {
  for (const line of response.headers.getSetCookie()) {
    const [pair] = line.split(";");
    const at = pair!.indexOf("=");
    jar.set(pair!.slice(0, at), pair!.slice(at + 1));
  }
  return cookieHeader(jar);
}

/** The jar as a Cookie header value. */
export function cookieHeader(jar: CookieJar): string {
  return [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
}

/** One POST to an Auth.js endpoint with a fresh CSRF token, as its own sign-in form sends it. */
export async function authPost(
  path: string,
  fields: Record<string, string>,
  jar: CookieJar = new Map(),
  baseUrl = testEnv.appUrl,
): Promise<Response> {
  const csrf = await fetch(`${baseUrl}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const cookie = cookiesOf(csrf, jar);
  const response = await fetch(`${baseUrl}${path}`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie },
    body: new URLSearchParams({ ...fields, csrfToken, callbackUrl: "/studio" }),
  });
  cookiesOf(response, jar);
  return response;
}

/** A password sign-in; the session cookie lands in `jar`. */
export const signInWith = (email: string, password: string, jar?: CookieJar, baseUrl?: string) =>
  authPost("/api/auth/callback/credentials", { email, password }, jar, baseUrl);

/**
 * Signs in and returns the Cookie header of the session, or throws naming the account when the
 * app does not hand out a session cookie.
 */
export async function sessionCookie(
  email: string,
  password: string,
  baseUrl = testEnv.appUrl,
): Promise<string> {
  const jar: CookieJar = new Map();
  const response = await signInWith(email, password, jar, baseUrl);
  if (response.status !== 302 || ![...jar.keys()].some((k) => k.includes("session-token")))
    throw new Error(`signing in as ${email} gave ${response.status} and no session`);
  return cookieHeader(jar);
}
