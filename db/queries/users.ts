import "server-only";
import { eq, sql } from "drizzle-orm";
import { db, schema } from "@/db";

/** The person's current session version, or undefined when the account is gone. */
export async function sessionVersionOf(userId: string): Promise<number | undefined> {
  const [row] = await db
    .select({ sessionVersion: schema.users.sessionVersion })
    .from(schema.users)
    .where(eq(schema.users.id, userId))
    .limit(1);
  return row?.sessionVersion;
}

/** Ends every session the person holds: tokens carrying the old version stop working. */
export async function bumpSessionVersion(userId: string): Promise<void> {
  await db
    .update(schema.users)
    .set({ sessionVersion: sql`${schema.users.sessionVersion} + 1` })
    .where(eq(schema.users.id, userId));
}

/** The account's password hash (null for link-only accounts), or undefined for no such account. */
export async function passwordHashOf(userId: string): Promise<string | null | undefined> {
  const [row] = await db
    .select({ passwordHash: schema.users.passwordHash })
    .from(schema.users)
    .where(eq(schema.users.id, userId))
    .limit(1);
  return row ? row.passwordHash : undefined;
}

/** Sets a new password hash and ends every session the person holds, in one statement. */
export async function replacePassword(userId: string, passwordHash: string): Promise<void> {
  await db
    .update(schema.users)
    .set({ passwordHash, sessionVersion: sql`${schema.users.sessionVersion} + 1` })
    .where(eq(schema.users.id, userId));
}

/** The account's address and whether a sign-in link ever confirmed it. */
export async function accountFacts(
  userId: string,
): Promise<{ email: string | null; emailVerified: Date | null }> {
  const [row] = await db
    .select({ email: schema.users.email, emailVerified: schema.users.emailVerified })
    .from(schema.users)
    .where(eq(schema.users.id, userId))
    .limit(1);
  return row ?? { email: null, emailVerified: null };
}
