import type { NextRequest } from "next/server";
import { apiRoute } from "@/server/api";
import { uploadRouteHandlers } from "@/server/uploads";
import { uploadRouter } from "./core";

const handlers = uploadRouteHandlers(uploadRouter);
// Upload starts change state: through apiRoute, a page of another site may not start one.
const post = apiRoute<undefined>(async (request) => handlers.POST(request as NextRequest));

export const GET = handlers.GET;
export const POST = (request: NextRequest) => post(request, undefined);
