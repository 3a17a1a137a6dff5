import { revalidatePath } from "next/cache";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { redirect } from "next/navigation";
import { changeMemberRole, listMembers } from "@/db/queries/anthologies";
import { listPendingInvitations, revokeInvitation } from "@/db/queries/invitations";
import { requireAnthologyAccess } from "@/server/auth/guard";
import {
  can,
  ROLE_CHANGE_REFUSALS,
  rolesInvitableBy,
  type RoleChangeRefusal,
} from "@/lib/auth/policy";
import { formatDate } from "@/lib/dates";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/domain";
import { InviteForm } from "./_components/invite-form";

export const metadata = { title: "People" };

export default async function MembersPage({
  params,
  searchParams,
}: {
  params: Promise<{ slug: string }>;
  searchParams: Promise<{ problem?: string }>;
}) {
  const { slug } = await params;
  const { problem } = await searchParams;
  const { anthology, role } = await requireAnthologyAccess(
    slug,
    "members:invite",
    `/studio/${slug}/members`,
  );
  const members = await listMembers(anthology.id);
  const pending = await listPendingInvitations(anthology.id);
  const mayManage = can(role, "members:manage");
  const here = `/studio/${slug}/members`;

  async function setRole(formData: FormData) {
    "use server";
    const { anthology: a } = await requireAnthologyAccess(slug, "members:manage");
    const userId = String(formData.get("userId") ?? "");
    const wanted = String(formData.get("role") ?? "");
    const next =
      wanted === "remove"
        ? null
        : (ROLES as readonly string[]).includes(wanted)
          ? (wanted as Role)
          : undefined;
    if (next === undefined) redirect(here);
    const outcome = await changeMemberRole(a.id, userId, next);
    revalidatePath(here);
    if (!outcome.ok) redirect(`${here}?problem=${outcome.reason}`);
    redirect(here);
  }

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
      {problem && problem in ROLE_CHANGE_REFUSALS ? (
        <Notice tone="error" testId="members-problem">
          {ROLE_CHANGE_REFUSALS[problem as RoleChangeRefusal]}
        </Notice>
      ) : null}
      {mayManage ? (
        <p className="-mt-4 text-sm text-ink-soft">
          Removing someone signs them out everywhere; their pieces and notes stay with the
          anthology.
        </p>
      ) : null}
      <table className="w-full text-left text-sm" data-testid="members">
        <thead className="text-ink-faint">
          <tr>
            <th className="py-1 font-normal">Name</th>
            {/* On a phone the address goes under the name, so the role picker still fits. */}
            <th className="hidden py-1 font-normal sm:table-cell">E-mail</th>
            <th className="py-1 font-normal">Role</th>
          </tr>
        </thead>
        <tbody>
          {members.map((m) => (
            <tr key={m.userId} className="border-t border-ink/10">
              <td className="py-1">
                {m.name}
                <span className="block break-all font-mono text-xs sm:hidden">{m.email}</span>
              </td>
              <td className="hidden py-1 font-mono sm:table-cell">{m.email}</td>
              <td className="py-1">
                {mayManage ? (
                  <form action={setRole} className="flex flex-wrap items-center gap-2">
                    <input type="hidden" name="userId" value={m.userId} />
                    <label className="sr-only" htmlFor={`role-${m.userId}`}>
                      Role of {m.name ?? m.email}
                    </label>
                    <select
                      id={`role-${m.userId}`}
                      name="role"
                      defaultValue={m.role}
                      className="rounded border border-ink/30 bg-white px-2 py-1"
                    >
                      {ROLES.map((r) => (
                        <option key={r} value={r}>
                          {ROLE_LABELS[r]}
                        </option>
                      ))}
                      <option value="remove">Remove from the anthology</option>
                    </select>
                    <Button
                      type="submit"
                      variant="quiet"
                      aria-label={`Save the role of ${m.name ?? m.email}`}
                    >
                      Save
                    </Button>
                  </form>
                ) : (
                  ROLE_LABELS[m.role]
                )}
              </td>
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
                {mayManage ? (
                  <th className="py-1 font-normal">
                    <span className="sr-only">Withdraw</span>
                  </th>
                ) : null}
              </tr>
            </thead>
            <tbody>
              {pending.map((p) => (
                <tr key={p.id} className="border-t border-ink/10">
                  <td className="break-all py-1 font-mono">{p.email}</td>
                  <td className="py-1">{ROLE_LABELS[p.role]}</td>
                  <td className="py-1">{formatDate(p.expiresAt)}</td>
                  {mayManage ? (
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
        {!mayManage && pending.length > 0 ? (
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
