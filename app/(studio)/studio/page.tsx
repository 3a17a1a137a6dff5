import Link from "next/link";
import { linkButtonClass } from "@/components/ui/button";
import { listMyAnthologies } from "@/db/queries/anthologies";
import { requireUser } from "@/server/auth/guard";
import { ROLES, ROLE_LABELS, STAGE_LABELS } from "@/lib/domain";
import { formatTrim } from "@/lib/format";

export const metadata = { title: "Your anthologies" };

export default async function StudioHome() {
  const user = await requireUser("/studio");
  const anthologies = await listMyAnthologies(user.id);
  return (
    <div className="flex flex-col gap-8">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-3xl font-extrabold">Your anthologies</h1>
          <p className="text-ink-soft">
            Hello{user.name ? `, ${user.name}` : ""}. Everything you edit, finish or contribute to.
          </p>
        </div>
        <Link href="/studio/new" className={linkButtonClass("accent")}>
          New anthology
        </Link>
      </div>
      {anthologies.length === 0 ? (
        <div
          className="rounded-lg border border-dashed border-ink/30 p-8 text-center"
          data-testid="empty-studio"
        >
          <p className="font-semibold">No anthologies yet.</p>
          <p className="mt-2 text-sm text-ink-soft">
            Start one of your own, or answer an open call: when an editor accepts your work or
            invites you, it shows up here.
          </p>
        </div>
      ) : (
        ROLES.map((role) => {
          const mine = anthologies.filter((a) => a.role === role);
          if (mine.length === 0) return null;
          return (
            <section key={role} aria-labelledby={`role-${role}`} data-testid={`role-group-${role}`}>
              <h2 id={`role-${role}`} className="mb-3 text-xl font-semibold">
                As {ROLE_LABELS[role].toLowerCase()}
              </h2>
              <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
                {mine.map((a) => (
                  <li key={a.id}>
                    <Link
                      href={`/studio/${a.slug}`}
                      className="block rounded-lg border border-ink/10 bg-white/60 p-4 no-underline hover:border-teal"
                    >
                      <p className="font-display text-lg font-semibold">{a.title}</p>
                      {a.pressName ? <p className="text-sm text-ink-soft">{a.pressName}</p> : null}
                      <p className="mt-2 font-mono text-xs text-ink-faint">
                        {STAGE_LABELS[a.stage]} · {formatTrim(a)} · {a.pageCountTarget} pages
                      </p>
                    </Link>
                  </li>
                ))}
              </ul>
            </section>
          );
        })
      )}
    </div>
  );
}
