import "server-only";
import { and, eq } from "drizzle-orm";
import { db, schema } from "@/db";
import { can } from "@/lib/auth/policy";

const m = schema.memberships;
const u = schema.users;

/** Whether this member asked to be e-mailed about each new piece. */
export async function findNotifyNewPieces(anthologyId: number, userId: string): Promise<boolean> {
  const [row] = await db
    .select({ on: m.notifyNewPieces })
    .from(m)
    .where(and(eq(m.anthologyId, anthologyId), eq(m.userId, userId)))
    .limit(1);
  return Boolean(row?.on);
}

/** Sets the member's own choice (the caller has checked they are a member who reviews). */
export async function setNotifyNewPieces(
  anthologyId: number,
  userId: string,
  on: boolean,
): Promise<void> {
  await db
    .update(m)
    .set({ notifyNewPieces: on })
    .where(and(eq(m.anthologyId, anthologyId), eq(m.userId, userId)));
}

/**
 * The members to tell about a new piece: those who opted in and whose role still reviews pieces
 * (a setting left from an editor now a finisher sends nothing), with an address to write to.
 */
export async function newPieceWatchers(anthologyId: number) {
  const rows = await db
    .select({ userId: m.userId, role: m.role, name: u.name, email: u.email })
    .from(m)
    .innerJoin(u, eq(u.id, m.userId))
    .where(and(eq(m.anthologyId, anthologyId), eq(m.notifyNewPieces, true)));
  return rows.flatMap((r) =>
    can(r.role, "pieces:review") && r.email
      ? [{ userId: r.userId, name: r.name, email: r.email }]
      : [],
  );
}
