import { savePlannedCopies } from "@/db/queries/page-map";
import type { PlannedCopiesAnswer } from "@/lib/map-edits/payload";
import { plannedCopiesSchema } from "@/lib/validations/page-map";
import { apiRoute, readJson, requireApiAccess } from "@/server/api";

/** Keeps the copies figure of the sheet view with the anthology; the map's pass figures use it. */
export const PUT = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const { slug } = await params;
  const { anthology } = await requireApiAccess(slug, "map:edit");
  const { copies } = await readJson(request, plannedCopiesSchema);
  return Response.json({
    copies: await savePlannedCopies(anthology, copies),
  } satisfies PlannedCopiesAnswer);
});
