import { deleteEvent } from "@/db/queries/run";
import type { OkAnswer } from "@/lib/wire/run";
import { apiRoute, idParam, requireApiAccess } from "@/server/api";

/** Removes an event (batches made for it keep their copies and lose the link). */
export const DELETE = apiRoute(
  async (_request, { params }: { params: Promise<{ slug: string; id: string }> }) => {
    const { slug, id } = await params;
    const { anthology } = await requireApiAccess(slug, "run:plan");
    await deleteEvent(anthology, idParam(id, "event"));
    return Response.json({ ok: true, message: "Event removed." } satisfies OkAnswer);
  },
);
