import type { NextRequest } from "next/server";
import { auth } from "@/auth";
import { apiRoute } from "@/server/api";
import { addressOf, consume, tooManyRequests } from "@/server/rate-limit";
import { uploadRouteHandlers } from "@/server/uploads";
import { uploadRouter } from "./core";

const handlers = uploadRouteHandlers(uploadRouter);
// Upload starts change state: through apiRoute, a page of another site may not start one.
const post = apiRoute<undefined>(async (request) => {
  const req = request as NextRequest;
  // Starting an upload is limited per person (per address when signed out); the SDK's
  // completion callbacks are not.
  if (new URL(req.url).searchParams.get("actionType") === "upload") {
    const session = await auth();
    const who = session?.user?.id ? `user:${session.user.id}` : `address:${addressOf(req.headers)}`;
    const limited = await consume("uploadStart", who);
    if (!limited.ok) return tooManyRequests(limited);
  }
  return handlers.POST(req);
});

export const GET = handlers.GET;
export const POST = (request: NextRequest) => post(request, undefined);
