// The submission route handlers, called directly with a stubbed session, against the real MariaDB:
// who may create, list, read, withdraw and see thumbnails, and what bad input gets back.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool, schema } from "@/db";
import { ingestUpload } from "@/server/submissions/ingest";
import { assertTestDatabase } from "../helpers/env";
import {
  greyPage,
  makeAnthologyWithCall,
  makePerson,
  makePiece,
  type TestPerson,
} from "../helpers/submissions";

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

const piecesRoute = await import("@/app/api/anthologies/[slug]/pieces/route");
const pieceRoute = await import("@/app/api/pieces/[id]/route");
const thumbnailRoute = await import("@/app/api/file-versions/[id]/thumbnail/route");

let lead: TestPerson,
  editor: TestPerson,
  finisher: TestPerson,
  bea: TestPerson,
  tomasz: TestPerson,
  newcomer: TestPerson,
  outsider: TestPerson;
let slug: string;
let anthologyId: number;
let closedSlug: string;

const as = (person: TestPerson | null) => {
  session.user = person ? { id: person.id, name: person.name, email: person.email } : null;
};

const slugCtx = (s: string) => ({ params: Promise.resolve({ slug: s }) });
const idCtx = (id: number | string) => ({ params: Promise.resolve({ id: String(id) }) });
const post = (body: unknown) =>
  new Request("http://localhost/api", {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: typeof body === "string" ? body : JSON.stringify(body),
  });
const patch = (body: unknown) =>
  new Request("http://localhost/api", {
    method: "PATCH",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(body),
  });
const get = () => new Request("http://localhost/api");

const goodPiece = {
  title: "Silt",
  kind: "single",
  pageCount: 1,
  inks: ["black"],
  creditLine: "Drawn by a tester",
  statement: "Mud, mostly.",
  altTexts: ["Brown mud with bird footprints."],
};

beforeAll(async () => {
  [lead, editor, finisher, bea, tomasz, newcomer, outsider] = await Promise.all([
    makePerson("lead"),
    makePerson("editor"),
    makePerson("finisher"),
    makePerson("bea"),
    makePerson("tomasz"),
    makePerson("newcomer"),
    makePerson("outsider"),
  ]);
  const a = await makeAnthologyWithCall([
    { person: lead, role: "lead" },
    { person: editor, role: "editor" },
    { person: finisher, role: "finisher" },
    { person: bea, role: "contributor" },
    { person: tomasz, role: "contributor" },
  ]);
  slug = a.slug;
  anthologyId = a.id;
  closedSlug = (await makeAnthologyWithCall([{ person: lead, role: "lead" }], { closed: true }))
    .slug;
});

afterAll(async () => {
  await pool.end();
});

type CreateBody = {
  piece: {
    id: number;
    title: string;
    kind: string;
    pageCount: number;
    inks: string[];
    status: string;
    verdict: string;
  };
  url: string;
  error: string;
  fields: Record<string, string[]>;
};

type DetailBody = {
  uploadsOpen: boolean;
  pages: {
    versions: {
      id: number;
      versionNumber: number;
      verdict: string;
      hasThumbnail: boolean;
      report: { verdict: string };
    }[];
  }[];
};

async function create(person: TestPerson | null, body: unknown = goodPiece, at = slug) {
  as(person);
  const response = await piecesRoute.POST(post(body), slugCtx(at));
  return { status: response.status, body: (await response.json()) as CreateBody };
}

describe("POST /api/anthologies/[slug]/pieces", () => {
  it("needs a session", async () => {
    expect((await create(null)).status).toBe(401);
  });

  it("a signed-in person who is not a member creates a piece and becomes a contributor", async () => {
    const { status, body } = await create(newcomer);
    expect(status).toBe(201);
    expect(body.piece).toMatchObject({
      title: "Silt",
      kind: "single",
      pageCount: 1,
      inks: ["black"],
      status: "awaiting-review",
      verdict: "missing",
    });
    expect(body.url).toBe(`/studio/${slug}/my-pieces/${body.piece.id}`);
    const [member] = await db
      .select()
      .from(schema.memberships)
      .where(
        and(
          eq(schema.memberships.anthologyId, anthologyId),
          eq(schema.memberships.userId, newcomer.id),
        ),
      );
    expect(member?.role).toBe("contributor");
    const pages = await db
      .select()
      .from(schema.piecePages)
      .where(eq(schema.piecePages.pieceId, body.piece.id));
    expect(pages.map((p) => [p.pageIndex, p.altText])).toEqual([
      [1, "Brown mud with bird footprints."],
    ]);
    const events = await db
      .select()
      .from(schema.pieceEvents)
      .where(eq(schema.pieceEvents.pieceId, body.piece.id));
    expect(events.map((e) => e.toStatus)).toEqual(["awaiting-review"]);
  });

  it("checks the piece against the call: kind, page count per kind, inks", async () => {
    const spread = await create(bea, { ...goodPiece, kind: "spread", pageCount: 3 });
    expect(spread.status).toBe(400);
    expect(spread.body.fields.pageCount?.[0]).toBe("This kind of piece has 2 pages");
    const run = await create(bea, { ...goodPiece, kind: "run", pageCount: 5 });
    expect(run.body.fields.pageCount?.[0]).toBe("A run has 2 to 4 pages in this call");
    const ink = await create(bea, { ...goodPiece, inks: ["gold"] });
    expect(ink.status).toBe(400);
    expect(ink.body.fields.inks?.[0]).toContain("gold is not one of them");
    const none = await create(bea, { ...goodPiece, inks: [] });
    expect(none.body.fields.inks?.[0]).toBe("Tick the inks your piece uses");
    const blank = await create(bea, { ...goodPiece, title: "  ", creditLine: "" });
    expect(Object.keys(blank.body.fields).sort()).toEqual(["creditLine", "title"]);
    expect((await create(bea, "{not json")).status).toBe(400);
  });

  it("refuses editors, leads and finishers of the anthology with a clear message", async () => {
    for (const person of [lead, editor]) {
      const { status, body } = await create(person);
      expect(status).toBe(403);
      expect(body.error).toContain("You edit this anthology");
    }
    const f = await create(finisher);
    expect(f.status).toBe(403);
    expect(f.body.error).toContain("finisher");
  });

  it("refuses a piece past the per-person limit, and a withdrawn piece frees a place", async () => {
    const first = await create(tomasz, { ...goodPiece, title: "One" });
    const second = await create(tomasz, {
      ...goodPiece,
      title: "Two",
      kind: "spread",
      pageCount: 2,
      inks: ["black", "TEAL"],
    });
    expect([first.status, second.status]).toEqual([201, 201]);
    expect(second.body.piece.inks).toEqual(["black", "teal"]);
    const third = await create(tomasz, { ...goodPiece, title: "Three" });
    expect(third.status).toBe(409);
    expect(third.body.error).toBe(
      "This call takes 2 pieces per person and you already have 2. Withdraw one to send another.",
    );
    as(tomasz);
    expect(
      (await pieceRoute.PATCH(patch({ action: "withdraw" }), idCtx(first.body.piece.id))).status,
    ).toBe(200);
    expect((await create(tomasz, { ...goodPiece, title: "Three" })).status).toBe(201);
  });

  it("refuses new pieces once the call has closed, and 404s without a call", async () => {
    const closed = await create(bea, goodPiece, closedSlug);
    expect(closed.status).toBe(409);
    expect(closed.body.error).toMatch(/^The call closed on .+; it no longer takes new pieces\.$/);
    expect((await create(bea, goodPiece, "no-such-anthology")).status).toBe(404);
  });
});

describe("reading pieces", () => {
  let beaPiece: number;
  let tomaszPiece: number;
  let beaVersion: number;

  beforeAll(async () => {
    beaPiece = await makePiece(anthologyId, bea.id, { title: "Bea's heron" });
    tomaszPiece = await makePiece(anthologyId, tomasz.id, { title: "Tomasz's crab" });
    const result = await ingestUpload(
      {
        pieceId: beaPiece,
        pageIndex: 1,
        expectedRevision: 0,
        uploadedBy: bea.id,
        file: {
          key: `k-${beaPiece}`,
          name: "heron.png",
          size: 0,
          type: "image/png",
          ufsUrl: "unused",
        },
      },
      { bytes: await greyPage(1725, 2625), notify: false },
    );
    beaVersion = result.versionId;
  });

  it("GET pieces lists only the caller's own; editors and finishers have no 'own pieces' here", async () => {
    as(bea);
    const mine = (await (await piecesRoute.GET(get(), slugCtx(slug))).json()) as {
      pieces: { id: number; title: string }[];
    };
    expect(mine.pieces.map((p) => p.id)).toContain(beaPiece);
    expect(mine.pieces.map((p) => p.id)).not.toContain(tomaszPiece);
    expect(mine.pieces.find((p) => p.id === beaPiece)).toMatchObject({
      pagesWithFiles: 1,
      firstVersionId: beaVersion,
      verdict: "pass",
    });
    for (const person of [editor, finisher, outsider]) {
      as(person);
      expect((await piecesRoute.GET(get(), slugCtx(slug))).status).toBe(403);
    }
    as(null);
    expect((await piecesRoute.GET(get(), slugCtx(slug))).status).toBe(401);
  });

  it("GET a piece: its contributor and the editors yes; another contributor and the finisher no; outsiders 404", async () => {
    const status = async (person: TestPerson | null, id: number | string = beaPiece) => {
      as(person);
      return (await pieceRoute.GET(get(), idCtx(id))).status;
    };
    expect(await status(bea)).toBe(200);
    expect(await status(lead)).toBe(200);
    expect(await status(editor)).toBe(200);
    expect(await status(tomasz)).toBe(403);
    expect(await status(finisher)).toBe(403);
    expect(await status(outsider)).toBe(404);
    expect(await status(null)).toBe(401);
    expect(await status(bea, "not-a-number")).toBe(404);
    as(bea);
    const detail = (await (await pieceRoute.GET(get(), idCtx(beaPiece))).json()) as DetailBody;
    expect(detail.uploadsOpen).toBe(true);
    expect(detail.pages[0]!.versions[0]!).toMatchObject({
      id: beaVersion,
      versionNumber: 1,
      verdict: "pass",
      hasThumbnail: true,
    });
    expect(detail.pages[0]!.versions[0]!.report.verdict).toBe("pass");
  });

  it("thumbnails: the contributor and editors see them, another contributor and the finisher do not", async () => {
    const status = async (person: TestPerson | null) => {
      as(person);
      return (await thumbnailRoute.GET(get(), idCtx(beaVersion))).status;
    };
    as(bea);
    const ok = await thumbnailRoute.GET(get(), idCtx(beaVersion));
    expect(ok.status).toBe(200);
    expect(ok.headers.get("content-type")).toBe("image/webp");
    expect(ok.headers.get("cache-control")).toContain("private");
    expect((await ok.arrayBuffer()).byteLength).toBeGreaterThan(0);
    expect(await status(editor)).toBe(200);
    expect(await status(lead)).toBe(200);
    expect(await status(tomasz)).toBe(403);
    expect(await status(finisher)).toBe(403);
    expect(await status(outsider)).toBe(404);
    expect(await status(null)).toBe(401);
  });
});

describe("PATCH /api/pieces/[id]", () => {
  it("only the contributor withdraws, once; the move is logged", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, { title: "To withdraw" });
    as(editor);
    expect((await pieceRoute.PATCH(patch({ action: "withdraw" }), idCtx(pieceId))).status).toBe(
      403,
    );
    as(tomasz);
    expect((await pieceRoute.PATCH(patch({ action: "withdraw" }), idCtx(pieceId))).status).toBe(
      403,
    );
    as(bea);
    const ok = await pieceRoute.PATCH(
      patch({ action: "withdraw", reason: "Sent it elsewhere" }),
      idCtx(pieceId),
    );
    expect(await ok.json()).toEqual({ status: "withdrawn" });
    const again = await pieceRoute.PATCH(patch({ action: "withdraw" }), idCtx(pieceId));
    expect(again.status).toBe(409);
    const events = await db
      .select()
      .from(schema.pieceEvents)
      .where(eq(schema.pieceEvents.pieceId, pieceId));
    expect(events.map((e) => [e.fromStatus, e.toStatus, e.message])).toEqual([
      ["awaiting-review", "withdrawn", "Sent it elsewhere"],
    ]);
  });

  it("a decided piece cannot be withdrawn; bad actions are 400", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, { title: "Declined", status: "declined" });
    as(bea);
    const refused = await pieceRoute.PATCH(patch({ action: "withdraw" }), idCtx(pieceId));
    expect(refused.status).toBe(409);
    expect(((await refused.json()) as { error: string }).error).toContain(
      "can no longer be withdrawn",
    );
    expect((await pieceRoute.PATCH(patch({ action: "delete" }), idCtx(pieceId))).status).toBe(400);
  });

  it("use-version switches the page's file, guarded by the revision", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, { title: "Choices" });
    const file = (key: string) => ({
      key,
      name: `${key}.png`,
      size: 0,
      type: "image/png",
      ufsUrl: "unused",
    });
    const v1 = await ingestUpload(
      {
        pieceId,
        pageIndex: 1,
        expectedRevision: 0,
        uploadedBy: bea.id,
        file: file(`c1-${pieceId}`),
      },
      { bytes: await greyPage(1650, 2550), notify: false },
    );
    await ingestUpload(
      {
        pieceId,
        pageIndex: 1,
        expectedRevision: 1,
        uploadedBy: bea.id,
        file: file(`c2-${pieceId}`),
      },
      { bytes: await greyPage(1725, 2625), notify: false },
    );
    as(bea);
    const stale = await pieceRoute.PATCH(
      patch({ action: "use-version", pageIndex: 1, versionId: v1.versionId, expectedRevision: 1 }),
      idCtx(pieceId),
    );
    expect(stale.status).toBe(409);
    const ok = await pieceRoute.PATCH(
      patch({ action: "use-version", pageIndex: 1, versionId: v1.versionId, expectedRevision: 2 }),
      idCtx(pieceId),
    );
    expect(await ok.json()).toEqual({ revision: 3, verdict: "blocker" });
    const [page] = await db
      .select()
      .from(schema.piecePages)
      .where(eq(schema.piecePages.pieceId, pieceId));
    expect(page?.currentVersionId).toBe(v1.versionId);
  });

  it("alt-text sets one page's description", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, { title: "Described" });
    as(bea);
    expect(
      (
        await pieceRoute.PATCH(
          patch({ action: "alt-text", pageIndex: 1, altText: "Two gulls on a post." }),
          idCtx(pieceId),
        )
      ).status,
    ).toBe(200);
    expect(
      (
        await pieceRoute.PATCH(
          patch({ action: "alt-text", pageIndex: 4, altText: "Nothing" }),
          idCtx(pieceId),
        )
      ).status,
    ).toBe(404);
    const [page] = await db
      .select()
      .from(schema.piecePages)
      .where(eq(schema.piecePages.pieceId, pieceId));
    expect(page?.altText).toBe("Two gulls on a post.");
  });
});
