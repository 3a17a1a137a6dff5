import { savePriceList } from "@/db/queries/run";
import { priceListSchema } from "@/lib/validations/run";
import { apiRoute, readJson, requireApiAccess } from "@/server/api";

/** A new price list for the anthology's collective. */
export const POST = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const { slug } = await params;
  const { anthology, user } = await requireApiAccess(slug, "run:plan");
  const input = await readJson(request, priceListSchema);
  return Response.json({ id: await savePriceList(anthology, user, null, input) }, { status: 201 });
});
