import { reverseSchema } from "@/lib/validations/payouts";
import type { IdAnswer } from "@/lib/wire/payouts";
import { apiRoute, idParam, readJson, requireApiAccess } from "@/server/api";
import { reverseOwedLine } from "@/server/payouts";

/** Cancels a wrong owed line with a reversing line (the original stays in the ledger). */
export const POST = apiRoute(
  async (request, { params }: { params: Promise<{ slug: string; id: string }> }) => {
    const { slug, id } = await params;
    const { anthology, user } = await requireApiAccess(slug, "payouts:manage");
    const entryId = idParam(id, "ledger line");
    const { reason } = await readJson(request, reverseSchema);
    const result = await reverseOwedLine(anthology, entryId, { reason, userId: user.id });
    return Response.json({ id: result.id! } satisfies IdAnswer, { status: 201 });
  },
);
