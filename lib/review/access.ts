import "server-only";
import { findPieceAnthologySlug } from "@/db/queries/review";
import { HttpError, requireApiAccess, requireApiUser } from "@/lib/api";
import type { AnthologyAccess } from "@/lib/auth/guard";
import type { Action } from "@/lib/auth/policy";

/**
 * For route handlers under /api/pieces/[id]: 401 without a session, 404 for an unknown piece,
 * 403 when the person's role in the piece's anthology does not allow `action`.
 */
export async function requirePieceApiAccess(
  idParam: string,
  action: Action,
): Promise<AnthologyAccess & { pieceId: number }> {
  await requireApiUser();
  const pieceId = /^\d{1,15}$/.test(idParam) ? Number(idParam) : NaN;
  const slug = Number.isSafeInteger(pieceId) ? await findPieceAnthologySlug(pieceId) : undefined;
  if (!slug) throw new HttpError(404, "There is no such piece.");
  return { ...(await requireApiAccess(slug, action)), pieceId };
}
