// The ingest side: the app registers route metadata, the browser or UTApi PUTs the file,
// the fake stores it and tells the app through a signed hook (a line on the dev stream, or a
// POST to the app's callback URL), then holds the PUT until the app reports its result.

import { randomUUID } from "node:crypto";
import { rmSync } from "node:fs";

import {
  BadRequestError,
  corsHeaders,
  deferred,
  readJson,
  sendJson,
  splitSignature,
  utParam,
  withTimeout,
} from "./http.mjs";
import { receiveMultipartFile } from "./multipart.mjs";
import { signPayload, verifyPayload } from "./token.mjs";

/**
 * The ingest routes over the shared context (see server.mjs).
 * @param {import("./server.mjs").FakeContext} ctx
 */
export function createIngestRoutes(ctx) {
  const {
    store,
    apiKey,
    appId,
    say,
    fileUrls,
    checkApiKey,
    verifySignatures,
    callbackTimeoutMs,
    metadataTimeoutMs,
    devStreamTimeoutMs,
  } = ctx;

  /** fileKey → route metadata registered by the app */
  const routeMeta = new Map();
  /** fileKey → [resolve] of PUTs waiting for the metadata (dev race) */
  const metaWaiters = new Map();
  /** fileKey → deferred for POST /callback-result */
  const resultWaiters = new Map();
  /** open dev streams */
  const devStreams = new Set();

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
      origin: req.headers.host ? `${proto}://${req.headers.host}` : ctx.baseUrl,
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
      const pub = new URL(ctx.publicUrl);
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
      if (err instanceof BadRequestError) return sendJson(req, res, 400, { error: err.message });
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

  /** Stops the sweeper, closes open dev streams and releases PUTs still waiting. */
  const close = () => {
    clearInterval(sweeper);
    for (const stream of [...devStreams]) closeDevStream(stream);
    for (const waiter of resultWaiters.values())
      waiter.resolve({ error: "upload fake is shutting down" });
  };

  return { handleRouteMetadata, handleCallbackResult, handleIngestHead, handleIngestPut, close };
}
