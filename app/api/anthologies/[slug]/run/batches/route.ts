import { planBatchesFromEvents } from "@/db/queries/run";
import type { OkAnswer } from "@/lib/wire/run";
import { apiRoute, requireApiAccess } from "@/server/api";

/** Makes one finishing batch per event (refused once finishing has started). */
export const POST = apiRoute(
  async (_request, { params }: { params: Promise<{ slug: string }> }) => {
    const { slug } = await params;
    const { anthology } = await requireApiAccess(slug, "run:plan");
    const n = await planBatchesFromEvents(anthology);
    return Response.json({
      ok: true,
      message: `${n} ${n === 1 ? "batch" : "batches"} planned.`,
    } satisfies OkAnswer);
  },
);
