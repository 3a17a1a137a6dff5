import Link from "next/link";
import { PieceStatusBadge } from "@/components/piece-status-badge";
import { linkButtonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { VerdictBadge } from "@/components/verdict-badge";
import { countActivePieces, findCall, listOwnPieces } from "@/db/queries/submissions";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { PIECE_KIND_LABELS } from "@/lib/domain";
import { callPhase } from "@/lib/stages";
import { formatDateTime } from "@/lib/dates";

export const metadata = { title: "My pieces" };

/** A contributor's pieces in one anthology: status, spec verdict and how many pages have files. */
export default async function MyPiecesPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { user, anthology } = await requireAnthologyAccess(
    slug,
    "pieces:view-own",
    `/studio/${slug}/my-pieces`,
  );
  const [pieces, call] = await Promise.all([
    listOwnPieces(anthology.id, user.id),
    findCall(anthology.id),
  ]);
  const phase = callPhase(call, anthology.stage, new Date());
  const active = await countActivePieces(anthology.id, user.id);
  const canSendMore = phase === "open" && call !== undefined && active < call.piecesPerPerson;

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-3xl font-extrabold">My pieces</h1>
          {call ? (
            <p className="text-sm text-ink-soft">
              {phase === "open"
                ? `The call is open until ${formatDateTime(call.closesAt, call.timeZone)}. You have ${active} of ${call.piecesPerPerson} pieces in.`
                : phase === "closed"
                  ? `The call closed on ${formatDateTime(call.closesAt, call.timeZone)}; files can only change where an editor asks for a fix.`
                  : "The call is not open yet."}
            </p>
          ) : null}
        </div>
        {canSendMore ? (
          <Link
            href={`/calls/${anthology.slug}/submit`}
            className={linkButtonClass("accent")}
            data-testid="send-another"
          >
            Send {pieces.length ? "another" : "a"} piece
          </Link>
        ) : null}
      </div>

      {pieces.length === 0 ? (
        <Notice title="No pieces yet" testId="my-pieces-empty">
          {phase === "open"
            ? "You have not sent a piece to this call yet."
            : "You did not send a piece to this call."}
        </Notice>
      ) : (
        <ul className="flex flex-col gap-3" data-testid="my-pieces">
          {pieces.map((piece) => (
            <li
              key={piece.id}
              className="flex items-center gap-4 rounded-lg border border-ink/10 bg-white/50 p-3"
              data-testid="my-piece"
            >
              <div className="flex h-20 w-16 shrink-0 items-center justify-center overflow-hidden rounded border border-ink/10 bg-paper-deep">
                {piece.firstVersionId ? (
                  // A plain img: the preview is private, already small, and served by our own route.
                  <img
                    src={`/api/file-versions/${piece.firstVersionId}/thumbnail`}
                    alt=""
                    className="max-h-full max-w-full"
                  />
                ) : (
                  <span className="px-1 text-center text-[10px] text-ink-faint">no file yet</span>
                )}
              </div>
              <div className="flex min-w-0 flex-1 flex-col gap-1">
                <Link
                  href={`/studio/${anthology.slug}/my-pieces/${piece.id}`}
                  className="font-semibold"
                  data-testid="my-piece-link"
                >
                  {piece.title}
                </Link>
                <p className="text-xs text-ink-soft">
                  {PIECE_KIND_LABELS[piece.kind]} · {piece.pageCount} page
                  {piece.pageCount === 1 ? "" : "s"} · {piece.inks.join(", ") || "no inks named"} ·{" "}
                  {piece.pagesWithFiles} of {piece.pageCount} file{piece.pageCount === 1 ? "" : "s"}{" "}
                  uploaded
                </p>
              </div>
              <div className="flex flex-col items-end gap-1 text-sm">
                <PieceStatusBadge status={piece.status} />
                <VerdictBadge verdict={piece.verdict} />
              </div>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
