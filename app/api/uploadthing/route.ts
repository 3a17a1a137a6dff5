import { uploadRouteHandlers } from "@/lib/uploads";
import { uploadRouter } from "./core";

export const { GET, POST } = uploadRouteHandlers(uploadRouter);
