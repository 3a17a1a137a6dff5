import { findRole } from "@/db/queries/anthologies";
import { findThumbnail } from "@/db/queries/submissions";
import { apiRoute, HttpError, requireApiUser } from "@/lib/api";
import { idFromParam } from "@/lib/submissions/http";

/** A file version's WebP preview: for the piece's contributor and the anthology's lead and editors. */
export const GET = apiRoute(async (request, { params }: { params: Promise<{ id: string }> }) => {
  const { id } = await params;
  const user = await requireApiUser();
  const row = await findThumbnail(idFromParam(id, "file"));
  if (!row) throw new HttpError(404, "There is no such file.");
  const role = await findRole(row.anthologyId, user.id);
  if (role === null) throw new HttpError(404, "There is no such file.");
  const allowed =
    role === "lead" ||
    role === "editor" ||
    (role === "contributor" && row.contributorId === user.id);
  if (!allowed)
    throw new HttpError(
      403,
      "Only the piece's contributor and the anthology's editors can see its files.",
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
