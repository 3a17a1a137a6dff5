import Link from "next/link";
import { CallSpecSummaryPanel } from "@/components/call-spec-summary";
import { Notice } from "@/components/ui/notice";
import { countPiecesForStage, findCall, toCallRecord } from "@/db/queries/open-call";
import { stageLayoutFacts } from "@/db/queries/page-map";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { can } from "@/lib/auth/policy";
import { callSpecSummary } from "@/lib/call-spec";
import { env } from "@/lib/env";
import { specOf } from "@/lib/print/spec";
import { callPhase, nextStage, reviewStageMove } from "@/lib/stages";
import { formatDateTime } from "@/lib/dates";
import { allTimeZones } from "@/lib/time-zones";
import { callInputFromRecord, newCallDefaults } from "@/lib/validations/call";
import { CallForm } from "./_components/call-form";
import { StageControls } from "./_components/stage-controls";

export const metadata = { title: "Open call" };

export default async function CallPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { anthology, role } = await requireAnthologyAccess(
    slug,
    "call:edit",
    `/studio/${slug}/call`,
  );
  const row = await findCall(anthology.id);
  const record = row ? toCallRecord(row) : null;
  const now = new Date();
  const phase = callPhase(row?.publishedAt ? row : null, anthology.stage, now);
  const next = nextStage(anthology.stage);
  const zone = record?.timeZone ?? "UTC";
  const at = (date: Date) => formatDateTime(date, zone);
  const review = next
    ? reviewStageMove(
        {
          stage: anthology.stage,
          anthology,
          call: record,
          pieces: await countPiecesForStage(anthology.id),
          layout: next === "printing" ? await stageLayoutFacts(anthology) : undefined,
          now,
        },
        next,
        at,
      )
    : null;
  const publicPath = `/calls/${anthology.slug}`;
  const publicUrl = new URL(publicPath, env().AUTH_URL).href;

  return (
    <div className="flex flex-col gap-8">
      <div>
        <h1 className="text-3xl font-extrabold">Open call</h1>
        <p className="mt-1 text-ink-soft">
          What {anthology.title} asks contributors for, when, and on what terms.
        </p>
      </div>

      <Notice
        tone={phase === "open" ? "info" : phase === "closed" ? "caution" : "warn"}
        testId="call-phase"
      >
        {phase === "unpublished" ? (
          <>Not published yet. Save the call, then open it below to put up its public page.</>
        ) : (
          <>
            {phase === "upcoming" && record ? (
              <>Published; it takes work from {at(record.opensAt)}. </>
            ) : null}
            {phase === "open" && record ? (
              <>Open: taking work until {at(record.closesAt)}. </>
            ) : null}
            {phase === "closed" && record ? <>Closed on {at(record.closesAt)}. </> : null}
            Public page:{" "}
            <Link href={publicPath} className="font-mono" data-testid="public-call-link">
              {publicUrl}
            </Link>
          </>
        )}
      </Notice>

      <StageControls
        slug={anthology.slug}
        stage={anthology.stage}
        next={next}
        problems={review?.problems ?? []}
        cautions={review?.cautions ?? []}
        canAdvance={can(role, "stage:advance")}
      />

      <div className="grid gap-8 lg:grid-cols-[3fr_2fr]">
        <CallForm
          slug={anthology.slug}
          initial={record ? callInputFromRecord(record) : newCallDefaults(anthology, now)}
          isNew={!record}
          anthologyInks={anthology.inks}
          maxPages={anthology.maxPages}
          currency={anthology.currency}
          canEditTerms={can(role, "call:edit-terms")}
          timeZones={allTimeZones()}
        />
        <aside className="flex flex-col gap-4">
          <CallSpecSummaryPanel
            slug={anthology.slug}
            spec={callSpecSummary(specOf(anthology, { inks: record?.allowedInks }))}
          />
          <p className="text-xs text-ink-faint">
            The spec comes from the anthology&rsquo;s print settings. Templates for a call that is
            not open yet can be downloaded by members only.
          </p>
        </aside>
      </div>
    </div>
  );
}
