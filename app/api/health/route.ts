import { healthReport, healthStatusCode } from "@/lib/health";
import { probeAll } from "@/server/health";

// Always measured now, never cached.
export const dynamic = "force-dynamic";

/**
 * GET /api/health: each service the app needs (the database, the upload host, the mail server, the print queue)
 * with its state; 200 when all are up, 503 naming the ones that are down. No sign-in needed and
 * nothing private in it: states, timings and plain reasons only.
 */
export async function GET() {
  const report = healthReport(await probeAll());
  return Response.json(report, {
    status: healthStatusCode(report),
    headers: { "Cache-Control": "no-store" },
  });
}
