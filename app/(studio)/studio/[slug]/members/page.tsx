import { revalidatePath } from "next/cache";
import { Button } from "@/components/ui/button";
import { listMembers } from "@/db/queries/anthologies";
import { listPendingInvitations, revokeInvitation } from "@/db/queries/invitations";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { can, rolesInvitableBy } from "@/lib/auth/policy";
import { ROLE_LABELS } from "@/lib/domain";
import { InviteForm } from "./_components/invite-form";

export const metadata = { title: "People" };

export default async function MembersPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { anthology, role } = await requireAnthologyAccess(
    slug,
    "members:invite",
    `/studio/${slug}/members`,
  );
  const members = await listMembers(anthology.id);
  const pending = await listPendingInvitations(anthology.id);
  const mayRevoke = can(role, "members:manage");

  async function revoke(formData: FormData) {
    "use server";
    const { anthology: a, user } = await requireAnthologyAccess(slug, "members:manage");
    const id = Number(formData.get("invitationId"));
    if (Number.isSafeInteger(id) && id > 0) await revokeInvitation(a.id, id, user.id);
    revalidatePath(`/studio/${slug}/members`);
  }
  return (
    <div className="flex max-w-3xl flex-col gap-8">
      <h1 className="text-3xl font-extrabold">People in {anthology.title}</h1>
      <table className="w-full text-left text-sm" data-testid="members">
        <thead className="text-ink-faint">
          <tr>
            <th className="py-1 font-normal">Name</th>
            <th className="py-1 font-normal">E-mail</th>
            <th className="py-1 font-normal">Role</th>
          </tr>
        </thead>
        <tbody>
          {members.map((m) => (
            <tr key={m.userId} className="border-t border-ink/10">
              <td className="py-1">{m.name}</td>
              <td className="py-1 font-mono">{m.email}</td>
              <td className="py-1">{ROLE_LABELS[m.role]}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <section aria-labelledby="pending-title" className="flex flex-col gap-3">
        <h2 id="pending-title" className="text-xl font-semibold">
          Invitations waiting for an answer
        </h2>
        {pending.length === 0 ? (
          <p className="text-sm text-ink-soft" data-testid="no-pending-invitations">
            None. Invitations that were accepted, withdrawn or have expired are not listed.
          </p>
        ) : (
          <table className="w-full text-left text-sm" data-testid="pending-invitations">
            <thead className="text-ink-faint">
              <tr>
                <th className="py-1 font-normal">E-mail</th>
                <th className="py-1 font-normal">Role</th>
                <th className="py-1 font-normal">Good until</th>
                {mayRevoke ? (
                  <th className="py-1 font-normal">
                    <span className="sr-only">Withdraw</span>
                  </th>
                ) : null}
              </tr>
            </thead>
            <tbody>
              {pending.map((p) => (
                <tr key={p.id} className="border-t border-ink/10">
                  <td className="py-1 font-mono">{p.email}</td>
                  <td className="py-1">{ROLE_LABELS[p.role]}</td>
                  <td className="py-1">{p.expiresAt.toISOString().slice(0, 10)}</td>
                  {mayRevoke ? (
                    <td className="py-1 text-right">
                      <form action={revoke}>
                        <input type="hidden" name="invitationId" value={p.id} />
                        <Button
                          type="submit"
                          variant="quiet"
                          aria-label={`Withdraw the invitation to ${p.email}`}
                        >
                          Withdraw
                        </Button>
                      </form>
                    </td>
                  ) : null}
                </tr>
              ))}
            </tbody>
          </table>
        )}
        {!mayRevoke && pending.length > 0 ? (
          <p className="text-sm text-ink-soft">Only the lead editor can withdraw an invitation.</p>
        ) : null}
      </section>
      <section aria-labelledby="invite-title">
        <h2 id="invite-title" className="mb-3 text-xl font-semibold">
          Invite someone
        </h2>
        <InviteForm slug={anthology.slug} roles={rolesInvitableBy(role)} />
      </section>
    </div>
  );
}
