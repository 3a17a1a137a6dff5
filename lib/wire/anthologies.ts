/** What the anthology and invitation routes answer; shared by the handlers and the studio forms. */
import type { Role } from "@/lib/domain";

/** POST /api/anthologies (201): the new anthology; its creator is its lead editor. */
export interface AnthologyCreatedAnswer {
  anthology: { id: number; slug: string; title: string };
}

/** POST /api/anthologies/[slug]/invitations (201): who was invited, as what, until when (ISO 8601). */
export interface InvitationSentAnswer {
  invited: string;
  role: Role;
  expiresAt: string;
}
