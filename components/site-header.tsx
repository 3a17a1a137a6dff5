import Link from "next/link";
import { signOut } from "@/auth";
import { currentUser } from "@/server/auth/guard";
import { Logo } from "@/components/ui/logo";

/** Top bar: the name mark, and either the studio link and sign-out or the sign-in links. */
export async function SiteHeader() {
  const user = await currentUser();
  return (
    <header className="border-b border-ink/10 bg-paper/90">
      <div className="mx-auto flex max-w-6xl items-center justify-between gap-4 px-5 py-3">
        <Link href={user ? "/studio" : "/"} className="no-underline" aria-label="Quireline home">
          <Logo />
        </Link>
        <nav className="flex items-center gap-4 text-sm">
          {user ? (
            <>
              <Link href="/studio" className="font-semibold">
                Your anthologies
              </Link>
              <Link
                href="/studio/account"
                className="hidden text-ink-faint sm:inline"
                data-testid="signed-in-as"
                title="Your account"
              >
                {user.email}
              </Link>
              <form
                action={async () => {
                  "use server";
                  await signOut({ redirectTo: "/" });
                }}
              >
                <button
                  type="submit"
                  className="rounded border border-ink/30 px-3 py-1 hover:bg-paper-deep"
                >
                  Sign out
                </button>
              </form>
            </>
          ) : (
            <>
              <Link href="/sign-in">Sign in</Link>
              <Link
                href="/sign-up"
                className="rounded bg-ink px-3 py-1 font-semibold text-paper no-underline"
              >
                Create an account
              </Link>
            </>
          )}
        </nav>
      </div>
    </header>
  );
}
