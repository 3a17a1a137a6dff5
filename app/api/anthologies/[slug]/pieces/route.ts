import { findAnthologyBySlug, findRole } from "@/db/queries/anthologies";
import { countActivePieces, createPiece, findCall, listOwnPieces } from "@/db/queries/submissions";
import { callRulesOf, submitRefusal } from "@/lib/pieces/submission-rules";
import { apiRoute, HttpError, readJson, requireApiAccess, requireApiUser } from "@/server/api";

import { callPhase } from "@/lib/stages";
import { formatDateTime } from "@/lib/dates";
import { pieceSchemaFor } from "@/lib/validations/piece";
import type { PieceCreatedAnswer } from "@/lib/wire/submissions";
import { mailPieceSubmitted } from "@/server/piece-submitted";

type Context = { params: Promise<{ slug: string }> };

/** The caller's own pieces in this anthology (contributors only). */
export const GET = apiRoute(async (_request, { params }: Context) => {
  const { slug } = await params;
  const { user, anthology } = await requireApiAccess(slug, "pieces:view-own");
  return Response.json({ pieces: await listOwnPieces(anthology.id, user.id) });
});

/**
 * Sends a new piece to the anthology's open call. Anyone signed in may; a person who is not yet a
 * member becomes a contributor. Editors, leads and finishers of the anthology are refused, as are
 * pieces past the call's per-person limit and pieces after the call has closed. The contributor
 * is sent a receipt.
 */
export const POST = apiRoute(async (request, { params }: Context) => {
  const { slug } = await params;
  const user = await requireApiUser();
  const anthology = await findAnthologyBySlug(slug);
  if (!anthology) throw new HttpError(404, `No anthology called "${slug}".`);
  const call = await findCall(anthology.id);
  const phase = callPhase(call, anthology.stage, new Date());
  if (!call || !call.publishedAt || phase === "unpublished")
    throw new HttpError(404, `${anthology.title} has no open call.`);
  if (phase === "upcoming")
    throw new HttpError(
      409,
      `The call opens on ${formatDateTime(call.opensAt, call.timeZone)}; come back then to send your piece.`,
    );
  if (phase === "closed")
    throw new HttpError(
      409,
      `The call closed on ${formatDateTime(call.closesAt, call.timeZone)}; it no longer takes new pieces.`,
    );
  // Cheap early answer; createPiece checks again under a lock.
  const early = submitRefusal(
    await findRole(anthology.id, user.id),
    await countActivePieces(anthology.id, user.id),
    call,
  );
  if (early) throw new HttpError(early.status, early.message);
  const input = await readJson(request, pieceSchemaFor(callRulesOf(call)));
  const piece = await createPiece(anthology, call, user.id, input);
  await mailPieceSubmitted(anthology, piece, user.id);
  return Response.json(
    {
      piece: {
        id: piece.id,
        title: piece.title,
        kind: piece.kind,
        pageCount: piece.pageCount,
        inks: piece.inks,
        status: piece.status,
        verdict: piece.verdict,
      },
      url: `/studio/${anthology.slug}/my-pieces/${piece.id}`,
    } satisfies PieceCreatedAnswer,
    { status: 201 },
  );
});
