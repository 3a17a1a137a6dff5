import "server-only";
import { forbidden, notFound, redirect } from "next/navigation";
import type { ReactNode } from "react";
import { auth } from "@/auth";
import { findAnthologyAccess, type Anthology } from "@/db/queries/anthologies";
import type { Role, SessionUser } from "@/lib/domain";
import { can, type Action } from "@/lib/auth/policy";

/** The signed-in person, or null. */
export async function currentUser(): Promise<SessionUser | null> {
  const session = await auth();
  const user = session?.user;
  if (!user?.id) return null;
  return { id: user.id, name: user.name ?? null, email: user.email ?? null };
}

/** For pages: the signed-in person, or a redirect to sign-in that comes back to `returnTo`. */
export async function requireUser(returnTo = "/studio"): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) redirect(`/sign-in?callbackUrl=${encodeURIComponent(returnTo)}`);
  return user;
}

export type AnthologyAccess = { user: SessionUser; anthology: Anthology; role: Role | null };

/** For pages: 404 for an unknown anthology, 403 page when the person's role does not allow `action`. */
export async function requireAnthologyAccess(
  slug: string,
  action: Action,
  returnTo?: string,
): Promise<AnthologyAccess> {
  const user = await requireUser(returnTo ?? `/studio/${slug}`);
  const found = await findAnthologyAccess(slug, user.id);
  if (!found) notFound();
  const { anthology, role } = found;
  if (!can(role, action)) forbidden();
  return { user, anthology, role };
}

/**
 * The layout of a section with a loading.tsx: the access check runs in the layout, outside the
 * segment's loading boundary, so a refusal is decided before the response starts and answers 403
 * (in the page, behind loading.tsx, it would stream as 200). `section` is the path under the
 * anthology, for the sign-in return.
 */
export function guardedSectionLayout(action: Action, section: string) {
  return async function GuardedSectionLayout({
    children,
    params,
  }: {
    children: ReactNode;
    params: Promise<{ slug: string }>;
  }) {
    const { slug } = await params;
    await requireAnthologyAccess(slug, action, `/studio/${slug}/${section}`);
    return children;
  };
}
