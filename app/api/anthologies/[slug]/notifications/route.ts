import { findNotifyNewPieces, setNotifyNewPieces } from "@/db/queries/notifications";
import { apiRoute, readJson, requireApiAccess } from "@/server/api";
import { notificationSettingsSchema } from "@/lib/validations/review";
import type { NotificationSettingsAnswer } from "@/lib/wire/review";

type Context = { params: Promise<{ slug: string }> };

/** The signed-in editor's or lead's own notice setting in this anthology. */
export const GET = apiRoute(async (_request, { params }: Context) => {
  const { slug } = await params;
  const { anthology, user } = await requireApiAccess(slug, "pieces:review");
  const answer = { newPieces: await findNotifyNewPieces(anthology.id, user.id) };
  return Response.json(answer satisfies NotificationSettingsAnswer);
});

/** Turns the caller's own e-mail about each new piece on or off; nobody sets it for another. */
export const PUT = apiRoute(async (request, { params }: Context) => {
  const { slug } = await params;
  const { anthology, user } = await requireApiAccess(slug, "pieces:review");
  const input = await readJson(request, notificationSettingsSchema);
  await setNotifyNewPieces(anthology.id, user.id, input.newPieces);
  const answer = { newPieces: await findNotifyNewPieces(anthology.id, user.id) };
  return Response.json(answer satisfies NotificationSettingsAnswer);
});
