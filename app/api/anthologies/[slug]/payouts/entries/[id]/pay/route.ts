import type { AlreadyPaidAnswer, PayAnswer } from "@/lib/wire/payouts";
import { apiRoute, HttpError, idParam, requireApiAccess } from "@/server/api";
import { PaymentProblem } from "@/server/payments";
import { payEntryByTransfer } from "@/server/payouts";

/**
 * Pays an owed line by transfer; 202 until the service's webhook confirms it, 200 once paid, 409
 * naming the transfer when the line was already paid by it.
 */
export const POST = apiRoute(
  async (_request, { params }: { params: Promise<{ slug: string; id: string }> }) => {
    const { slug, id } = await params;
    const { anthology, user } = await requireApiAccess(slug, "payouts:manage");
    const entryId = idParam(id, "ledger line");
    const result = await payEntryByTransfer(anthology, entryId, user.id).catch((error: unknown) => {
      if (error instanceof PaymentProblem) throw new HttpError(error.status, error.message);
      throw error;
    });
    if (result.alreadyPaid)
      return Response.json(
        {
          error: "This line is already paid.",
          state: "paid",
          transferId: result.transferId,
        } satisfies AlreadyPaidAnswer,
        { status: 409 },
      );
    return Response.json(
      { state: result.state, transferId: result.transferId } satisfies PayAnswer,
      { status: result.state === "paid" ? 200 : 202 },
    );
  },
);
