import { addEditorNote, listEditorNotes } from "@/db/queries/review";
import { apiRoute, readJson, requirePieceApiAccess } from "@/server/api";
import { editorNoteSchema } from "@/lib/validations/review";
import type { NoteAddedAnswer, NotesAnswer } from "@/lib/wire/review";

type Context = { params: Promise<{ id: string }> };

/** The editors' notes on a piece, newest first. Contributors never see these. */
export const GET = apiRoute(async (_request, { params }: Context) => {
  const { id } = await params;
  const { pieceId } = await requirePieceApiAccess(id, "pieces:review");
  return Response.json({ notes: await listEditorNotes(pieceId) } satisfies NotesAnswer, {
    headers: { "cache-control": "no-store" },
  });
});

export const POST = apiRoute(async (request, { params }: Context) => {
  const { id } = await params;
  const { pieceId, user } = await requirePieceApiAccess(id, "pieces:review");
  const input = await readJson(request, editorNoteSchema);
  return Response.json(
    { note: await addEditorNote(pieceId, user, input.body) } satisfies NoteAddedAnswer,
    { status: 201 },
  );
});
