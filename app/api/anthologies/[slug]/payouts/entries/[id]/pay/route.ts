import type { PayAnswer } from "@/lib/wire/payouts";
import { apiRoute, idParam, requireApiAccess } from "@/server/api";
import { payEntryByTransfer } from "@/server/payouts";

/** Pays an owed line by transfer; 202 until the service's webhook confirms it, 200 once paid. */
export const POST = apiRoute(
  async (_request, { params }: { params: Promise<{ slug: string; id: string }> }) => {
    const { slug, id } = await params;
    const { anthology, user } = await requireApiAccess(slug, "payouts:manage");
    const result = await payEntryByTransfer(anthology, idParam(id, "ledger line"), user.id);
    return Response.json(
      { state: result.state, transferId: result.transferId } satisfies PayAnswer,
      { status: result.state === "paid" ? 200 : 202 },
    );
  },
);
