import { previewPageNotices, sendPageNotices } from "@/server/page-notices";
import { can } from "@/lib/auth/policy";
import type { NoticesAnswer, NoticesPreviewAnswer } from "@/lib/map-edits/payload";
import { apiRoute, requireApiAccess } from "@/server/api";

type Context = { params: Promise<{ slug: string }> };

/** Who the page notices would go to and with which pages, sending nothing (the screen asks first). */
export const GET = apiRoute(async (_request, { params }: Context) => {
  const { slug } = await params;
  const { anthology, role } = await requireApiAccess(slug, "map:edit");
  return Response.json(
    (await previewPageNotices(anthology, {
      mayShowEmail: can(role, "contributors:private-data"),
    })) satisfies NoticesPreviewAnswer,
  );
});

/** E-mails every contributor with placed pieces their page numbers; a notice already sent for the same pages is not sent again. */
export const POST = apiRoute(async (_request, { params }: Context) => {
  const { slug } = await params;
  const { anthology } = await requireApiAccess(slug, "map:edit");
  return Response.json((await sendPageNotices(anthology)) satisfies NoticesAnswer);
});
