// The file host: GET/HEAD /f/<key> and /a/<appId>/<key> with ETag, Range and signed URLs for
// private files.

import { createReadStream, statSync } from "node:fs";

import { contentDispositionHeader, corsHeaders, sendJson, splitSignature } from "./http.mjs";
import { verifyPayload } from "./token.mjs";

/** @param {import("./server.mjs").FakeContext} ctx */
export function createFileServer(ctx) {
  const { store, apiKey } = ctx;

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

  return handleServe;
}
