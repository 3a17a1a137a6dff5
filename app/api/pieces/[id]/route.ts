import {
  findCall,
  getPieceDetail,
  setAltText,
  useVersion,
  withdrawPiece,
} from "@/db/queries/submissions";
import { apiRoute, HttpError, readJson, requirePieceViewer } from "@/server/api";
import { uploadsAllowed } from "@/lib/pieces/submission-rules";
import { pieceActionSchema } from "@/lib/validations/piece";
import type { CreditLineSavedAnswer } from "@/lib/wire/credits";
import { changeCreditLine } from "@/server/credits";
import type {
  AltTextSavedAnswer,
  PieceWithdrawnAnswer,
  VersionChosenAnswer,
} from "@/lib/wire/submissions";

type Context = { params: Promise<{ id: string }> };

/** A piece with its pages, every file version and report, and its history. */
export const GET = apiRoute(async (_request, { params }: Context) => {
  const { id } = await params;
  const { pieceId, anthology, piece } = await requirePieceViewer(id);
  const detail = await getPieceDetail(pieceId);
  if (!detail) throw new HttpError(404, "There is no such piece.");
  const call = await findCall(anthology.id);
  return Response.json({ ...detail, uploadsOpen: uploadsAllowed(piece.status, call, anthology) });
});

/**
 * The contributor's own changes: withdraw the piece, choose which version a page uses, describe a
 * page, change the credit line (an approved line is then asked about again by e-mail).
 */
export const PATCH = apiRoute(async (request, { params }: Context) => {
  const { id } = await params;
  const { user, pieceId, isOwner, anthology, piece } = await requirePieceViewer(id);
  if (!isOwner) throw new HttpError(403, "Only the person who sent this piece can change it.");
  const action = await readJson(request, pieceActionSchema);
  if (action.action === "withdraw") {
    const status = await withdrawPiece(pieceId, user.id, action.reason);
    return Response.json({ status } satisfies PieceWithdrawnAnswer);
  }
  if (action.action === "use-version") {
    const call = await findCall(anthology.id);
    const result = await useVersion(pieceId, user.id, action, (status) =>
      uploadsAllowed(status, call, anthology),
    );
    return Response.json(result satisfies VersionChosenAnswer);
  }
  if (action.action === "credit-line") {
    if (piece.status === "withdrawn" || piece.status === "declined")
      throw new HttpError(409, "This piece is not going in the book, so its credit cannot change.");
    const outcome = await changeCreditLine(pieceId, action.creditLine);
    return Response.json({
      creditLine: action.creditLine,
      ...outcome,
    } satisfies CreditLineSavedAnswer);
  }
  await setAltText(pieceId, user.id, action.pageIndex, action.altText);
  return Response.json({ ok: true } satisfies AltTextSavedAnswer);
});
