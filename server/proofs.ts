import "server-only";
import type { Anthology } from "@/db/queries/anthologies";
import { creditApprovals, currentPageArt, thumbnailBytes } from "@/db/queries/credits";
import { readMapState } from "@/db/queries/page-map";
import { findPieceAccess } from "@/db/queries/submissions";
import { maySeePiece, maySeeProofNeighbour, pieceIsPublic } from "@/lib/auth/policy";
import { proofSpreads, sharesSpreadWith } from "@/lib/credits/proof";
import { RESERVATION_LABELS } from "@/lib/map-edits/labels";
import { HttpError } from "@/server/api";

/**
 * A contributor's proof of their piece in the book: its reader spreads with the facing pages, and
 * the neighbours' artwork only where the policy allows it (lib/auth/policy.ts maySeeProofNeighbour).
 */

export type ProofPageView = {
  page: number;
  kind: "own" | "neighbour" | "reserved" | "empty";
  /** What the page holds, in words: a title, "Credits", "Empty". */
  label: string;
  /** Which page of a multi-page piece, e.g. "2 of 3"; null otherwise. */
  partOf: string | null;
  /** The thumbnail to show, or null when only the label may be shown (or there is no file). */
  imageUrl: string | null;
  alt: string;
  /** For a neighbour: whether its contributor approved their credit (so it may be shown). */
  isPublic: boolean | null;
};

export type ProofSpreadView = { label: string; pages: ProofPageView[] };

/** The spreads of `pieceId` as its contributor's proof shows them; empty when it is not on the map. */
export async function loadPieceProof(
  anthology: Anthology,
  pieceId: number,
): Promise<ProofSpreadView[]> {
  const { state } = await readMapState(anthology);
  const spreads = proofSpreads(state, pieceId);
  const pieceIds = [
    ...new Set(
      spreads.flatMap((s) =>
        s.pages.flatMap((p) => (p.kind === "own" || p.kind === "neighbour" ? [p.pieceId] : [])),
      ),
    ),
  ];
  const [approvals, art] = await Promise.all([creditApprovals(pieceIds), currentPageArt(pieceIds)]);
  const artOf = (id: number, index: number) =>
    art.find((a) => a.pieceId === id && a.pageIndex === index);
  const titleOf = (id: number) => state.pieces.find((p) => p.id === id)?.title ?? `Piece ${id}`;
  const lengthOf = (id: number) => art.filter((a) => a.pieceId === id).length;
  return spreads.map(({ spread, pages }) => ({
    label:
      spread.kind === "front-cover"
        ? "Front cover"
        : spread.kind === "back-cover"
          ? "Back cover"
          : `Pages ${spread.pages.join("–")}`,
    pages: pages.map((p): ProofPageView => {
      if (p.kind === "reserved")
        return {
          page: p.page,
          kind: "reserved",
          label: RESERVATION_LABELS[p.reservation],
          partOf: null,
          imageUrl: null,
          alt: "",
          isPublic: null,
        };
      if (p.kind === "empty")
        return {
          page: p.page,
          kind: "empty",
          label: "Not filled yet",
          partOf: null,
          imageUrl: null,
          alt: "",
          isPublic: null,
        };
      const title = titleOf(p.pieceId);
      const found = artOf(p.pieceId, p.piecePageIndex);
      const length = lengthOf(p.pieceId);
      const hasThumb = Boolean(found?.versionId && found.hasThumbnail);
      const isPublic =
        p.kind === "own"
          ? null
          : pieceIsPublic({
              creditApprovedAt: approvals.get(p.pieceId) ?? null,
            });
      const imageUrl = !hasThumb
        ? null
        : p.kind === "own"
          ? `/api/file-versions/${found!.versionId}/thumbnail`
          : isPublic
            ? `/api/pieces/${pieceId}/proof/${p.page}`
            : null;
      return {
        page: p.page,
        kind: p.kind,
        label: title,
        partOf: length > 1 ? `${p.piecePageIndex} of ${length}` : null,
        imageUrl,
        alt: found?.altText?.trim() || `${title}${length > 1 ? `, page ${p.piecePageIndex}` : ""}`,
        isPublic,
      };
    }),
  }));
}

/**
 * The thumbnail of reader page `page` for the proof of the viewer's piece `ownPieceId`: 404 unless
 * the viewer sent that piece, 403 unless the page shares a spread with it and its piece is public
 * (or is their own), 404 when the page has no preview.
 */
export async function proofThumbnail(
  userId: string,
  ownPieceId: number,
  page: number,
): Promise<{ webp: Buffer; etag: string }> {
  const access = await findPieceAccess(ownPieceId, userId);
  if (!access || !access.isOwner || access.role === null)
    throw new HttpError(404, "There is no such piece.");
  const { state } = await readMapState(access.anthology);
  const slot = state.slots.find((s) => s.page === page);
  if (!slot || slot.pieceId === null) throw new HttpError(404, "That page holds no piece.");
  const own = (await findPieceAccess(slot.pieceId, userId))?.isOwner ?? false;
  const allowed = own
    ? maySeePiece(access.role, true)
    : maySeeProofNeighbour(access.role, {
        sharesSpreadWithOwnPiece: sharesSpreadWith(state, ownPieceId, page),
        neighbourIsPublic: pieceIsPublic({
          creditApprovedAt: (await creditApprovals([slot.pieceId])).get(slot.pieceId) ?? null,
        }),
      });
  if (!allowed)
    throw new HttpError(
      403,
      "Only the pages on your own spreads whose contributors approved their credit can be shown.",
    );
  const art = (await currentPageArt([slot.pieceId])).find(
    (a) => a.pageIndex === (slot.piecePageIndex ?? 1),
  );
  const bytes = art?.versionId ? await thumbnailBytes(art.versionId) : undefined;
  if (!bytes?.webp) throw new HttpError(404, "This page has no preview yet.");
  return { webp: bytes.webp, etag: `"${art!.versionId}-${bytes.md5 ?? ""}"` };
}
