import { NextResponse } from "next/server";
import { auth } from "@/auth";
import { STUDIO_PATH_HEADER } from "@/lib/auth/forbidden";
import { originOf, securityHeaders } from "@/lib/security/headers";

/** Origins the browser talks to besides this one: the upload host it sends files to. */
const connectOrigins = [originOf(process.env.UPLOADTHING_INGEST_URL)].filter(
  (o): o is string => o !== null,
);

/**
 * Every page: a fresh CSP nonce and the security headers. Studio pages also send signed-out
 * visitors to sign-in, coming back afterwards (API routes answer 401 themselves).
 */
export const proxy = auth((request) => {
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
});

export const config = {
  // Pages only: API routes, built assets and font files are left alone.
  matcher: ["/((?!api/|_next/static|_next/image|favicon.ico|fonts/).*)"],
};
