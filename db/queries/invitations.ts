import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { db, schema } from "@/db";
import type { Role } from "@/lib/domain";
import { ROLE_LABELS } from "@/lib/domain";
import { env } from "@/lib/env";
import { simpleHtml } from "@/server/mail";
import { sendLoggedMail } from "./mail-log";
import type { Anthology } from "./anthologies";

const INVITATION_DAYS = 14;

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
  | { state: "unknown" | "used" | "expired" };

export async function findInvitation(token: string): Promise<InvitationLookup> {
  const [row] = await db
    .select({ invitation: schema.invitations, anthology: schema.anthologies })
    .from(schema.invitations)
    .innerJoin(schema.anthologies, eq(schema.anthologies.id, schema.invitations.anthologyId))
    .where(eq(schema.invitations.tokenHash, hashToken(token)))
    .limit(1);
  if (!row) return { state: "unknown" };
  if (row.invitation.acceptedAt) return { state: "used" };
  if (row.invitation.expiresAt.getTime() < Date.now()) return { state: "expired" };
  return { state: "valid", ...row };
}

/** Accepts an invitation for the signed-in person. Existing members keep their role. */
export async function acceptInvitation(token: string, userId: string) {
  return db.transaction(async (tx) => {
    const [invitation] = await tx
      .select()
      .from(schema.invitations)
      .where(eq(schema.invitations.tokenHash, hashToken(token)))
      .for("update");
    if (!invitation || invitation.acceptedAt || invitation.expiresAt.getTime() < Date.now()) {
      return { ok: false as const };
    }
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
    return {
      ok: true as const,
      anthologyId: invitation.anthologyId,
      keptRole: existing?.role ?? null,
    };
  });
}
