import { movePieces } from "@/server/review";
import { apiRoute, readJson, requireApiAccess } from "@/server/api";
import { bulkStatusChangeSchema } from "@/lib/validations/review";
import type { BulkMoveAnswer } from "@/lib/wire/review";

/**
 * Moves several pieces to one status. Each piece is checked and changed on its own, so the answer
 * lists which changed and which were refused, with the reason.
 */
export const POST = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const { slug } = await params;
  const { anthology, user } = await requireApiAccess(slug, "pieces:review");
  const input = await readJson(request, bulkStatusChangeSchema);
  const result = await movePieces(anthology, user, input.pieceIds, input.to, input.message);
  return Response.json(result satisfies BulkMoveAnswer);
});
