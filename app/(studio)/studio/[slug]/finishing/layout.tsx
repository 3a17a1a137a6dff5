import type { ReactNode } from "react";
import { requireAnthologyAccess } from "@/server/auth/guard";

/** The guard runs outside the loading boundary so a refusal answers 403 (see map/layout.tsx). */
export default async function FinishingLayout({
  children,
  params,
}: {
  children: ReactNode;
  params: Promise<{ slug: string }>;
}) {
  const { slug } = await params;
  await requireAnthologyAccess(slug, "finishing:view", `/studio/${slug}/finishing`);
  return children;
}
