/**
 * Review state for the demo almanac, laid over whatever pieces the demo already holds: a status
 * history line for pieces that are past "waiting for a read" but have none, and one editors' note
 * from the lead. Changes no piece's status. Idempotent: rows are added only when missing.
 */
import { and, asc, eq, inArray, ne } from "drizzle-orm";
import type { Db } from "@/db";
import { schema } from "@/db";

const NOTE =
  "Strong line work. Check the teal separation against the drum before we commit to a spread.";

export async function seedReview(db: Db): Promise<{ events: number; notes: number }> {
  const [almanac] = await db
    .select()
    .from(schema.anthologies)
    .where(eq(schema.anthologies.slug, "low-tide-almanac"))
    .limit(1);
  if (!almanac) throw new Error("seed the demo press before its review state");
  const [lead] = await db
    .select({ userId: schema.memberships.userId })
    .from(schema.memberships)
    .where(and(eq(schema.memberships.anthologyId, almanac.id), eq(schema.memberships.role, "lead")))
    .limit(1);
  if (!lead) return { events: 0, notes: 0 };

  const pieces = await db
    .select({ id: schema.pieces.id, status: schema.pieces.status })
    .from(schema.pieces)
    .where(eq(schema.pieces.anthologyId, almanac.id))
    .orderBy(asc(schema.pieces.id));
  if (pieces.length === 0) return { events: 0, notes: 0 };

  let events = 0;
  const moved = pieces.filter((p) => p.status !== "awaiting-review" && p.status !== "withdrawn");
  if (moved.length) {
    const withHistory = new Set(
      (
        await db
          .select({ pieceId: schema.pieceEvents.pieceId })
          .from(schema.pieceEvents)
          .where(
            and(
              inArray(
                schema.pieceEvents.pieceId,
                moved.map((p) => p.id),
              ),
              ne(schema.pieceEvents.toStatus, "awaiting-review"),
            ),
          )
      ).map((e) => e.pieceId),
    );
    for (const piece of moved.filter((p) => !withHistory.has(p.id))) {
      await db.insert(schema.pieceEvents).values({
        pieceId: piece.id,
        actorId: lead.userId,
        fromStatus: "awaiting-review",
        toStatus: piece.status,
        message:
          piece.status === "fix-requested"
            ? "The teal layer is missing its registration marks; please add them and send it again."
            : null,
      });
      events++;
    }
  }

  let notes = 0;
  const first = pieces[0]!;
  const [existing] = await db
    .select({ id: schema.editorNotes.id })
    .from(schema.editorNotes)
    .where(and(eq(schema.editorNotes.pieceId, first.id), eq(schema.editorNotes.body, NOTE)))
    .limit(1);
  if (!existing) {
    await db
      .insert(schema.editorNotes)
      .values({ pieceId: first.id, authorId: lead.userId, body: NOTE });
    notes++;
  }
  return { events, notes };
}
