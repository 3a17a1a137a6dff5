// Local stand-in for the UploadThing ingest + file host + UTApi endpoints.
// Speaks the wire protocol described in /work/shared/brief/UPLOADS.md so the
// real `uploadthing` SDK (route handler, browser client, UTApi) works against it.
//
// Node built-ins only. Binds 127.0.0.1. State lives in <dataDir>/index.json and
// <dataDir>/files/<key>; both are recreated on demand if the folder is removed.
//
//   node storage-fake/uploads.mjs      (env: UPLOADTHING_TOKEN, FAKE_PORT, FAKE_DATA_DIR, ...)

import { createHash, createHmac, randomBytes, randomUUID, timingSafeEqual } from "node:crypto";
import {
  createReadStream,
  createWriteStream,
  mkdirSync,
  readFileSync,
  realpathSync,
  renameSync,
  rmSync,
  statSync,
  writeFileSync,
} from "node:fs";
import { createServer } from "node:http";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const SIGNATURE_PREFIX = "hmac-sha256=";
const HOST = "127.0.0.1";
const KEY_RE = /^[A-Za-z0-9_-]{1,200}$/;
const RESERVED_SEGMENTS = new Set(["route-metadata", "callback-result", "f", "a", "v6", "health"]);

/**
 * Decode and validate an UPLOADTHING_TOKEN the same way the SDK does.
 * @param {string} token
 * @returns {{apiKey: string, appId: string, regions: string[], ingestHost: string}}
 */
export function parseToken(token) {
  if (!token || typeof token !== "string") {
    throw new Error("UPLOADTHING_TOKEN is required (the same token the app uses)");
  }
  let parsed;
  try {
    parsed = JSON.parse(Buffer.from(token.trim(), "base64").toString("utf8"));
  } catch {
    throw new Error("UPLOADTHING_TOKEN is not base64-encoded JSON");
  }
  if (!parsed || typeof parsed.apiKey !== "string" || !parsed.apiKey.startsWith("sk_")) {
    throw new Error('UPLOADTHING_TOKEN: apiKey must be a string starting with "sk_"');
  }
  if (typeof parsed.appId !== "string" || parsed.appId === "") {
    throw new Error("UPLOADTHING_TOKEN: appId must be a non-empty string");
  }
  if (!Array.isArray(parsed.regions) || parsed.regions.length === 0) {
    throw new Error("UPLOADTHING_TOKEN: regions must be a non-empty array");
  }
  return {
    apiKey: parsed.apiKey,
    appId: parsed.appId,
    regions: parsed.regions,
    ingestHost: parsed.ingestHost ?? "ingest.uploadthing.com",
  };
}

/** `hmac-sha256=<hex>` over `payload`, keyed with the api key (utf8). */
export function signPayload(payload, apiKey) {
  return SIGNATURE_PREFIX + createHmac("sha256", apiKey).update(payload).digest("hex");
}

/** Constant-time check of a `hmac-sha256=<hex>` signature. */
export function verifyPayload(payload, signature, apiKey) {
  if (typeof signature !== "string" || !signature.startsWith(SIGNATURE_PREFIX)) return false;
  const given = Buffer.from(signature.slice(SIGNATURE_PREFIX.length), "hex");
  const expected = createHmac("sha256", apiKey).update(payload).digest();
  return given.length === expected.length && timingSafeEqual(given, expected);
}

/** Constant-time string comparison. */
function safeEqual(a, b) {
  const x = Buffer.from(String(a ?? ""));
  const y = Buffer.from(String(b ?? ""));
  return x.length === y.length && timingSafeEqual(x, y);
}

// ---------------------------------------------------------------------------
// Persistent index (index.json) — disk is the source of truth, cached by stat.
// ---------------------------------------------------------------------------

class FileStore {
  /** @param {string} dataDir */
  constructor(dataDir) {
    this.dataDir = dataDir;
    this.indexPath = join(dataDir, "index.json");
    this.filesDir = join(dataDir, "files");
    this.tmpDir = join(dataDir, "tmp");
    /** @type {{stamp: string, data: {version: number, files: any[]}} | null} */
    this.cache = null;
  }

  ensureDirs() {
    mkdirSync(this.filesDir, { recursive: true });
    mkdirSync(this.tmpDir, { recursive: true });
  }

  filePath(key) {
    return join(this.filesDir, key);
  }

  tmpPath() {
    this.ensureDirs();
    return join(this.tmpDir, `${Date.now()}-${randomBytes(6).toString("hex")}.part`);
  }

  /** @returns {{version: number, files: any[]}} */
  load() {
    let st;
    try {
      st = statSync(this.indexPath);
    } catch {
      this.cache = null;
      return { version: 1, files: [] };
    }
    const stamp = `${st.mtimeMs}:${st.size}:${st.ino}`;
    if (this.cache && this.cache.stamp === stamp) return structuredClone(this.cache.data);
    try {
      const data = JSON.parse(readFileSync(this.indexPath, "utf8"));
      if (!data || !Array.isArray(data.files)) throw new Error("no files array");
      this.cache = { stamp, data };
      return structuredClone(data);
    } catch (err) {
      process.stderr.write(
        `[uploads-fake] ignoring unreadable ${this.indexPath}: ${err.message}\n`,
      );
      return { version: 1, files: [] };
    }
  }

  save(data) {
    mkdirSync(this.dataDir, { recursive: true });
    const tmp = `${this.indexPath}.${process.pid}.tmp`;
    writeFileSync(tmp, JSON.stringify(data, null, 1));
    renameSync(tmp, this.indexPath);
    const st = statSync(this.indexPath);
    this.cache = { stamp: `${st.mtimeMs}:${st.size}:${st.ino}`, data: structuredClone(data) };
  }

  /** Synchronous read-modify-write (atomic within the event loop). */
  mutate(fn) {
    const data = this.load();
    const result = fn(data);
    this.save(data);
    return result;
  }

  all() {
    return this.load().files;
  }

  findByKey(key) {
    return this.all().find((f) => f.key === key) ?? null;
  }

  /** Resolve `{fileKey}` or `{customId}` to a record. */
  find(ref) {
    const files = this.all();
    if (ref.fileKey != null) return files.find((f) => f.key === ref.fileKey) ?? null;
    if (ref.customId != null) {
      for (let i = files.length - 1; i >= 0; i--)
        if (files[i].customId === ref.customId) return files[i];
    }
    return null;
  }

  /** Move a finished temp file into place and record it. */
  commit(tmpPath, record) {
    this.ensureDirs();
    renameSync(tmpPath, this.filePath(record.key));
    this.mutate((data) => {
      data.files = data.files.filter((f) => f.key !== record.key);
      data.files.push(record);
    });
  }

  removeKeys(keys) {
    const wanted = new Set(keys);
    let removed = [];
    this.mutate((data) => {
      removed = data.files.filter((f) => wanted.has(f.key));
      data.files = data.files.filter((f) => !wanted.has(f.key));
    });
    for (const f of removed) rmSync(this.filePath(f.key), { force: true });
    return removed.length;
  }
}

// ---------------------------------------------------------------------------
// Streaming multipart/form-data parser: writes the "file" part straight to disk.
// ---------------------------------------------------------------------------

function boundaryOf(contentType) {
  const m = /boundary=(?:"([^"]+)"|([^;]+))/i.exec(contentType ?? "");
  return m ? (m[1] ?? m[2]).trim() : null;
}

function parsePartHeaders(text) {
  const headers = {};
  for (const line of text.split("\r\n")) {
    const i = line.indexOf(":");
    if (i > 0) headers[line.slice(0, i).trim().toLowerCase()] = line.slice(i + 1).trim();
  }
  const cd = headers["content-disposition"] ?? "";
  const name = /\bname="([^"]*)"/i.exec(cd)?.[1] ?? /\bname=([^;]+)/i.exec(cd)?.[1] ?? null;
  const filenameStar = /\bfilename\*=(?:UTF-8'')?([^;]+)/i.exec(cd)?.[1];
  let filename = /\bfilename="([^"]*)"/i.exec(cd)?.[1] ?? null;
  if (filenameStar) {
    try {
      filename = decodeURIComponent(filenameStar);
    } catch {
      /* keep the plain filename */
    }
  }
  return { name, filename, contentType: headers["content-type"] ?? null };
}

class MultipartError extends Error {}

/**
 * Read a multipart body from `req`, streaming the part named `field` into `destPath`.
 * Stops writing (but keeps counting) once `maxBytes` is exceeded.
 * @returns {Promise<{size: number, md5: string, filename: string|null, contentType: string|null} | null>}
 */
async function receiveMultipartFile(req, { field, destPath, maxBytes }) {
  const boundary = boundaryOf(req.headers["content-type"]);
  if (!boundary || !/^multipart\/form-data/i.test(req.headers["content-type"] ?? "")) {
    throw new MultipartError("expected a multipart/form-data body");
  }
  const delim = Buffer.from(`\r\n--${boundary}`);
  const headerEnd = Buffer.from("\r\n\r\n");
  // Prefix CRLF so the first delimiter matches like every later one.
  let buf = Buffer.from("\r\n");
  let state = "preamble"; // preamble | afterDelim | headers | body | done
  let part = null; // {isFile, out?, hash?, size}
  let result = null;
  let out = null;
  let outError = null;

  const openOut = () => {
    outError = null;
    out = createWriteStream(destPath, { highWaterMark: 4 * 1024 * 1024 });
    out.on("error", (err) => {
      outError = err;
    });
  };

  const waitFor = (event) =>
    new Promise((res, rej) => {
      if (outError) return rej(outError);
      const onEvent = () => {
        out.off("error", onError);
        res();
      };
      const onError = (err) => {
        out.off(event, onEvent);
        rej(err);
      };
      out.once(event, onEvent);
      out.once("error", onError);
    });

  const writeOut = async (chunk) => {
    if (!part || !part.isFile || chunk.length === 0) return;
    part.size += chunk.length;
    part.hash.update(chunk);
    if (part.size > maxBytes) {
      part.tooLarge = true;
      return;
    }
    if (outError) throw outError;
    if (!out.write(chunk)) await waitFor("drain");
  };

  const finishPart = async () => {
    if (part && part.isFile && !result) {
      const finished = waitFor("finish");
      out.end();
      await finished;
      result = {
        size: part.size,
        md5: part.hash.digest("hex"),
        filename: part.filename,
        contentType: part.contentType,
        tooLarge: Boolean(part.tooLarge),
      };
      out = null;
    }
    part = null;
  };

  try {
    for await (const chunk of req) {
      buf = buf.length ? Buffer.concat([buf, chunk]) : chunk;
      let progressed = true;
      while (progressed && state !== "done") {
        progressed = false;
        if (state === "preamble") {
          const i = buf.indexOf(delim);
          if (i >= 0) {
            buf = buf.subarray(i + delim.length);
            state = "afterDelim";
            progressed = true;
          } else if (buf.length > delim.length) {
            buf = buf.subarray(buf.length - delim.length);
          }
        } else if (state === "afterDelim") {
          if (buf.length < 2) break;
          if (buf[0] === 0x2d && buf[1] === 0x2d) {
            state = "done";
            break;
          }
          const eol = buf.indexOf("\r\n");
          if (eol < 0) {
            if (buf.length > 1024) throw new MultipartError("malformed multipart delimiter line");
            break;
          }
          buf = buf.subarray(eol + 2);
          state = "headers";
          progressed = true;
        } else if (state === "headers") {
          const i = buf.indexOf(headerEnd);
          if (i < 0) {
            if (buf.length > 16 * 1024)
              throw new MultipartError("multipart part headers too large");
            break;
          }
          const info = parsePartHeaders(buf.subarray(0, i).toString("utf8"));
          buf = buf.subarray(i + headerEnd.length);
          const isFile = info.name === field && !result;
          part = { ...info, isFile, size: 0, hash: isFile ? createHash("md5") : null };
          if (isFile) openOut();
          state = "body";
          progressed = true;
        } else if (state === "body") {
          const i = buf.indexOf(delim);
          if (i >= 0) {
            await writeOut(buf.subarray(0, i));
            buf = buf.subarray(i + delim.length);
            await finishPart();
            state = "afterDelim";
            progressed = true;
          } else {
            const safe = buf.length - (delim.length - 1);
            if (safe > 0) {
              await writeOut(buf.subarray(0, safe));
              buf = Buffer.from(buf.subarray(safe));
            }
          }
        }
      }
    }
  } finally {
    if (out) {
      out.destroy();
      out = null;
    }
  }
  if (state !== "done") {
    rmSync(destPath, { force: true });
    throw new MultipartError("multipart body ended before the closing boundary");
  }
  return result;
}

// ---------------------------------------------------------------------------
// HTTP helpers
// ---------------------------------------------------------------------------

function corsHeaders(req) {
  const origin = req.headers.origin;
  return {
    "access-control-allow-origin": origin || "*",
    vary: "Origin",
    "access-control-allow-methods": "GET, HEAD, PUT, POST, DELETE, OPTIONS",
    "access-control-allow-headers": req.headers["access-control-request-headers"] || "*",
    "access-control-expose-headers":
      "x-ut-range-start, etag, content-length, content-type, content-disposition, content-range, accept-ranges",
    "access-control-allow-private-network": "true",
    "access-control-max-age": "600",
  };
}

function sendJson(req, res, status, body, extra = {}) {
  if (res.headersSent || res.writableEnded) return;
  const text = JSON.stringify(body);
  res.writeHead(status, {
    ...corsHeaders(req),
    "content-type": "application/json; charset=utf-8",
    "content-length": Buffer.byteLength(text),
    "cache-control": "no-store",
    ...extra,
  });
  res.end(req.method === "HEAD" ? undefined : text);
}

async function readBody(req, limit = 5 * 1024 * 1024) {
  const chunks = [];
  let size = 0;
  for await (const chunk of req) {
    size += chunk.length;
    if (size > limit) throw new MultipartError("request body too large");
    chunks.push(chunk);
  }
  return Buffer.concat(chunks).toString("utf8");
}

async function readJson(req) {
  const text = await readBody(req);
  if (text.trim() === "") return {};
  return JSON.parse(text);
}

/** Split a raw request URL into the signed part and the `signature` value (appended last). */
function splitSignature(rawUrl) {
  const i = rawUrl.lastIndexOf("&signature=");
  if (i < 0) return null;
  let signature = rawUrl.slice(i + "&signature=".length);
  try {
    signature = decodeURIComponent(signature);
  } catch {
    return null;
  }
  return { unsigned: rawUrl.slice(0, i), signature };
}

/** The one-time decode the SDK's double encoding needs. */
function utParam(url, name) {
  const v = url.searchParams.get(name);
  if (v == null) return null;
  try {
    return decodeURIComponent(v);
  } catch {
    return v;
  }
}

function contentDispositionHeader(kind, filename) {
  const type = kind === "attachment" ? "attachment" : "inline";
  const ascii = String(filename ?? "file")
    .replace(/[^\x20-\x7e]/g, "_")
    .replace(/["\\]/g, "_");
  return `${type}; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(filename ?? "file")}`;
}

function withTimeout(promise, ms, message) {
  let timer;
  return Promise.race([
    promise.finally(() => clearTimeout(timer)),
    new Promise((_, reject) => {
      timer = setTimeout(() => reject(new Error(message)), ms);
      timer.unref?.();
    }),
  ]);
}

function deferred() {
  let resolve, reject;
  const promise = new Promise((res, rej) => {
    resolve = res;
    reject = rej;
  });
  promise.catch(() => {});
  return { promise, resolve, reject };
}

// ---------------------------------------------------------------------------
// The server
// ---------------------------------------------------------------------------

/**
 * Start the upload fake.
 * @param {{
 *   port?: number, dataDir: string, token: string, publicUrl?: string,
 *   verifySignatures?: boolean, callbackTimeoutMs?: number, metadataTimeoutMs?: number,
 *   devStreamTimeoutMs?: number, log?: number
 * }} options
 * @returns {Promise<{port: number, baseUrl: string, publicUrl: string, dataDir: string, close: () => Promise<void>}>}
 */
export async function startUploadFake(options) {
  const {
    port = 4590,
    dataDir,
    token,
    verifySignatures = true,
    callbackTimeoutMs = 30_000,
    metadataTimeoutMs = 15_000,
    devStreamTimeoutMs = 5 * 60_000,
    log = 0,
  } = options ?? {};
  if (!dataDir) throw new Error("startUploadFake: dataDir is required");
  const { apiKey, appId } = parseToken(token);
  const store = new FileStore(resolve(dataDir));
  store.ensureDirs();

  const say = (level, ...parts) => {
    if (log >= level) process.stderr.write(`[uploads-fake] ${parts.join(" ")}\n`);
  };

  /** fileKey → route metadata registered by the app */
  const routeMeta = new Map();
  /** fileKey → [resolve] of PUTs waiting for the metadata (dev race) */
  const metaWaiters = new Map();
  /** fileKey → deferred for POST /callback-result */
  const resultWaiters = new Map();
  /** open dev streams */
  const devStreams = new Set();

  let publicUrl = "";
  let baseUrl = "";

  const fileUrls = (key) => ({
    url: `${publicUrl}/f/${key}`,
    ufsUrl: `${publicUrl}/f/${key}`,
    appUrl: `${publicUrl}/a/${appId}/${key}`,
  });

  const waitForMeta = (key) => {
    const existing = routeMeta.get(key);
    if (existing) return Promise.resolve(existing);
    const d = deferred();
    const list = metaWaiters.get(key) ?? [];
    list.push(d.resolve);
    metaWaiters.set(key, list);
    return withTimeout(
      d.promise,
      metadataTimeoutMs,
      `no route metadata registered for ${key}`,
    ).finally(() => {
      const l = metaWaiters.get(key);
      if (l) {
        const rest = l.filter((r) => r !== d.resolve);
        if (rest.length) metaWaiters.set(key, rest);
        else metaWaiters.delete(key);
      }
    });
  };

  /** Mark a key as handled; closes its dev stream when every key is done. */
  const finishKey = (key) => {
    const meta = routeMeta.get(key);
    routeMeta.delete(key);
    const stream = meta?.stream;
    if (stream) {
      stream.pending.delete(key);
      if (stream.pending.size === 0) closeDevStream(stream);
    }
  };

  const closeDevStream = (stream) => {
    if (stream.closed) return;
    stream.closed = true;
    clearTimeout(stream.timer);
    devStreams.delete(stream);
    if (!stream.res.writableEnded) stream.res.end();
    say(2, "dev stream closed", [...stream.keys].join(","));
  };

  /**
   * Deliver a signed hook for `meta`: a line on the dev stream, or a POST to the
   * app's callback URL (prod, or dev when the stream is gone).
   */
  const deliverHook = async (meta, hook, payloadObj) => {
    const payload = JSON.stringify(payloadObj);
    const signature = signPayload(payload, apiKey);
    if (meta.isDev && meta.stream && !meta.stream.closed && !meta.stream.res.destroyed) {
      meta.stream.res.write(JSON.stringify({ payload, signature, hook }) + "\n");
      say(2, "dev stream line", hook);
      return;
    }
    const target = new URL(meta.callbackUrl);
    target.searchParams.set("slug", meta.callbackSlug);
    say(2, "POST hook", hook, target.href);
    const res = await fetch(target, {
      method: "POST",
      headers: {
        "content-type": "application/json",
        "uploadthing-hook": hook,
        "x-uploadthing-signature": signature,
      },
      body: payload,
    });
    const text = await res.text().catch(() => "");
    if (!res.ok) {
      throw new Error(
        `callback to ${target.href} answered ${res.status} ${res.statusText} ${text.slice(0, 200)}`.trim(),
      );
    }
  };

  // Forget metadata of uploads that never happened.
  const sweeper = setInterval(() => {
    const cutoff = Date.now() - 2 * 60 * 60_000;
    for (const [key, meta] of routeMeta) if (meta.registeredAt < cutoff) finishKey(key);
  }, 60_000);
  sweeper.unref();

  const checkApiKey = (req, res) => {
    if (safeEqual(req.headers["x-uploadthing-api-key"], apiKey)) return true;
    sendJson(req, res, 401, { error: "Invalid or missing x-uploadthing-api-key" });
    return false;
  };

  // --- POST /route-metadata -------------------------------------------------
  const handleRouteMetadata = async (req, res) => {
    if (!checkApiKey(req, res)) return;
    const body = await readJson(req);
    const fileKeys = Array.isArray(body.fileKeys) ? body.fileKeys.map(String) : [];
    if (
      fileKeys.length === 0 ||
      typeof body.callbackUrl !== "string" ||
      typeof body.callbackSlug !== "string"
    ) {
      return sendJson(req, res, 400, {
        error: "fileKeys, callbackUrl and callbackSlug are required",
      });
    }
    try {
      new URL(body.callbackUrl);
    } catch {
      return sendJson(req, res, 400, { error: `callbackUrl is not a URL: ${body.callbackUrl}` });
    }
    const proto = String(req.headers["x-forwarded-proto"] ?? "http")
      .split(",")[0]
      .trim();
    const common = {
      metadata: body.metadata ?? {},
      isDev: Boolean(body.isDev),
      callbackUrl: body.callbackUrl,
      callbackSlug: body.callbackSlug,
      awaitServerData: body.awaitServerData !== false,
      origin: req.headers.host ? `${proto}://${req.headers.host}` : baseUrl,
      registeredAt: Date.now(),
      stream: null,
    };
    let stream = null;
    if (common.isDev) {
      res.writeHead(200, {
        ...corsHeaders(req),
        "content-type": "application/x-ndjson",
        "cache-control": "no-store",
        "x-accel-buffering": "no",
      });
      res.flushHeaders();
      stream = {
        res,
        keys: new Set(fileKeys),
        pending: new Set(fileKeys),
        closed: false,
        timer: null,
      };
      stream.timer = setTimeout(() => {
        say(1, "dev stream timed out for", [...stream.pending].join(","));
        for (const key of stream.pending)
          if (routeMeta.get(key)?.stream === stream) routeMeta.delete(key);
        closeDevStream(stream);
      }, devStreamTimeoutMs);
      stream.timer.unref();
      res.on("close", () => {
        if (!stream.closed) {
          stream.closed = true;
          clearTimeout(stream.timer);
          devStreams.delete(stream);
        }
      });
      devStreams.add(stream);
    }
    for (const key of fileKeys) {
      const meta = { ...common, stream };
      routeMeta.set(key, meta);
      for (const resolveWaiter of metaWaiters.get(key) ?? []) resolveWaiter(meta);
      metaWaiters.delete(key);
    }
    say(
      1,
      "route-metadata",
      common.isDev ? "dev" : "prod",
      common.callbackSlug,
      fileKeys.join(","),
    );
    if (!common.isDev) sendJson(req, res, 200, { ok: true });
  };

  // --- POST /callback-result ------------------------------------------------
  const handleCallbackResult = async (req, res) => {
    if (!checkApiKey(req, res)) return;
    const body = await readJson(req);
    const key = typeof body.fileKey === "string" ? body.fileKey : null;
    if (!key) return sendJson(req, res, 400, { error: "fileKey is required" });
    const waiter = resultWaiters.get(key);
    say(
      1,
      "callback-result",
      key,
      body.error ? `error: ${body.error}` : "ok",
      waiter ? "" : "(no upload waiting)",
    );
    if (waiter) {
      resultWaiters.delete(key);
      if (typeof body.error === "string") waiter.resolve({ error: body.error });
      else waiter.resolve({ callbackData: body.callbackData ?? null });
    }
    finishKey(key);
    sendJson(req, res, 200, { ok: true });
  };

  // --- presigned URL checks -------------------------------------------------
  const checkPresigned = (req, url) => {
    if (verifySignatures) {
      const split = splitSignature(req.url ?? "");
      if (!split) return "missing signature";
      const { unsigned, signature } = split;
      const proto = String(req.headers["x-forwarded-proto"] ?? "http")
        .split(",")[0]
        .trim();
      const candidates = new Set([`${proto}://${req.headers.host}${unsigned}`]);
      const pub = new URL(publicUrl);
      candidates.add(`${pub.origin}${pub.pathname.replace(/\/$/, "")}${unsigned}`);
      if (![...candidates].some((c) => verifyPayload(c, signature, apiKey)))
        return "invalid signature";
    }
    const expires = Number(url.searchParams.get("expires"));
    if (!Number.isFinite(expires) || expires < Date.now()) return "URL expired";
    if (utParam(url, "x-ut-identifier") !== appId) return "x-ut-identifier does not match this app";
    return null;
  };

  // --- HEAD /<key> ----------------------------------------------------------
  const handleIngestHead = (req, res, key, url) => {
    const problem = checkPresigned(req, url);
    res.writeHead(problem ? 403 : 200, {
      ...corsHeaders(req),
      "x-ut-range-start": "0",
      "cache-control": "no-store",
    });
    res.end();
    say(2, "HEAD", key, problem ?? "ok");
  };

  // --- PUT /<key> -----------------------------------------------------------
  const handleIngestPut = async (req, res, key, url) => {
    const problem = checkPresigned(req, url);
    if (problem) {
      say(1, "PUT", key, "rejected:", problem);
      req.resume();
      return sendJson(req, res, 403, { error: `Forbidden: ${problem}` }, { connection: "close" });
    }
    const name = utParam(url, "x-ut-file-name") ?? key;
    const declaredSize = Number(utParam(url, "x-ut-file-size"));
    const declaredType = utParam(url, "x-ut-file-type");
    const slug = utParam(url, "x-ut-slug");
    const customId = utParam(url, "x-ut-custom-id");
    const contentDisposition = utParam(url, "x-ut-content-disposition") || "inline";
    const acl = utParam(url, "x-ut-acl") || "public-read";

    const tmpPath = store.tmpPath();
    let received;
    try {
      received = await receiveMultipartFile(req, {
        field: "file",
        destPath: tmpPath,
        maxBytes: Number.isFinite(declaredSize) ? declaredSize : Number.MAX_SAFE_INTEGER,
      });
    } catch (err) {
      rmSync(tmpPath, { force: true });
      if (err instanceof MultipartError) return sendJson(req, res, 400, { error: err.message });
      throw err;
    }

    const fail = async (status, error) => {
      rmSync(tmpPath, { force: true });
      if (slug) {
        try {
          const meta = await waitForMeta(key);
          await deliverHook(meta, "error", { fileKey: key, error });
        } catch (err) {
          say(1, "could not deliver error hook for", key, err.message);
        }
        finishKey(key);
      }
      say(1, "PUT", key, "failed:", error);
      sendJson(req, res, status, { error });
    };

    if (!received) return fail(400, 'multipart body has no "file" field');
    const type = declaredType || received.contentType || "application/octet-stream";
    if (Number.isFinite(declaredSize) && received.size !== declaredSize) {
      return fail(
        400,
        `File size mismatch: expected ${declaredSize} bytes, received ${received.size}`,
      );
    }

    const urls = fileUrls(key);
    const record = {
      id: randomUUID(),
      key,
      name,
      size: received.size,
      type,
      customId: customId ?? null,
      contentDisposition,
      acl,
      fileHash: received.md5,
      uploadedAt: Date.now(),
      status: "Uploaded",
      slug: slug ?? null,
    };
    try {
      store.commit(tmpPath, record);
    } catch (err) {
      return fail(500, `Could not store file: ${err.message}`);
    }
    say(1, "stored", key, `${received.size}B`, name, slug ? `slug=${slug}` : "(server upload)");

    const reply = { ...urls, fileHash: received.md5, serverData: null };
    if (!slug) return sendJson(req, res, 200, reply);

    let meta;
    try {
      meta = await waitForMeta(key);
    } catch (err) {
      store.removeKeys([key]);
      return sendJson(req, res, 500, { error: `Upload rejected: ${err.message}` });
    }

    const payload = {
      status: "uploaded",
      file: {
        name,
        size: received.size,
        type,
        lastModified: record.uploadedAt,
        customId: customId ?? null,
        key,
        ...urls,
        fileHash: received.md5,
      },
      origin: meta.origin,
      metadata: meta.metadata,
    };

    const result = meta.awaitServerData ? deferred() : null;
    if (result) resultWaiters.set(key, result);

    const delivery = deliverHook(meta, "callback", payload);
    if (!result) {
      delivery.then(
        () => finishKey(key),
        (err) => {
          say(1, "callback delivery failed for", key, err.message);
          finishKey(key);
        },
      );
      return sendJson(req, res, 200, reply);
    }

    delivery.catch((err) =>
      result.resolve({ error: `Could not deliver upload callback: ${err.message}` }),
    );
    let outcome;
    try {
      outcome = await withTimeout(
        result.promise,
        callbackTimeoutMs,
        `timed out after ${callbackTimeoutMs} ms waiting for the app to report onUploadComplete`,
      );
    } catch (err) {
      outcome = { error: err.message };
    } finally {
      resultWaiters.delete(key);
      finishKey(key);
    }
    if (outcome.error) {
      say(1, "PUT", key, "callback failed:", outcome.error);
      return sendJson(req, res, 500, { error: outcome.error });
    }
    sendJson(req, res, 200, { ...reply, serverData: outcome.callbackData });
  };

  // --- GET/HEAD /f/<key>, /a/<appId>/<key> ------------------------------------
  const handleServe = (req, res, key, url) => {
    const record = store.findByKey(key);
    const path = store.filePath(key);
    let st = null;
    if (record) {
      try {
        st = statSync(path);
      } catch {
        st = null;
      }
    }
    if (!record || !st) return sendJson(req, res, 404, { error: "File not found" });

    if (record.acl === "private") {
      const split = splitSignature(req.url ?? "");
      const expires = Number(url.searchParams.get("expires"));
      const proto = String(req.headers["x-forwarded-proto"] ?? "http")
        .split(",")[0]
        .trim();
      const ok =
        split !== null &&
        Number.isFinite(expires) &&
        expires >= Date.now() &&
        verifyPayload(`${proto}://${req.headers.host}${split.unsigned}`, split.signature, apiKey);
      if (!ok) return sendJson(req, res, 403, { error: "This file is private; use a signed URL" });
    }

    const etag = `"${record.fileHash}"`;
    const headers = {
      ...corsHeaders(req),
      "content-type": record.type || "application/octet-stream",
      "content-disposition": contentDispositionHeader(record.contentDisposition, record.name),
      etag,
      "accept-ranges": "bytes",
      "cache-control":
        record.acl === "private" ? "private, no-store" : "public, max-age=31536000, immutable",
      "cross-origin-resource-policy": "cross-origin",
      "last-modified": new Date(record.uploadedAt).toUTCString(),
    };
    const inm = req.headers["if-none-match"];
    if (inm && inm.split(",").some((t) => t.trim() === etag || t.trim() === "*")) {
      res.writeHead(304, headers);
      return res.end();
    }
    let start = 0;
    let end = st.size - 1;
    let status = 200;
    const range = /^bytes=(\d*)-(\d*)$/.exec(String(req.headers.range ?? "").trim());
    if (range && (range[1] !== "" || range[2] !== "") && st.size > 0) {
      if (range[1] === "") {
        start = Math.max(0, st.size - Number(range[2]));
      } else {
        start = Number(range[1]);
        if (range[2] !== "") end = Math.min(end, Number(range[2]));
      }
      if (start > end || start >= st.size) {
        res.writeHead(416, { ...headers, "content-range": `bytes */${st.size}` });
        return res.end();
      }
      status = 206;
      headers["content-range"] = `bytes ${start}-${end}/${st.size}`;
    }
    headers["content-length"] = st.size === 0 ? 0 : end - start + 1;
    res.writeHead(status, headers);
    if (req.method === "HEAD" || st.size === 0) return res.end();
    const rs = createReadStream(path, { start, end, highWaterMark: 1024 * 1024 });
    rs.on("error", () => res.destroy());
    rs.pipe(res);
  };

  // --- POST /v6/<op> ----------------------------------------------------------
  const refsOf = (body) => {
    if (Array.isArray(body.fileKeys)) return body.fileKeys.map((k) => ({ fileKey: String(k) }));
    if (Array.isArray(body.customIds)) return body.customIds.map((c) => ({ customId: String(c) }));
    return [];
  };

  const signedFileUrl = (key, expiresInSeconds) => {
    const u = new URL(`${publicUrl}/f/${key}`);
    u.searchParams.append("expires", String(Date.now() + expiresInSeconds * 1000));
    u.searchParams.append("signature", signPayload(u.toString(), apiKey));
    return u.href;
  };

  const v6 = {
    deleteFiles(body) {
      const keys = refsOf(body)
        .map((r) => store.find(r)?.key)
        .filter(Boolean);
      const deletedCount = store.removeKeys(keys);
      return { success: true, deletedCount };
    },
    getFileUrl(body) {
      const data = refsOf(body)
        .map((r) => store.find(r))
        .filter(Boolean)
        .map((f) => ({ key: f.key, url: fileUrls(f.key).ufsUrl }));
      return { data };
    },
    listFiles(body) {
      const limit = Number.isInteger(body.limit) && body.limit > 0 ? body.limit : 500;
      const offset = Number.isInteger(body.offset) && body.offset > 0 ? body.offset : 0;
      const files = store.all();
      return {
        hasMore: offset + limit < files.length,
        files: files.slice(offset, offset + limit).map((f) => ({
          id: f.id,
          customId: f.customId ?? null,
          key: f.key,
          name: f.name,
          size: f.size,
          status: f.status ?? "Uploaded",
          uploadedAt: f.uploadedAt,
        })),
      };
    },
    renameFiles(body) {
      const updates = Array.isArray(body.updates) ? body.updates : [];
      store.mutate((data) => {
        for (const u of updates) {
          const match =
            u.fileKey != null
              ? data.files.find((f) => f.key === u.fileKey)
              : data.files.findLast((f) => f.customId === u.customId);
          if (match && typeof u.newName === "string" && u.newName !== "") match.name = u.newName;
        }
      });
      return { success: true };
    },
    getUsageInfo() {
      const files = store.all();
      const totalBytes = files.reduce((n, f) => n + (f.size ?? 0), 0);
      return {
        totalBytes,
        appTotalBytes: totalBytes,
        filesUploaded: files.length,
        limitBytes: 100 * 1024 ** 3,
      };
    },
    requestFileAccess(body) {
      const f = store.find(
        body.fileKey != null ? { fileKey: body.fileKey } : { customId: body.customId },
      );
      if (!f) return { status: 404, body: { error: "File not found" } };
      const expiresIn =
        Number.isFinite(body.expiresIn) && body.expiresIn > 0 ? body.expiresIn : 3600;
      const url = signedFileUrl(f.key, expiresIn);
      return { url, ufsUrl: url };
    },
    updateACL(body) {
      const updates = Array.isArray(body.updates) ? body.updates : [];
      store.mutate((data) => {
        for (const u of updates) {
          const match =
            u.fileKey != null
              ? data.files.find((f) => f.key === u.fileKey)
              : data.files.findLast((f) => f.customId === u.customId);
          if (match && (u.acl === "public-read" || u.acl === "private")) match.acl = u.acl;
        }
      });
      return { success: true };
    },
  };

  const handleV6 = async (req, res, op) => {
    if (!checkApiKey(req, res)) return;
    const fn = Object.hasOwn(v6, op) ? v6[op] : null;
    if (!fn) return sendJson(req, res, 404, { error: `Unknown API operation ${op}` });
    const body = await readJson(req);
    const out = fn(body ?? {});
    say(1, "v6", op);
    if (out && typeof out.status === "number" && out.body)
      return sendJson(req, res, out.status, out.body);
    sendJson(req, res, 200, out);
  };

  // --- router -----------------------------------------------------------------
  const route = async (req, res) => {
    const url = new URL(req.url ?? "/", "http://fake.invalid");
    const segments = url.pathname
      .split("/")
      .filter(Boolean)
      .map((s) => {
        try {
          return decodeURIComponent(s);
        } catch {
          return s;
        }
      });
    const method = req.method ?? "GET";
    say(2, method, url.pathname);

    if (method === "OPTIONS") {
      res.writeHead(204, corsHeaders(req));
      return res.end();
    }
    if (segments.length === 0 || (segments.length === 1 && segments[0] === "health")) {
      if (method === "GET" || method === "HEAD")
        return sendJson(req, res, 200, { ok: true, service: "uploads-fake", appId });
    }
    if (method === "POST" && segments.length === 1 && segments[0] === "route-metadata")
      return handleRouteMetadata(req, res);
    if (method === "POST" && segments.length === 1 && segments[0] === "callback-result")
      return handleCallbackResult(req, res);
    if (method === "POST" && segments.length === 2 && segments[0] === "v6")
      return handleV6(req, res, segments[1]);
    if ((method === "GET" || method === "HEAD") && segments.length === 2 && segments[0] === "f") {
      return handleServe(req, res, segments[1], url);
    }
    if ((method === "GET" || method === "HEAD") && segments.length === 3 && segments[0] === "a") {
      if (segments[1] !== appId) return sendJson(req, res, 404, { error: "Unknown app" });
      return handleServe(req, res, segments[2], url);
    }
    if (segments.length === 1 && !RESERVED_SEGMENTS.has(segments[0]) && KEY_RE.test(segments[0])) {
      if (method === "HEAD") return handleIngestHead(req, res, segments[0], url);
      if (method === "PUT") return handleIngestPut(req, res, segments[0], url);
    }
    req.resume();
    sendJson(req, res, 404, { error: `No route for ${method} ${url.pathname}` });
  };

  const server = createServer((req, res) => {
    route(req, res).catch((err) => {
      const aborted = err?.code === "ECONNRESET" || err?.message === "aborted";
      say(
        aborted ? 1 : 0,
        "error handling",
        req.method,
        req.url,
        aborted ? "client aborted" : (err?.stack ?? err),
      );
      if (err instanceof SyntaxError)
        return sendJson(req, res, 400, { error: `Invalid JSON: ${err.message}` });
      if (err instanceof MultipartError) return sendJson(req, res, 400, { error: err.message });
      if (!res.headersSent) sendJson(req, res, 500, { error: String(err?.message ?? err) });
      else res.destroy();
    });
  });
  // Large uploads and held PUTs (awaitServerData) must not be cut off.
  server.requestTimeout = 0;
  server.headersTimeout = 60_000;
  server.keepAliveTimeout = 5_000;

  await new Promise((res, rej) => {
    server.once("error", rej);
    server.listen(port, HOST, () => {
      server.off("error", rej);
      res();
    });
  });
  const actualPort = /** @type {import("node:net").AddressInfo} */ (server.address()).port;
  baseUrl = `http://${HOST}:${actualPort}`;
  publicUrl = (options.publicUrl || baseUrl).replace(/\/+$/, "");

  let closed = false;
  const close = async () => {
    if (closed) return;
    closed = true;
    clearInterval(sweeper);
    for (const stream of [...devStreams]) closeDevStream(stream);
    for (const waiter of resultWaiters.values())
      waiter.resolve({ error: "upload fake is shutting down" });
    await new Promise((res) => {
      server.close(() => res());
      server.closeIdleConnections?.();
      setTimeout(() => server.closeAllConnections?.(), 1000).unref();
    });
  };

  return { port: actualPort, baseUrl, publicUrl, dataDir: store.dataDir, close };
}

// ---------------------------------------------------------------------------
// Standalone
// ---------------------------------------------------------------------------

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
