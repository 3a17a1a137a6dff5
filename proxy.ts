import { NextResponse } from "next/server";
import { auth } from "@/auth";
import { STUDIO_PATH_HEADER } from "@/lib/auth/forbidden";

/** Sends signed-out visitors of studio pages to sign-in, coming back afterwards. API routes answer 401 themselves. */
export const proxy = auth((request) => {
  if (!request.auth?.user) {
    const url = new URL("/sign-in", request.nextUrl.origin);
    url.searchParams.set("callbackUrl", request.nextUrl.pathname + request.nextUrl.search);
    return NextResponse.redirect(url);
  }
  // The 403 page cannot see the URL; it reads the path from this header to tell an outsider
  // (not a member of the anthology) from a member whose role does not open the page.
  const headers = new Headers(request.headers);
  headers.set(STUDIO_PATH_HEADER, request.nextUrl.pathname);
  return NextResponse.next({ request: { headers } });
});

export const config = { matcher: ["/studio/:path*"] };
