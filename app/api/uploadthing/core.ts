import "server-only";
import { errorSummary, log } from "@/server/log";
/**
 * The upload routes. One route, `artworkPage`: one file for one page of the caller's own piece.
 * The middleware decides before any byte is sent; onUploadComplete runs the spec-check pipeline
 * and hands its outcome back to the browser as serverData. It never throws: a thrown error would
 * leave the browser waiting for an answer that never comes.
 */
import type { HeldBack } from "@/lib/pieces/versions";
import { Refusal } from "@/lib/refusal";
import { currentUser } from "@/server/auth/guard";
import { authoriseArtworkUpload, ingestUpload } from "@/server/submissions/ingest";
import {
  createUploadthing,
  deleteStoredFiles,
  sdkFileSizeLimit,
  StoredFileError,
  UploadThingError,
  type FileRouter,
} from "@/server/uploads";
import { artworkUploadInputSchema } from "@/lib/validations/piece";

const f = createUploadthing();

// The SDK has no "conflict" code: a closed call or a stale page answers 403.
const CODES = {
  400: "BAD_REQUEST",
  403: "FORBIDDEN",
  404: "NOT_FOUND",
  409: "FORBIDDEN",
  413: "TOO_LARGE",
} as const;

/** What the browser receives once the file is checked. */
export type ArtworkServerData =
  | {
      ok: true;
      versionId: number;
      versionNumber: number;
      /** The separation's ink, or null for a composite page file. */
      ink: string | null;
      verdict: string;
      pieceVerdict: string;
      current: boolean;
      /** Why the file is not the page's current one: replaced meanwhile, or unreadable. */
      heldBack: HeldBack | null;
      revision: number;
    }
  | { ok: false; error: string };

const limit = () => ({ maxFileSize: sdkFileSizeLimit(), maxFileCount: 1 });

export const uploadRouter = {
  /**
   * The five artwork types by name; "blob" lets anything else through too, so a file of the wrong
   * kind (a GIF, a Photoshop file, text renamed .png) is stored with a report that says what it
   * is, instead of vanishing with a bare type error.
   */
  artworkPage: f(
    {
      "image/png": limit(),
      "image/jpeg": limit(),
      "image/tiff": limit(),
      "image/webp": limit(),
      pdf: limit(),
      blob: limit(),
    },
    { awaitServerData: true },
  )
    .input(artworkUploadInputSchema)
    .middleware(async ({ input, files }) => {
      const user = await currentUser();
      try {
        return await authoriseArtworkUpload(user?.id ?? null, input, files);
      } catch (error) {
        if (error instanceof Refusal) {
          throw new UploadThingError({ code: CODES[error.status], message: error.message });
        }
        throw error;
      }
    })
    .onUploadComplete(async ({ metadata, file }): Promise<ArtworkServerData> => {
      try {
        const result = await ingestUpload({
          pieceId: metadata.pieceId,
          pageIndex: metadata.pageIndex,
          ink: metadata.ink,
          expectedRevision: metadata.expectedRevision,
          uploadedBy: metadata.userId,
          file: {
            key: file.key,
            name: file.name,
            size: file.size,
            type: file.type,
            ufsUrl: file.ufsUrl,
            fileHash: file.fileHash,
          },
        });
        return { ok: true, ...result };
      } catch (error) {
        // Nothing was recorded, so the stored bytes must not linger either.
        await deleteStoredFiles([file.key]);
        if (error instanceof Refusal) return { ok: false, error: error.message };
        if (error instanceof StoredFileError)
          return {
            ok: false,
            error: `The file arrived but could not be read back (${error.message}); nothing was kept. Please upload it again.`,
          };
        log.error({ kind: "ingest", error: errorSummary(error) }, "artwork ingest failed");
        return {
          ok: false,
          error:
            "Something went wrong while checking the file; nothing was kept. Please upload it again.",
        };
      }
    }),
} satisfies FileRouter;

export type UploadRouter = typeof uploadRouter;
