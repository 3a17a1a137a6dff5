// The upload route end to end with the real UploadThing SDK in production-callback mode: the route
// presigns (after the middleware's checks), the file goes to the upload fake, the fake posts the
// signed hook back to the route, the route runs the spec check and the answer reaches the uploader.
import type { Server } from "node:http";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { assertTestDatabase } from "../helpers/env";
import { presignUpload, putUpload, startHookServer } from "../helpers/upload-route";
import type { TestPerson } from "../helpers/submissions";

assertTestDatabase(process.env.DATABASE_URL);

const session = vi.hoisted(() => ({
  user: null as null | { id: string; name: string; email: string },
}));
vi.mock("@/auth", () => ({
  auth: async () =>
    session.user
      ? { user: session.user, expires: new Date(Date.now() + 3600_000).toISOString() }
      : null,
}));

type Route = typeof import("@/app/api/uploadthing/route");
let route: Route;
let server: Server;
let helpers: typeof import("../helpers/submissions");
let dbModule: typeof import("@/db");
let bea: TestPerson, tomasz: TestPerson;
let openId: number, closedId: number;

beforeAll(async () => {
  // The fake must post its hook somewhere this process answers: a small server in front of the route.
  server = await startHookServer(() => (request) => route.POST(request as never));
  // Only now load the app: lib/env.ts reads the environment once.
  route = await import("@/app/api/uploadthing/route");
  helpers = await import("../helpers/submissions");
  dbModule = await import("@/db");
  [bea, tomasz] = await Promise.all([helpers.makePerson("bea"), helpers.makePerson("tomasz")]);
  openId = (
    await helpers.makeAnthologyWithCall([
      { person: bea, role: "contributor" },
      { person: tomasz, role: "contributor" },
    ])
  ).id;
  closedId = (
    await helpers.makeAnthologyWithCall([{ person: bea, role: "contributor" }], { closed: true })
  ).id;
});

afterAll(async () => {
  await new Promise((resolve) => server?.close(resolve));
  await dbModule?.pool.end();
});

const as = (person: TestPerson | null) => {
  session.user = person ? { id: person.id, name: person.name, email: person.email } : null;
};

type PutBody = {
  fileHash: string;
  serverData: {
    ok: boolean;
    verdict: string;
    versionId: number;
    versionNumber: number;
    current: boolean;
  };
};

/** Step 1, as the browser client does it: ask the route for a presigned URL. */
const presign = (
  input: { pieceId: number; pageIndex: number; expectedRevision: number },
  file: { name: string; size: number; type: string },
) => presignUpload((request) => route.POST(request as never), input, file);

/** Steps 2 and 3: send the bytes to the presigned URL and wait for the checked answer. */
const put = (url: string, bytes: Uint8Array, name: string, type: string) =>
  putUpload<PutBody>(url, bytes, name, type);

describe("the artworkPage upload route", () => {
  it("a good page goes through the SDK, the fake and the hook, and comes back checked", async () => {
    const pieceId = await helpers.makePiece(openId, bea.id, { title: "Through the wire" });
    const bytes = await helpers.greyPage(1725, 2625);
    as(bea);
    const presigned = await presign(
      { pieceId, pageIndex: 1, expectedRevision: 0 },
      { name: "wire.png", size: bytes.length, type: "image/png" },
    );
    expect(presigned.status).toBe(200);
    as(null); // the hook carries no session; the route must not need one
    const put1 = await put(presigned.body[0].url, bytes, "wire.png", "image/png");
    expect(put1.status).toBe(200);
    expect(put1.body.serverData).toMatchObject({
      ok: true,
      verdict: "pass",
      current: true,
      versionNumber: 1,
    });
    const { db, schema } = dbModule;
    const [v] = await db
      .select()
      .from(schema.fileVersions)
      .where(eq(schema.fileVersions.id, put1.body.serverData.versionId));
    expect(v).toMatchObject({
      storageKey: presigned.body[0].key,
      fileName: "wire.png",
      verdict: "pass",
      md5: put1.body.fileHash,
    });
  });

  it("text named .png and a plain text file are stored with a finding, not dropped", async () => {
    const text = new TextEncoder().encode("not a picture at all\n".repeat(10));
    for (const [name, type] of [
      ["notes.png", "image/png"],
      ["notes.txt", "text/plain"],
    ] as const) {
      const pieceId = await helpers.makePiece(openId, bea.id, { title: name });
      as(bea);
      const presigned = await presign(
        { pieceId, pageIndex: 1, expectedRevision: 0 },
        { name, size: text.length, type },
      );
      expect(presigned.status).toBe(200);
      const result = await put(presigned.body[0].url, text, name, type);
      expect(result.body.serverData).toMatchObject({ ok: true, verdict: "blocker" });
      const { db, schema } = dbModule;
      const [v] = await db
        .select()
        .from(schema.fileVersions)
        .where(eq(schema.fileVersions.id, result.body.serverData.versionId));
      expect((v?.report as { findings: { code: string }[] }).findings.map((f) => f.code)).toContain(
        "file-unrecognised",
      );
    }
  });

  it("refuses, before any byte is sent, someone else's piece, a closed call, a stale page, a signed-out caller and a file over the limit", async () => {
    const beas = await helpers.makePiece(openId, bea.id, { title: "Bea only" });
    const late = await helpers.makePiece(closedId, bea.id, { title: "Too late" });
    const file = { name: "p.png", size: 1000, type: "image/png" };
    as(tomasz);
    const other = await presign({ pieceId: beas, pageIndex: 1, expectedRevision: 0 }, file);
    expect(other.status).toBe(403);
    expect(other.body.message).toBe("You can only upload files to your own pieces.");
    as(bea);
    const closed = await presign({ pieceId: late, pageIndex: 1, expectedRevision: 0 }, file);
    expect(closed.status).toBe(403);
    expect(closed.body.message).toContain("The call has closed");
    const stale = await presign({ pieceId: beas, pageIndex: 1, expectedRevision: 5 }, file);
    expect(stale.status).toBe(403);
    expect(stale.body.message).toContain("was replaced in another window");
    const big = await presign(
      { pieceId: beas, pageIndex: 1, expectedRevision: 0 },
      { ...file, size: 600 * 1024 * 1024 },
    );
    expect(big.status).toBe(413);
    expect(big.body.message).toMatch(/is 600\.0 MB; a page file may be at most \d+ MB/);
    const bad = await presign({ pieceId: beas, pageIndex: 0, expectedRevision: 0 }, file);
    expect(bad.status).toBe(400);
    as(null);
    const anonymous = await presign({ pieceId: beas, pageIndex: 1, expectedRevision: 0 }, file);
    expect(anonymous.status).toBe(403);
    expect(anonymous.body.message).toBe("Sign in to upload files.");
  });
});
