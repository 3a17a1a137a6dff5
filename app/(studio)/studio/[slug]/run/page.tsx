import { loadRunPlan } from "@/db/queries/run";
import { can } from "@/lib/auth/policy";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { RunPlanner } from "./_components/run-planner";

export const metadata = { title: "Print run" };

export default async function RunPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { anthology, role } = await requireAnthologyAccess(slug, "run:view", `/studio/${slug}/run`);
  const initial = await loadRunPlan(anthology, can(role, "run:plan"));
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-3xl font-extrabold">Print run</h1>
        <p className="max-w-3xl text-sm text-ink-soft">
          What {anthology.title} costs a copy at any quantity, printed and finished yourselves, from
          copy-shop sheets or by a print shop; where one becomes cheaper than another; and the
          finishing batches the events call for.
        </p>
      </div>
      <RunPlanner slug={slug} initial={initial} />
    </div>
  );
}
