import Link from "next/link";
import { SignUpForm } from "./_components/sign-up-form";

export const metadata = { title: "Create an account" };

export default async function SignUpPage({
  searchParams,
}: {
  searchParams: Promise<{ callbackUrl?: string }>;
}) {
  const { callbackUrl } = await searchParams;
  return (
    <div className="mx-auto flex max-w-md flex-col gap-6">
      <h1 className="text-3xl font-extrabold">Create your Quireline account</h1>
      <p className="text-ink-soft">
        One account for everything: editing your own anthologies and sending work to other
        people&apos;s calls.
      </p>
      <SignUpForm callbackUrl={callbackUrl} />
      <p className="text-sm">
        Already have an account?{" "}
        <Link
          href={
            callbackUrl ? `/sign-in?callbackUrl=${encodeURIComponent(callbackUrl)}` : "/sign-in"
          }
        >
          Sign in
        </Link>
      </p>
    </div>
  );
}
