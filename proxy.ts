import {
  NextResponse,
  type NextFetchEvent,
  type NextMiddleware,
  type NextRequest,
} from "next/server";
import { auth } from "@/auth";
import { STUDIO_PATH_HEADER } from "@/lib/auth/forbidden";
import { originOf, securityHeaders } from "@/lib/security/headers";

/** Origins the browser talks to besides this one: the upload host it sends files to. */
const connectOrigins = [originOf(process.env.UPLOADTHING_INGEST_URL)].filter(
  (o): o is string => o !== null,
);

/**
 * Pages: a fresh CSP nonce and the security headers. Studio pages also send signed-out
 * visitors to sign-in, coming back afterwards (API routes answer 401 themselves).
 */
// auth() wraps it as middleware; its overloads also cover route handlers, hence the narrowing.
const pages = auth((request) => {
  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(18))).toString("base64");
  const headers = securityHeaders({
    nonce,
    development: process.env.NODE_ENV === "development",
    connectOrigins,
    https: request.nextUrl.protocol === "https:",
  });
  const path = request.nextUrl.pathname;

  let response: NextResponse;
  if (path.startsWith("/studio") && !request.auth?.user) {
    const url = new URL("/sign-in", request.nextUrl.origin);
    url.searchParams.set("callbackUrl", path + request.nextUrl.search);
    response = NextResponse.redirect(url);
  } else {
    // Next.js reads the nonce from the request's CSP header and puts it on its own scripts.
    const forward = new Headers(request.headers);
    forward.set("Content-Security-Policy", headers["Content-Security-Policy"]!);
    // The 403 page cannot see the URL; it reads the path from this header to tell an outsider
    // (not a member of the anthology) from a member whose role does not open the page.
    if (path.startsWith("/studio")) forward.set(STUDIO_PATH_HEADER, path);
    response = NextResponse.next({ request: { headers: forward } });
  }
  for (const [name, value] of Object.entries(headers)) response.headers.set(name, value);
  return response;
}) as unknown as NextMiddleware;

/** Whether every %-escape in a path decodes (a lone "%" or an escaped lone surrogate does not). */
function decodes(path: string): boolean {
  try {
    decodeURIComponent(path);
    return true;
  } catch {
    return false;
  }
}

/**
 * Every request first: a path whose %-escapes do not decode is refused with 400 here, since the
 * router would otherwise fail on it with a bare 500. API routes then go on untouched (they answer
 * 401 themselves); pages get the headers above.
 */
export function proxy(request: NextRequest, event: NextFetchEvent) {
  const path = request.nextUrl.pathname;
  if (!decodes(path))
    return NextResponse.json(
      { error: "This address has a broken %-escape in it, so it leads nowhere." },
      { status: 400 },
    );
  if (path.startsWith("/api/")) return NextResponse.next();
  return pages(request, event);
}

export const config = {
  // Built assets and font files are left alone.
  matcher: ["/((?!_next/static|_next/image|favicon.ico|fonts/).*)"],
};
