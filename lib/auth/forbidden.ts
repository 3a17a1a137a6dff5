/**
 * What the 403 page says. A member whose role does not open a page is told so; someone who is
 * not a member of the anthology at all is told how to join instead, since no role change helps.
 */

/** Request header `proxy.ts` sets on studio requests: the path asked for. */
export const STUDIO_PATH_HEADER = "x-quireline-studio-path";

/** The anthology slug of a studio path (`/studio/<slug>/…`), or null for other studio pages. */
export function anthologySlugOfPath(path: string | null | undefined): string | null {
  const match = /^\/studio\/([^/]+)/.exec(path ?? "");
  if (!match?.[1]) return null;
  let slug: string;
  try {
    slug = decodeURIComponent(match[1]);
  } catch {
    return null;
  }
  // `/studio/new` and `/studio/account` are studio pages, not anthologies.
  if (slug === "new" || slug === "account") return null;
  return slug;
}

export type ForbiddenReason =
  { kind: "role" } | { kind: "outsider"; anthologyTitle: string; openCallPath: string | null };

/** Why the person sees the 403 page: null role in a known anthology means not a member. */
export function forbiddenReason(
  anthology: { title: string; slug: string } | null | undefined,
  isMember: boolean,
  callIsOpen: boolean,
): ForbiddenReason {
  if (!anthology || isMember) return { kind: "role" };
  return {
    kind: "outsider",
    anthologyTitle: anthology.title,
    openCallPath: callIsOpen ? `/calls/${anthology.slug}` : null,
  };
}
