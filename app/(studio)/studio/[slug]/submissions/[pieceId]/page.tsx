import Link from "next/link";
import { parseId } from "@/lib/ids";
import { notFound } from "next/navigation";
import { PieceStatusBadge } from "@/components/piece-status-badge";
import { SpecOverlay } from "@/components/spec-overlay";
import { SpecReport } from "@/components/spec-report";
import { VerdictBadge } from "@/components/verdict-badge";
import { getPieceForReview, type ReviewVersion } from "@/db/queries/review";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { formatDateTime } from "@/lib/dates";
import { PIECE_KIND_LABELS, PIECE_STATUS_LABELS } from "@/lib/domain";
import type { OverlaySpec } from "@/lib/pieces/overlay";
import { specOf } from "@/lib/print/spec";
import { editorMovesFrom } from "@/lib/pieces/status";
import { listInks, masterName, requiredFileLabel } from "@/lib/pieces/separations";
import type { SpecReport as Report } from "@/lib/print/check";
import { EditorNotes } from "./_components/editor-notes";
import { StatusChangeForm } from "./_components/status-change-form";

export const metadata = { title: "Submission" };

const when = (date: Date) => formatDateTime(date);

function sizeText(bytes: number) {
  return bytes < 1024 * 1024
    ? `${(bytes / 1024).toFixed(0)} KB`
    : `${(bytes / 1048576).toFixed(1)} MB`;
}

export default async function SubmissionPage({
  params,
}: {
  params: Promise<{ slug: string; pieceId: string }>;
}) {
  const { slug, pieceId } = await params;
  const { anthology } = await requireAnthologyAccess(
    slug,
    "pieces:review",
    `/studio/${slug}/submissions/${pieceId}`,
  );
  const id = parseId(pieceId);
  const detail = id === null ? undefined : await getPieceForReview(anthology.id, id);
  if (!detail) notFound();
  const { piece, contributor, pages, events } = detail;
  const spec = specOf(anthology);
  const facts: [string, string][] = [
    ["Kind", PIECE_KIND_LABELS[piece.kind]],
    ["Pages", String(piece.pageCount)],
    ["Inks", piece.inks.join(", ")],
    ["Credit line", piece.creditLine + (piece.creditApprovedAt ? " (approved)" : "")],
    ["Sent", when(piece.createdAt)],
    ["Last change", when(piece.updatedAt)],
  ];

  return (
    <div className="flex flex-col gap-8">
      <div className="flex flex-col gap-2">
        <Link href={`/studio/${slug}/submissions`} className="text-sm">
          ← All submissions
        </Link>
        <h1 className="text-3xl font-extrabold" data-testid="piece-title">
          {piece.title}
        </h1>
        <p className="flex flex-wrap items-center gap-3 text-sm">
          <span>
            by <strong>{contributor.name ?? "Unnamed contributor"}</strong>
            {contributor.email ? (
              <span className="font-mono text-ink-soft"> · {contributor.email}</span>
            ) : null}
          </span>
          <span data-testid="piece-status">
            <PieceStatusBadge status={piece.status} />
          </span>
          <VerdictBadge verdict={piece.verdict} />
        </p>
      </div>

      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="flex flex-col gap-8">
          <dl className="grid grid-cols-[9rem_1fr] gap-x-4 gap-y-1 text-sm">
            {facts.map(([label, value]) => (
              <div key={label} className="contents">
                <dt className="text-ink-soft">{label}</dt>
                <dd>{value}</dd>
              </div>
            ))}
          </dl>
          {piece.statement ? (
            <section aria-labelledby="statement-title">
              <h2 id="statement-title" className="mb-1 text-lg font-semibold">
                Contributor&rsquo;s statement
              </h2>
              <p className="max-w-2xl whitespace-pre-line text-sm">{piece.statement}</p>
            </section>
          ) : null}

          <section aria-labelledby="pages-title" className="flex flex-col gap-6">
            <h2 id="pages-title" className="text-2xl font-semibold">
              Pages
            </h2>
            {pages.map((page) => (
              <article
                key={page.pageIndex}
                className="flex flex-col gap-3 border-t border-ink/10 pt-4"
                data-testid="review-page"
                aria-labelledby={`page-${page.pageIndex}`}
              >
                <h3 id={`page-${page.pageIndex}`} className="text-lg font-semibold">
                  Page {page.pageIndex} of {pages.length}
                </h3>
                {page.separations.length > 0 ? (
                  <>
                    <p className="text-sm text-ink-soft">
                      Sent as one greyscale master per ink (
                      {listInks(page.separations.map((s) => s.ink))}).
                    </p>
                    {page.separations.map((sep) => (
                      <div
                        key={sep.ink}
                        className="flex flex-col gap-2"
                        data-testid="review-separation"
                        data-ink={sep.ink}
                      >
                        <h4 className="font-semibold">
                          {requiredFileLabel(`Page ${page.pageIndex}`, {
                            kind: "separation",
                            ink: sep.ink,
                          })}
                        </h4>
                        {sep.current ? (
                          <VersionView
                            version={sep.current}
                            spec={spec}
                            alt={`${piece.title}, page ${page.pageIndex}, ${masterName(sep.ink)}`}
                            current
                          />
                        ) : (
                          <p className="rounded-md border border-dashed border-ink/30 px-4 py-6 text-sm text-ink-soft">
                            No {masterName(sep.ink)} for this page yet.
                          </p>
                        )}
                        {sep.older.length ? (
                          <details className="rounded-md border border-ink/15 px-3 py-2">
                            <summary className="cursor-pointer text-sm font-semibold">
                              Earlier {masterName(sep.ink)}s ({sep.older.length})
                            </summary>
                            <div className="mt-3 flex flex-col gap-6">
                              {sep.older.map((version) => (
                                <VersionView
                                  key={version.id}
                                  version={version}
                                  spec={spec}
                                  alt={`${piece.title}, page ${page.pageIndex}, ${masterName(sep.ink)}, version ${version.versionNumber}`}
                                />
                              ))}
                            </div>
                          </details>
                        ) : null}
                      </div>
                    ))}
                    {page.current ? (
                      <div className="flex flex-col gap-2">
                        <h4 className="font-semibold">Colour guide (not printed)</h4>
                        <VersionView
                          version={page.current}
                          spec={spec}
                          alt={
                            page.altText ?? `${piece.title}, page ${page.pageIndex}, colour guide`
                          }
                        />
                      </div>
                    ) : null}
                  </>
                ) : page.current ? (
                  <VersionView
                    version={page.current}
                    spec={spec}
                    alt={page.altText ?? `${piece.title}, page ${page.pageIndex}`}
                    current
                  />
                ) : (
                  <p className="rounded-md border border-dashed border-ink/30 px-4 py-6 text-sm text-ink-soft">
                    No file for this page yet.
                  </p>
                )}
                {page.older.length ? (
                  <details
                    className="rounded-md border border-ink/15 px-3 py-2"
                    data-testid="older-versions"
                  >
                    <summary className="cursor-pointer text-sm font-semibold">
                      Earlier versions ({page.older.length})
                    </summary>
                    <div className="mt-3 flex flex-col gap-6">
                      {page.older.map((version) => (
                        <VersionView
                          key={version.id}
                          version={version}
                          spec={spec}
                          alt={`${piece.title}, page ${page.pageIndex}, version ${version.versionNumber}`}
                        />
                      ))}
                    </div>
                  </details>
                ) : null}
              </article>
            ))}
          </section>
        </div>

        <aside className="flex flex-col gap-8">
          <section aria-labelledby="status-title" className="flex flex-col gap-3">
            <h2 id="status-title" className="text-xl font-semibold">
              Status
            </h2>
            <StatusChangeForm
              pieceId={piece.id}
              status={piece.status}
              moves={[...editorMovesFrom(piece.status)]}
              contributorName={contributor.name ?? contributor.email ?? "the contributor"}
            />
          </section>

          <section aria-labelledby="history-title" className="flex flex-col gap-3">
            <h2 id="history-title" className="text-xl font-semibold">
              History
            </h2>
            <ol className="flex flex-col gap-3 text-sm" data-testid="status-history">
              {events.map((event) => (
                <li key={event.id} className="border-l-2 border-ink/20 pl-3">
                  <p>
                    {event.fromStatus ? (
                      <>
                        {PIECE_STATUS_LABELS[event.fromStatus] ?? event.fromStatus} →{" "}
                        <strong>{PIECE_STATUS_LABELS[event.toStatus] ?? event.toStatus}</strong>
                      </>
                    ) : (
                      <strong>{PIECE_STATUS_LABELS[event.toStatus] ?? event.toStatus}</strong>
                    )}
                  </p>
                  <p className="text-xs text-ink-soft">
                    {when(event.createdAt)}
                    {event.actorName ? ` · ${event.actorName}` : ""}
                  </p>
                  {event.message ? (
                    <blockquote className="mt-1 whitespace-pre-line border-l-2 border-mustard pl-2 text-ink-soft">
                      {event.message}
                    </blockquote>
                  ) : null}
                </li>
              ))}
              <li className="border-l-2 border-ink/20 pl-3">
                <p>
                  <strong>Sent</strong>
                </p>
                <p className="text-xs text-ink-soft">{when(piece.createdAt)}</p>
              </li>
            </ol>
          </section>

          <section aria-labelledby="notes-title" className="flex flex-col gap-3">
            <h2 id="notes-title" className="text-xl font-semibold">
              Editors&rsquo; notes
            </h2>
            <p className="text-xs text-ink-soft">
              Only the lead and editors of {anthology.title} see these. Contributors never do.
            </p>
            <EditorNotes pieceId={piece.id} />
          </section>
        </aside>
      </div>
    </div>
  );
}

function VersionView({
  version,
  spec,
  alt,
  current = false,
}: {
  version: ReviewVersion;
  spec: OverlaySpec;
  alt: string;
  current?: boolean;
}) {
  const report = version.report as Report | null;
  return (
    <div
      className="grid gap-4 sm:grid-cols-[minmax(0,16rem)_1fr]"
      data-testid={current ? "current-version" : "older-version"}
    >
      <SpecOverlay
        spec={spec}
        measured={report?.measured}
        format={report?.format}
        thumbnailUrl={version.hasThumbnail ? `/api/file-versions/${version.id}/thumbnail` : null}
        alt={alt}
      />
      <div className="flex flex-col gap-2">
        <p className="text-sm">
          <strong>Version {version.versionNumber}</strong>
          {current ? " (in use)" : ""} · <span className="font-mono">{version.fileName}</span> ·{" "}
          {sizeText(version.sizeBytes)}
        </p>
        <p className="text-xs text-ink-soft">
          Uploaded {when(version.createdAt)}
          {version.uploadedByName ? ` by ${version.uploadedByName}` : ""}
        </p>
        {report && Array.isArray(report.findings) ? (
          <SpecReport report={report} />
        ) : (
          <VerdictBadge verdict={version.verdict} />
        )}
      </div>
    </div>
  );
}
