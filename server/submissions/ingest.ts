import "server-only";
import { errorSummary, log } from "@/server/log";
/**
 * What happens to an artwork file once it is stored: read it back, check it against the
 * anthology's print spec, make a thumbnail, record the version with its report, move the page's
 * current file (guarded by the page revision; a file the check could not read never displaces a
 * readable one), recompute the piece's verdict and status, and e-mail the contributor the
 * result. Also the upload route's permission check, and the check itself for re-checks.
 */
import { createHash } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import { db, schema } from "@/db";
import type { Anthology } from "@/db/queries/anthologies";
import { markOutputsStale } from "@/db/queries/print-files";
import { findCall, refreshPieceVerdict } from "@/db/queries/submissions";
import type { PieceKind, PieceStatus } from "@/lib/domain";
import { Refusal } from "@/lib/refusal";
import { env } from "@/lib/env";
import { specReportMail } from "@/lib/mail/templates/spec-report";
import { appUrl, sendLoggedMail } from "@/server/mail";
import { checkArtwork, type SpecReport } from "@/lib/print/check";
import { statusAfterNewFile } from "@/lib/pieces/status";
import { uploadsAllowed, uploadsClosedReason } from "@/lib/pieces/submission-rules";
import { masterName, specForFile, uploadInkRefusal } from "@/lib/pieces/separations";
import { isPieceVerdict, type PieceVerdict } from "@/lib/pieces/verdict";
import { readable, shouldBecomeCurrent, type HeldBack } from "@/lib/pieces/versions";
import { maxUploadBytes, readStoredFile } from "@/server/uploads";
import type { ArtworkUploadInput } from "@/lib/validations/piece";
import { makeThumbnail } from "./thumbnail";

const p = schema.pieces;
const pp = schema.piecePages;
const fv = schema.fileVersions;
const ps = schema.pageSeparations;

export type UploadMetadata = {
  pieceId: number;
  pageIndex: number;
  /** The separation's ink, or null for the page's composite file. */
  ink: string | null;
  expectedRevision: number;
  userId: string;
};

/**
 * The upload route's permission check, before any byte is sent: the piece is the caller's, the
 * page exists, the page has not changed since the caller's screen showed it, and the piece takes
 * files (open call or a fix asked for). Also refuses files over the size limit with the numbers.
 */
export async function authoriseArtworkUpload(
  userId: string | null,
  input: ArtworkUploadInput,
  files: readonly { name: string; size: number }[],
  now = new Date(),
): Promise<UploadMetadata> {
  if (!userId) throw new Refusal(403, "Sign in to upload files.");
  if (files.length !== 1) throw new Refusal(400, "Upload one file per page.");
  const file = files[0]!;
  const limit = maxUploadBytes();
  if (file.size > limit)
    throw new Refusal(
      413,
      `"${file.name}" is ${(file.size / 1048576).toFixed(1)} MB; a page file may be at most ${env().MAX_UPLOAD_MB} MB. Export it at the print size (or as a compressed PNG or high-quality JPEG) and try again.`,
    );
  const [row] = await db
    .select({ piece: p, anthology: schema.anthologies, page: pp })
    .from(p)
    .innerJoin(schema.anthologies, eq(schema.anthologies.id, p.anthologyId))
    .leftJoin(pp, and(eq(pp.pieceId, p.id), eq(pp.pageIndex, input.pageIndex)))
    .where(eq(p.id, input.pieceId))
    .limit(1);
  if (!row || row.piece.contributorId !== userId)
    throw new Refusal(403, "You can only upload files to your own pieces.");
  if (!row.page) throw new Refusal(404, `This piece has no page ${input.pageIndex}.`);
  const ink = input.ink ?? null;
  const wrongInk = uploadInkRefusal(row.anthology, row.piece, ink);
  if (wrongInk) throw wrongInk;
  const call = await findCall(row.anthology.id);
  if (!uploadsAllowed(row.piece.status, call, row.anthology, now))
    throw new Refusal(409, uploadsClosedReason(row.piece.status));
  let revision = row.page.revision;
  if (ink !== null) {
    const [separation] = await db
      .select({ revision: ps.revision })
      .from(ps)
      .where(and(eq(ps.piecePageId, row.page.id), eq(ps.ink, ink)));
    revision = separation?.revision ?? 0;
  }
  if (revision !== input.expectedRevision)
    throw new Refusal(
      409,
      `${ink === null ? "Page" : `The ${masterName(ink)} of page`} ${input.pageIndex} was replaced in another window since this one loaded; reload to see its current file before replacing it.`,
    );
  return {
    pieceId: input.pieceId,
    pageIndex: input.pageIndex,
    ink,
    expectedRevision: input.expectedRevision,
    userId,
  };
}

export type StoredUpload = {
  key: string;
  name: string;
  size: number;
  type: string;
  ufsUrl: string;
  fileHash?: string | null;
};

export type IngestRequest = {
  pieceId: number;
  pageIndex: number;
  /** The ink of a separation (one ink's master); null or absent for the page's composite file. */
  ink?: string | null;
  /** The revision the uploader saw; null takes the page whatever its revision (the seed). */
  expectedRevision: number | null;
  uploadedBy: string;
  file: StoredUpload;
};

export type IngestResult = {
  versionId: number;
  versionNumber: number;
  verdict: SpecReport["verdict"];
  pieceVerdict: PieceVerdict;
  /** The separation's ink, or null for a composite. */
  ink: string | null;
  /** False when the file is kept as a version but not used for the page; `heldBack` says why. */
  current: boolean;
  /** Why a file is not current: another upload replaced the page first, or it could not be read. */
  heldBack: HeldBack | null;
  revision: number;
  status: PieceStatus;
};

export type IngestOptions = {
  /** The file's bytes when the caller has them already (the seed); otherwise read from ufsUrl. */
  bytes?: Uint8Array;
  /** E-mail the contributor the report (default true). */
  notify?: boolean;
  now?: Date;
  /** Check the call window and piece status again at completion (default true). */
  enforceWindow?: boolean;
};

/** The largest image, in pixels, the check decodes (MAX_IMAGE_MEGAPIXELS). */
function maxImagePixels(): number {
  return Math.round(env().MAX_IMAGE_MEGAPIXELS * 1e6);
}

/**
 * The spec check of one page file of a piece against its anthology's spec: what every upload
 * runs, and what the re-check after a spec change runs again on the stored bytes.
 */
export function checkPageFile(
  anthology: Anthology,
  piece: { inks: string[]; kind?: PieceKind },
  bytes: Uint8Array,
  file: { name: string; type: string },
  pageIndex?: number,
  ink: string | null = null,
): Promise<SpecReport> {
  return checkArtwork(bytes, specForFile(anthology, piece, pageIndex, ink), {
    filename: file.name,
    mimeType: file.type,
    maxPixels: maxImagePixels(),
  });
}

/** Runs the whole pipeline for one stored upload; see the module comment. Refusals throw Refusal. */
export async function ingestUpload(
  request: IngestRequest,
  options: IngestOptions = {},
): Promise<IngestResult> {
  const now = options.now ?? new Date();
  const [ctx] = await db
    .select({ piece: p, anthology: schema.anthologies })
    .from(p)
    .innerJoin(schema.anthologies, eq(schema.anthologies.id, p.anthologyId))
    .where(eq(p.id, request.pieceId))
    .limit(1);
  if (!ctx) throw new Refusal(404, "There is no such piece.");
  if (ctx.piece.contributorId !== request.uploadedBy)
    throw new Refusal(403, "You can only upload files to your own pieces.");
  const ink = request.ink ?? null;
  const wrongInk = uploadInkRefusal(ctx.anthology, ctx.piece, ink);
  if (wrongInk) throw wrongInk;
  const call = await findCall(ctx.anthology.id);

  const bytes = options.bytes ?? (await readStoredFile(request.file.ufsUrl, maxUploadBytes()));
  const report = await checkPageFile(
    ctx.anthology,
    ctx.piece,
    bytes,
    request.file,
    request.pageIndex,
    ink,
  );
  const thumbnail = await makeThumbnail(bytes, report, maxImagePixels());
  const md5 = createHash("md5").update(bytes).digest("hex");

  const outcome = await db.transaction(async (tx) => {
    // The piece row first, then the page: every writer takes them in this order.
    const [piece] = await tx.select().from(p).where(eq(p.id, request.pieceId)).for("update");
    if (!piece) throw new Refusal(404, "There is no such piece.");
    if (options.enforceWindow !== false && !uploadsAllowed(piece.status, call, ctx.anthology, now))
      throw new Refusal(409, uploadsClosedReason(piece.status));
    const [page] = await tx
      .select()
      .from(pp)
      .where(and(eq(pp.pieceId, request.pieceId), eq(pp.pageIndex, request.pageIndex)))
      .for("update");
    if (!page) throw new Refusal(404, `This piece has no page ${request.pageIndex}.`);
    // A separation's current file and revision live in its own row, made on its first upload
    // and then locked like the page row, so two tabs replacing one master leave one current.
    let slot: { currentVersionId: number | null; revision: number } = page;
    if (ink !== null) {
      await tx
        .insert(ps)
        .values({ piecePageId: page.id, ink })
        .onDuplicateKeyUpdate({ set: { ink: sql`${ps.ink}` } });
      const [separation] = await tx
        .select()
        .from(ps)
        .where(and(eq(ps.piecePageId, page.id), eq(ps.ink, ink)))
        .for("update");
      if (!separation) throw new Error("separation row missing after insert");
      slot = separation;
    }

    // A hook delivered twice must not make two versions of one stored file.
    const [already] = await tx
      .select({ id: fv.id, versionNumber: fv.versionNumber, report: fv.report })
      .from(fv)
      .where(and(eq(fv.piecePageId, page.id), eq(fv.storageKey, request.file.key)));
    if (already) {
      const current = slot.currentVersionId === already.id;
      const heldBack: HeldBack | null = current
        ? null
        : readable(already.report as SpecReport)
          ? "replaced"
          : "unreadable";
      return {
        versionId: already.id,
        versionNumber: already.versionNumber,
        current,
        heldBack,
        revision: slot.revision,
        pieceVerdict: (isPieceVerdict(piece.verdict) ? piece.verdict : "missing") as PieceVerdict,
        status: piece.status,
        duplicate: true,
        title: piece.title,
      };
    }

    const [last] = await tx
      .select({ n: sql<number>`COALESCE(MAX(${fv.versionNumber}), 0)` })
      .from(fv)
      .where(eq(fv.piecePageId, page.id));
    const versionNumber = Number(last?.n ?? 0) + 1;
    const [inserted] = await tx
      .insert(fv)
      .values({
        piecePageId: page.id,
        versionNumber,
        storageKey: request.file.key,
        fileName: request.file.name.slice(0, 255),
        mimeType: (request.file.type || "application/octet-stream").slice(0, 100),
        sizeBytes: bytes.length,
        md5,
        ink,
        report,
        verdict: report.verdict,
        thumbnailWebp: thumbnail?.webp ?? null,
        thumbnailWidthPx: thumbnail?.widthPx ?? null,
        thumbnailHeightPx: thumbnail?.heightPx ?? null,
        uploadedBy: request.uploadedBy,
      })
      .$returningId();
    if (!inserted) throw new Error("file version insert returned no id");

    // The file in use stays when another upload replaced the page meanwhile, and when this file
    // could not be read but the one in use can (lib/pieces/versions).
    const [inUse] =
      slot.currentVersionId === null
        ? []
        : await tx.select({ report: fv.report }).from(fv).where(eq(fv.id, slot.currentVersionId));
    const onTime = request.expectedRevision === null || request.expectedRevision === slot.revision;
    const heldBack: HeldBack | null = !onTime
      ? "replaced"
      : shouldBecomeCurrent(report, inUse ? (inUse.report as SpecReport) : null)
        ? null
        : "unreadable";
    const current = heldBack === null;
    const revision = current ? slot.revision + 1 : slot.revision;
    if (current && ink === null)
      await tx
        .update(pp)
        .set({ currentVersionId: inserted.id, revision })
        .where(eq(pp.id, page.id));
    if (current && ink !== null)
      await tx
        .update(ps)
        .set({ currentVersionId: inserted.id, revision })
        .where(and(eq(ps.piecePageId, page.id), eq(ps.ink, ink)));
    // Print files made with the page's earlier file no longer match it.
    if (current) await markOutputsStale(piece.anthologyId, tx);
    const pieceVerdict = await refreshPieceVerdict(tx, piece.id);

    // A file that could not be read answers no fix request: the piece waits for a readable one.
    const status = heldBack === "unreadable" ? piece.status : statusAfterNewFile(piece.status);
    if (status !== piece.status) {
      await tx.update(p).set({ status }).where(eq(p.id, piece.id));
      await tx.insert(schema.pieceEvents).values({
        pieceId: piece.id,
        actorId: request.uploadedBy,
        fromStatus: piece.status,
        toStatus: status,
        message:
          ink === null
            ? `New file for page ${request.pageIndex} (version ${versionNumber})`
            : `New ${masterName(ink)} for page ${request.pageIndex} (version ${versionNumber})`,
      });
    } else {
      // Touch the piece so "last updated" reflects the new file.
      await tx.update(p).set({ updatedAt: now }).where(eq(p.id, piece.id));
    }
    return {
      versionId: inserted.id,
      versionNumber,
      current,
      heldBack,
      revision,
      pieceVerdict,
      status,
      duplicate: false,
      title: piece.title,
    };
  });

  if (!outcome.duplicate && options.notify !== false) {
    await mailReport(ctx.anthology, request, outcome, report).catch((error: unknown) =>
      log.error({ kind: "mail", error: errorSummary(error) }, "spec report mail failed"),
    );
  }
  return {
    versionId: outcome.versionId,
    versionNumber: outcome.versionNumber,
    verdict: report.verdict,
    ink,
    pieceVerdict: outcome.pieceVerdict,
    current: outcome.current,
    heldBack: outcome.heldBack,
    revision: outcome.revision,
    status: outcome.status,
  };
}

/** The spec report by e-mail to the person who uploaded the file, once per version. */
async function mailReport(
  anthology: Anthology,
  request: IngestRequest,
  outcome: { versionId: number; versionNumber: number; heldBack: HeldBack | null; title: string },
  report: SpecReport,
) {
  const [person] = await db
    .select({ email: schema.users.email, name: schema.users.name })
    .from(schema.users)
    .where(eq(schema.users.id, request.uploadedBy));
  if (!person?.email) return;
  const mail = specReportMail({
    personName: person.name,
    fileName: request.file.name,
    pieceTitle: outcome.title,
    pageIndex: request.pageIndex,
    ink: request.ink ?? null,
    versionNumber: outcome.versionNumber,
    anthologyTitle: anthology.title,
    report,
    notUsed: outcome.heldBack,
    link: appUrl(`/studio/${anthology.slug}/my-pieces/${request.pieceId}`),
  });
  await sendLoggedMail(
    {
      anthologyId: anthology.id,
      pieceId: request.pieceId,
      kind: "spec-report",
      to: person.email,
      dedupeKey: `spec-report-${outcome.versionId}`,
    },
    mail,
  );
}
