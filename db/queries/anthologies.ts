import "server-only";
import { randomBytes } from "node:crypto";
import { and, asc, eq } from "drizzle-orm";
import { db, schema } from "@/db";
import { roleChangeRefusal, type RoleChangeRefusal } from "@/lib/auth/policy";
import type { Role } from "@/lib/domain";
import { isSlug } from "@/lib/slug";
import { isDuplicateKey } from "./payouts";
import { bumpSessionVersion } from "./users";

export type Anthology = typeof schema.anthologies.$inferSelect;

/**
 * The anthology at exactly this slug. The column's collation ignores case and trailing spaces,
 * so anything not shaped like a slug is refused first and the row's slug is compared as written.
 */
export async function findAnthologyBySlug(slug: string): Promise<Anthology | undefined> {
  if (!isSlug(slug)) return undefined;
  const [row] = await db
    .select()
    .from(schema.anthologies)
    .where(eq(schema.anthologies.slug, slug))
    .limit(1);
  return row?.slug === slug ? row : undefined;
}

/**
 * The anthology named by `slug` and the person's role in it (null: not a member), in one query;
 * undefined for an unknown anthology. Every guarded route and page asks this first.
 */
export async function findAnthologyAccess(
  slug: string,
  userId: string,
): Promise<{ anthology: Anthology; role: Role | null } | undefined> {
  if (!isSlug(slug)) return undefined;
  const [row] = await db
    .select({ anthology: schema.anthologies, role: schema.memberships.role })
    .from(schema.anthologies)
    .leftJoin(
      schema.memberships,
      and(
        eq(schema.memberships.anthologyId, schema.anthologies.id),
        eq(schema.memberships.userId, userId),
      ),
    )
    .where(eq(schema.anthologies.slug, slug))
    .limit(1);
  if (row?.anthology.slug !== slug) return undefined;
  return { anthology: row.anthology, role: row.role ?? null };
}

export async function findRole(anthologyId: number, userId: string): Promise<Role | null> {
  const [row] = await db
    .select({ role: schema.memberships.role })
    .from(schema.memberships)
    .where(
      and(eq(schema.memberships.anthologyId, anthologyId), eq(schema.memberships.userId, userId)),
    )
    .limit(1);
  return row?.role ?? null;
}

/** Every anthology the person belongs to, with their role there, newest first. */
export async function listMyAnthologies(userId: string) {
  return db
    .select({
      id: schema.anthologies.id,
      slug: schema.anthologies.slug,
      title: schema.anthologies.title,
      pressName: schema.anthologies.pressName,
      stage: schema.anthologies.stage,
      trimWidthMm: schema.anthologies.trimWidthMm,
      trimHeightMm: schema.anthologies.trimHeightMm,
      trimPreset: schema.anthologies.trimPreset,
      pageCountTarget: schema.anthologies.pageCountTarget,
      role: schema.memberships.role,
    })
    .from(schema.memberships)
    .innerJoin(schema.anthologies, eq(schema.anthologies.id, schema.memberships.anthologyId))
    .where(eq(schema.memberships.userId, userId))
    .orderBy(asc(schema.anthologies.title));
}

export async function listMembers(anthologyId: number) {
  return db
    .select({
      userId: schema.users.id,
      name: schema.users.name,
      email: schema.users.email,
      role: schema.memberships.role,
    })
    .from(schema.memberships)
    .innerJoin(schema.users, eq(schema.users.id, schema.memberships.userId))
    .where(eq(schema.memberships.anthologyId, anthologyId))
    .orderBy(asc(schema.memberships.role), asc(schema.users.name));
}

/**
 * Changes a member's role, or removes them (null), under a lock on the anthology's memberships so
 * two leads cannot demote each other at once. A removed person's sessions end.
 */
export async function changeMemberRole(
  anthologyId: number,
  userId: string,
  newRole: Role | null,
): Promise<{ ok: true } | { ok: false; reason: RoleChangeRefusal }> {
  const outcome = await db.transaction(async (tx) => {
    const members = await tx
      .select({ userId: schema.memberships.userId, role: schema.memberships.role })
      .from(schema.memberships)
      .where(eq(schema.memberships.anthologyId, anthologyId))
      .for("update");
    const refusal = roleChangeRefusal(members, userId, newRole);
    if (refusal) return { ok: false as const, reason: refusal };
    const mine = and(
      eq(schema.memberships.anthologyId, anthologyId),
      eq(schema.memberships.userId, userId),
    );
    if (newRole === null) await tx.delete(schema.memberships).where(mine);
    else await tx.update(schema.memberships).set({ role: newRole }).where(mine);
    return { ok: true as const };
  });
  if (outcome.ok && newRole === null) await bumpSessionVersion(userId);
  return outcome;
}

/** Static pages under /studio whose names an anthology's slug must not take. */
const STUDIO_SEGMENTS = new Set(["new", "account"]);

/** Creates an anthology with a free slug and makes its creator the lead editor, in one transaction. */
export async function createAnthology(
  userId: string,
  fields: Omit<typeof schema.anthologies.$inferInsert, "slug" | "createdBy">,
  wantedSlug: string,
): Promise<Anthology> {
  // Two people (or two tabs) creating "Tide Pools" at once both see the slug free; the unique
  // index refuses the later insert, and the next try finds the slug taken and picks the next one.
  // After two collisions (many at once with one title), a short random tail ends the race.
  for (let attempt = 1; ; attempt++) {
    const slug =
      attempt <= 2 ? wantedSlug : `${wantedSlug.slice(0, 53)}-${randomBytes(3).toString("hex")}`;
    try {
      return await insertAnthology(userId, fields, slug);
    } catch (error) {
      if (attempt >= 8 || !isDuplicateKey(error)) throw error;
    }
  }
}

async function insertAnthology(
  userId: string,
  fields: Omit<typeof schema.anthologies.$inferInsert, "slug" | "createdBy">,
  wantedSlug: string,
): Promise<Anthology> {
  return db.transaction(async (tx) => {
    let slug = wantedSlug;
    for (let n = 2; ; n++) {
      const [taken] = await tx
        .select({ id: schema.anthologies.id })
        .from(schema.anthologies)
        .where(eq(schema.anthologies.slug, slug))
        .limit(1);
      if (!taken && !STUDIO_SEGMENTS.has(slug)) break;
      slug = `${wantedSlug.slice(0, 55)}-${n}`;
    }
    const [inserted] = await tx
      .insert(schema.anthologies)
      .values({ ...fields, slug, createdBy: userId })
      .$returningId();
    if (!inserted) throw new Error("insert returned no id");
    await tx.insert(schema.memberships).values({ anthologyId: inserted.id, userId, role: "lead" });
    const [row] = await tx
      .select()
      .from(schema.anthologies)
      .where(eq(schema.anthologies.id, inserted.id));
    if (!row) throw new Error("anthology vanished after insert");
    return row;
  });
}
