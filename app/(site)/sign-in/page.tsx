import Link from "next/link";
import { SignInForms } from "./_components/sign-in-forms";

export const metadata = { title: "Sign in" };

export default async function SignInPage({
  searchParams,
}: {
  searchParams: Promise<{ callbackUrl?: string }>;
}) {
  const { callbackUrl } = await searchParams;
  const signUpHref = callbackUrl
    ? `/sign-up?callbackUrl=${encodeURIComponent(callbackUrl)}`
    : "/sign-up";
  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-6">
      <h1 className="text-3xl font-extrabold">Sign in to Quireline</h1>
      <SignInForms callbackUrl={callbackUrl} />
      <p className="text-sm">
        New here? <Link href={signUpHref}>Create an account</Link>
      </p>
    </div>
  );
}
