import { movePiece } from "@/server/review";
import { apiRoute, HttpError, readJson, requirePieceApiAccess } from "@/server/api";
import { pieceStatusChangeSchema } from "@/lib/validations/review";
import type { AcceptWarningAnswer, PieceMoveAnswer } from "@/lib/wire/review";

/**
 * An editor moves one piece; 409 with the reason when the move is refused, and 409 with
 * `needsConfirm` when accepting a piece that cannot print needs `confirm: true`.
 */
export const POST = apiRoute(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  const { anthology, user, pieceId } = await requirePieceApiAccess(id, "pieces:review");
  const input = await readJson(request, pieceStatusChangeSchema);
  const outcome = await movePiece(anthology, user, pieceId, input.to, {
    message: input.message,
    expectedFrom: input.from,
    confirmAccept: input.confirm,
  });
  if (!outcome.changed && outcome.needsConfirm) {
    const answer = {
      error: outcome.reason,
      warning: outcome.reason,
      needsConfirm: true,
      pieces: [{ pieceId, warning: outcome.reason }],
    } satisfies AcceptWarningAnswer;
    return Response.json(answer, { status: 409 });
  }
  if (!outcome.changed) throw new HttpError(409, outcome.reason, { refused: outcome });
  return Response.json(outcome satisfies PieceMoveAnswer);
});
