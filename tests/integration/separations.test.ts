// Separations (one greyscale master per ink) through the real upload route, as in
// submissions-upload-route.test.ts: presign with an ink, the bytes to the upload fake, its signed
// hook back to the route; then the piece's verdict over its masters and the re-check after a spec change.
import type { Server } from "node:http";
import { and, eq } from "drizzle-orm";
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
let openId: number;

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
    ink: string | null;
    pieceVerdict: string;
    revision: number;
  };
};

/** Step 1, as the browser client does it: ask the route for a presigned URL. */
const presign = (
  input: { pieceId: number; pageIndex: number; expectedRevision: number; ink?: string },
  file: { name: string; size: number; type: string },
) => presignUpload((request) => route.POST(request as never), input, file);

/** Steps 2 and 3: send the bytes to the presigned URL and wait for the checked answer. */
const put = (url: string, bytes: Uint8Array, name: string, type: string) =>
  putUpload<PutBody>(url, bytes, name, type);

/** Presign and send one page file, as the browser does; the checked answer. */
async function upload(
  input: { pieceId: number; pageIndex: number; expectedRevision: number; ink?: string },
  bytes: Uint8Array,
  name: string,
) {
  as(bea);
  const presigned = await presign(input, { name, size: bytes.length, type: "image/png" });
  expect(presigned.status, presigned.body.message).toBe(200);
  as(null);
  const sent = await put(presigned.body[0].url, bytes, name, "image/png");
  expect(sent.status).toBe(200);
  return sent.body.serverData;
}

async function pieceVerdict(pieceId: number) {
  const { db, schema } = dbModule;
  const [row] = await db
    .select({ verdict: schema.pieces.verdict })
    .from(schema.pieces)
    .where(eq(schema.pieces.id, pieceId));
  return row?.verdict;
}

async function separation(pieceId: number, ink: string) {
  const { db, schema } = dbModule;
  const [row] = await db
    .select({
      currentVersionId: schema.pageSeparations.currentVersionId,
      revision: schema.pageSeparations.revision,
    })
    .from(schema.pageSeparations)
    .innerJoin(schema.piecePages, eq(schema.piecePages.id, schema.pageSeparations.piecePageId))
    .where(and(eq(schema.piecePages.pieceId, pieceId), eq(schema.pageSeparations.ink, ink)));
  return row;
}

// Half letter with 1/8 in bleed at 300 ppi: 5.75 x 8.75 in = 1725 x 2625 px (pixels = inches x ppi).
const FULL = [1725, 2625] as const;

describe("separations through the upload route", () => {
  it("stores each master with its ink, and the piece's files stay missing until every ink has one", async () => {
    const pieceId = await helpers.makePiece(openId, bea.id, {
      title: "Two inks",
      inks: ["black", "teal"],
    });
    const black = await upload(
      { pieceId, pageIndex: 1, expectedRevision: 0, ink: "black" },
      await helpers.greyPage(...FULL),
      "black.png",
    );
    expect(black).toMatchObject({
      ok: true,
      ink: "black",
      verdict: "pass",
      current: true,
      revision: 1,
    });
    expect(black.pieceVerdict).toBe("missing");
    const { db, schema } = dbModule;
    const [stored] = await db
      .select()
      .from(schema.fileVersions)
      .where(eq(schema.fileVersions.id, black.versionId));
    expect(stored?.ink).toBe("black");
    expect((stored?.report as { ink?: string }).ink).toBe("black");
    expect(await separation(pieceId, "black")).toEqual({
      currentVersionId: black.versionId,
      revision: 1,
    });
    // The composite page is untouched: a separation is not the page's file.
    const [page] = await db
      .select()
      .from(schema.piecePages)
      .where(eq(schema.piecePages.pieceId, pieceId));
    expect(page).toMatchObject({ currentVersionId: null, revision: 0 });
    expect(await pieceVerdict(pieceId)).toBe("missing");

    const teal = await upload(
      { pieceId, pageIndex: 1, expectedRevision: 0, ink: "teal" },
      await helpers.greyPage(...FULL),
      "teal.png",
    );
    expect(teal).toMatchObject({ ok: true, ink: "teal", current: true, pieceVerdict: "pass" });
    expect(await pieceVerdict(pieceId)).toBe("pass");
    // The contributor's list counts the page as having its files, though it has no composite.
    const { listOwnPieces } = await import("@/db/queries/submissions");
    const own = (await listOwnPieces(openId, bea.id)).find((x) => x.id === pieceId);
    expect(own?.pagesWithFiles).toBe(1);
  });

  it("a master with colour in it is stored with a warning asking for a greyscale master for that ink", async () => {
    const pieceId = await helpers.makePiece(openId, bea.id, {
      title: "Colourful teal",
      inks: ["black", "teal"],
    });
    const teal = await upload(
      { pieceId, pageIndex: 1, expectedRevision: 0, ink: "teal" },
      await helpers.greyPage(...FULL, { colour: true }),
      "teal-rgb.png",
    );
    expect(teal).toMatchObject({ ok: true, verdict: "warning" });
    const { db, schema } = dbModule;
    const [stored] = await db
      .select()
      .from(schema.fileVersions)
      .where(eq(schema.fileVersions.id, teal.versionId));
    const finding = (
      stored?.report as { findings: { code: string; fix?: string }[] }
    ).findings.find((f) => f.code === "colour-in-separation");
    expect(finding?.fix).toContain("Send a greyscale master for teal");
  });

  it("refuses an ink the piece does not print in, an ink for a one-ink piece, and a stale master, before any byte is sent", async () => {
    const two = await helpers.makePiece(openId, bea.id, {
      title: "Refusals",
      inks: ["black", "teal"],
    });
    const one = await helpers.makePiece(openId, tomasz.id, { title: "One ink", inks: ["black"] });
    const file = { name: "p.png", size: 1000, type: "image/png" };
    as(bea);
    const gold = await presign(
      { pieceId: two, pageIndex: 1, expectedRevision: 0, ink: "gold" },
      file,
    );
    expect(gold.status).toBe(400);
    expect(gold.body.message).toBe(
      "This piece prints in black and teal; “gold” is not one of its inks.",
    );
    as(tomasz);
    const single = await presign(
      { pieceId: one, pageIndex: 1, expectedRevision: 0, ink: "black" },
      file,
    );
    expect(single.status).toBe(400);
    expect(single.body.message).toContain("prints in one ink, so each page takes a single file");
    // The teal master has no file yet, so its revision is 0; a screen that saw 2 is stale.
    as(bea);
    const stale = await presign(
      { pieceId: two, pageIndex: 1, expectedRevision: 2, ink: "teal" },
      file,
    );
    expect(stale.status).toBe(403);
    expect(stale.body.message).toContain(
      "The teal master of page 1 was replaced in another window",
    );
  });
});

describe("separations in the pipeline", () => {
  const stored = (key: string) => ({
    key,
    name: `${key}.png`,
    size: 1,
    type: "image/png",
    ufsUrl: "http://127.0.0.1:9/unused",
  });

  it("two tabs replacing the same master leave one current version", async () => {
    const { ingestUpload } = await import("@/server/submissions/ingest");
    const pieceId = await helpers.makePiece(openId, bea.id, {
      title: "Two tabs",
      inks: ["black", "teal"],
    });
    const bytes = await helpers.greyPage(...FULL);
    const first = await ingestUpload(
      {
        pieceId,
        pageIndex: 1,
        ink: "teal",
        expectedRevision: 0,
        uploadedBy: bea.id,
        file: stored(`tabs-0-${pieceId}`),
      },
      { bytes, notify: false },
    );
    expect(first.revision).toBe(1);
    const both = await Promise.all(
      [1, 2].map((n) =>
        ingestUpload(
          {
            pieceId,
            pageIndex: 1,
            ink: "teal",
            expectedRevision: 1,
            uploadedBy: bea.id,
            file: stored(`tabs-${n}-${pieceId}`),
          },
          { bytes, notify: false },
        ),
      ),
    );
    expect(both.filter((r) => r.current)).toHaveLength(1);
    expect(both.filter((r) => r.heldBack === "replaced")).toHaveLength(1);
    const winner = both.find((r) => r.current)!;
    expect(await separation(pieceId, "teal")).toEqual({
      currentVersionId: winner.versionId,
      revision: 2,
    });
    // The other ink's master is its own: still none.
    expect(await separation(pieceId, "black")).toBeUndefined();
  });

  it("a master that cannot be read never displaces a readable one", async () => {
    const { ingestUpload } = await import("@/server/submissions/ingest");
    const pieceId = await helpers.makePiece(openId, bea.id, {
      title: "Broken master",
      inks: ["black", "teal"],
    });
    const good = await ingestUpload(
      {
        pieceId,
        pageIndex: 1,
        ink: "black",
        expectedRevision: 0,
        uploadedBy: bea.id,
        file: stored(`good-${pieceId}`),
      },
      { bytes: await helpers.greyPage(...FULL), notify: false },
    );
    const broken = await ingestUpload(
      {
        pieceId,
        pageIndex: 1,
        ink: "black",
        expectedRevision: 1,
        uploadedBy: bea.id,
        file: stored(`broken-${pieceId}`),
      },
      { bytes: new TextEncoder().encode("not a picture"), notify: false },
    );
    expect(broken).toMatchObject({ current: false, heldBack: "unreadable", verdict: "blocker" });
    expect(await separation(pieceId, "black")).toEqual({
      currentVersionId: good.versionId,
      revision: 1,
    });
  });

  it("the re-check after a spec change checks every current master again, as that ink's", async () => {
    const other = await helpers.makeAnthologyWithCall([{ person: bea, role: "contributor" }]);
    const pieceId = await helpers.makePiece(other.id, bea.id, {
      title: "Rechecked",
      inks: ["black", "teal"],
    });
    const page = await helpers.greyPage(...FULL);
    await upload({ pieceId, pageIndex: 1, expectedRevision: 0, ink: "black" }, page, "b.png");
    await upload({ pieceId, pageIndex: 1, expectedRevision: 0, ink: "teal" }, page, "t.png");
    expect(await pieceVerdict(pieceId)).toBe("pass");
    const { db, schema } = dbModule;
    // 600 ppi asked of a 300 ppi page: both masters now fall short.
    await db
      .update(schema.anthologies)
      .set({ minPpi: 600 })
      .where(eq(schema.anthologies.id, other.id));
    const { recheckCurrentFiles } = await import("@/server/submissions/recheck");
    const summary = await recheckCurrentFiles(other.id);
    expect(summary.checked).toBe(2);
    expect(summary.notChecked).toBe(0);
    expect(summary.changed.map((c) => c.ink).sort()).toEqual(["black", "teal"]);
    const versions = await db
      .select({
        ink: schema.fileVersions.ink,
        verdict: schema.fileVersions.verdict,
        report: schema.fileVersions.report,
      })
      .from(schema.fileVersions)
      .innerJoin(schema.piecePages, eq(schema.piecePages.id, schema.fileVersions.piecePageId))
      .where(eq(schema.piecePages.pieceId, pieceId));
    for (const v of versions) {
      expect(v.verdict).not.toBe("pass");
      expect((v.report as { ink?: string }).ink).toBe(v.ink);
    }
    expect(await pieceVerdict(pieceId)).not.toBe("pass");
    expect(await pieceVerdict(pieceId)).not.toBe("missing");
  });
});
