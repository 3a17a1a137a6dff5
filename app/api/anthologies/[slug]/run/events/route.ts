import { addEvent, anthologyZone } from "@/db/queries/run";
import { todayIn } from "@/lib/run/batches";
import { runEventSchema } from "@/lib/validations/run";
import { apiRoute, readJson, requireApiAccess } from "@/server/api";

/** Adds an event copies are wanted for; a day before today in the anthology's zone is refused. */
export const POST = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const { slug } = await params;
  const { anthology } = await requireApiAccess(slug, "run:plan");
  const today = todayIn(await anthologyZone(anthology.id));
  const input = await readJson(request, runEventSchema(today));
  return Response.json({ id: await addEvent(anthology, input) }, { status: 201 });
});
