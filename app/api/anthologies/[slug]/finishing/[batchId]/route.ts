import { tickStep } from "@/db/queries/run";
import type { OkAnswer } from "@/lib/wire/run";
import { tickSchema } from "@/lib/validations/run";
import { apiRoute, idParam, readJson, requireApiAccess } from "@/server/api";

/** Ticks or clears one checklist step of a batch, or (stepId "batch") the whole batch. */
export const POST = apiRoute(
  async (request, { params }: { params: Promise<{ slug: string; batchId: string }> }) => {
    const { slug, batchId } = await params;
    const { anthology, user } = await requireApiAccess(slug, "finishing:tick");
    const id = idParam(batchId, "batch");
    const { stepId, done } = await readJson(request, tickSchema);
    await tickStep(anthology, user, id, stepId, done);
    return Response.json({ ok: true, message: done ? "Ticked." : "Cleared." } satisfies OkAnswer);
  },
);
