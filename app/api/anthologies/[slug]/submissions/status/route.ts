import { movePieces } from "@/server/review";
import { apiRoute, readJson, requireApiAccess } from "@/server/api";
import { bulkStatusChangeSchema } from "@/lib/validations/review";
import { acceptWarnings } from "@/db/queries/review";
import { acceptWarningForMany } from "@/lib/pieces/accept-warning";
import type { AcceptWarningAnswer, BulkMoveAnswer } from "@/lib/wire/review";

/**
 * Moves several pieces to one status. Each piece is checked and changed on its own, so the answer
 * lists which changed and which were refused, with the reason. Accepting pieces that cannot print
 * answers 409 with `needsConfirm` and moves nothing until the request carries `confirm: true`.
 */
export const POST = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const { slug } = await params;
  const { anthology, user } = await requireApiAccess(slug, "pieces:review");
  const input = await readJson(request, bulkStatusChangeSchema);
  if (input.to === "accepted" && !input.confirm) {
    const pieces = await acceptWarnings(anthology.id, input.pieceIds);
    const warning = acceptWarningForMany(pieces.map((w) => w.warning));
    if (warning) {
      const answer = { error: warning, warning, needsConfirm: true, pieces } as const;
      return Response.json(answer satisfies AcceptWarningAnswer, { status: 409 });
    }
  }
  const result = await movePieces(
    anthology,
    user,
    input.pieceIds,
    input.to,
    input.message,
    input.confirm,
  );
  return Response.json(result satisfies BulkMoveAnswer);
});
