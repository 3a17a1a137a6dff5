import Link from "next/link";
import type { ReactNode } from "react";
import { findAnthologyAccess } from "@/db/queries/anthologies";
import { currentUser } from "@/server/auth/guard";
import { can, type Action } from "@/lib/auth/policy";

/** Sections of an anthology, each shown only to roles that may open it. */
const SECTIONS: { href: string; label: string; action: Action }[] = [
  { href: "", label: "Overview", action: "anthology:view" },
  { href: "/spec", label: "Print spec", action: "anthology:edit-spec" },
  { href: "/call", label: "Open call", action: "call:edit" },
  { href: "/submissions", label: "Submissions", action: "pieces:review" },
  { href: "/my-pieces", label: "My pieces", action: "pieces:view-own" },
  { href: "/map", label: "Page map", action: "map:view" },
  { href: "/print", label: "Print files", action: "print:view" },
  { href: "/credits", label: "Credits", action: "credits:manage" },
  { href: "/sales", label: "Sales", action: "sales:record" },
  { href: "/payouts", label: "Payouts", action: "payouts:manage" },
  { href: "/my-payouts", label: "My payouts", action: "payouts:view-own" },
  { href: "/run", label: "Print run", action: "run:view" },
  { href: "/finishing", label: "Finishing", action: "finishing:view" },
  { href: "/stock", label: "Stock", action: "stock:view" },
  { href: "/members", label: "People", action: "members:invite" },
];

export default async function AnthologyLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ slug: string }>;
}) {
  const { slug } = await params;
  const user = await currentUser();
  const found = user ? await findAnthologyAccess(slug, user.id) : undefined;
  const anthology = found?.anthology;
  const role = found?.role ?? null;
  const visible = SECTIONS.filter((s) => can(role, s.action));
  return (
    <div className="flex flex-col gap-6">
      {anthology && visible.length > 0 ? (
        <nav
          aria-label={`${anthology.title} sections`}
          className="flex flex-wrap gap-1 border-b border-ink/10 pb-2 text-sm"
        >
          <span className="mr-3 font-display font-semibold">{anthology.title}</span>
          {visible.map((s) => (
            <Link
              key={s.href}
              href={`/studio/${slug}${s.href}`}
              className="rounded px-2 py-1 no-underline hover:bg-paper-deep"
            >
              {s.label}
            </Link>
          ))}
        </nav>
      ) : null}
      {children}
    </div>
  );
}
