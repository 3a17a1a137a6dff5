"use client";

import { z } from "zod";

// zod compiles object parsers with `new Function` when it may, and probes for that by trying
// once; under the pages' CSP (no 'unsafe-eval') the probe is refused and reported as a violation.
// Without it zod parses the same way, only without the generated fast path.
z.config({ jitless: true });

/** Sets zod up for the browser before any form parses; renders nothing. */
export function ZodSetup() {
  return null;
}
