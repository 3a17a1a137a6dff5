import { listMembers } from "@/db/queries/anthologies";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { rolesInvitableBy } from "@/lib/auth/policy";
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
      <section aria-labelledby="invite-title">
        <h2 id="invite-title" className="mb-3 text-xl font-semibold">
          Invite someone
        </h2>
        <InviteForm slug={anthology.slug} roles={rolesInvitableBy(role)} />
      </section>
    </div>
  );
}
