// The upload route driven as the browser's SDK drives it, for integration tests: a small HTTP
// server in front of the route (the fake posts its signed hook there), the presign call and the
// PUT of the bytes to the presigned URL.
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";

type Post = (request: Request) => Promise<Response>;

/**
 * Starts a server on a free loopback port that hands every request to `post` (the route's POST,
 * looked up per request so it may be loaded later) and points UPLOADTHING_CALLBACK_URL at it.
 * Set before the app's modules load: lib/env.ts reads the environment once.
 */
export async function startHookServer(post: () => Post): Promise<Server> {
  const server = createServer(async (req, res) => {
    const chunks: Buffer[] = [];
    for await (const chunk of req) chunks.push(chunk as Buffer);
    const headers = new Headers();
    for (const [name, value] of Object.entries(req.headers)) {
      if (
        typeof value === "string" &&
        (name === "content-type" ||
          name.startsWith("uploadthing") ||
          name.startsWith("x-uploadthing"))
      )
        headers.set(name, value);
    }
    const request = new Request(`http://127.0.0.1${req.url}`, {
      method: req.method,
      headers,
      body: chunks.length ? Buffer.concat(chunks) : undefined,
    });
    const response = await post()(request);
    res.writeHead(response.status, {
      "content-type": response.headers.get("content-type") ?? "application/json",
    });
    res.end(Buffer.from(await response.arrayBuffer()));
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  process.env.UPLOADTHING_CALLBACK_URL = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/uploadthing`;
  return server;
}

/** Either the presigned files or, when refused, the SDK's error shape. */
export type PresignBody = { 0: { url: string; key: string }; message: string };

/** Step 1, as the browser client does it: ask the route for a presigned URL. */
export async function presignUpload(
  post: Post,
  input: Record<string, unknown>,
  file: { name: string; size: number; type: string },
) {
  const response = await post(
    new Request("http://127.0.0.1/api/uploadthing?actionType=upload&slug=artworkPage", {
      method: "POST",
      headers: {
        "content-type": "application/json",
        "x-uploadthing-package": "@uploadthing/react",
        "x-uploadthing-version": "7.7.4",
      },
      body: JSON.stringify({ input, files: [{ ...file, lastModified: Date.now() }] }),
    }),
  );
  return { status: response.status, body: (await response.json()) as PresignBody };
}

/** Steps 2 and 3: send the bytes to the presigned URL and wait for the checked answer. */
export async function putUpload<T>(url: string, bytes: Uint8Array, name: string, type: string) {
  const form = new FormData();
  form.append("file", new File([new Uint8Array(bytes)], name, { type }));
  const response = await fetch(url, {
    method: "PUT",
    body: form,
    headers: { Range: "bytes=0-", "x-uploadthing-version": "7.7.4" },
  });
  return { status: response.status, body: (await response.json()) as T };
}
