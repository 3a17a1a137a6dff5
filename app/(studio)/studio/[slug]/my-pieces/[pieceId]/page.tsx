import Link from "next/link";
import { parseId } from "@/lib/ids";
import { notFound } from "next/navigation";
import { PieceStatusBadge } from "@/components/piece-status-badge";
import { SpecOverlay } from "@/components/spec-overlay";
import { SpecReport } from "@/components/spec-report";
import { Notice } from "@/components/ui/notice";
import { VerdictBadge } from "@/components/verdict-badge";
import {
  findCall,
  getPieceDetail,
  type PageView,
  type VersionView,
} from "@/db/queries/submissions";
import { placedPagesOf } from "@/db/queries/page-map";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { formatDateTime } from "@/lib/dates";
import { findCreditPiece } from "@/db/queries/credits";
import { pagesInWords } from "@/lib/map/state";
import { PIECE_KIND_LABELS, PIECE_STATUS_LABELS, type PieceStatus } from "@/lib/domain";
import { env } from "@/lib/env";
import { canMove } from "@/lib/pieces/status";
import { shouldBecomeCurrent, unreadableSinceCurrent } from "@/lib/pieces/versions";
import { specOf } from "@/lib/print/spec";
import { uploadsAllowed, uploadsClosedReason } from "@/lib/pieces/submission-rules";
import {
  masterName,
  missingFileCount,
  requiredFileLabel,
  requiredFilesOf,
  separationsExplanation,
} from "@/lib/pieces/separations";
import { loadPieceProof } from "@/server/proofs";
import { formatDate } from "@/lib/dates";
import { AltTextEditor } from "./_components/alt-text-editor";
import { CreditLineEditor } from "./_components/credit-line-editor";
import { PieceProof } from "./_components/piece-proof";
import { PageUpload } from "./_components/page-upload";
import { UnreadableUploads } from "./_components/unreadable-uploads";
import { UseVersionButton } from "./_components/use-version-button";
import { WithdrawPiece } from "./_components/withdraw-piece";

type Props = { params: Promise<{ slug: string; pieceId: string }> };

export const metadata = { title: "My piece" };

const when = (iso: string) => formatDateTime(new Date(iso));

/** "pages 8–9" for pages in a row, otherwise "pages 3 and 9". */
function mapPagesLabel(pages: number[]): string {
  const first = pages[0];
  const last = pages[pages.length - 1];
  const inARow = pages.every((page, i) => page === (first ?? 0) + i);
  return pages.length > 1 && inARow ? `pages ${first}–${last}` : pagesInWords(pages);
}

function pageName(kind: string, pageIndex: number, pageCount: number) {
  if (pageCount === 1) return "The page";
  if (kind === "spread") return pageIndex === 1 ? "Left page" : "Right page";
  return `Page ${pageIndex}`;
}

/** One of the contributor's pieces: each page's current file with its spec report, uploads, and every earlier version. */
export default async function MyPiecePage({ params }: Props) {
  const { slug, pieceId } = await params;
  const { user, anthology } = await requireAnthologyAccess(
    slug,
    "pieces:view-own",
    `/studio/${slug}/my-pieces/${pieceId}`,
  );
  const id = parseId(pieceId);
  const detail = id === null ? undefined : await getPieceDetail(id);
  if (
    !detail ||
    detail.piece.contributorId !== user.id ||
    detail.piece.anthologyId !== anthology.id
  )
    notFound();
  const { piece, pages, events } = detail;
  const call = await findCall(anthology.id);
  const open = uploadsAllowed(piece.status, call, anthology);
  const spec = specOf(anthology);
  const maxMb = env().MAX_UPLOAD_MB;
  const required = requiredFilesOf(anthology, piece);
  const bySeparation = required.some((f) => f.kind === "separation");
  const missing = missingFileCount(
    required,
    pages.map((page) => ({
      composite: page.currentVersionId === null ? null : "sent",
      separations: Object.fromEntries(
        page.separations.map((s) => [s.ink, s.currentVersionId === null ? null : "sent"]),
      ),
    })),
  );
  const mapPages = await placedPagesOf(anthology, piece.id);
  const [credit, proof] = await Promise.all([
    findCreditPiece(piece.id),
    mapPages.length > 0 ? loadPieceProof(anthology, piece.id) : Promise.resolve([]),
  ]);
  const creditStatus = credit?.creditApprovedAt
    ? `Approved on ${formatDate(credit.creditApprovedAt)}; it prints as shown.`
    : credit?.creditRequestedAt
      ? `Waiting for your approval: we e-mailed you a link on ${formatDate(credit.creditRequestedAt)}.`
      : "Not approved yet. The editors will e-mail you a link to approve it before printing.";

  return (
    <div className="flex flex-col gap-8" data-testid="my-piece-page" data-piece-id={piece.id}>
      <header className="flex flex-col gap-2">
        <p className="text-sm">
          <Link href={`/studio/${anthology.slug}/my-pieces`}>← My pieces</Link>
        </p>
        <div className="flex flex-wrap items-center gap-3">
          <h1 className="text-3xl font-extrabold" data-testid="piece-title">
            {piece.title}
          </h1>
          <PieceStatusBadge status={piece.status} />
          <span
            data-testid="piece-verdict"
            data-verdict={piece.verdict}
            className="text-sm font-semibold"
          >
            <VerdictBadge verdict={piece.verdict} />
          </span>
        </div>
        <p className="text-sm text-ink-soft">
          {PIECE_KIND_LABELS[piece.kind]} · {piece.pageCount} page{piece.pageCount === 1 ? "" : "s"}{" "}
          · inks: {piece.inks.join(", ") || "none named"}
        </p>
        {mapPages.length > 0 ? (
          <p className="text-sm font-semibold" data-testid="piece-map-pages">
            On {mapPagesLabel(mapPages)} of the map (may still change)
          </p>
        ) : null}
        {piece.statement ? (
          <p className="max-w-2xl whitespace-pre-line text-sm">{piece.statement}</p>
        ) : null}
      </header>

      {piece.status === "fix-requested" ? (
        <Notice tone="warn" title="An editor asked for a fix" testId="fix-requested">
          Read their note in the history below, then upload new files; the piece goes back to the
          editors when you do.
        </Notice>
      ) : null}
      {!open ? (
        <Notice tone="caution" title="Files are closed" testId="uploads-closed">
          {uploadsClosedReason(piece.status)}
        </Notice>
      ) : missing > 0 && bySeparation ? (
        <Notice
          title={`${missing} master${missing === 1 ? "" : "s"} still to send`}
          testId="files-missing"
        >
          Each master is a PNG, JPEG, TIFF, WebP or one-page PDF, up to {maxMb} MB, checked against
          the print spec as soon as it arrives.
        </Notice>
      ) : missing > 0 ? (
        <Notice
          title={`${missing} page${missing === 1 ? "" : "s"} still need${missing === 1 ? "s" : ""} a file`}
          testId="files-missing"
        >
          Upload one file per page: PNG, JPEG, TIFF, WebP or a one-page PDF, up to {maxMb} MB each.
          Each file is checked against the print spec as soon as it arrives.
        </Notice>
      ) : null}

      {bySeparation ? (
        <Notice title="One file per ink" testId="separations-explained">
          {separationsExplanation(piece.inks)}
        </Notice>
      ) : null}
      {piece.status === "accepted" ? <PieceProof spreads={proof} /> : null}

      <CreditLineEditor
        pieceId={piece.id}
        initial={piece.creditLine}
        status={creditStatus}
        editable={piece.status !== "withdrawn" && piece.status !== "declined"}
      />

      <div className="flex flex-col gap-10">
        {pages.map((page) => (
          <PageSection
            key={page.pageIndex}
            page={page}
            name={pageName(piece.kind, page.pageIndex, piece.pageCount)}
            pieceId={piece.id}
            spec={spec}
            open={open}
            maxMb={maxMb}
          />
        ))}
      </div>

      <section aria-labelledby="history-heading" className="flex flex-col gap-2">
        <h2 id="history-heading" className="text-xl font-semibold">
          History
        </h2>
        <ol className="flex flex-col gap-1 text-sm" data-testid="piece-history">
          {events.map((e, n) => (
            <li key={n}>
              <span className="font-mono text-xs text-ink-faint">{when(e.at)}</span> ·{" "}
              {PIECE_STATUS_LABELS[e.toStatus as PieceStatus] ?? e.toStatus}
              {e.message ? ` — ${e.message}` : ""}
            </li>
          ))}
        </ol>
      </section>

      {canMove(piece.status, "withdrawn", "contributor") ? (
        <WithdrawPiece pieceId={piece.id} title={piece.title} />
      ) : null}
    </div>
  );
}

function thumbUrl(v: VersionView) {
  return v.hasThumbnail ? `/api/file-versions/${v.id}/thumbnail` : null;
}

/** A test id for an ink: "fluorescent pink" → "fluorescent-pink". */
function inkKey(ink: string) {
  return ink.toLowerCase().replace(/[^a-z0-9]+/g, "-");
}

type OverlayFor = {
  trimWidthMm: number;
  trimHeightMm: number;
  bleedMm: number;
  safeMarginMm: number;
};

function PageSection({
  page,
  name,
  pieceId,
  spec,
  open,
  maxMb,
}: {
  page: PageView;
  name: string;
  pieceId: number;
  spec: OverlayFor;
  open: boolean;
  maxMb: number;
}) {
  const composite = page.versions.find((v) => v.id === page.currentVersionId) ?? null;
  const bySeparation = page.separations.length > 0;
  return (
    <section
      aria-labelledby={`page-${page.pageIndex}-heading`}
      className="flex flex-col gap-4"
      data-testid={`page-${page.pageIndex}`}
    >
      <h2
        id={`page-${page.pageIndex}-heading`}
        className="border-b border-ink/10 pb-1 text-2xl font-semibold"
      >
        {name}
        {composite && !bySeparation ? (
          <span className="ml-2 text-sm font-normal text-ink-soft">
            version {composite.versionNumber}
          </span>
        ) : null}
      </h2>
      {bySeparation ? (
        <>
          {page.separations.map((sep) => (
            <FileSlot
              key={sep.ink}
              testKey={`${page.pageIndex}-${inkKey(sep.ink)}`}
              heading={requiredFileLabel(name === "The page" ? "Page 1" : name, {
                kind: "separation",
                ink: sep.ink,
              })}
              what={masterName(sep.ink)}
              versions={sep.versions}
              currentVersionId={sep.currentVersionId}
              revision={sep.revision}
              ink={sep.ink}
              pageIndex={page.pageIndex}
              pieceId={pieceId}
              spec={spec}
              open={open}
              maxMb={maxMb}
            />
          ))}
          {composite || (open && page.versions.length === 0) ? (
            <details className="rounded-md border border-ink/10 bg-white/40 p-3">
              <summary className="cursor-pointer text-sm font-semibold">
                Colour guide for the editors (optional, not printed)
              </summary>
              <div className="mt-3">
                <FileSlot
                  testKey={`${page.pageIndex}`}
                  heading={null}
                  what="colour guide"
                  versions={page.versions}
                  currentVersionId={page.currentVersionId}
                  revision={page.revision}
                  ink={null}
                  pageIndex={page.pageIndex}
                  pieceId={pieceId}
                  spec={spec}
                  open={open}
                  maxMb={maxMb}
                />
              </div>
            </details>
          ) : null}
        </>
      ) : (
        <FileSlot
          testKey={`${page.pageIndex}`}
          heading={null}
          what="page"
          versions={page.versions}
          currentVersionId={page.currentVersionId}
          revision={page.revision}
          ink={null}
          pageIndex={page.pageIndex}
          pieceId={pieceId}
          spec={spec}
          open={open}
          maxMb={maxMb}
        />
      )}
      <AltTextEditor pieceId={pieceId} pageIndex={page.pageIndex} initial={page.altText ?? ""} />
    </section>
  );
}

/**
 * One file a page needs (its composite, or one ink's master): the file in use over the trim,
 * bleed and safe lines, its upload control and report, newer uploads the check could not read,
 * and the earlier versions.
 */
function FileSlot({
  testKey,
  heading,
  what,
  versions,
  currentVersionId,
  revision,
  ink,
  pageIndex,
  pieceId,
  spec,
  open,
  maxMb,
}: {
  testKey: string;
  heading: string | null;
  /** "page", "black master", "colour guide": what the file is, in sentences. */
  what: string;
  versions: VersionView[];
  currentVersionId: number | null;
  revision: number;
  ink: string | null;
  pageIndex: number;
  pieceId: number;
  spec: OverlayFor;
  open: boolean;
  maxMb: number;
}) {
  const current = versions.find((v) => v.id === currentVersionId) ?? null;
  // Newer uploads the check could not read are shown beside the file in use, not tucked away.
  const unreadable = unreadableSinceCurrent(versions, currentVersionId);
  const others = versions.filter((v) => v.id !== currentVersionId && !unreadable.includes(v));
  const label = heading ?? `The ${what}`;
  return (
    <div className="flex flex-col gap-4" data-testid={`file-${testKey}`}>
      {heading ? (
        <h3 className="text-lg font-semibold">
          {heading}
          {current ? (
            <span className="ml-2 text-sm font-normal text-ink-soft">
              version {current.versionNumber}
            </span>
          ) : null}
        </h3>
      ) : null}
      <div className="grid gap-6 md:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
        <div className="flex flex-col gap-3">
          {current ? (
            <SpecOverlay
              spec={spec}
              measured={current.report.measured}
              format={current.report.format}
              thumbnailUrl={thumbUrl(current)}
              alt={`${label}: ${current.fileName}`}
              testId={`overlay-${testKey}`}
            />
          ) : (
            <div
              className="flex aspect-[3/4] items-center justify-center rounded border border-dashed border-ink/30 text-sm text-ink-faint"
              data-testid={`no-file-${testKey}`}
            >
              {ink ? `No ${what} yet` : "No file yet"}
            </div>
          )}
          {open ? (
            <PageUpload
              pieceId={pieceId}
              pageIndex={pageIndex}
              ink={ink}
              testKey={testKey}
              revision={revision}
              maxMb={maxMb}
              replacing={current !== null}
              label={
                heading !== null || what === "colour guide"
                  ? `${current ? "Replace" : "Upload"} the ${what}`
                  : undefined
              }
            />
          ) : null}
        </div>
        <div className="flex flex-col gap-4">
          {current ? (
            <>
              <p className="text-xs text-ink-soft">
                {current.fileName} · uploaded {when(current.uploadedAt)}
              </p>
              <SpecReport report={current.report} testId={`report-${testKey}`} />
            </>
          ) : null}
        </div>
      </div>
      {current && unreadable.length > 0 ? (
        <UnreadableUploads
          versions={unreadable}
          pageIndex={pageIndex}
          inUse={current.versionNumber}
          when={when}
        />
      ) : null}
      {others.length > 0 ? (
        <details
          className="rounded-md border border-ink/10 bg-white/40 p-3"
          data-testid={`versions-${testKey}`}
        >
          <summary className="cursor-pointer text-sm font-semibold">
            {others.length} other version{others.length === 1 ? "" : "s"} of this {what}
          </summary>
          <ul className="mt-3 flex flex-col gap-6">
            {others.map((v) => (
              <li
                key={v.id}
                className="grid gap-4 md:grid-cols-[12rem_1fr]"
                data-testid="older-version"
              >
                <SpecOverlay
                  spec={spec}
                  measured={v.report.measured}
                  format={v.report.format}
                  thumbnailUrl={thumbUrl(v)}
                  alt={`Version ${v.versionNumber}: ${v.fileName}`}
                />
                <div className="flex flex-col gap-2">
                  <p className="text-sm">
                    <span className="font-semibold">Version {v.versionNumber}</span> · {v.fileName}{" "}
                    · {when(v.uploadedAt)}
                  </p>
                  <SpecReport report={v.report} />
                  {open &&
                  ink === null &&
                  shouldBecomeCurrent(v.report, current?.report ?? null) ? (
                    <UseVersionButton
                      pieceId={pieceId}
                      pageIndex={pageIndex}
                      versionId={v.id}
                      revision={revision}
                      versionNumber={v.versionNumber}
                    />
                  ) : null}
                </div>
              </li>
            ))}
          </ul>
        </details>
      ) : null}
    </div>
  );
}
