import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { and, desc, eq, gt, isNull } from "drizzle-orm";
import { db, schema } from "@/db";
import type { Role } from "@/lib/domain";
import { ROLE_LABELS } from "@/lib/domain";
import {
  acceptanceCheck,
  INVITATION_DAYS,
  invitationState,
  type InvitationState,
} from "@/lib/invitations";
import { env } from "@/lib/env";
import { simpleHtml } from "@/server/mail";
import { sendLoggedMail } from "./mail-log";
import type { Anthology } from "./anthologies";

const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");

/** Records an invitation and e-mails its link; the e-mail is logged. */
export async function inviteToAnthology(
  anthology: Anthology,
  inviter: { id: string; name: string | null },
  email: string,
  role: Role,
) {
  const token = randomBytes(24).toString("base64url");
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 24 * 3600 * 1000);
  await db.insert(schema.invitations).values({
    anthologyId: anthology.id,
    email,
    role,
    tokenHash: hashToken(token),
    invitedBy: inviter.id,
    expiresAt,
  });
  const link = `${env().AUTH_URL.replace(/\/$/, "")}/invite/${token}`;
  const subject = `You're invited to ${anthology.title} on Quireline`;
  const who = inviter.name ?? "An editor";
  const lines = [
    `${who} invited you to join "${anthology.title}" as ${ROLE_LABELS[role].toLowerCase()}.`,
    `The invitation is good for ${INVITATION_DAYS} days.`,
  ];
  await sendLoggedMail({
    anthologyId: anthology.id,
    kind: "invitation",
    to: email,
    subject,
    text: `${lines.join("\n")}\n\n${link}\n`,
    html: simpleHtml(lines, { href: link, label: "Open the invitation" }),
  });
  return { expiresAt };
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
