import { NextRequest } from "next/server";
import { auth } from "@/auth";
import { apiRoute, HttpError, jsonDepth, MAX_JSON_BYTES, readTextCapped } from "@/server/api";
import { addressOf, consume, tooManyRequests } from "@/server/rate-limit";
import { uploadRouteHandlers } from "@/server/uploads";
import { uploadRouter } from "./core";

const handlers = uploadRouteHandlers(uploadRouter);
/** An upload start or callback is a flat object of a few levels; far deeper is not one. */
const MAX_UPLOAD_JSON_DEPTH = 32;
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
  // The SDK reads any body whole and fails on one nested thousands deep: cap and check it first.
  const text = await readTextCapped(req, MAX_JSON_BYTES);
  if (text.trim() !== "") {
    let parsed: unknown;
    try {
      parsed = JSON.parse(text);
    } catch {
      throw new HttpError(400, "The request body is not valid JSON.");
    }
    if (jsonDepth(parsed) > MAX_UPLOAD_JSON_DEPTH)
      throw new HttpError(400, "The request body nests too deeply.");
  }
  const headers = new Headers(req.headers);
  headers.delete("content-length");
  return handlers.POST(
    new NextRequest(req.url, { method: req.method, headers, body: text === "" ? null : text }),
  );
});

export const GET = handlers.GET;
export const POST = (request: NextRequest) => post(request, undefined);
