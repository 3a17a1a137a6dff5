import { sendPageNotices } from "@/server/page-notices";
import type { NoticesAnswer } from "@/lib/map-edits/payload";
import { apiRoute, requireApiAccess } from "@/server/api";

/** E-mails every contributor with placed pieces their page numbers; a notice already sent for the same pages is not sent again. */
export const POST = apiRoute(
  async (_request, { params }: { params: Promise<{ slug: string }> }) => {
    const { slug } = await params;
    const { anthology } = await requireApiAccess(slug, "map:edit");
    return Response.json((await sendPageNotices(anthology)) satisfies NoticesAnswer);
  },
);
