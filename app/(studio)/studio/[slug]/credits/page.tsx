import { can } from "@/lib/auth/policy";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { creditsOverview } from "@/server/credits";
import { CreditsScreen } from "./_components/credits-screen";

export const metadata = { title: "Credits" };

/** Credit lines of the pieces in this issue: who approved, who was asked, and the page they make. */
export default async function CreditsPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { anthology, role } = await requireAnthologyAccess(
    slug,
    "credits:manage",
    `/studio/${slug}/credits`,
  );
  const initial = await creditsOverview(anthology, {
    mayShowEmail: can(role, "contributors:private-data"),
  });
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-3xl font-extrabold">Credits</h1>
        <p className="max-w-3xl text-sm text-ink-soft">
          Each contributor approves their credit line from a link in an e-mail, before anything
          prints. Only approved lines go on the credits page; the rest are listed as outstanding.
        </p>
      </div>
      <CreditsScreen slug={slug} initial={initial} />
    </div>
  );
}
