import { apiRoute, requireApiAccess } from "@/server/api";

/** One anthology's record and the caller's role in it. */
export const GET = apiRoute(async (_request, { params }: { params: Promise<{ slug: string }> }) => {
  const { slug } = await params;
  const { anthology, role } = await requireApiAccess(slug, "anthology:view");
  return Response.json({ anthology, role });
});
