import Link from "next/link";

export const metadata = { title: "Sign-in problem" };

const MESSAGES: Record<string, { title: string; text: string }> = {
  Verification: {
    title: "This sign-in link no longer works",
    text: "Each link signs you in once and expires after an hour. This one has been used already or has expired. Ask for a fresh link below.",
  },
  AccessDenied: {
    title: "Sign-in was refused",
    text: "This account may not sign in. Ask the anthology's lead editor.",
  },
  Configuration: {
    title: "Sign-in is not set up correctly",
    text: "The server's sign-in settings are incomplete. Tell the person who runs this Quireline.",
  },
};

export default async function SignInProblem({
  searchParams,
}: {
  searchParams: Promise<{ error?: string }>;
}) {
  const { error } = await searchParams;
  const message = MESSAGES[error ?? ""] ?? {
    title: "Sign-in did not go through",
    text: "Something interrupted signing in. Please try again.",
  };
  return (
    <section className="mx-auto max-w-xl py-10" data-testid="sign-in-problem">
      <h1 className="text-3xl font-extrabold">{message.title}</h1>
      <p className="mt-4 text-ink-soft">{message.text}</p>
      <Link href="/sign-in" className="mt-6 inline-block font-semibold">
        Back to sign-in
      </Link>
    </section>
  );
}
