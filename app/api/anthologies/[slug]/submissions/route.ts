import { listSubmissions } from "@/db/queries/review";
import { apiRoute, readQuery, requireApiAccess } from "@/server/api";
import { searchParamsToQueryInput, submissionsQuerySchema } from "@/lib/validations/review";
import type { SubmissionsPage } from "@/lib/wire/review";

/** One page of the anthology's submissions for its editors: GET ?page&pageSize&sort&dir&q&status&verdict. */
export const GET = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const { slug } = await params;
  const { anthology } = await requireApiAccess(slug, "pieces:review");
  const query = readQuery(request, submissionsQuerySchema, searchParamsToQueryInput);
  return Response.json((await listSubmissions(anthology.id, query)) satisfies SubmissionsPage, {
    headers: { "cache-control": "no-store" },
  });
});
