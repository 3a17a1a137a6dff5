// The upload fake's HTTP server: the shared context, the router and start/stop.

import { createServer } from "node:http";
import { resolve } from "node:path";

import { FileStore } from "./file-store.mjs";
import { BadRequestError, corsHeaders, sendJson } from "./http.mjs";
import { createIngestRoutes } from "./ingest.mjs";
import { createFileServer } from "./serve.mjs";
import { parseToken, safeEqual } from "./token.mjs";
import { createUtApiRoutes } from "./utapi.mjs";

export const HOST = "127.0.0.1";
const KEY_RE = /^[A-Za-z0-9_-]{1,200}$/;
const RESERVED_SEGMENTS = new Set(["route-metadata", "callback-result", "f", "a", "v6", "health"]);

/**
 * What the route modules share. `publicUrl` and `baseUrl` are known once the server listens.
 * @typedef {{
 *   store: FileStore, apiKey: string, appId: string,
 *   say: (level: number, ...parts: unknown[]) => void,
 *   publicUrl: string, baseUrl: string,
 *   fileUrls: (key: string) => {url: string, ufsUrl: string, appUrl: string},
 *   checkApiKey: (req: import("node:http").IncomingMessage, res: import("node:http").ServerResponse) => boolean,
 *   verifySignatures: boolean, callbackTimeoutMs: number, metadataTimeoutMs: number,
 *   devStreamTimeoutMs: number
 * }} FakeContext
 */

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

  /** @type {FakeContext} */
  const ctx = {
    store,
    apiKey,
    appId,
    say,
    publicUrl: "",
    baseUrl: "",
    fileUrls: (key) => ({
      url: `${ctx.publicUrl}/f/${key}`,
      ufsUrl: `${ctx.publicUrl}/f/${key}`,
      appUrl: `${ctx.publicUrl}/a/${appId}/${key}`,
    }),
    checkApiKey: (req, res) => {
      if (safeEqual(req.headers["x-uploadthing-api-key"], apiKey)) return true;
      sendJson(req, res, 401, { error: "Invalid or missing x-uploadthing-api-key" });
      return false;
    },
    verifySignatures,
    callbackTimeoutMs,
    metadataTimeoutMs,
    devStreamTimeoutMs,
  };
  const ingest = createIngestRoutes(ctx);
  const { handleRouteMetadata, handleCallbackResult, handleIngestHead, handleIngestPut } = ingest;
  const handleServe = createFileServer(ctx);
  const handleV6 = createUtApiRoutes(ctx);

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
      if (err instanceof BadRequestError) return sendJson(req, res, 400, { error: err.message });
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

  ctx.baseUrl = `http://${HOST}:${actualPort}`;
  ctx.publicUrl = (options.publicUrl || ctx.baseUrl).replace(/\/+$/, "");

  let closed = false;
  const close = async () => {
    if (closed) return;
    closed = true;
    ingest.close();
    await new Promise((res) => {
      server.close(() => res());
      server.closeIdleConnections?.();
      setTimeout(() => server.closeAllConnections?.(), 1000).unref();
    });
  };

  return {
    port: actualPort,
    baseUrl: ctx.baseUrl,
    publicUrl: ctx.publicUrl,
    dataDir: store.dataDir,
    close,
  };
}
