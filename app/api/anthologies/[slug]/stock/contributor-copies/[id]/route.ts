import { updateContributorCopy } from "@/db/queries/run";
import type { OkAnswer } from "@/lib/wire/run";
import { contributorCopyUpdateSchema } from "@/lib/validations/run";
import { apiRoute, idParam, readJson, requireApiAccess } from "@/server/api";

/** How a contributor's copies reach them, and whether they have (taking them out of stock). */
export const PATCH = apiRoute(
  async (request, { params }: { params: Promise<{ slug: string; id: string }> }) => {
    const { slug, id } = await params;
    const { anthology, user } = await requireApiAccess(slug, "stock:move");
    const input = await readJson(request, contributorCopyUpdateSchema);
    await updateContributorCopy(anthology, user, idParam(id, "contributor copy"), input);
    return Response.json({ ok: true, message: "Saved." } satisfies OkAnswer);
  },
);
