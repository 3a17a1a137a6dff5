/**
 * The print engine's public API: pure computations with no React or database, safe to import
 * from client components. The spec check needs sharp (native, server only), so its functions
 * are imported from "@/lib/print/check"; only its types are re-exported here.
 */
export * from "./units";
export * from "./sizes";
export * from "./paper";
export * from "./spec";
export * from "./imposition";
export * from "./creep";
export * from "./passes";
export * from "./costs";
export type * from "./check/types";
export {
  DEFAULT_MAX_PIXELS,
  FORMAT_NAMES,
  SUPPORTED_FORMATS,
  SUPPORTED_FORMATS_TEXT,
} from "./check/types";
