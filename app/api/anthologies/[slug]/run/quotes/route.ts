import { saveShopQuote } from "@/db/queries/run";
import { shopQuoteSchema } from "@/lib/validations/run";
import { apiRoute, readJson, requireApiAccess } from "@/server/api";

/** A new print shop quote for the anthology's collective. */
export const POST = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const { slug } = await params;
  const { anthology, user } = await requireApiAccess(slug, "run:plan");
  const input = await readJson(request, shopQuoteSchema);
  return Response.json({ id: await saveShopQuote(anthology, user, null, input) }, { status: 201 });
});
