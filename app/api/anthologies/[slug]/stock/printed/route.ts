import { recordAllPrinted } from "@/db/queries/run";
import type { OkAnswer } from "@/lib/wire/run";
import { apiRoute, requireApiAccess } from "@/server/api";

/** Records every open batch's sheets as printed at once. */
export const POST = apiRoute(
  async (_request, { params }: { params: Promise<{ slug: string }> }) => {
    const { slug } = await params;
    const { anthology, user } = await requireApiAccess(slug, "stock:move");
    const n = await recordAllPrinted(anthology, user);
    return Response.json(
      { ok: true, message: `Printed sheets for ${n} copies recorded.` } satisfies OkAnswer,
      { status: 201 },
    );
  },
);
