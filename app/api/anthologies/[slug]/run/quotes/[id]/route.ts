import { saveShopQuote } from "@/db/queries/run";
import { shopQuoteSchema } from "@/lib/validations/run";
import { apiRoute, idParam, readJson, requireApiAccess } from "@/server/api";

/** Changes one of the collective's shop quotes. */
export const PUT = apiRoute(
  async (request, { params }: { params: Promise<{ slug: string; id: string }> }) => {
    const { slug, id } = await params;
    const { anthology, user } = await requireApiAccess(slug, "run:plan");
    const quoteId = idParam(id, "quote");
    const input = await readJson(request, shopQuoteSchema);
    return Response.json({ id: await saveShopQuote(anthology, user, quoteId, input) });
  },
);
