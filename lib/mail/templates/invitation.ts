import { ROLE_LABELS, type Role } from "@/lib/domain";
import { INVITATION_DAYS } from "@/lib/invitations";
import { composeMail, type Mail } from "../compose";

/** The invitation to join an anthology with a role; `link` opens it. */
export function invitationMail(input: {
  anthologyTitle: string;
  inviterName: string | null;
  role: Role;
  link: string;
}): Mail {
  const who = input.inviterName ?? "An editor";
  return composeMail(
    `You're invited to ${input.anthologyTitle} on Quireline`,
    [
      `${who} invited you to join "${input.anthologyTitle}" as ${ROLE_LABELS[input.role].toLowerCase()}.`,
      `The invitation is good for ${INVITATION_DAYS} days, and only for this e-mail address.`,
    ],
    { href: input.link, label: "Open the invitation" },
  );
}
