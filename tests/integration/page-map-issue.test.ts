// What goes into this issue, through the page map's routes against the real test database and
// SMTP sink: leaving a piece out and bringing it back, the page-notice preview that sends nothing,
// the copies figure kept with the anthology, a contributor's pages on the map, and what the move
// to printing says is still open.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { assertTestDatabase, testEnv } from "../helpers/env";
import { uniqueEmail } from "../helpers/demo";
import { listMessages } from "../helpers/outbox";

const authState = vi.hoisted(() => ({
  session: null as null | { user: { id: string; name: string | null; email: string } },
}));
vi.mock("@/auth", () => ({ auth: async () => authState.session }));

const { db, pool, schema } = await import("@/db");
const { createAnthology } = await import("@/db/queries/anthologies");
const { placedPagesOf } = await import("@/db/queries/page-map");
const mapRoute = await import("@/app/api/anthologies/[slug]/map/route");
const copiesRoute = await import("@/app/api/anthologies/[slug]/map/copies/route");
const noticesRoute = await import("@/app/api/anthologies/[slug]/map/notices/route");
const stageRoute = await import("@/app/api/anthologies/[slug]/stage/route");

type Person = { id: string; name: string | null; email: string };
type Json = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any

assertTestDatabase();

let slug = "";
let anthologyId = 0;
const people: Record<"lead" | "finisher" | "artist" | "unnamed", Person> = {} as never;
const piece: Record<"moths" | "kelp" | "heron", number> = {} as never;

function as(person: Person | null) {
  authState.session = person ? { user: person } : null;
}
const ctx = () => ({ params: Promise.resolve({ slug }) });
const url = (path = "") => `${testEnv.appUrl}/api/anthologies/${slug}${path}`;
const json = (method: string, body: unknown) => ({
  method,
  headers: { "content-type": "application/json" },
  body: JSON.stringify(body),
});

async function getMap(query = ""): Promise<{ status: number; body: Json }> {
  const response = await mapRoute.GET(new Request(url(`/map${query}`)), ctx());
  return { status: response.status, body: (await response.json()) as Json };
}
async function change(body: Json): Promise<{ status: number; body: Json }> {
  const { body: map } = await getMap();
  const response = await mapRoute.POST(
    new Request(url("/map"), json("POST", { version: map.version, change: body })),
    ctx(),
  );
  return { status: response.status, body: (await response.json()) as Json };
}
async function anthologyRow() {
  const [row] = await db
    .select()
    .from(schema.anthologies)
    .where(eq(schema.anthologies.id, anthologyId));
  return row!;
}

async function addPiece(owner: Person, title: string, kind: "single" | "spread", verdict: string) {
  const [row] = await db
    .insert(schema.pieces)
    .values({
      anthologyId,
      contributorId: owner.id,
      title,
      kind,
      pageCount: kind === "spread" ? 2 : 1,
      inks: ["black"],
      creditLine: owner.name ?? "x",
      status: "accepted",
      verdict,
    })
    .$returningId();
  return row!.id;
}

beforeAll(async () => {
  for (const label of ["lead", "finisher", "artist", "unnamed"] as const) {
    const person = {
      id: crypto.randomUUID(),
      name: label === "unnamed" ? null : `Issue ${label}`,
      email: uniqueEmail(`issue-${label}`),
    };
    await db.insert(schema.users).values(person);
    people[label] = person;
  }
  const anthology = await createAnthology(
    people.lead.id,
    {
      title: "Issue Test Gazette",
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
      inks: ["black", "teal"],
      inksPerPass: 1,
      minPpi: 300,
    },
    `issue-test-${Date.now().toString(36)}`,
  );
  slug = anthology.slug;
  anthologyId = anthology.id;
  await db.insert(schema.memberships).values([
    { anthologyId, userId: people.finisher.id, role: "finisher" },
    { anthologyId, userId: people.artist.id, role: "contributor" },
    { anthologyId, userId: people.unnamed.id, role: "contributor" },
  ]);
  piece.moths = await addPiece(people.artist, "Moths", "single", "pass");
  piece.kelp = await addPiece(people.artist, "Kelp Forest", "spread", "blocker");
  piece.heron = await addPiece(people.unnamed, "Heron", "single", "missing");
});

afterAll(async () => {
  if (anthologyId)
    await db.delete(schema.anthologies).where(eq(schema.anthologies.id, anthologyId));
  for (const person of Object.values(people))
    await db.delete(schema.users).where(eq(schema.users.id, person.id));
  await pool.end();
});

describe("leaving a piece out of this issue", () => {
  it("takes it out of the tray and the rules, keeps it listed, records it, and brings it back", async () => {
    as(people.lead);
    const before = await getMap();
    const notPlaced = (m: Json) =>
      (m.check.messages as Json[])
        .filter((x) => x.code === "piece-not-placed")
        .flatMap((x) => x.pieceIds as number[]);
    expect(notPlaced(before.body)).toContain(piece.heron);

    const out = await change({ op: "leave-out", pieceId: piece.heron, leftOut: true });
    expect(out.status).toBe(200);
    expect(out.body).toMatchObject({ changed: true, version: before.body.version + 1 });
    expect(out.body.summary).toBe("Left “Heron” out of this issue.");
    expect(notPlaced(out.body)).not.toContain(piece.heron);
    expect((out.body.state.pieces as Json[]).find((p) => p.id === piece.heron)?.leftOut).toBe(true);
    expect((out.body.events as Json[])[0]).toMatchObject({
      action: "leave-out",
      summary: "Left “Heron” out of this issue.",
    });
    const [row] = await db
      .select({ leftOut: schema.pieces.leftOut })
      .from(schema.pieces)
      .where(eq(schema.pieces.id, piece.heron));
    expect(row?.leftOut).toBe(true);

    // Placing it is refused until it is brought back.
    const place = await change({ op: "place", pieceId: piece.heron, startPage: 2 });
    expect(place.status).toBe(422);

    const back = await change({ op: "leave-out", pieceId: piece.heron, leftOut: false });
    expect(back.status).toBe(200);
    expect(back.body.summary).toBe("Brought “Heron” back to the tray.");
    expect(notPlaced(back.body)).toContain(piece.heron);
  });

  it("refuses to leave out a placed piece until it is taken off the map, and the finisher may not", async () => {
    as(people.lead);
    expect((await change({ op: "place", pieceId: piece.moths, startPage: 3 })).status).toBe(200);
    const refused = await change({ op: "leave-out", pieceId: piece.moths, leftOut: true });
    expect(refused.status).toBe(422);
    expect(refused.body.error).toContain("take it off the map before leaving it out");
    as(people.finisher);
    expect((await change({ op: "leave-out", pieceId: piece.heron, leftOut: true })).status).toBe(
      403,
    );
  });
});

describe("the copies figure", () => {
  it("is kept with the anthology: the map uses it when ?copies is absent, and only editors change it", async () => {
    as(people.lead);
    expect((await getMap()).body.passes.copies).toBe(100);
    const saved = await copiesRoute.PUT(
      new Request(url("/map/copies"), json("PUT", { copies: 250 })),
      ctx(),
    );
    expect(saved.status).toBe(200);
    expect(await saved.json()).toEqual({ copies: 250 });
    expect((await anthologyRow()).plannedCopies).toBe(250);
    const reloaded = await getMap();
    expect(reloaded.body.passes.copies).toBe(250);
    expect(reloaded.body.anthology.plannedCopies).toBe(250);
    // A figure in the query still wins, for a what-if.
    expect((await getMap("?copies=40")).body.passes.copies).toBe(40);

    const bad = await copiesRoute.PUT(
      new Request(url("/map/copies"), json("PUT", { copies: 0 })),
      ctx(),
    );
    expect(bad.status).toBe(400);
    as(people.finisher);
    const forbidden = await copiesRoute.PUT(
      new Request(url("/map/copies"), json("PUT", { copies: 5 })),
      ctx(),
    );
    expect(forbidden.status).toBe(403);
    expect((await anthologyRow()).plannedCopies).toBe(250);
  });
});

describe("page notices, asked first", () => {
  it("the preview names who gets which pages, sends nothing, then the send follows it", async () => {
    as(people.lead);
    expect((await change({ op: "place", pieceId: piece.kelp, startPage: 4 })).status).toBe(200);
    expect((await change({ op: "place", pieceId: piece.heron, startPage: 7 })).status).toBe(200);

    const preview = await noticesRoute.GET(new Request(url("/map/notices")), ctx());
    expect(preview.status).toBe(200);
    const body = (await preview.json()) as Json;
    expect(body).toMatchObject({ toSend: 2, alreadySent: 0 });
    const byName = new Map((body.contributors as Json[]).map((c) => [c.contributorName, c]));
    expect(byName.get("Issue artist")).toMatchObject({
      alreadySent: false,
      hasAddress: true,
      pieces: [
        { title: "Moths", pages: [3] },
        { title: "Kelp Forest", pages: [4, 5] },
      ],
    });
    // The lead may see private data: an unnamed contributor reads as their address.
    expect(byName.get(people.unnamed.email)?.pieces).toEqual([{ title: "Heron", pages: [7] }]);
    expect(await listMessages({ to: people.artist.email })).toHaveLength(0);
    expect(await listMessages({ to: people.unnamed.email })).toHaveLength(0);

    const sent = await noticesRoute.POST(
      new Request(url("/map/notices"), { method: "POST" }),
      ctx(),
    );
    expect(await sent.json()).toMatchObject({ sent: 2, alreadySent: 0 });
    const after = (await (
      await noticesRoute.GET(new Request(url("/map/notices")), ctx())
    ).json()) as Json;
    expect(after).toMatchObject({ toSend: 0, alreadySent: 2 });
    expect((after.contributors as Json[]).every((c) => c.alreadySent === true)).toBe(true);
  });

  it("is for editors only and never shows an address to a role that may not see it", async () => {
    as(people.finisher);
    const forbidden = await noticesRoute.GET(new Request(url("/map/notices")), ctx());
    expect(forbidden.status).toBe(403);
    expect(JSON.stringify(await forbidden.json())).not.toContain("@");
  });
});

describe("a contributor's pages", () => {
  it("come from the map for an accepted placed piece, and not for one off the map", async () => {
    const anthology = await anthologyRow();
    expect(await placedPagesOf(anthology, piece.kelp)).toEqual([4, 5]);
    expect(await placedPagesOf(anthology, piece.moths)).toEqual([3]);
    await db
      .update(schema.pieces)
      .set({ status: "withdrawn" })
      .where(eq(schema.pieces.id, piece.moths));
    expect(await placedPagesOf(anthology, piece.moths)).toEqual([]);
    await db
      .update(schema.pieces)
      .set({ status: "accepted" })
      .where(eq(schema.pieces.id, piece.moths));
  });
});

describe("moving to printing", () => {
  it("moves, and answers with what is still open on the map", async () => {
    as(people.lead);
    // Left out: it is neither a piece to place nor a file to fix.
    await db.insert(schema.pieces).values({
      anthologyId,
      contributorId: people.artist.id,
      title: "Not this time",
      kind: "single",
      pageCount: 1,
      inks: ["black"],
      creditLine: "x",
      status: "accepted",
      verdict: "blocker",
      leftOut: true,
    });
    await db
      .update(schema.anthologies)
      .set({ stage: "laying-out" })
      .where(eq(schema.anthologies.id, anthologyId));
    const { body: map } = await getMap();
    const empty = (map.state.slots as Json[])
      .filter((s) => s.pieceId === null && s.reservation === null)
      .map((s) => s.page as number);
    expect(empty.length).toBeGreaterThan(0);
    const response = await stageRoute.POST(
      new Request(url("/stage"), json("POST", { to: "printing" })),
      ctx(),
    );
    expect(response.status).toBe(200);
    const body = (await response.json()) as Json;
    expect(body.stage).toBe("printing");
    const cautions = body.cautions as string[];
    expect(cautions).toHaveLength(2);
    expect(cautions[0]).toContain(`${empty.length} pages are still empty on the page map`);
    // Kelp Forest (won't print) and Heron (files missing); Moths passes.
    expect(cautions[1]).toContain("2 pieces have files that do not meet the print spec");
  });
});
