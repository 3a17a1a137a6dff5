// HTTP helpers shared by the routes: CORS, JSON answers, body reading, the SDK's URL quirks.

/** A request the fake refuses with 400 and the error's message. */
export class BadRequestError extends Error {}

export function corsHeaders(req) {
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

export function sendJson(req, res, status, body, extra = {}) {
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

export async function readBody(req, limit = 5 * 1024 * 1024) {
  const chunks = [];
  let size = 0;
  for await (const chunk of req) {
    size += chunk.length;
    if (size > limit) throw new BadRequestError("request body too large");
    chunks.push(chunk);
  }
  return Buffer.concat(chunks).toString("utf8");
}

export async function readJson(req) {
  const text = await readBody(req);
  if (text.trim() === "") return {};
  return JSON.parse(text);
}

/** Split a raw request URL into the signed part and the `signature` value (appended last). */
export function splitSignature(rawUrl) {
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
export function utParam(url, name) {
  const v = url.searchParams.get(name);
  if (v == null) return null;
  try {
    return decodeURIComponent(v);
  } catch {
    return v;
  }
}

export function contentDispositionHeader(kind, filename) {
  const type = kind === "attachment" ? "attachment" : "inline";
  const ascii = String(filename ?? "file")
    .replace(/[^\x20-\x7e]/g, "_")
    .replace(/["\\]/g, "_");
  return `${type}; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(filename ?? "file")}`;
}

export function withTimeout(promise, ms, message) {
  let timer;
  return Promise.race([
    promise.finally(() => clearTimeout(timer)),
    new Promise((_, reject) => {
      timer = setTimeout(() => reject(new Error(message)), ms);
      timer.unref?.();
    }),
  ]);
}

export function deferred() {
  let resolve, reject;
  const promise = new Promise((res, rej) => {
    resolve = res;
    reject = rej;
  });
  promise.catch(() => {});
  return { promise, resolve, reject };
}
