import type { CloseAnswer } from "@/lib/wire/payouts";
import { apiRoute, idParam, requireApiAccess } from "@/server/api";
import { closePayoutPeriod } from "@/server/payouts";

/** Shares the period's net sales out and writes everyone's owed lines, once. */
export const POST = apiRoute(
  async (_request, { params }: { params: Promise<{ slug: string; id: string }> }) => {
    const { slug, id } = await params;
    const { anthology, user } = await requireApiAccess(slug, "payouts:manage");
    const result = await closePayoutPeriod(anthology, idParam(id, "period"), user.id);
    return Response.json({
      linesWritten: result.linesWritten,
      poolCents: result.poolCents,
      netCents: result.sales.netCents,
    } satisfies CloseAnswer);
  },
);
