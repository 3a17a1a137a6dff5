// Local stand-in for the UploadThing ingest + file host + UTApi endpoints.
// Speaks the wire protocol described in /work/shared/brief/UPLOADS.md so the
// real `uploadthing` SDK (route handler, browser client, UTApi) works against it.
//
// Binds 127.0.0.1. State lives in <dataDir>/index.json and <dataDir>/files/<key>; both are
// recreated on demand if the folder is removed. The parts live in uploads/: token.mjs
// (token and HMAC signatures), http.mjs (CORS, JSON, bodies), multipart.mjs (receiving the
// file), file-store.mjs, ingest.mjs (route metadata, PUT, hooks, callback results),
// serve.mjs (the file host), utapi.mjs (/v6/*) and server.mjs (router, start, stop).
//
//   node storage-fake/uploads.mjs      (env: UPLOADTHING_TOKEN, FAKE_PORT, FAKE_DATA_DIR, ...)

import { realpathSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

import { HOST, startUploadFake } from "./uploads/server.mjs";

export { startUploadFake } from "./uploads/server.mjs";
export { parseToken, signPayload, verifyPayload } from "./uploads/token.mjs";

export const defaultDataDir = resolve(
  dirname(fileURLToPath(import.meta.url)),
  "..",
  ".data",
  "fakes",
);

function envNumber(name, fallback) {
  const v = process.env[name];
  if (v == null || v === "") return fallback;
  const n = Number(v);
  if (!Number.isFinite(n) || n < 0)
    throw new Error(`${name} must be a non-negative number, got "${v}"`);
  return n;
}

/** Options for startUploadFake read from the FAKE_* environment. */
export function uploadOptionsFromEnv(env = process.env) {
  return {
    token: env.UPLOADTHING_TOKEN,
    dataDir: env.FAKE_DATA_DIR || defaultDataDir,
    publicUrl: env.FAKE_PUBLIC_URL || undefined,
    verifySignatures: env.FAKE_VERIFY_SIGNATURES !== "0",
    callbackTimeoutMs: envNumber("FAKE_CALLBACK_TIMEOUT_MS", 30_000),
    metadataTimeoutMs: envNumber("FAKE_METADATA_TIMEOUT_MS", 15_000),
    devStreamTimeoutMs: envNumber("FAKE_DEV_STREAM_TIMEOUT_MS", 5 * 60_000),
    log: envNumber("FAKE_LOG", 0),
  };
}

function isMain() {
  if (!process.argv[1]) return false;
  try {
    return import.meta.url === pathToFileURL(realpathSync(process.argv[1])).href;
  } catch {
    return false;
  }
}

if (isMain()) {
  const port = envNumber("FAKE_PORT", envNumber("FAKE_UPLOAD_PORT", 4590));
  let fake;
  try {
    fake = await startUploadFake({ ...uploadOptionsFromEnv(), port });
  } catch (err) {
    if (err?.code === "EADDRINUSE") {
      process.stderr.write(
        `uploads-fake: port ${port} on ${HOST} is already in use (set FAKE_PORT)\n`,
      );
    } else {
      process.stderr.write(`uploads-fake: ${err?.message ?? err}\n`);
    }
    process.exit(1);
  }
  process.stdout.write(
    JSON.stringify({ ready: true, pid: process.pid, port: fake.port, baseUrl: fake.baseUrl }) +
      "\n",
  );
  const stop = () => fake.close().then(() => process.exit(0));
  process.once("SIGTERM", stop);
  process.once("SIGINT", stop);
}
