/**
 * Invitations to an anthology: when one can still be used, and who may accept it. An invitation
 * is bound to the address it was sent to: only an account with that address, confirmed by an
 * e-mail link, may accept it, once, before it expires and unless the lead revoked it.
 */

/** How long an invitation link stays good. */
export const INVITATION_DAYS = 14;

export interface InvitationFacts {
  email: string;
  expiresAt: Date;
  acceptedAt: Date | null;
  revokedAt: Date | null;
}

export type InvitationState = "valid" | "used" | "expired" | "revoked";

/** Whether the invitation can still be accepted at `now`; a used or revoked one never again. */
export function invitationState(invitation: InvitationFacts, now: Date): InvitationState {
  if (invitation.acceptedAt) return "used";
  if (invitation.revokedAt) return "revoked";
  if (invitation.expiresAt.getTime() <= now.getTime()) return "expired";
  return "valid";
}

export interface AccountFacts {
  email: string | null;
  emailVerified: Date | null;
}

/**
 * Whether this account may accept an invitation sent to `invitedEmail`: "ok", "other-address"
 * (signed in as someone else), or "unconfirmed" (the right address, never confirmed by a link:
 * anyone can type an address into the sign-up form).
 */
export function acceptanceCheck(
  invitedEmail: string,
  account: AccountFacts,
): "ok" | "other-address" | "unconfirmed" {
  if (!account.email || normaliseEmail(account.email) !== normaliseEmail(invitedEmail))
    return "other-address";
  return account.emailVerified ? "ok" : "unconfirmed";
}

/** E-mail addresses compare without case and surrounding space (as sign-in stores them). */
export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

/** An address with most of its local part hidden, e.g. "j•••@example.org", for pages a link opens. */
export function maskEmail(email: string): string {
  const at = email.lastIndexOf("@");
  if (at <= 0) return "•••";
  return `${email[0]}•••${email.slice(at)}`;
}
