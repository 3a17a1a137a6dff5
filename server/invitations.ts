import "server-only";
import type { Anthology } from "@/db/queries/anthologies";
import { createInvitation } from "@/db/queries/invitations";
import type { Role } from "@/lib/domain";
import { invitationMail } from "@/lib/mail/templates/invitation";
import { appUrl, sendLoggedMail } from "@/server/mail";

/** Records an invitation and e-mails its link to the invited address; the e-mail is logged. */
export async function inviteToAnthology(
  anthology: Anthology,
  inviter: { id: string; name: string | null },
  email: string,
  role: Role,
): Promise<{ expiresAt: Date; mailed: boolean }> {
  const { token, expiresAt } = await createInvitation(anthology.id, inviter.id, email, role);
  const mail = invitationMail({
    anthologyTitle: anthology.title,
    inviterName: inviter.name,
    role,
    link: appUrl(`/invite/${token}`),
  });
  const { sent } = await sendLoggedMail(
    { anthologyId: anthology.id, kind: "invitation", to: email },
    mail,
  );
  return { expiresAt, mailed: sent };
}
