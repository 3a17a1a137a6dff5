import { apiRoute, HttpError, readJson, requireApiAccess } from "@/server/api";
import { rolesInvitableBy } from "@/lib/auth/policy";
import { inviteToAnthology } from "@/server/invitations";
import { inviteSchema } from "@/lib/validations/anthology";
import type { InvitationSentAnswer } from "@/lib/wire/anthologies";

/** Invites a person by e-mail with a role; leads may invite any role, editors all but leads. */
export const POST = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const { slug } = await params;
  const { anthology, user, role } = await requireApiAccess(slug, "members:invite");
  const input = await readJson(request, inviteSchema);
  if (!rolesInvitableBy(role).includes(input.role)) {
    throw new HttpError(403, "Only the lead editor can invite another lead editor.");
  }
  const { expiresAt } = await inviteToAnthology(anthology, user, input.email, input.role);
  return Response.json(
    {
      invited: input.email,
      role: input.role,
      expiresAt: expiresAt.toISOString(),
    } satisfies InvitationSentAnswer,
    { status: 201 },
  );
});
