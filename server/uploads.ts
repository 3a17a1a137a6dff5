import "server-only";
import { errorSummary, log } from "@/server/log";
/**
 * The one module that talks to the UploadThing SDK. Everything about where files go (the hosted
 * service, or the local fake in storage-fake/) is configuration read here from lib/env.ts.
 */
import type { NextRequest } from "next/server";
import { createRouteHandler, createUploadthing } from "uploadthing/next";
import { UploadThingError, UTApi, UTFile, type FileRouter } from "uploadthing/server";
import { env } from "@/lib/env";

export { createUploadthing, UploadThingError };
export type { FileRouter };

/** The largest artwork file a contributor may upload, in bytes (MAX_UPLOAD_MB). */
export function maxUploadBytes(): number {
  return Math.floor(env().MAX_UPLOAD_MB * 1024 * 1024);
}

/**
 * The same limit in the SDK's notation. Kilobytes keep fractional megabyte limits exact
 * (the SDK reads only the whole-number part of "0.5MB").
 */
export function sdkFileSizeLimit(): `${1 | 2 | 4 | 8 | 16 | 32 | 64 | 128 | 256 | 512 | 1024}MB` {
  return `${Math.floor(env().MAX_UPLOAD_MB * 1024)}KB` as never;
}

/** SDK options from the environment; unset values are left out so the SDK's own defaults apply. */
function sdkConfig() {
  const e = env();
  const config: Record<string, string> = { logLevel: e.UPLOADTHING_LOG_LEVEL };
  if (e.UPLOADTHING_TOKEN) config.token = e.UPLOADTHING_TOKEN;
  if (e.UPLOADTHING_INGEST_URL) config.ingestUrl = e.UPLOADTHING_INGEST_URL;
  if (e.UPLOADTHING_CALLBACK_URL) config.callbackUrl = e.UPLOADTHING_CALLBACK_URL;
  return config as {
    token?: string;
    ingestUrl?: string;
    callbackUrl?: string;
    logLevel?: "Warning";
  };
}

/**
 * GET and POST for app/api/uploadthing. The SDK handler is made on the first request, so a build
 * without upload settings still works and the settings are read once the server runs.
 */
export function uploadRouteHandlers<R extends FileRouter>(router: R) {
  let handlers: ReturnType<typeof createRouteHandler> | undefined;
  const get = () => (handlers ??= createRouteHandler({ router, config: sdkConfig() }));
  return {
    GET: (request: NextRequest) => get().GET(request),
    POST: (request: NextRequest) => get().POST(request),
  };
}

let api: UTApi | undefined;

/** The server-side client (deleting files, storing the demo files). */
function utapi(): UTApi {
  const e = env();
  api ??= new UTApi({
    token: e.UPLOADTHING_TOKEN,
    ...(e.UPLOADTHING_API_URL ? { apiUrl: e.UPLOADTHING_API_URL } : {}),
    ...(e.UPLOADTHING_INGEST_URL ? { ingestUrl: e.UPLOADTHING_INGEST_URL } : {}),
    logLevel: e.UPLOADTHING_LOG_LEVEL,
  });
  return api;
}

export class StoredFileError extends Error {}

/**
 * Reads an uploaded file's bytes back from the file host. Stops at `maxBytes` + 1 so a file
 * larger than the limit is never held in memory whole.
 */
export async function readStoredFile(
  url: string,
  maxBytes: number = maxUploadBytes(),
): Promise<Buffer> {
  let response: Response;
  try {
    response = await fetch(url, { cache: "no-store" });
  } catch (error) {
    throw new StoredFileError(
      `the file host did not answer (${error instanceof Error ? error.message : String(error)})`,
    );
  }
  if (!response.ok || !response.body)
    throw new StoredFileError(`the file host answered ${response.status}`);
  const chunks: Buffer[] = [];
  let total = 0;
  const reader = response.body.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel();
      throw new StoredFileError(
        `the stored file is larger than the ${Math.round(maxBytes / 1048576)} MB limit`,
      );
    }
    chunks.push(Buffer.from(value));
  }
  return Buffer.concat(chunks);
}

/**
 * A short-lived signed address the file host serves a stored file from, for reading an upload
 * back after the upload itself (the re-check after a spec change). Signed by the SDK itself
 * (UPLOADTHING_UFS_HOST, UPLOADTHING_UFS_APP_ID_LOCATION), so private files read too.
 */
export async function storedFileUrl(key: string): Promise<string> {
  return (await utapi().generateSignedURL(key, { expiresIn: 600 })).ufsUrl;
}

/** Deletes stored files; failures are logged, never thrown (used when a file must not be kept). */
export async function deleteStoredFiles(keys: string[]): Promise<void> {
  if (keys.length === 0) return;
  try {
    await utapi().deleteFiles(keys);
  } catch (error) {
    log.error(
      { kind: "storage", files: keys.length, error: errorSummary(error) },
      "could not delete stored files",
    );
  }
}

export type StoredFile = {
  key: string;
  name: string;
  size: number;
  type: string;
  ufsUrl: string;
  fileHash: string;
};

/** Stores bytes from the server (no browser involved); used by the demo seed. */
export async function storeFile(
  bytes: Uint8Array,
  name: string,
  type: string,
): Promise<StoredFile> {
  const result = await utapi().uploadFiles(new UTFile([new Uint8Array(bytes)], name, { type }));
  if (result.error || !result.data)
    throw new StoredFileError(`could not store ${name}: ${result.error?.message ?? "no answer"}`);
  const d = result.data;
  return {
    key: d.key,
    name: d.name,
    size: d.size,
    type: d.type,
    ufsUrl: d.ufsUrl,
    fileHash: d.fileHash,
  };
}

/**
 * Opens a stored file for streaming to a browser (print-file downloads, which may be larger than
 * the upload limit and are never held whole in memory here).
 */
export async function openStoredFile(key: string): Promise<ReadableStream<Uint8Array>> {
  let response: Response;
  try {
    response = await fetch(await storedFileUrl(key), { cache: "no-store" });
  } catch (error) {
    throw new StoredFileError(
      `the file host did not answer (${error instanceof Error ? error.message : String(error)})`,
    );
  }
  if (!response.ok || !response.body)
    throw new StoredFileError(`the file host answered ${response.status}`);
  return response.body;
}
