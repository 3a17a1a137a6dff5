import type { Metadata } from "next";
import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { connection } from "next/server";
import { linkButtonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { findRole } from "@/db/queries/anthologies";
import { findPublishedCall } from "@/db/queries/open-call";
import { countActivePieces } from "@/db/queries/submissions";
import { callRulesOf, submitRefusal } from "@/lib/pieces/submission-rules";
import { currentUser } from "@/server/auth/guard";
import { formatLength, formatTrim } from "@/lib/format";
import { bleedBoxOf, pixelsFor, specOf } from "@/lib/print/spec";
import { callPhase, kindsText } from "@/lib/stages";
import { formatDateTime } from "@/lib/dates";
import { PieceForm } from "./_components/piece-form";

type Props = { params: Promise<{ slug: string }> };

export const metadata: Metadata = { title: "Send your work" };

/** The submission form of a published call; signed-out visitors go to sign-in (or sign-up) and come back. */
export default async function SubmitPage({ params }: Props) {
  await connection();
  const { slug } = await params;
  const found = await findPublishedCall(slug);
  if (!found) notFound();
  const { anthology, call } = found;
  const here = `/calls/${anthology.slug}/submit`;
  const user = await currentUser();
  if (!user) redirect(`/sign-in?callbackUrl=${encodeURIComponent(here)}`);

  const phase = callPhase(call, anthology.stage, new Date());
  const role = await findRole(anthology.id, user.id);
  const active = await countActivePieces(anthology.id, user.id);
  const refusal = phase === "open" ? submitRefusal(role, active, call) : null;
  const myPieces = `/studio/${anthology.slug}/my-pieces`;
  const px = pixelsFor(bleedBoxOf(specOf(anthology)), anthology.minPpi);

  return (
    <div className="flex flex-col gap-6">
      <header>
        <p className="text-sm text-ink-soft">
          <Link href={`/calls/${anthology.slug}`}>{call.theme}</Link> · {anthology.title}
        </p>
        <h1 className="text-3xl font-extrabold">Send your work</h1>
      </header>

      {phase === "upcoming" ? (
        <Notice tone="warn" title="Not open yet" testId="submit-closed">
          This call opens on {formatDateTime(call.opensAt, call.timeZone)}. Come back then to send
          your work.
        </Notice>
      ) : phase !== "open" ? (
        <Notice tone="caution" title="This call is closed" testId="submit-closed">
          It closed on {formatDateTime(call.closesAt, call.timeZone)} and takes no new pieces.
          {active > 0 ? (
            <>
              {" "}
              Your pieces are still on <Link href={myPieces}>your pieces page</Link>; if an editor
              asks you for a fix, you can upload new files there.
            </>
          ) : null}
        </Notice>
      ) : refusal ? (
        <Notice tone="error" title="You cannot send a piece here" testId="submit-refused">
          {refusal.message}
          {active > 0 ? (
            <>
              {" "}
              <Link href={myPieces}>See your pieces</Link>.
            </>
          ) : null}
        </Notice>
      ) : (
        <div className="grid gap-8 lg:grid-cols-[3fr_2fr]">
          <PieceForm
            slug={anthology.slug}
            rules={callRulesOf(call)}
            defaultCreditLine={user.name ?? ""}
            remaining={call.piecesPerPerson - active}
          />
          <aside className="flex flex-col gap-3 text-sm" aria-labelledby="files-heading">
            <h2 id="files-heading" className="text-xl font-semibold">
              Files come next
            </h2>
            <p>
              After you save the piece you upload one file per page. Each file is checked against
              the print spec the moment it lands, and you see what to fix.
            </p>
            <dl className="grid grid-cols-[9rem_1fr] gap-x-3 gap-y-1" data-testid="submit-spec">
              <dt className="text-ink-soft">Page</dt>
              <dd>{formatTrim(anthology)}</dd>
              <dt className="text-ink-soft">Bleed</dt>
              <dd>{formatLength(anthology.bleedMm)} on every side</dd>
              <dt className="text-ink-soft">Safe margin</dt>
              <dd>{formatLength(anthology.safeMarginMm)} inside the trim</dd>
              <dt className="text-ink-soft">Pixels per page</dt>
              <dd className="font-mono">
                {px.widthPx} x {px.heightPx} px at {anthology.minPpi} ppi
              </dd>
              <dt className="text-ink-soft">A piece may be</dt>
              <dd>{kindsText(call.allowedKinds, call.maxRunPages)}</dd>
              <dt className="text-ink-soft">Inks</dt>
              <dd>{call.allowedInks.join(", ")}</dd>
            </dl>
            {/* Only members have a pieces page: before the first piece it would answer 403, and a
                prefetch of that refusal would be reused by the move there after saving. */}
            {role ? (
              <p>
                <Link href={myPieces} className={linkButtonClass("quiet")}>
                  Your pieces
                </Link>
              </p>
            ) : null}
          </aside>
        </div>
      )}
    </div>
  );
}
