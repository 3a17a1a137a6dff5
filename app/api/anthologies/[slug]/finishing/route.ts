import { loadFinishing } from "@/db/queries/run";
import { can } from "@/lib/auth/policy";
import type { FinishingPayload } from "@/lib/wire/run";
import { apiRoute, requireApiAccess } from "@/server/api";

/** Batches with their checklist ticks; people are named without private data for finishers. */
export const GET = apiRoute(async (_request, { params }: { params: Promise<{ slug: string }> }) => {
  const { slug } = await params;
  const { anthology, role } = await requireApiAccess(slug, "finishing:view");
  return Response.json(
    (await loadFinishing(anthology, {
      canTick: can(role, "finishing:tick"),
      mayShowEmail: can(role, "contributors:private-data"),
    })) satisfies FinishingPayload,
  );
});
