import {
  findCall,
  findPieceAccess,
  getPieceDetail,
  maySeePiece,
  setAltText,
  useVersion,
  withdrawPiece,
} from "@/db/queries/submissions";
import { apiRoute, HttpError, readJson, requireApiUser } from "@/lib/api";
import { idFromParam, refusalsAsHttp } from "@/lib/submissions/http";
import { uploadsAllowed } from "@/lib/submissions/ingest";
import { pieceActionSchema } from "@/lib/validations/piece";

type Context = { params: Promise<{ id: string }> };

/** The piece, its person can see it: 404 for people outside the anthology, 403 for members who may not. */
async function access(idParam: string) {
  const user = await requireApiUser();
  const pieceId = idFromParam(idParam, "piece");
  const found = await findPieceAccess(pieceId, user.id);
  if (!found || found.role === null) throw new HttpError(404, "There is no such piece.");
  if (!maySeePiece(found))
    throw new HttpError(
      403,
      "Only the piece's contributor and the anthology's editors can see it.",
    );
  return { user, pieceId, ...found };
}

/** A piece with its pages, every file version and report, and its history. */
export const GET = apiRoute(async (_request, { params }: Context) => {
  const { id } = await params;
  const { pieceId, anthology, piece } = await access(id);
  const detail = await getPieceDetail(pieceId);
  if (!detail) throw new HttpError(404, "There is no such piece.");
  const call = await findCall(anthology.id);
  return Response.json({ ...detail, uploadsOpen: uploadsAllowed(piece.status, call, anthology) });
});

/** The contributor's own changes: withdraw the piece, choose which version a page uses, describe a page. */
export const PATCH = apiRoute(async (request, { params }: Context) => {
  const { id } = await params;
  const { user, pieceId, isOwner, anthology } = await access(id);
  if (!isOwner) throw new HttpError(403, "Only the person who sent this piece can change it.");
  const action = await readJson(request, pieceActionSchema);
  if (action.action === "withdraw") {
    const status = await refusalsAsHttp(() => withdrawPiece(pieceId, user.id, action.reason));
    return Response.json({ status });
  }
  if (action.action === "use-version") {
    const call = await findCall(anthology.id);
    const result = await refusalsAsHttp(() =>
      useVersion(pieceId, user.id, action, (status) => uploadsAllowed(status, call, anthology)),
    );
    return Response.json(result);
  }
  await refusalsAsHttp(() => setAltText(pieceId, user.id, action.pageIndex, action.altText));
  return Response.json({ ok: true });
});
