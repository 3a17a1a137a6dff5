import { personLabel } from "@/lib/people";
import { markPaidSchema } from "@/lib/validations/payouts";
import type { IdAnswer } from "@/lib/wire/payouts";
import { apiRoute, idParam, readJson, requireApiAccess } from "@/server/api";
import { markPaidByHand } from "@/server/payouts";

/** Records that an owed line was paid outside the payments service, with a reference and who did it. */
export const POST = apiRoute(
  async (request, { params }: { params: Promise<{ slug: string; id: string }> }) => {
    const { slug, id } = await params;
    const { anthology, user } = await requireApiAccess(slug, "payouts:manage");
    const entryId = idParam(id, "ledger line");
    const { reference } = await readJson(request, markPaidSchema);
    const result = await markPaidByHand(anthology, entryId, {
      reference,
      userId: user.id,
      userLabel: personLabel(user, { mayShowEmail: true }),
    });
    return Response.json({ id: result.id! } satisfies IdAnswer, { status: 201 });
  },
);
