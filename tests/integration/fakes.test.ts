// The local stand-ins (storage-fake/) driven by the real clients: the uploadthing SDK
// (UTApi and a route handler in both callback modes) and nodemailer. No database needed.
import { createHash, createHmac, randomBytes } from "node:crypto";
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { createServer, get as httpGet, type IncomingMessage, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";

import nodemailer from "nodemailer";
import {
  createRouteHandler,
  createUploadthing,
  UTApi,
  UTFile,
  type FileRouter,
} from "uploadthing/server";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";

import {
  clearMessages,
  extractLinks,
  getMessage,
  listMessages,
  waitForMessage,
} from "../helpers/outbox";

// --- the fakes are plain .mjs; describe the parts this test uses ---------------------------
interface UploadFake {
  port: number;
  baseUrl: string;
  publicUrl: string;
  dataDir: string;
  close(): Promise<void>;
}
interface UploadsModule {
  startUploadFake(options: {
    port: number;
    dataDir: string;
    token: string;
    publicUrl?: string;
  }): Promise<UploadFake>;
}
interface SmtpSink {
  smtpPort: number;
  httpPort: number;
  outboxUrl: string;
  close(): Promise<void>;
}
interface SinkModule {
  startSmtpSink(options: {
    smtpPort: number;
    httpPort: number;
    dataDir: string;
  }): Promise<SmtpSink>;
}

const fakesDir = new URL("../../storage-fake/", import.meta.url);
const loadUploads = async () =>
  (await import(/* @vite-ignore */ new URL("uploads.mjs", fakesDir).href)) as UploadsModule;
const loadSink = async () =>
  (await import(/* @vite-ignore */ new URL("smtp-sink.mjs", fakesDir).href)) as SinkModule;

// --- shared fixtures -------------------------------------------------------------------------
const API_KEY = `sk_test_${randomBytes(12).toString("hex")}`;
const APP_ID = "quirelinetestapp";
const TOKEN = Buffer.from(
  JSON.stringify({ apiKey: API_KEY, appId: APP_ID, regions: ["local1"] }),
).toString("base64");
const SDK_VERSION = "7.7.4";

const md5 = (data: Uint8Array) => createHash("md5").update(data).digest("hex");
const tempDir = (label: string) => mkdtempSync(join(tmpdir(), `quireline-${label}-`));

let workDir: string;
let uploads: UploadFake;
let utapi: UTApi;

async function fetchBytes(url: string): Promise<{ res: Response; bytes: Buffer }> {
  const res = await fetch(url);
  return { res, bytes: Buffer.from(await res.arrayBuffer()) };
}

/** Serve a fetch-style handler (Request → Response) with node:http on a free port. */
async function serveFetch(
  handler: () => (req: Request) => Promise<Response>,
): Promise<{ server: Server; url: string }> {
  const server = createServer((req: IncomingMessage, res) => {
    void (async () => {
      const chunks: Buffer[] = [];
      for await (const chunk of req) chunks.push(chunk as Buffer);
      const headers = new Headers();
      for (const [name, value] of Object.entries(req.headers)) {
        for (const v of Array.isArray(value) ? value : value === undefined ? [] : [value])
          headers.append(name, v);
      }
      const method = req.method ?? "GET";
      const request = new Request(`http://${req.headers.host}${req.url}`, {
        method,
        headers,
        body: method === "GET" || method === "HEAD" ? undefined : Buffer.concat(chunks),
      });
      const response = await handler()(request);
      res.writeHead(response.status, Object.fromEntries(response.headers));
      res.end(Buffer.from(await response.arrayBuffer()));
    })().catch((err: unknown) => {
      res.writeHead(500, { "content-type": "text/plain" });
      res.end(String(err));
    });
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  return { server, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
}

const closeServer = (server: Server) =>
  new Promise<void>((resolve) => {
    server.close(() => resolve());
    server.closeAllConnections();
  });

/** GET with an explicit Host header (for URLs signed for a host name the resolver may not map to 127.0.0.1). */
function getWithHost(
  port: number,
  path: string,
  host: string,
): Promise<{ status: number; body: Buffer }> {
  return new Promise((resolve, reject) => {
    httpGet({ host: "127.0.0.1", port, path, headers: { host } }, (res) => {
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, body: Buffer.concat(chunks) }));
      res.on("error", reject);
    }).on("error", reject);
  });
}

/** Sign an ingest URL the same way the SDK does (HMAC-SHA256 over the URL, signature appended last). */
function signIngestUrl(
  base: string,
  key: string,
  params: Record<string, string>,
  expires: number,
): string {
  const url = new URL(`${base}/${key}`);
  url.searchParams.append("expires", String(expires));
  for (const [k, v] of Object.entries(params)) url.searchParams.append(k, encodeURIComponent(v));
  const signature =
    "hmac-sha256=" + createHmac("sha256", API_KEY).update(url.toString()).digest("hex");
  url.searchParams.append("signature", signature);
  return url.href;
}

function multipart(bytes: Uint8Array, name: string, type: string): FormData {
  const form = new FormData();
  form.append("file", new File([new Uint8Array(bytes)], name, { type }));
  return form;
}

beforeAll(async () => {
  workDir = tempDir("fakes");
  const { startUploadFake } = await loadUploads();
  uploads = await startUploadFake({ port: 0, dataDir: join(workDir, "uploads"), token: TOKEN });
  utapi = new UTApi({
    token: TOKEN,
    ingestUrl: uploads.baseUrl,
    apiUrl: uploads.baseUrl,
    logLevel: "Error",
  });
});

afterAll(async () => {
  await uploads?.close();
  if (workDir) rmSync(workDir, { recursive: true, force: true });
});

// ============================================================================================
describe("upload fake with UTApi", () => {
  it("stores an upload and serves the same bytes back on /f and /a with headers", async () => {
    const bytes = randomBytes(300_000);
    const result = await utapi.uploadFiles(
      new UTFile([bytes], "plate-03 ä.png", { type: "image/png" }),
    );
    expect(result.error).toBeNull();
    const data = result.data!;
    expect(data.fileHash).toBe(md5(bytes));
    expect(data.ufsUrl).toBe(`${uploads.baseUrl}/f/${data.key}`);
    expect(data.size).toBe(bytes.length);

    const { res, bytes: served } = await fetchBytes(data.ufsUrl);
    expect(res.status).toBe(200);
    expect(md5(served)).toBe(data.fileHash);
    expect(res.headers.get("content-type")).toBe("image/png");
    expect(res.headers.get("content-disposition")).toMatch(/^inline; filename="plate-03 _\.png"/);
    expect(res.headers.get("content-disposition")).toContain(
      "filename*=UTF-8''plate-03%20%C3%A4.png",
    );
    expect(res.headers.get("etag")).toBe(`"${data.fileHash}"`);

    const app = await fetchBytes(`${uploads.baseUrl}/a/${APP_ID}/${data.key}`);
    expect(app.res.status).toBe(200);
    expect(md5(app.bytes)).toBe(data.fileHash);
    expect((await fetch(`${uploads.baseUrl}/a/someotherapp/${data.key}`)).status).toBe(404);

    const head = await fetch(data.ufsUrl, { method: "HEAD" });
    expect(head.status).toBe(200);
    expect(head.headers.get("content-length")).toBe(String(bytes.length));

    const notModified = await fetch(data.ufsUrl, {
      headers: { "if-none-match": `"${data.fileHash}"` },
    });
    expect(notModified.status).toBe(304);

    const partial = await fetch(data.ufsUrl, { headers: { range: "bytes=100-199" } });
    expect(partial.status).toBe(206);
    expect(partial.headers.get("content-range")).toBe(`bytes 100-199/${bytes.length}`);
    expect(Buffer.from(await partial.arrayBuffer()).equals(bytes.subarray(100, 200))).toBe(true);
  });

  it("accepts a 60 MB upload and returns it intact", { timeout: 120_000 }, async () => {
    const bytes = randomBytes(60 * 1024 * 1024);
    const result = await utapi.uploadFiles(
      new UTFile([bytes], "imposed-signatures.pdf", { type: "application/pdf" }),
    );
    expect(result.error).toBeNull();
    expect(result.data!.fileHash).toBe(md5(bytes));
    const { res, bytes: served } = await fetchBytes(result.data!.ufsUrl);
    expect(res.status).toBe(200);
    expect(served.length).toBe(bytes.length);
    expect(md5(served)).toBe(md5(bytes));
  });

  it("lists, renames, reports usage, resolves URLs and deletes files", async () => {
    const credits = Buffer.from("Edited by Wren Halloway; type by Ines Okafor.\n");
    const cover = randomBytes(2048);
    const [a, b] = await utapi.uploadFiles([
      new UTFile([credits], "credits.txt", { type: "text/plain", customId: "credits-spring" }),
      new UTFile([cover], "cover.jpg", { type: "image/jpeg" }),
    ]);
    expect(a!.error).toBeNull();
    expect(b!.error).toBeNull();
    const keyA = a!.data!.key;
    const keyB = b!.data!.key;

    const listed = await utapi.listFiles();
    const entryA = listed.files.find((f) => f.key === keyA);
    expect(entryA).toMatchObject({
      name: "credits.txt",
      size: credits.length,
      customId: "credits-spring",
      status: "Uploaded",
    });
    expect(listed.files.some((f) => f.key === keyB)).toBe(true);

    const page = await utapi.listFiles({ limit: 1, offset: 0 });
    expect(page.files).toHaveLength(1);
    expect(page.hasMore).toBe(true);

    expect((await utapi.renameFiles({ fileKey: keyA, newName: "credits-final.txt" })).success).toBe(
      true,
    );
    const renamed = (await utapi.listFiles()).files.find((f) => f.key === keyA);
    expect(renamed?.name).toBe("credits-final.txt");
    const servedRenamed = await fetch(a!.data!.ufsUrl);
    expect(servedRenamed.headers.get("content-disposition")).toContain(
      'filename="credits-final.txt"',
    );

    const urls = await utapi.getFileUrls(["credits-spring"], { keyType: "customId" });
    expect(urls.data).toEqual([{ key: keyA, url: `${uploads.baseUrl}/f/${keyA}` }]);

    const usage = await utapi.getUsageInfo();
    expect(usage.filesUploaded).toBe((await utapi.listFiles()).files.length);
    expect(usage.totalBytes).toBeGreaterThanOrEqual(credits.length + cover.length);

    const deleted = await utapi.deleteFiles(keyA);
    expect(deleted.success).toBe(true);
    expect(deleted.deletedCount).toBe(1);
    expect((await fetch(a!.data!.ufsUrl)).status).toBe(404);
    expect((await utapi.listFiles()).files.some((f) => f.key === keyA)).toBe(false);
    expect((await utapi.deleteFiles("credits-spring", { keyType: "customId" })).deletedCount).toBe(
      0,
    );
    expect((await fetch(b!.data!.ufsUrl)).status).toBe(200);
  });

  it("rejects API calls with the wrong key", async () => {
    const res = await fetch(`${uploads.baseUrl}/v6/listFiles`, {
      method: "POST",
      headers: { "content-type": "application/json", "x-uploadthing-api-key": "sk_wrong" },
      body: "{}",
    });
    expect(res.status).toBe(401);
    const otherToken = Buffer.from(
      JSON.stringify({ apiKey: "sk_other", appId: APP_ID, regions: ["x"] }),
    ).toString("base64");
    const stranger = new UTApi({
      token: otherToken,
      apiUrl: uploads.baseUrl,
      ingestUrl: uploads.baseUrl,
      logLevel: "None",
    });
    await expect(stranger.listFiles()).rejects.toThrow();
    const upload = await stranger.uploadFiles(new UTFile(["x"], "x.txt"));
    expect(upload.error).not.toBeNull();
  });

  it("keeps private files behind signed URLs", async () => {
    const bytes = randomBytes(4096);
    const result = await utapi.uploadFiles(
      new UTFile([bytes], "proof.pdf", { type: "application/pdf" }),
      { acl: "private" },
    );
    const key = result.data!.key;
    expect((await fetch(result.data!.ufsUrl)).status).toBe(403);

    const access = await utapi.getSignedURL(key, { expiresIn: 600 });
    const signed = await fetchBytes(access.ufsUrl);
    expect(signed.res.status).toBe(200);
    expect(md5(signed.bytes)).toBe(md5(bytes));
    const forged = access.ufsUrl.replace(/.$/, (c) => (c === "0" ? "1" : "0"));
    expect((await fetch(forged)).status).toBe(403);

    // The SDK's local signing (generateSignedURL) with a "local" ufsHost, path style.
    const hostName = `localhost:${uploads.port}`;
    const local = new UTApi({
      token: TOKEN,
      ufsHost: hostName,
      ufsAppIdLocation: "path",
      logLevel: "Error",
    });
    const { ufsUrl } = await local.generateSignedURL(key, { expiresIn: 300 });
    expect(ufsUrl.startsWith(`http://${hostName}/a/${APP_ID}/${key}?`)).toBe(true);
    const viaLocal = await getWithHost(
      uploads.port,
      ufsUrl.slice(`http://${hostName}`.length),
      hostName,
    );
    expect(viaLocal.status).toBe(200);
    expect(md5(viaLocal.body)).toBe(md5(bytes));

    await utapi.updateACL(key, "public-read");
    expect((await fetch(result.data!.ufsUrl)).status).toBe(200);
  });

  it("persists across restarts and recovers when its data folder is removed", async () => {
    const { startUploadFake } = await loadUploads();
    const dir = join(workDir, "restart");
    let fake = await startUploadFake({ port: 0, dataDir: dir, token: TOKEN });
    try {
      const api = () =>
        new UTApi({
          token: TOKEN,
          ingestUrl: fake.baseUrl,
          apiUrl: fake.baseUrl,
          logLevel: "Error",
        });
      const bytes = Buffer.from("page map v1");
      const first = await api().uploadFiles(
        new UTFile([bytes], "page-map.json", { type: "application/json" }),
      );
      const key = first.data!.key;
      expect(JSON.parse(readFileSync(join(dir, "index.json"), "utf8")).files[0].key).toBe(key);

      await fake.close();
      fake = await startUploadFake({ port: 0, dataDir: dir, token: TOKEN });
      expect((await api().listFiles()).files.map((f) => f.key)).toEqual([key]);
      const again = await fetchBytes(`${fake.baseUrl}/f/${key}`);
      expect(again.bytes.equals(bytes)).toBe(true);

      rmSync(dir, { recursive: true, force: true });
      expect((await api().listFiles()).files).toEqual([]);
      expect((await fetch(`${fake.baseUrl}/f/${key}`)).status).toBe(404);

      const after = await api().uploadFiles(
        new UTFile([bytes], "page-map.json", { type: "application/json" }),
      );
      expect(after.error).toBeNull();
      expect((await fetchBytes(after.data!.ufsUrl)).bytes.equals(bytes)).toBe(true);
      expect(existsSync(join(dir, "index.json"))).toBe(true);
    } finally {
      await fake.close();
    }
  });

  it("answers CORS preflights and puts CORS headers on every response", async () => {
    const origin = "http://localhost:3000";
    const preflight = await fetch(`${uploads.baseUrl}/anykey123`, {
      method: "OPTIONS",
      headers: {
        origin,
        "access-control-request-method": "PUT",
        "access-control-request-headers": "b3,traceparent,x-uploadthing-version,range",
        "access-control-request-private-network": "true",
      },
    });
    expect(preflight.status).toBe(204);
    expect(preflight.headers.get("access-control-allow-origin")).toBe(origin);
    expect(preflight.headers.get("access-control-allow-methods")).toContain("PUT");
    expect(preflight.headers.get("access-control-allow-headers")).toBe(
      "b3,traceparent,x-uploadthing-version,range",
    );
    expect(preflight.headers.get("access-control-allow-private-network")).toBe("true");
    expect(preflight.headers.get("access-control-expose-headers")).toContain("x-ut-range-start");

    const missing = await fetch(`${uploads.baseUrl}/f/doesnotexist`, { headers: { origin } });
    expect(missing.status).toBe(404);
    expect(missing.headers.get("access-control-allow-origin")).toBe(origin);
  });
});

// ============================================================================================
describe.each([
  { mode: "production callback", isDev: false },
  { mode: "dev stream", isDev: true },
])("route handler round trip ($mode)", ({ isDev }) => {
  const completed: {
    metadata: Record<string, unknown>;
    file: {
      key: string;
      ufsUrl: string;
      fileHash: string;
      name: string;
      size: number;
      customId: string | null;
    };
  }[] = [];
  const failures: { fileKey: string; message: string }[] = [];
  let app: { server: Server; url: string };

  beforeAll(async () => {
    const f = createUploadthing();
    const router = {
      artwork: f({ image: { maxFileSize: "8MB", maxFileCount: 2 } })
        .middleware(({ req }) => ({
          editorId: "ed_wren",
          issue: req.headers.get("x-issue") ?? "none",
        }))
        .onUploadError(({ error, fileKey }) => {
          failures.push({ fileKey, message: error.message });
        })
        .onUploadComplete(({ metadata, file }) => {
          completed.push({
            metadata,
            file: {
              key: file.key,
              ufsUrl: file.ufsUrl,
              fileHash: file.fileHash,
              name: file.name,
              size: file.size,
              customId: file.customId,
            },
          });
          return { pageSlot: 7, storedKey: file.key, by: metadata.editorId };
        }),
    } satisfies FileRouter;

    let handler: ((req: Request) => Promise<Response>) | null = null;
    app = await serveFetch(() => handler!);
    handler = createRouteHandler({
      router,
      config: {
        token: TOKEN,
        ingestUrl: uploads.baseUrl,
        callbackUrl: `${app.url}/api/uploadthing`,
        isDev,
        logLevel: "None",
      },
    });
  });

  beforeEach(() => {
    completed.length = 0;
    failures.length = 0;
  });

  afterAll(async () => {
    if (app) await closeServer(app.server);
  });

  async function presign(files: { name: string; size: number; type: string }[]) {
    const res = await fetch(`${app.url}/api/uploadthing?actionType=upload&slug=artwork`, {
      method: "POST",
      headers: {
        "content-type": "application/json",
        "x-uploadthing-package": "@uploadthing/react",
        "x-uploadthing-version": SDK_VERSION,
        "x-issue": "spring-27",
      },
      body: JSON.stringify({
        input: null,
        files: files.map((file) => ({ ...file, lastModified: Date.now() })),
      }),
    });
    expect(res.status).toBe(200);
    return (await res.json()) as {
      url: string;
      key: string;
      name: string;
      customId: string | null;
    }[];
  }

  const put = (url: string, body: FormData) =>
    fetch(url, {
      method: "PUT",
      body,
      headers: {
        range: "bytes=0-",
        "x-uploadthing-version": SDK_VERSION,
        origin: "http://localhost:3000",
      },
    });

  it("uploads like the browser does and returns onUploadComplete's data", async () => {
    const bytes = randomBytes(150_000);
    const [presigned] = await presign([
      { name: "plate-2.png", size: bytes.length, type: "image/png" },
    ]);
    expect(presigned!.url.startsWith(`${uploads.baseUrl}/${presigned!.key}?`)).toBe(true);
    expect(new URL(presigned!.url).searchParams.get("x-ut-slug")).toBe("artwork");

    const head = await fetch(presigned!.url, {
      method: "HEAD",
      headers: { origin: "http://localhost:3000" },
    });
    expect(head.status).toBe(200);
    expect(head.headers.get("x-ut-range-start")).toBe("0");
    expect(head.headers.get("access-control-allow-origin")).toBe("http://localhost:3000");

    const res = await put(presigned!.url, multipart(bytes, "plate-2.png", "image/png"));
    const body = (await res.json()) as {
      url: string;
      appUrl: string;
      ufsUrl: string;
      fileHash: string;
      serverData: unknown;
    };
    expect(res.status).toBe(200);
    expect(body.serverData).toEqual({ pageSlot: 7, storedKey: presigned!.key, by: "ed_wren" });
    expect(body.fileHash).toBe(md5(bytes));
    expect(body.ufsUrl).toBe(`${uploads.baseUrl}/f/${presigned!.key}`);
    expect(body.appUrl).toBe(`${uploads.baseUrl}/a/${APP_ID}/${presigned!.key}`);

    expect(completed).toHaveLength(1);
    expect(completed[0]!.metadata).toEqual({ editorId: "ed_wren", issue: "spring-27" });
    expect(completed[0]!.file).toEqual({
      key: presigned!.key,
      ufsUrl: body.ufsUrl,
      fileHash: md5(bytes),
      name: "plate-2.png",
      size: bytes.length,
      customId: null,
    });

    const served = await fetchBytes(body.ufsUrl);
    expect(md5(served.bytes)).toBe(md5(bytes));
    expect(served.res.headers.get("content-type")).toBe("image/png");
  });

  it("uploads two files from one presign request", async () => {
    const one = randomBytes(1000);
    const two = randomBytes(2000);
    const presigned = await presign([
      { name: "a.png", size: one.length, type: "image/png" },
      { name: "b.png", size: two.length, type: "image/png" },
    ]);
    const results = await Promise.all([
      put(presigned[0]!.url, multipart(one, "a.png", "image/png")).then((r) => r.json()),
      put(presigned[1]!.url, multipart(two, "b.png", "image/png")).then((r) => r.json()),
    ]);
    expect(
      results.map((r: { serverData: { storedKey: string } }) => r.serverData.storedKey),
    ).toEqual(presigned.map((p) => p.key));
    expect(completed.map((c) => c.file.key).sort()).toEqual(presigned.map((p) => p.key).sort());
  });

  it("refuses a presigned URL whose signature or parameters were altered", async () => {
    const bytes = randomBytes(500);
    const [presigned] = await presign([{ name: "x.png", size: bytes.length, type: "image/png" }]);
    const url = presigned!.url;

    const badSignature = url.replace(/.$/, (c) => (c === "0" ? "1" : "0"));
    const res1 = await put(badSignature, multipart(bytes, "x.png", "image/png"));
    expect(res1.status).toBe(403);
    expect(((await res1.json()) as { error: string }).error).toMatch(/signature/);
    expect((await fetch(badSignature, { method: "HEAD" })).status).toBe(403);

    const biggerFile = url.replace(/x-ut-file-size=\d+/, "x-ut-file-size=999999");
    expect(biggerFile).not.toBe(url);
    const res2 = await put(biggerFile, multipart(bytes, "x.png", "image/png"));
    expect(res2.status).toBe(403);

    const unsigned = url.slice(0, url.indexOf("&signature="));
    expect((await put(unsigned, multipart(bytes, "x.png", "image/png"))).status).toBe(403);

    expect(completed).toHaveLength(0);
    expect((await fetch(`${uploads.baseUrl}/f/${presigned!.key}`)).status).toBe(404);
  });

  it("reports a size mismatch to onUploadError and fails the PUT", async () => {
    const [presigned] = await presign([{ name: "short.png", size: 1000, type: "image/png" }]);
    const res = await put(presigned!.url, multipart(randomBytes(400), "short.png", "image/png"));
    expect(res.status).toBe(400);
    expect(((await res.json()) as { error: string }).error).toMatch(/size mismatch/i);
    if (!isDev) {
      // production: the signed "error" hook has been handled before the PUT answered
      expect(failures).toEqual([
        { fileKey: presigned!.key, message: expect.stringContaining(presigned!.key) as string },
      ]);
    } else {
      // dev: the SDK forwards the stream line itself; wait for it to arrive
      const deadline = Date.now() + 5000;
      while (failures.length === 0 && Date.now() < deadline)
        await new Promise((r) => setTimeout(r, 25));
      expect(failures.map((f) => f.fileKey)).toEqual([presigned!.key]);
    }
    expect(completed).toHaveLength(0);
    expect((await fetch(`${uploads.baseUrl}/f/${presigned!.key}`)).status).toBe(404);
  });
});

describe("presigned URL expiry", () => {
  const params = {
    "x-ut-identifier": APP_ID,
    "x-ut-file-name": "late.txt",
    "x-ut-file-size": "4",
    "x-ut-file-type": "text/plain",
    "x-ut-content-disposition": "inline",
  };

  it("accepts a correctly signed URL and refuses the same URL once expired", async () => {
    const fresh = signIngestUrl(uploads.baseUrl, "selfsignedkey0001", params, Date.now() + 60_000);
    const ok = await fetch(fresh, {
      method: "PUT",
      body: multipart(Buffer.from("late"), "late.txt", "text/plain"),
    });
    expect(ok.status).toBe(200);
    expect(((await ok.json()) as { fileHash: string }).fileHash).toBe(md5(Buffer.from("late")));

    const expired = signIngestUrl(uploads.baseUrl, "selfsignedkey0002", params, Date.now() - 1000);
    const res = await fetch(expired, {
      method: "PUT",
      body: multipart(Buffer.from("late"), "late.txt", "text/plain"),
    });
    expect(res.status).toBe(403);
    expect(((await res.json()) as { error: string }).error).toMatch(/expired/);

    const otherApp = signIngestUrl(
      uploads.baseUrl,
      "selfsignedkey0003",
      { ...params, "x-ut-identifier": "someone-else" },
      Date.now() + 60_000,
    );
    const res3 = await fetch(otherApp, {
      method: "PUT",
      body: multipart(Buffer.from("late"), "late.txt", "text/plain"),
    });
    expect(res3.status).toBe(403);
  });
});

describe("multipart bodies on the ingest PUT", () => {
  const artwork = randomBytes(3000);
  let nextKey = 0;

  /** PUT `body` to a freshly signed ingest URL declaring `declaredSize` bytes (no slug: no hooks). */
  async function putRaw(contentType: string, body: Buffer, declaredSize = artwork.length) {
    const key = `multipartcase${String(++nextKey).padStart(4, "0")}`;
    const params = {
      "x-ut-identifier": APP_ID,
      "x-ut-file-name": "plate-9.png",
      "x-ut-file-size": String(declaredSize),
      "x-ut-file-type": "image/png",
      "x-ut-content-disposition": "inline",
    };
    const url = signIngestUrl(uploads.baseUrl, key, params, Date.now() + 60_000);
    const res = await fetch(url, {
      method: "PUT",
      headers: { "content-type": contentType },
      body: new Uint8Array(body),
    });
    return { key, res, json: (await res.json()) as { fileHash?: string; error?: string } };
  }

  /** A multipart body built by hand, CRLF line ends as RFC 7578 requires. */
  function multipartBody(boundary: string, parts: { headers: string[]; data: Buffer }[]) {
    const chunks: Buffer[] = [];
    for (const part of parts) {
      chunks.push(Buffer.from(`--${boundary}\r\n${part.headers.join("\r\n")}\r\n\r\n`), part.data);
      chunks.push(Buffer.from("\r\n"));
    }
    chunks.push(Buffer.from(`--${boundary}--\r\n`));
    return Buffer.concat(chunks);
  }

  const filePart = {
    headers: [
      'Content-Disposition: form-data; name="file"; filename="plate-9.png"',
      "Content-Type: image/png",
    ],
    data: artwork,
  };

  it("finds the boundary parameter after a quoted parameter that mentions boundary=", async () => {
    // RFC 2045 section 5.1: a parameter value may be a quoted string, which may hold "boundary=".
    const { key, res, json } = await putRaw(
      'multipart/form-data; comment="boundary=not-this-one"; boundary=plate-9-sep',
      multipartBody("plate-9-sep", [filePart]),
    );
    expect(res.status).toBe(200);
    expect(json.fileHash).toBe(md5(artwork));
    const served = await fetchBytes(`${uploads.baseUrl}/f/${key}`);
    expect(served.bytes.equals(artwork)).toBe(true);
  });

  it("stores the file part, not a plain text field that shares its name", async () => {
    // RFC 7578 section 4.2: the part holding a file's content carries a filename parameter.
    const textField = {
      headers: ['Content-Disposition: form-data; name="file"'],
      data: Buffer.from("a caption, not the artwork"),
    };
    const { key, res, json } = await putRaw(
      "multipart/form-data; boundary=plate-9-sep",
      multipartBody("plate-9-sep", [textField, filePart]),
    );
    expect(res.status).toBe(200);
    expect(json.fileHash).toBe(md5(artwork));
    expect((await fetchBytes(`${uploads.baseUrl}/f/${key}`)).bytes.equals(artwork)).toBe(true);
  });

  it("refuses a file larger than its declared size with 400, keeping nothing", async () => {
    const { key, res, json } = await putRaw(
      "multipart/form-data; boundary=plate-9-sep",
      multipartBody("plate-9-sep", [filePart]),
      1000,
    );
    expect(res.status).toBe(400);
    expect(json.error).toBe(`File size mismatch: expected 1000 bytes, received ${artwork.length}`);
    expect((await fetch(`${uploads.baseUrl}/f/${key}`)).status).toBe(404);
    expect(readdirSync(join(uploads.dataDir, "tmp"))).toEqual([]);
    expect(existsSync(join(uploads.dataDir, "files", key))).toBe(false);
  });

  it("answers 400 for a body cut off before its closing boundary", async () => {
    const whole = multipartBody("plate-9-sep", [filePart]);
    const { res, json } = await putRaw(
      "multipart/form-data; boundary=plate-9-sep",
      whole.subarray(0, whole.length - "\r\n--plate-9-sep--\r\n".length),
    );
    expect(res.status).toBe(400);
    expect(json.error).toBe("multipart body ended before the closing boundary");
    expect(readdirSync(join(uploads.dataDir, "tmp"))).toEqual([]);
  });
});

// ============================================================================================
describe("SMTP sink and outbox API", () => {
  let sink: SmtpSink;
  let sinkDir: string;
  let transport: nodemailer.Transporter;
  const outbox = () => ({ baseUrl: sink.outboxUrl });

  beforeAll(async () => {
    sinkDir = join(workDir, "mail");
    const { startSmtpSink } = await loadSink();
    sink = await startSmtpSink({ smtpPort: 0, httpPort: 0, dataDir: sinkDir });
    transport = nodemailer.createTransport({
      host: "127.0.0.1",
      port: sink.smtpPort,
      secure: false,
      ignoreTLS: true,
      auth: { user: "quireline", pass: "any-password-works" },
    });
  });

  afterAll(async () => {
    transport?.close();
    await sink?.close();
  });

  it("decodes a quoted-printable sign-in mail so the link comes back intact", async () => {
    await clearMessages(outbox());
    const link =
      "http://localhost:3000/api/auth/callback/nodemailer?callbackUrl=http%3A%2F%2Flocalhost%3A3000%2Fstudio" +
      `&token=${"7f3a".repeat(16)}&email=ines.okafor%40zine.test`;
    const mail = {
      from: "Quireline <no-reply@quireline.test>",
      to: "Ines.Okafor@Zine.test",
      subject: "Sign in to Quireline — Brackish Tides issue",
      text: `Hello Inès,\n\nUse this link to sign in: ${link}\n\nIt expires in 24 hours.\n`,
      html: `<p>Hello Inès,</p><p><a href="${link.replace(/&/g, "&amp;")}">Sign in</a></p>`,
      textEncoding: "quoted-printable" as const,
    };

    // Build the exact bytes first to be sure they are quoted-printable with soft line breaks.
    const built = await nodemailer
      .createTransport({ streamTransport: true, buffer: true })
      .sendMail(mail);
    const raw = built.message as Buffer;
    const source = raw.toString("utf8");
    expect(source).toMatch(/Content-Transfer-Encoding: quoted-printable/i);
    expect(source).toContain("=3D");
    expect(source).toMatch(/=\r\n/);
    expect(source).not.toContain(link);

    await transport.sendMail({
      envelope: { from: "no-reply@quireline.test", to: ["Ines.Okafor@Zine.test"] },
      raw,
    });

    const msg = await waitForMessage({
      ...outbox(),
      to: "ines.okafor@zine.test",
      subject: /^Sign in to Quireline/,
    });
    expect(msg.subject).toBe("Sign in to Quireline — Brackish Tides issue");
    expect(msg.from).toBe('"Quireline" <no-reply@quireline.test>');
    expect(msg.text).toContain("Hello Inès,");
    expect(extractLinks(msg.text)).toEqual([link]);
    expect(extractLinks(msg.html ?? "")).toEqual([link]);
    expect(new Date(msg.date).getTime()).not.toBeNaN();
    expect(await getMessage(msg.id, outbox())).toEqual(msg);
  });

  it("filters by any recipient (including Bcc), persists to outbox.jsonl and clears", async () => {
    await clearMessages(outbox());
    await transport.sendMail({
      from: "Quireline <no-reply@quireline.test>",
      to: "tomasz.varga@saltmarsh.test",
      cc: "Hollis.Brandt@saltmarsh.test",
      bcc: "payouts@quireline.test",
      subject: "Contributor copies are on their way",
      text: "Three copies of Brackish Tides #4 ship from Port Ellery on Friday.",
    });
    await transport.sendMail({
      from: "Quireline <no-reply@quireline.test>",
      to: "mara.quell@inkhouse.test",
      subject: "Your submission was received",
      text: "Thanks, Mara.",
    });

    const all = await listMessages(outbox());
    expect(all.map((m) => m.subject)).toEqual([
      "Contributor copies are on their way",
      "Your submission was received",
    ]);
    expect(all[0]!.to).toEqual(
      expect.arrayContaining([
        "tomasz.varga@saltmarsh.test",
        "Hollis.Brandt@saltmarsh.test",
        "payouts@quireline.test",
      ]),
    );
    expect(
      (await listMessages({ ...outbox(), to: "HOLLIS.BRANDT@SALTMARSH.TEST" })).map((m) => m.id),
    ).toEqual([all[0]!.id]);
    expect(
      (await listMessages({ ...outbox(), to: "payouts@quireline.test" })).map((m) => m.id),
    ).toEqual([all[0]!.id]);
    expect(await listMessages({ ...outbox(), to: "nobody@quireline.test" })).toEqual([]);

    const lines = readFileSync(join(sinkDir, "outbox.jsonl"), "utf8").trim().split("\n");
    expect(lines.map((l) => (JSON.parse(l) as { id: string }).id)).toEqual(all.map((m) => m.id));

    // A second sink on the same folder reloads the same messages.
    const { startSmtpSink } = await loadSink();
    const reloaded = await startSmtpSink({ smtpPort: 0, httpPort: 0, dataDir: sinkDir });
    try {
      expect((await listMessages({ baseUrl: reloaded.outboxUrl })).map((m) => m.id)).toEqual(
        all.map((m) => m.id),
      );
    } finally {
      await reloaded.close();
    }

    expect((await fetch(`${sink.outboxUrl}/messages/not-a-real-id`)).status).toBe(404);
    await clearMessages(outbox());
    expect(await listMessages(outbox())).toEqual([]);
    expect(readFileSync(join(sinkDir, "outbox.jsonl"), "utf8")).toBe("");
  });

  it("treats a removed data folder as an empty outbox and keeps accepting mail", async () => {
    await transport.sendMail({
      from: "a@quireline.test",
      to: "b@quireline.test",
      subject: "before",
      text: "x",
    });
    expect((await listMessages(outbox())).length).toBeGreaterThan(0);
    rmSync(sinkDir, { recursive: true, force: true });
    expect(await listMessages(outbox())).toEqual([]);
    await transport.sendMail({
      from: "a@quireline.test",
      to: "b@quireline.test",
      subject: "after",
      text: "y",
    });
    expect((await listMessages(outbox())).map((m) => m.subject)).toEqual(["after"]);
  });

  it("waitForMessage gives up with a helpful error", async () => {
    await expect(
      waitForMessage({ ...outbox(), to: "ghost@quireline.test", timeoutMs: 300 }),
    ).rejects.toThrow(/No message to ghost@quireline\.test/);
  });
});

describe("extractLinks", () => {
  it("finds links in text and HTML, trimming punctuation and decoding &amp;", () => {
    const text =
      "Open https://quireline.test/calls/brackish-tides. Or (see http://localhost:3000/studio?x=1&y=2), " +
      '<a href="http://localhost:3000/a?b=1&amp;c=2">here</a> and again https://quireline.test/calls/brackish-tides!';
    expect(extractLinks(text)).toEqual([
      "https://quireline.test/calls/brackish-tides",
      "http://localhost:3000/studio?x=1&y=2",
      "http://localhost:3000/a?b=1&c=2",
    ]);
    expect(extractLinks("https://en.example.test/wiki/Folio_(printing)")).toEqual([
      "https://en.example.test/wiki/Folio_(printing)",
    ]);
    expect(extractLinks("no links here")).toEqual([]);
  });
});
