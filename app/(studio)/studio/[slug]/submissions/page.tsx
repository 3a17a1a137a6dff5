import { Suspense } from "react";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { findNotifyNewPieces } from "@/db/queries/notifications";
import { NewPieceNoticeToggle } from "./_components/new-piece-notice-toggle";
import { SubmissionsTable } from "./_components/submissions-table";

export const metadata = { title: "Submissions" };

export default async function SubmissionsPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { anthology, user } = await requireAnthologyAccess(
    slug,
    "pieces:review",
    `/studio/${slug}/submissions`,
  );
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-3xl font-extrabold">Submissions</h1>
        <p className="mt-1 max-w-2xl text-sm text-ink-soft">
          Every piece sent to {anthology.title}. Open one to see its pages against the trim, bleed
          and safe area, its spec check and its history; select several to move them together.
          Contributors are e-mailed when their piece is shortlisted, accepted, declined or needs a
          fix.
        </p>
        <div className="mt-3">
          <NewPieceNoticeToggle
            slug={anthology.slug}
            initial={await findNotifyNewPieces(anthology.id, user.id)}
          />
        </div>
      </div>
      <Suspense fallback={<p className="text-sm text-ink-soft">Loading the table…</p>}>
        <SubmissionsTable slug={anthology.slug} />
      </Suspense>
    </div>
  );
}
