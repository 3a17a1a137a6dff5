import { findRole } from "@/db/queries/anthologies";
import { findThumbnail } from "@/db/queries/submissions";
import { apiRoute, assertMaySeePiece, HttpError, idParam, requireApiUser } from "@/server/api";

/** A file version's WebP preview: for the piece's contributor and the anthology's lead and editors. */
export const GET = apiRoute(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  const user = await requireApiUser();
  const row = await findThumbnail(idParam(id, "file"));
  if (!row) throw new HttpError(404, "There is no such file.");
  assertMaySeePiece(
    await findRole(row.anthologyId, user.id),
    row.contributorId === user.id,
    "file",
  );
  if (!row.webp)
    throw new HttpError(404, "This file has no preview: it could not be read as a picture.");
  // A version's file never changes, so its preview can be cached for good (privately).
  const etag = `"${row.md5 ?? id}"`;
  if (request.headers.get("if-none-match") === etag)
    return new Response(null, { status: 304, headers: { etag } });
  return new Response(new Uint8Array(row.webp), {
    headers: {
      "content-type": "image/webp",
      "cache-control": "private, max-age=31536000, immutable",
      etag,
    },
  });
});
