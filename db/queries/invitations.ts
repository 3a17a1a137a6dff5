import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { and, desc, eq, gt, isNull } from "drizzle-orm";
import { db, schema } from "@/db";
import type { Role } from "@/lib/domain";
import {
  acceptanceCheck,
  INVITATION_DAYS,
  invitationState,
  type InvitationState,
} from "@/lib/invitations";
import type { Anthology } from "./anthologies";

const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");

/** Records an invitation; the token comes back once, to be e-mailed, and only its hash is kept. */
export async function createInvitation(
  anthologyId: number,
  inviterId: string,
  email: string,
  role: Role,
): Promise<{ token: string; expiresAt: Date }> {
  const token = randomBytes(24).toString("base64url");
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 24 * 3600 * 1000);
  await db.insert(schema.invitations).values({
    anthologyId,
    email,
    role,
    tokenHash: hashToken(token),
    invitedBy: inviterId,
    expiresAt,
  });
  return { token, expiresAt };
}

export type InvitationLookup =
  | { state: "valid"; invitation: typeof schema.invitations.$inferSelect; anthology: Anthology }
  | { state: "unknown" | Exclude<InvitationState, "valid"> };

export async function findInvitation(token: string): Promise<InvitationLookup> {
  const [row] = await db
    .select({ invitation: schema.invitations, anthology: schema.anthologies })
    .from(schema.invitations)
    .innerJoin(schema.anthologies, eq(schema.anthologies.id, schema.invitations.anthologyId))
    .where(eq(schema.invitations.tokenHash, hashToken(token)))
    .limit(1);
  if (!row) return { state: "unknown" };
  const state = invitationState(row.invitation, new Date());
  return state === "valid" ? { state, ...row } : { state };
}

export type AcceptOutcome =
  | { ok: true; anthologyId: number; keptRole: Role | null }
  | { ok: false; reason: "unknown" | "other-address" | "unconfirmed" | InvitationState };

/**
 * Accepts an invitation for the signed-in person: only an account whose confirmed address is the
 * invited one, once, while the invitation is neither expired nor revoked. Existing members keep
 * their role.
 */
export async function acceptInvitation(token: string, userId: string): Promise<AcceptOutcome> {
  return db.transaction(async (tx) => {
    const [invitation] = await tx
      .select()
      .from(schema.invitations)
      .where(eq(schema.invitations.tokenHash, hashToken(token)))
      .for("update");
    if (!invitation) return { ok: false, reason: "unknown" };
    const state = invitationState(invitation, new Date());
    if (state !== "valid") return { ok: false, reason: state };
    const [account] = await tx
      .select({ email: schema.users.email, emailVerified: schema.users.emailVerified })
      .from(schema.users)
      .where(eq(schema.users.id, userId));
    const check = acceptanceCheck(
      invitation.email,
      account ?? { email: null, emailVerified: null },
    );
    if (check !== "ok") return { ok: false, reason: check };
    const [existing] = await tx
      .select()
      .from(schema.memberships)
      .where(
        and(
          eq(schema.memberships.anthologyId, invitation.anthologyId),
          eq(schema.memberships.userId, userId),
        ),
      );
    if (!existing) {
      await tx
        .insert(schema.memberships)
        .values({ anthologyId: invitation.anthologyId, userId, role: invitation.role });
    }
    await tx
      .update(schema.invitations)
      .set({ acceptedAt: new Date(), acceptedBy: userId })
      .where(eq(schema.invitations.id, invitation.id));
    return { ok: true, anthologyId: invitation.anthologyId, keptRole: existing?.role ?? null };
  });
}

/** Invitations still waiting for an answer (not accepted, revoked or expired), newest first. */
export async function listPendingInvitations(anthologyId: number) {
  const i = schema.invitations;
  return db
    .select({
      id: i.id,
      email: i.email,
      role: i.role,
      expiresAt: i.expiresAt,
      createdAt: i.createdAt,
      invitedBy: schema.users.name,
    })
    .from(i)
    .leftJoin(schema.users, eq(schema.users.id, i.invitedBy))
    .where(
      and(
        eq(i.anthologyId, anthologyId),
        isNull(i.acceptedAt),
        isNull(i.revokedAt),
        gt(i.expiresAt, new Date()),
      ),
    )
    .orderBy(desc(i.createdAt));
}

/** Revokes a pending invitation of this anthology; false when there was none to revoke. */
export async function revokeInvitation(
  anthologyId: number,
  invitationId: number,
  byUserId: string,
): Promise<boolean> {
  const i = schema.invitations;
  const [result] = await db
    .update(i)
    .set({ revokedAt: new Date(), revokedBy: byUserId })
    .where(
      and(
        eq(i.id, invitationId),
        eq(i.anthologyId, anthologyId),
        isNull(i.acceptedAt),
        isNull(i.revokedAt),
      ),
    );
  return result.affectedRows > 0;
}
