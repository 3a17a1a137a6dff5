import type { z } from "zod";

/** The first message for each dotted path of a failed parse, for messages beside the fields. */
export function fieldErrorsOf(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    out[key] ??= issue.message;
  }
  return out;
}
