import { savePriceList } from "@/db/queries/run";
import { priceListSchema } from "@/lib/validations/run";
import { apiRoute, idParam, readJson, requireApiAccess } from "@/server/api";

/** Changes one of the collective's price lists. */
export const PUT = apiRoute(
  async (request, { params }: { params: Promise<{ slug: string; id: string }> }) => {
    const { slug, id } = await params;
    const { anthology, user } = await requireApiAccess(slug, "run:plan");
    const listId = idParam(id, "price list");
    const input = await readJson(request, priceListSchema);
    return Response.json({ id: await savePriceList(anthology, user, listId, input) });
  },
);
