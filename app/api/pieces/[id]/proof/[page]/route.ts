import { apiRoute, HttpError, idParam, requireApiUser } from "@/server/api";
import { proofThumbnail } from "@/server/proofs";

type Context = { params: Promise<{ id: string; page: string }> };

/**
 * A page's preview for the proof of the viewer's own piece `id`: only pages on the same reader
 * spreads, and a neighbour's only when it is public (lib/auth/policy.ts maySeeProofNeighbour).
 */
export const GET = apiRoute(async (request, { params }: Context) => {
  const { id, page } = await params;
  const user = await requireApiUser();
  const pageNumber = Number(page);
  if (!/^[1-9][0-9]{0,3}$/.test(page)) throw new HttpError(404, "There is no such page.");
  const thumb = await proofThumbnail(user.id, idParam(id, "piece"), pageNumber);
  // The page can change with the map, so the browser asks again each time (304 when unchanged).
  if (request.headers.get("if-none-match") === thumb.etag)
    return new Response(null, { status: 304, headers: { etag: thumb.etag } });
  return new Response(new Uint8Array(thumb.webp), {
    headers: {
      "content-type": "image/webp",
      "cache-control": "private, no-cache",
      etag: thumb.etag,
    },
  });
});
