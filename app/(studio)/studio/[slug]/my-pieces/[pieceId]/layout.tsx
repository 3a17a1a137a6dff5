import { notFound } from "next/navigation";
import type { ReactNode } from "react";
import { findPieceAccess } from "@/db/queries/submissions";
import { parseId } from "@/lib/ids";
import { requireAnthologyAccess } from "@/server/auth/guard";

/**
 * Only the contributor who sent a piece opens its page. Decided here, outside the segment's
 * loading boundary, so another person's piece or an id that does not exist answers 404 before the
 * response starts (in the page, behind loading.tsx, the refusal would stream as 200).
 */
export default async function MyPieceLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ slug: string; pieceId: string }>;
}) {
  const { slug, pieceId } = await params;
  const { user, anthology } = await requireAnthologyAccess(
    slug,
    "pieces:view-own",
    `/studio/${slug}/my-pieces/${pieceId}`,
  );
  const id = parseId(pieceId);
  const access = id === null ? undefined : await findPieceAccess(id, user.id);
  if (!access || !access.isOwner || access.anthology.id !== anthology.id) notFound();
  return children;
}
