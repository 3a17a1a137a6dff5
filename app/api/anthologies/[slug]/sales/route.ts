import { insertSale } from "@/db/queries/payouts";
import { saleSchema } from "@/lib/validations/payouts";
import type { IdAnswer, SalesAnswer } from "@/lib/wire/payouts";
import { apiRoute, readJson, requireApiAccess } from "@/server/api";
import { assertSaleDateOpen } from "@/server/payouts";
import { salesView } from "@/server/payouts-view";

type Ctx = { params: Promise<{ slug: string }> };

/** Sales, their net, and each period's net and contributors' pool. */
export const GET = apiRoute(async (_request, { params }: Ctx) => {
  const { anthology } = await requireApiAccess((await params).slug, "sales:record");
  return Response.json((await salesView(anthology)) satisfies SalesAnswer);
});

/** Records a sale (or copies returned, with negative copies); never edits an earlier one. */
export const POST = apiRoute(async (request, { params }: Ctx) => {
  const { anthology, user } = await requireApiAccess((await params).slug, "sales:record");
  const sale = await readJson(request, saleSchema);
  await assertSaleDateOpen(anthology.id, sale.soldOn);
  const id = await insertSale({
    ...sale,
    anthologyId: anthology.id,
    note: sale.note || null,
    currency: anthology.currency,
    recordedBy: user.id,
  });
  return Response.json({ id } satisfies IdAnswer, { status: 201 });
});
