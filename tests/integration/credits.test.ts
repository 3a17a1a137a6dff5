// Credit approval end to end against the real test database and SMTP sink: the editors ask, the
// mail carries a signed link, the contributor approves through it (as it is, or edited), a change
// after approval asks again, and stale links (expired, already used, changed, forged) change
// nothing. Also the proof thumbnails: only public neighbours on the viewer's own spreads.
import { eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { assertTestDatabase, testEnv } from "../helpers/env";
import { uniqueEmail } from "../helpers/demo";
import { extractLinks, listMessages, waitForMessage } from "../helpers/outbox";

const authState = vi.hoisted(() => ({
  session: null as null | { user: { id: string; name: string | null; email: string } },
}));
vi.mock("@/auth", () => ({ auth: async () => authState.session }));

const { db, pool, schema } = await import("@/db");
const { createAnthology } = await import("@/db/queries/anthologies");
const { signCreditToken } = await import("@/lib/credits/token");
const { reservedTextPagesFor } = await import("@/server/credits");
const creditsRoute = await import("@/app/api/anthologies/[slug]/credits/route");
const creditLineRoute = await import("@/app/api/anthologies/[slug]/credits/[pieceId]/route");
const approveRoute = await import("@/app/api/credits/[token]/route");
const pieceRoute = await import("@/app/api/pieces/[id]/route");
const proofRoute = await import("@/app/api/pieces/[id]/proof/[page]/route");
const mapRoute = await import("@/app/api/anthologies/[slug]/map/route");

type Person = { id: string; name: string | null; email: string };
type Json = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any

assertTestDatabase();

let slug = "";
let anthologyId = 0;
const people: Record<"lead" | "finisher" | "wren" | "pell" | "juno", Person> = {} as never;
const piece: Record<"heron" | "moths" | "lantern" | "tide", number> = {} as never;

function as(person: Person | null) {
  authState.session = person ? { user: person } : null;
}
const json = (method: string, body: unknown) => ({
  method,
  headers: { "content-type": "application/json" },
  body: JSON.stringify(body),
});
const api = (path: string) => `${testEnv.appUrl}/api${path}`;
const slugCtx = () => ({ params: Promise.resolve({ slug }) });

async function answer(response: Response): Promise<{ status: number; body: Json }> {
  return { status: response.status, body: (await response.json()) as Json };
}
const overview = async () =>
  answer(await creditsRoute.GET(new Request(api(`/anthologies/${slug}/credits`)), slugCtx()));
const ask = async (body: Json) =>
  answer(
    await creditsRoute.POST(
      new Request(api(`/anthologies/${slug}/credits`), json("POST", body)),
      slugCtx(),
    ),
  );
const approve = async (token: string, creditLine: string) =>
  answer(
    await approveRoute.POST(new Request(api(`/credits/${token}`), json("POST", { creditLine })), {
      params: Promise.resolve({ token }),
    }),
  );
async function row(id: number) {
  const [r] = await db.select().from(schema.pieces).where(eq(schema.pieces.id, id));
  return r!;
}
/** The token from the newest credit mail to `to` with a subject matching `subject`. */
async function tokenFromMail(to: string, subject: RegExp): Promise<string> {
  const mail = await waitForMessage({ to, subject });
  const link = extractLinks(mail.text).find((l) => l.includes("/credits/"));
  expect(link, mail.text).toBeDefined();
  return decodeURIComponent(new URL(link!).pathname.split("/").pop()!);
}

async function addPiece(owner: Person, title: string, kind: "single" | "spread", credit: string) {
  const [inserted] = await db
    .insert(schema.pieces)
    .values({
      anthologyId,
      contributorId: owner.id,
      title,
      kind,
      pageCount: kind === "spread" ? 2 : 1,
      inks: ["black"],
      creditLine: credit,
      status: "accepted",
      verdict: "pass",
    })
    .$returningId();
  const id = inserted!.id;
  // Each page gets a current file with a (tiny, fake) preview, so thumbnails can be served.
  for (let index = 1; index <= (kind === "spread" ? 2 : 1); index++) {
    const [page] = await db
      .insert(schema.piecePages)
      .values({ pieceId: id, pageIndex: index, altText: `${title} page ${index}` })
      .$returningId();
    const [version] = await db
      .insert(schema.fileVersions)
      .values({
        piecePageId: page!.id,
        versionNumber: 1,
        storageKey: `credits-test-${id}-${index}`,
        fileName: `${title}-${index}.png`,
        mimeType: "image/png",
        sizeBytes: 10,
        md5: `${id}`.padStart(32, "0"),
        report: {},
        verdict: "pass",
        thumbnailWebp: Buffer.from(`preview of ${title} ${index}`),
        thumbnailWidthPx: 10,
        thumbnailHeightPx: 14,
        uploadedBy: owner.id,
      })
      .$returningId();
    await db
      .update(schema.piecePages)
      .set({ currentVersionId: version!.id })
      .where(eq(schema.piecePages.id, page!.id));
  }
  return id;
}

beforeAll(async () => {
  for (const label of ["lead", "finisher", "wren", "pell", "juno"] as const) {
    const person = {
      id: crypto.randomUUID(),
      name:
        label === "lead" ? "Credits Lead" : `${label[0]!.toUpperCase()}${label.slice(1)} Tester`,
      email: uniqueEmail(`credits-${label}`),
    };
    await db.insert(schema.users).values(person);
    people[label] = person;
  }
  const anthology = await createAnthology(
    people.lead.id,
    {
      title: "Credits Test Quarterly",
      pressName: "Fenwick Lane Press",
      trimPreset: "a6",
      trimWidthMm: 105,
      trimHeightMm: 148,
      bleedMm: 3,
      safeMarginMm: 5,
      binding: "saddle-stitch",
      pageCountTarget: 8,
      maxPages: 16,
      coverStock: "self",
      paperGsm: 80,
      paperCaliperMm: 0.1,
      printMethod: "duplicator",
      inks: ["black"],
      inksPerPass: 1,
      minPpi: 300,
    },
    `credits-test-${Date.now().toString(36)}`,
  );
  slug = anthology.slug;
  anthologyId = anthology.id;
  await db.insert(schema.memberships).values([
    { anthologyId, userId: people.finisher.id, role: "finisher" },
    { anthologyId, userId: people.wren.id, role: "contributor" },
    { anthologyId, userId: people.pell.id, role: "contributor" },
    { anthologyId, userId: people.juno.id, role: "contributor" },
  ]);
  piece.heron = await addPiece(people.wren, "Heron at the Sluice Gate", "spread", "Wren Halloway");
  piece.moths = await addPiece(people.pell, "Moth Census", "single", "Pell Ashdown");
  piece.lantern = await addPiece(people.juno, "Lantern Walk", "single", "Juno Marsh");
  piece.tide = await addPiece(people.pell, "Tide Clock", "single", "Pell Ashdown");
  // 8 pages read 1 | 2–3 | 4–5 | 6–7 | 8: Wren's spread on 4–5, Moths on 2 facing the credits on 3,
  // Lantern on 6 and Tide on 7 (the spread 6–7).
  const layout: Record<number, [number | null, number | null, "cover" | "credits" | null]> = {
    1: [null, null, "cover"],
    2: [piece.moths, 1, null],
    3: [null, null, "credits"],
    4: [piece.heron, 1, null],
    5: [piece.heron, 2, null],
    6: [piece.lantern, 1, null],
    7: [piece.tide, 1, null],
    8: [null, null, "cover"],
  };
  await db.insert(schema.pageSlots).values(
    Object.entries(layout).map(([page, [pieceId, index, reservation]]) => ({
      anthologyId,
      pageNumber: Number(page),
      pieceId,
      piecePageIndex: index,
      reservation,
    })),
  );
});

afterAll(async () => {
  if (anthologyId) {
    await db.delete(schema.emailLog).where(eq(schema.emailLog.anthologyId, anthologyId));
    await db.delete(schema.anthologies).where(eq(schema.anthologies.id, anthologyId));
  }
  const ids = Object.values(people).map((p) => p.id);
  await db.delete(schema.users).where(inArray(schema.users.id, ids));
  await pool.end();
});

describe("asking for approval", () => {
  it("is for leads and editors only", async () => {
    as(people.finisher);
    expect((await overview()).status).toBe(403);
    as(people.wren);
    expect((await ask({ scope: "outstanding" })).status).toBe(403);
    as(null);
    expect((await overview()).status).toBe(401);
  });

  it("lists every piece in the issue as not asked yet, with its pages, and prints nothing", async () => {
    as(people.lead);
    const { status, body } = await overview();
    expect(status).toBe(200);
    expect(body.counts).toEqual({ approved: 0, asked: 0, notAsked: 4, outstanding: 4 });
    expect(body.rows.find((r: Json) => r.pieceId === piece.heron)).toMatchObject({
      state: "not-asked",
      pages: [4, 5],
      creditLine: "Wren Halloway",
    });
    expect(body.preview.page).toEqual({ kind: "text", heading: "Credits", lines: [] });
    expect(body.reserved).toEqual({ credits: [3], colophon: [] });
    expect(body.colophon.lines).toContain("Published by Fenwick Lane Press");
  });

  it("mails each outstanding contributor a link, once per request, and records when", async () => {
    as(people.lead);
    const asked = await ask({ scope: "outstanding" });
    expect(asked.status).toBe(200);
    expect(asked.body).toMatchObject({ asked: 4, failed: 0, skipped: 0 });
    expect(asked.body.credits.counts).toMatchObject({ asked: 4, notAsked: 0, outstanding: 4 });
    const mail = await waitForMessage({ to: people.wren.email, subject: /Approve your credit/ });
    expect(mail.subject).toBe("Approve your credit in Credits Test Quarterly");
    expect(mail.text).toContain("Wren Halloway");
    expect(mail.text).toContain("“Heron at the Sluice Gate”");
    expect((await row(piece.heron)).creditRequestedAt).toBeInstanceOf(Date);
    // Pell has two pieces: two mails, one per piece.
    const pells = await listMessages({ to: people.pell.email });
    expect(pells.filter((m) => /Approve your credit/.test(m.subject))).toHaveLength(2);
    const logged = await db
      .select()
      .from(schema.emailLog)
      .where(eq(schema.emailLog.pieceId, piece.heron));
    expect(logged[0]).toMatchObject({ kind: "credit-request" });
    expect(logged[0]!.dedupeKey).toMatch(new RegExp(`^credit-request:${piece.heron}:\\d+$`));
  });
});

describe("approving through the link", () => {
  it("works signed out, approves the line as mailed, and cannot be used twice", async () => {
    as(null);
    const token = await tokenFromMail(people.wren.email, /Approve your credit/);
    const done = await approve(token, "Wren Halloway");
    expect(done.status).toBe(200);
    expect(done.body.creditLine).toBe("Wren Halloway");
    const stored = await row(piece.heron);
    expect(stored.creditApprovedAt).toBeInstanceOf(Date);
    expect(stored.creditRequestedAt).toBeNull();
    const again = await approve(token, "Someone Else");
    expect(again.status).toBe(409);
    expect(again.body.error).toContain("already approved");
    expect((await row(piece.heron)).creditLine).toBe("Wren Halloway");
  });

  it("takes an edited line, which is what then prints", async () => {
    const token = await tokenFromMail(people.juno.email, /Approve your credit/);
    const done = await approve(token, "  Juno Marsh & the Tuesday Lantern Club ");
    expect(done.status).toBe(200);
    const stored = await row(piece.lantern);
    expect(stored.creditLine).toBe("Juno Marsh & the Tuesday Lantern Club");
    expect(stored.creditApprovedAt).toBeInstanceOf(Date);
    as(people.lead);
    const { body } = await overview();
    expect(body.counts).toMatchObject({ approved: 2, outstanding: 2 });
    expect(body.preview.page.lines).toEqual([
      "pp. 4\u20135  Heron at the Sluice Gate \u2014 Wren Halloway",
      "p. 6  Lantern Walk \u2014 Juno Marsh & the Tuesday Lantern Club",
    ]);
    expect(body.preview.outstanding.map((o: Json) => o.title)).toEqual([
      "Moth Census",
      "Tide Clock",
    ]);
  });

  it("refuses a line that breaks the shared rules, changing nothing", async () => {
    const [tideToken] = await Promise.all([
      (async () => {
        const mails = await listMessages({ to: people.pell.email });
        const tide = mails.find((m) => m.text.includes("Tide Clock"))!;
        return decodeURIComponent(
          new URL(extractLinks(tide.text).find((l) => l.includes("/credits/"))!).pathname
            .split("/")
            .pop()!,
        );
      })(),
    ]);
    const bad = await approve(tideToken!, "Pell\nAshdown");
    expect(bad.status).toBe(400);
    expect(bad.body.fields.creditLine).toBeDefined();
    expect((await row(piece.tide)).creditApprovedAt).toBeNull();
  });

  it("says not-ours for a forged or cut token", async () => {
    const forged = signCreditToken(
      { pieceId: piece.moths, creditLine: "Pell Ashdown", requestedAt: new Date() },
      "not-the-app-secret-at-all-000000",
    );
    expect((await approve(forged, "Pell Ashdown")).status).toBe(404);
    expect((await approve("c1.1.2.3", "Pell Ashdown")).status).toBe(404);
    expect((await row(piece.moths)).creditApprovedAt).toBeNull();
  });

  it("refuses an expired link and leaves the request open", async () => {
    const longAgo = new Date(Date.now() - 31 * 86_400_000);
    await db
      .update(schema.pieces)
      .set({ creditRequestedAt: longAgo })
      .where(eq(schema.pieces.id, piece.moths));
    const token = signCreditToken(
      { pieceId: piece.moths, creditLine: "Pell Ashdown", requestedAt: longAgo },
      process.env.AUTH_SECRET!,
    );
    const refused = await approve(token, "Pell Ashdown");
    expect(refused.status).toBe(409);
    expect(refused.body.error).toContain("expired");
    const stored = await row(piece.moths);
    expect(stored.creditApprovedAt).toBeNull();
    expect(stored.creditRequestedAt?.getTime()).toBe(longAgo.getTime());
  });
});

describe("a change after approval", () => {
  it("by the contributor clears the approval and mails a new link; the old one says changed", async () => {
    const oldToken = signCreditToken(
      {
        pieceId: piece.heron,
        creditLine: "Wren Halloway",
        requestedAt: new Date(Date.now() - 60_000),
      },
      process.env.AUTH_SECRET!,
    );
    as(people.wren);
    const saved = await answer(
      await pieceRoute.PATCH(
        new Request(
          api(`/pieces/${piece.heron}`),
          json("PATCH", { action: "credit-line", creditLine: "W. Halloway" }),
        ),
        { params: Promise.resolve({ id: String(piece.heron) }) },
      ),
    );
    expect(saved.status).toBe(200);
    expect(saved.body).toEqual({ creditLine: "W. Halloway", changed: true, asked: true });
    const stored = await row(piece.heron);
    expect(stored.creditApprovedAt).toBeNull();
    expect(stored.creditRequestedAt).toBeInstanceOf(Date);
    const token = await tokenFromMail(people.wren.email, /Approve your changed credit/);
    as(null);
    const stale = await approve(oldToken, "Wren Halloway");
    expect(stale.status).toBe(409);
    expect(stale.body.error).toContain("changed");
    expect((await approve(token, "W. Halloway")).status).toBe(200);
  });

  it("by an editor does the same, and another contributor may not change it", async () => {
    as(people.pell);
    const refused = await pieceRoute.PATCH(
      new Request(
        api(`/pieces/${piece.lantern}`),
        json("PATCH", { action: "credit-line", creditLine: "Not Juno" }),
      ),
      { params: Promise.resolve({ id: String(piece.lantern) }) },
    );
    expect(refused.status).toBe(403);
    as(people.lead);
    const saved = await answer(
      await creditLineRoute.PATCH(
        new Request(
          api(`/anthologies/${slug}/credits/${piece.lantern}`),
          json("PATCH", { creditLine: "Juno Marsh" }),
        ),
        { params: Promise.resolve({ slug, pieceId: String(piece.lantern) }) },
      ),
    );
    expect(saved.body).toEqual({ creditLine: "Juno Marsh", changed: true, asked: true });
    expect((await row(piece.lantern)).creditApprovedAt).toBeNull();
    await tokenFromMail(people.juno.email, /Approve your changed credit/);
  });
});

describe("the text pages for the print job", () => {
  it("puts approved lines only on the reserved credits page, and says the colophon has no page", async () => {
    const [anthology] = await db
      .select()
      .from(schema.anthologies)
      .where(eq(schema.anthologies.id, anthologyId));
    const out = await reservedTextPagesFor(anthology!, { copies: 60, year: 2026 });
    expect(out.pages).toEqual([
      {
        page: 3,
        content: {
          kind: "text",
          heading: "Credits",
          lines: ["pp. 4\u20135  Heron at the Sluice Gate \u2014 W. Halloway"],
        },
      },
    ]);
    expect(out.unplaced).toEqual(["colophon"]);
    expect(out.outstanding).toBe(3);
  });
});

describe("proof thumbnails", () => {
  const thumb = async (viewer: Person | null, own: number, page: number) => {
    as(viewer);
    return proofRoute.GET(new Request(api(`/pieces/${own}/proof/${page}`)), {
      params: Promise.resolve({ id: String(own), page: String(page) }),
    });
  };

  it("serves a public neighbour on the viewer's own spread", async () => {
    // Heron (Wren, 4–5) is approved again above; Lantern (6) faces Tide (7), Pell's.
    await db
      .update(schema.pieces)
      .set({ creditApprovedAt: new Date() })
      .where(eq(schema.pieces.id, piece.lantern));
    const ok = await thumb(people.pell, piece.tide, 6);
    expect(ok.status).toBe(200);
    expect(ok.headers.get("content-type")).toBe("image/webp");
    expect(Buffer.from(await ok.arrayBuffer()).toString()).toBe("preview of Lantern Walk 1");
    // Their own page on the spread is served too.
    expect((await thumb(people.pell, piece.tide, 7)).status).toBe(200);
  });

  it("refuses a neighbour that is not public, a page on another spread, and other people's pieces", async () => {
    await db
      .update(schema.pieces)
      .set({ creditApprovedAt: null })
      .where(eq(schema.pieces.id, piece.lantern));
    expect((await thumb(people.pell, piece.tide, 6)).status).toBe(403);
    // Heron is public but on 4–5, not on a spread with Tide.
    expect((await row(piece.heron)).creditApprovedAt).toBeInstanceOf(Date);
    expect((await thumb(people.pell, piece.tide, 4)).status).toBe(403);
    // Juno may not use Pell's piece as the key.
    expect((await thumb(people.juno, piece.tide, 7)).status).toBe(404);
    // A finisher has no piece of their own on the map.
    expect((await thumb(people.finisher, piece.tide, 6)).status).toBe(404);
    expect((await thumb(null, piece.tide, 6)).status).toBe(401);
    // A reserved page holds no piece.
    expect((await thumb(people.pell, piece.moths, 3)).status).toBe(404);
  });
});

describe("artwork on the page map", () => {
  const cards = async (viewer: Person) => {
    as(viewer);
    const { body } = await answer(
      await mapRoute.GET(new Request(api(`/anthologies/${slug}/map`)), slugCtx()),
    );
    return body.cards as Json[];
  };

  it("gives editors each page's preview and description, and finishers none", async () => {
    const heron = (await cards(people.lead)).find((c) => c.id === piece.heron)!;
    expect(heron.art).toHaveLength(2);
    expect(heron.art[1]).toMatchObject({
      pageIndex: 2,
      altText: "Heron at the Sluice Gate page 2",
      thumbnailUrl: expect.stringMatching(/^\/api\/file-versions\/\d+\/thumbnail$/),
    });
    for (const card of await cards(people.finisher)) expect(card.art).toBeUndefined();
  });
});
