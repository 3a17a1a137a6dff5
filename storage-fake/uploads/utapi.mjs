// The server-side API the SDK's UTApi calls: POST /v6/<operation> with the api key.

import { readJson, sendJson } from "./http.mjs";
import { signPayload } from "./token.mjs";

/** @param {import("./server.mjs").FakeContext} ctx */
export function createUtApiRoutes(ctx) {
  const { store, apiKey, say, fileUrls, checkApiKey } = ctx;

  // --- POST /v6/<op> ----------------------------------------------------------
  const refsOf = (body) => {
    if (Array.isArray(body.fileKeys)) return body.fileKeys.map((k) => ({ fileKey: String(k) }));
    if (Array.isArray(body.customIds)) return body.customIds.map((c) => ({ customId: String(c) }));
    return [];
  };

  const signedFileUrl = (key, expiresInSeconds) => {
    const u = new URL(`${ctx.publicUrl}/f/${key}`);
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

  return handleV6;
}
