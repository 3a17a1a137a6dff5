import { passwordHashOf } from "@/db/queries/users";
import { requireUser } from "@/server/auth/guard";
import { Notice } from "@/components/ui/notice";
import { PasswordForm } from "./_components/password-form";

export const metadata = { title: "Your account" };

export default async function AccountPage({
  searchParams,
}: {
  searchParams: Promise<{ changed?: string }>;
}) {
  const user = await requireUser("/studio/account");
  const { changed } = await searchParams;
  const hasPassword = Boolean(await passwordHashOf(user.id));
  return (
    <div className="flex max-w-3xl flex-col gap-8">
      <div>
        <h1 className="text-3xl font-extrabold">Your account</h1>
        <p className="text-ink-soft">
          Signed in as <span className="font-mono">{user.email}</span>
          {user.name ? ` (${user.name})` : ""}.
        </p>
      </div>
      <section aria-labelledby="password-title" className="flex flex-col gap-3">
        <h2 id="password-title" className="text-xl font-semibold">
          {hasPassword ? "Change your password" : "Set a password"}
        </h2>
        <p className="text-sm text-ink-soft">
          {hasPassword
            ? "Changing it signs you out on every other browser and device."
            : "You sign in by e-mail link today. A password lets you sign in without waiting for mail."}
        </p>
        {changed === "1" ? (
          <Notice tone="info" testId="password-outcome">
            Password changed. You were signed out everywhere else; this browser stays signed in.
          </Notice>
        ) : null}
        <PasswordForm hasPassword={hasPassword} />
      </section>
    </div>
  );
}
