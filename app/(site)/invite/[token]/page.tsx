import Link from "next/link";
import { redirect } from "next/navigation";
import { AuthError } from "next-auth";
import { signIn } from "@/auth";
import { Button, linkButtonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { acceptInvitation, findInvitation } from "@/db/queries/invitations";
import { accountFacts } from "@/db/queries/users";
import { ROLE_LABELS } from "@/lib/domain";
import { acceptanceCheck, maskEmail } from "@/lib/invitations";
import { currentUser } from "@/server/auth/guard";

export const metadata = { title: "Invitation" };

const PROBLEMS = {
  unknown: "This invitation link is not one we know. Check that the whole link was copied.",
  used: "This invitation has already been accepted. Find the anthology under your anthologies.",
  expired: "This invitation has expired. Ask the editor to send a new one.",
  revoked: "This invitation was withdrawn by the anthology's lead editor.",
  "other-address": "This invitation was sent to another address.",
  unconfirmed: "Confirm the invited address first.",
} as const;

/**
 * An invitation opened from its e-mail. Only the invited address may accept it: an account with
 * that address, confirmed by a sign-in link sent to it. Anyone else is offered that link.
 */
export default async function InvitationPage({
  params,
  searchParams,
}: {
  params: Promise<{ token: string }>;
  searchParams: Promise<{ problem?: string }>;
}) {
  const { token } = await params;
  const { problem } = await searchParams;
  const self = `/invite/${encodeURIComponent(token)}`;
  const found = await findInvitation(token);
  if (found.state !== "valid") {
    return (
      <section className="mx-auto max-w-xl py-10" data-testid="invitation-problem">
        <h1 className="text-3xl font-extrabold">This invitation cannot be used</h1>
        <p className="mt-4 text-ink-soft">{PROBLEMS[found.state]}</p>
      </section>
    );
  }
  const { invitation, anthology } = found;
  const invited = maskEmail(invitation.email);
  const user = await currentUser();
  const check = user
    ? acceptanceCheck(invitation.email, await accountFacts(user.id))
    : "other-address";

  async function accept() {
    "use server";
    const signedIn = await currentUser();
    if (!signedIn) redirect(`/sign-in?callbackUrl=${encodeURIComponent(self)}`);
    const result = await acceptInvitation(token, signedIn.id);
    redirect(result.ok ? `/studio` : `${self}?problem=${result.reason}`);
  }

  async function sendLink() {
    "use server";
    // The link goes to the invited address only, whoever pressed the button.
    const again = await findInvitation(token);
    if (again.state !== "valid") redirect(self);
    try {
      await signIn("nodemailer", {
        email: again.invitation.email,
        redirect: false,
        redirectTo: self,
      });
    } catch (error) {
      if (error instanceof AuthError) redirect(`${self}?problem=mail`);
      throw error;
    }
    redirect(`/sign-in/check-email`);
  }

  const role = ROLE_LABELS[invitation.role].toLowerCase();
  return (
    <section className="mx-auto flex max-w-xl flex-col gap-5 py-10">
      <h1 className="text-3xl font-extrabold">Join {anthology.title}</h1>
      <p className="text-ink-soft">
        You are invited as {role}. The invitation was sent to{" "}
        <strong className="font-mono">{invited}</strong>
        {user ? (
          <>
            ; you are signed in as <span className="font-mono">{user.email}</span>
          </>
        ) : null}
        .
      </p>
      {problem === "mail" ? (
        <Notice tone="error" testId="invitation-notice">
          We could not send the link just now. Try again in a minute.
        </Notice>
      ) : problem && problem in PROBLEMS ? (
        <Notice tone="error" testId="invitation-notice">
          {PROBLEMS[problem as keyof typeof PROBLEMS]}
        </Notice>
      ) : null}
      {check === "ok" ? (
        <form action={accept}>
          <Button type="submit" variant="accent">
            Accept the invitation
          </Button>
        </form>
      ) : (
        <div className="flex flex-col gap-4" data-testid="invitation-confirm">
          <p>
            {check === "unconfirmed"
              ? "Your account has this address, but it has not been confirmed yet. We will e-mail a sign-in link to it; opening it confirms the address and brings you back here."
              : user
                ? "Only the invited address can accept. We will e-mail a sign-in link to it; opening it signs you in with that address and brings you back here."
                : "Sign in with the invited address to accept. We can e-mail a sign-in link to it, which also makes an account if there is none."}
          </p>
          <div className="flex flex-wrap gap-3">
            <form action={sendLink}>
              <Button type="submit" variant="accent">
                E-mail a sign-in link to {invited}
              </Button>
            </form>
            {!user ? (
              <Link
                href={`/sign-in?callbackUrl=${encodeURIComponent(self)}`}
                className={linkButtonClass("quiet")}
              >
                Sign in with a password
              </Link>
            ) : null}
          </div>
        </div>
      )}
    </section>
  );
}
