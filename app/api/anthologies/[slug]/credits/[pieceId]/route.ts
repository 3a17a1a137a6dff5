import { findCreditPiece } from "@/db/queries/credits";
import { creditLineChangeSchema } from "@/lib/validations/credits";
import type { CreditLineSavedAnswer } from "@/lib/wire/credits";
import { changeCreditLine } from "@/server/credits";
import { apiRoute, HttpError, idParam, readJson, requireApiAccess } from "@/server/api";

type Context = { params: Promise<{ slug: string; pieceId: string }> };

/** An editor changes a piece's credit line; an approved or asked-about line is asked about again. */
export const PATCH = apiRoute(async (request, { params }: Context) => {
  const { slug, pieceId: raw } = await params;
  const { anthology } = await requireApiAccess(slug, "credits:manage");
  const pieceId = idParam(raw, "piece");
  const piece = await findCreditPiece(pieceId);
  if (!piece || piece.anthologyId !== anthology.id)
    throw new HttpError(404, "There is no such piece in this anthology.");
  const { creditLine } = await readJson(request, creditLineChangeSchema);
  const outcome = await changeCreditLine(pieceId, creditLine);
  return Response.json({ creditLine, ...outcome } satisfies CreditLineSavedAnswer);
});
