import type { ReactNode } from "react";
import { requireAnthologyAccess } from "@/server/auth/guard";

/**
 * The guard runs here, outside the segment's loading boundary, so a refusal is decided before
 * the response starts and answers 403 (in the page, behind loading.tsx, it would stream as 200).
 */
export default async function PrintFilesLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ slug: string }>;
}) {
  const { slug } = await params;
  await requireAnthologyAccess(slug, "print:view", `/studio/${slug}/print`);
  return children;
}
