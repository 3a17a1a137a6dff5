import { uploadRouteHandlers } from "@/server/uploads";
import { uploadRouter } from "./core";

export const { GET, POST } = uploadRouteHandlers(uploadRouter);
