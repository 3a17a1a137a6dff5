import { redirect } from "next/navigation";
import { Button } from "@/components/ui/button";
import { acceptInvitation, findInvitation } from "@/db/queries/invitations";
import { requireUser } from "@/server/auth/guard";
import { ROLE_LABELS } from "@/lib/domain";

export const metadata = { title: "Invitation" };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const user = await requireUser(`/invite/${token}`);
  const found = await findInvitation(token);
  if (found.state !== "valid") {
    const text = {
      unknown: "This invitation link is not one we know. Check that the whole link was copied.",
      used: "This invitation has already been accepted. Find the anthology under your anthologies.",
      expired: "This invitation has expired. Ask the editor to send a new one.",
    }[found.state];
    return (
      <section className="mx-auto max-w-xl py-10" data-testid="invitation-problem">
        <h1 className="text-3xl font-extrabold">This invitation cannot be used</h1>
        <p className="mt-4 text-ink-soft">{text}</p>
      </section>
    );
  }
  async function accept() {
    "use server";
    const result = await acceptInvitation(token, user.id);
    redirect(result.ok ? `/studio` : `/invite/${token}`);
  }
  return (
    <section className="mx-auto max-w-xl py-10">
      <h1 className="text-3xl font-extrabold">Join {found.anthology.title}</h1>
      <p className="mt-4 text-ink-soft">
        You are invited as {ROLE_LABELS[found.invitation.role].toLowerCase()}. You are signed in as{" "}
        {user.email}.
      </p>
      <form action={accept} className="mt-6">
        <Button type="submit" variant="accent">
          Accept the invitation
        </Button>
      </form>
    </section>
  );
}
