import { loadRunPlan, saveRunPlan } from "@/db/queries/run";
import { can } from "@/lib/auth/policy";
import type { RunPayload, RunPlanSettings } from "@/lib/wire/run";
import { runPlanSchema } from "@/lib/validations/run";
import { apiRoute, readJson, requireApiAccess } from "@/server/api";

type Ctx = { params: Promise<{ slug: string }> };

/** The run planner's data: counts from the page map, the collective's prices and quotes, events. */
export const GET = apiRoute(async (_request, { params }: Ctx) => {
  const { slug } = await params;
  const { anthology, role } = await requireApiAccess(slug, "run:view");
  return Response.json((await loadRunPlan(anthology, can(role, "run:plan"))) satisfies RunPayload);
});

/** Keeps the quantities weighed, the chosen prices and quote, the finishing timings and hours. */
export const PUT = apiRoute(async (request, { params }: Ctx) => {
  const { slug } = await params;
  const { anthology } = await requireApiAccess(slug, "run:plan");
  const input = await readJson(request, runPlanSchema);
  return Response.json((await saveRunPlan(anthology, input)) satisfies RunPlanSettings);
});
