import { listSubmissions } from "@/db/queries/review";
import { apiRoute, fieldErrors, HttpError, requireApiAccess } from "@/lib/api";
import { searchParamsToQueryInput, submissionsQuerySchema } from "@/lib/validations/review";

/** One page of the anthology's submissions for its editors: GET ?page&pageSize&sort&dir&q&status&verdict. */
export const GET = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const { slug } = await params;
  const { anthology } = await requireApiAccess(slug, "pieces:review");
  const parsed = submissionsQuerySchema.safeParse(
    searchParamsToQueryInput(new URL(request.url).searchParams),
  );
  if (!parsed.success) {
    // A bad entry in a list (status.1) is reported under the parameter's own name.
    const fields: Record<string, string[]> = {};
    for (const [path, messages] of Object.entries(fieldErrors(parsed.error))) {
      (fields[path.split(".")[0]!] ??= []).push(...messages);
    }
    throw new HttpError(400, "Some query parameters need attention.", { fields });
  }
  return Response.json(await listSubmissions(anthology.id, parsed.data), {
    headers: { "cache-control": "no-store" },
  });
});
