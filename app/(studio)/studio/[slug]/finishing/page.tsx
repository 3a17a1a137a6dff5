import { loadFinishing } from "@/db/queries/run";
import { can } from "@/lib/auth/policy";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { FinishingBoard } from "./_components/finishing-board";

export const metadata = { title: "Finishing" };

export default async function FinishingPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { anthology, role } = await requireAnthologyAccess(
    slug,
    "finishing:view",
    `/studio/${slug}/finishing`,
  );
  const initial = await loadFinishing(anthology, {
    canTick: can(role, "finishing:tick"),
    mayShowEmail: can(role, "contributors:private-data"),
  });
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-3xl font-extrabold">Finishing</h1>
        <p className="max-w-3xl text-sm text-ink-soft">
          The batches of {anthology.title}, each with the steps this booklet needs. Tick a step when
          the whole batch has been through it.
        </p>
      </div>
      <FinishingBoard
        slug={slug}
        initial={initial}
        planHref={can(role, "run:plan") ? `/studio/${slug}/run` : null}
      />
    </div>
  );
}
