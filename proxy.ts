import { NextResponse } from "next/server";
import { auth } from "@/auth";

/** Sends signed-out visitors of studio pages to sign-in, coming back afterwards. API routes answer 401 themselves. */
export const proxy = auth((request) => {
  if (!request.auth?.user) {
    const url = new URL("/sign-in", request.nextUrl.origin);
    url.searchParams.set("callbackUrl", request.nextUrl.pathname + request.nextUrl.search);
    return NextResponse.redirect(url);
  }
  return NextResponse.next();
});

export const config = { matcher: ["/studio/:path*"] };
