// The page map through its route handlers, against the real test database and SMTP sink:
// who may look and change, the version guard under concurrent changes, each kind of change,
// proposals that save nothing until accepted, and page notices sent once.
import { and, eq, like, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { assertTestDatabase, testEnv } from "../helpers/env";
import { uniqueEmail } from "../helpers/demo";
import { waitForMessage, listMessages } from "../helpers/outbox";

const authState = vi.hoisted(() => ({
  session: null as null | { user: { id: string; name: string; email: string } },
}));
vi.mock("@/auth", () => ({ auth: async () => authState.session }));

const { db, pool, schema } = await import("@/db");
const { createAnthology } = await import("@/db/queries/anthologies");
const mapRoute = await import("@/app/api/anthologies/[slug]/map/route");
const proposalRoute = await import("@/app/api/anthologies/[slug]/map/proposal/route");
const noticesRoute = await import("@/app/api/anthologies/[slug]/map/notices/route");

type Person = { id: string; name: string; email: string };
type Json = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any

assertTestDatabase();

let slug = "";
let anthologyId = 0;
const people: Record<
  "lead" | "finisher" | "contributor" | "outsider" | "artistA" | "artistB",
  Person
> = {} as never;
const piece: Record<"moths" | "kelp" | "heron" | "dunes" | "gulls", number> = {} as never;

async function makePerson(label: string): Promise<Person> {
  const person = {
    id: crypto.randomUUID(),
    name: `Map ${label}`,
    email: uniqueEmail(`map-${label}`),
  };
  await db.insert(schema.users).values(person);
  return person;
}

function as(person: Person | null) {
  authState.session = person ? { user: person } : null;
}

const ctx = () => ({ params: Promise.resolve({ slug }) });
const url = (path = "") => `${testEnv.appUrl}/api/anthologies/${slug}/map${path}`;

async function getMap(): Promise<{ status: number; body: Json }> {
  const response = await mapRoute.GET(new Request(url()), ctx());
  return { status: response.status, body: (await response.json()) as Json };
}

async function change(version: number, body: Json): Promise<{ status: number; body: Json }> {
  const response = await mapRoute.POST(
    new Request(url(), {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ version, change: body }),
    }),
    ctx(),
  );
  return { status: response.status, body: (await response.json()) as Json };
}

async function slotRows() {
  return db
    .select({
      page: schema.pageSlots.pageNumber,
      pieceId: schema.pageSlots.pieceId,
      index: schema.pageSlots.piecePageIndex,
      reservation: schema.pageSlots.reservation,
    })
    .from(schema.pageSlots)
    .where(eq(schema.pageSlots.anthologyId, anthologyId))
    .orderBy(schema.pageSlots.pageNumber);
}

async function storedVersion(): Promise<number> {
  const [row] = await db
    .select({ v: schema.anthologies.mapVersion })
    .from(schema.anthologies)
    .where(eq(schema.anthologies.id, anthologyId));
  return row!.v;
}

async function addPiece(
  owner: Person,
  title: string,
  kind: "single" | "spread" | "run",
  pageCount: number,
  inks: string[],
) {
  const [row] = await db
    .insert(schema.pieces)
    .values({
      anthologyId,
      contributorId: owner.id,
      title,
      kind,
      pageCount,
      inks,
      creditLine: owner.name,
      status: "accepted",
    })
    .$returningId();
  return row!.id;
}

beforeAll(async () => {
  for (const label of [
    "lead",
    "finisher",
    "contributor",
    "outsider",
    "artistA",
    "artistB",
  ] as const)
    people[label] = await makePerson(label);
  const anthology = await createAnthology(
    people.lead.id,
    {
      title: "Map Test Quarterly",
      trimPreset: "a6",
      trimWidthMm: 105,
      trimHeightMm: 148,
      bleedMm: 3,
      safeMarginMm: 5,
      binding: "saddle-stitch",
      pageCountTarget: 7,
      maxPages: 16,
      coverStock: "self",
      paperGsm: 80,
      paperCaliperMm: 0.1,
      printMethod: "duplicator",
      inks: ["black", "teal"],
      inksPerPass: 1,
      minPpi: 300,
    },
    `map-test-${Date.now().toString(36)}`,
  );
  slug = anthology.slug;
  anthologyId = anthology.id;
  await db.insert(schema.memberships).values([
    { anthologyId, userId: people.finisher.id, role: "finisher" },
    { anthologyId, userId: people.contributor.id, role: "contributor" },
    { anthologyId, userId: people.artistA.id, role: "contributor" },
    { anthologyId, userId: people.artistB.id, role: "contributor" },
  ]);
  piece.moths = await addPiece(people.artistA, "Moths at the Porch Light", "single", 1, ["black"]);
  piece.kelp = await addPiece(people.artistB, "Kelp Forest", "spread", 2, ["teal"]);
  piece.heron = await addPiece(people.artistA, "Heron", "single", 1, ["teal"]);
  piece.dunes = await addPiece(people.artistB, "Dunes", "single", 1, ["black"]);
  piece.gulls = await addPiece(people.artistB, "Gulls", "single", 1, ["black", "teal"]);
  // Not accepted: never offered to the map.
  await db.insert(schema.pieces).values({
    anthologyId,
    contributorId: people.contributor.id,
    title: "Still waiting for a read",
    kind: "single",
    pageCount: 1,
    inks: ["black"],
    creditLine: "x",
    status: "awaiting-review",
  });
});

afterAll(async () => {
  // The anthology takes its slots, history, pieces and memberships with it.
  if (anthologyId)
    await db.delete(schema.anthologies).where(eq(schema.anthologies.id, anthologyId));
  for (const person of Object.values(people))
    await db.delete(schema.users).where(eq(schema.users.id, person.id));
  await pool.end();
});

describe("who may see and change the page map", () => {
  it("answers 401 without a session", async () => {
    as(null);
    expect((await getMap()).status).toBe(401);
    expect((await change(0, { op: "lock", page: 1, locked: true })).status).toBe(401);
  });

  it("refuses contributors and outsiders with 403", async () => {
    for (const person of [people.contributor, people.outsider]) {
      as(person);
      expect((await getMap()).status).toBe(403);
      expect((await change(0, { op: "lock", page: 1, locked: true })).status).toBe(403);
    }
  });

  it("lets the finisher look but not change", async () => {
    as(people.finisher);
    const seen = await getMap();
    expect(seen.status).toBe(200);
    expect(seen.body.canEdit).toBe(false);
    const refused = await change(seen.body.version, { op: "lock", page: 1, locked: true });
    expect(refused.status).toBe(403);
    expect(await storedVersion()).toBe(0);
  });
});

describe("the map", () => {
  it("is created on first opening from the page count target, padded to whole sheets, covers kept", async () => {
    as(people.lead);
    const { status, body } = await getMap();
    expect(status).toBe(200);
    expect(body.canEdit).toBe(true);
    expect(body.version).toBe(0);
    expect(body.state.pageCount).toBe(8);
    const rows = await slotRows();
    expect(rows.map((r) => r.page)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    expect(rows.filter((r) => r.reservation === "cover").map((r) => r.page)).toEqual([1, 8]);
    // Only accepted pieces reach the map; every one is waiting, so the check says so.
    expect((body.state.pieces as Json[]).map((p) => p.id).sort()).toEqual(
      Object.values(piece).sort(),
    );
    expect((body.check.errors as Json[]).filter((m) => m.code === "piece-not-placed")).toHaveLength(
      5,
    );
    expect(body.passes.passesPerCopy).toBe(0);
    expect(body.creepMm).toHaveLength(2);
  });

  it("places, refuses a spread on a right-hand page, moves and removes, recording each change", async () => {
    as(people.lead);
    const placed = await change(0, { op: "place", pieceId: piece.moths, startPage: 2 });
    expect(placed.status).toBe(200);
    expect(placed.body.version).toBe(1);
    expect(placed.body.summary).toContain("Moths at the Porch Light");
    expect((await slotRows()).find((r) => r.page === 2)?.pieceId).toBe(piece.moths);

    const oddSpread = await change(1, { op: "place", pieceId: piece.kelp, startPage: 3 });
    expect(oddSpread.status).toBe(422);
    expect(oddSpread.body.error).toMatch(/left \(even\) page/);
    expect(await storedVersion()).toBe(1);

    const spread = await change(1, { op: "place", pieceId: piece.kelp, startPage: 4 });
    expect(spread.status).toBe(200);
    const rows = await slotRows();
    expect(rows.filter((r) => r.pieceId === piece.kelp).map((r) => [r.page, r.index])).toEqual([
      [4, 1],
      [5, 2],
    ]);

    const moved = await change(2, { op: "move", pieceId: piece.moths, startPage: 3 });
    expect(moved.status).toBe(200);
    const afterMove = await slotRows();
    expect(afterMove.find((r) => r.page === 2)?.pieceId).toBeNull();
    expect(afterMove.find((r) => r.page === 3)?.pieceId).toBe(piece.moths);

    const onCover = await change(3, { op: "place", pieceId: piece.heron, startPage: 1 });
    expect(onCover.status).toBe(422);
    expect(onCover.body.error).toMatch(/cover/);

    const removed = await change(3, { op: "remove", pieceId: piece.moths });
    expect(removed.status).toBe(200);
    expect((await slotRows()).some((r) => r.pieceId === piece.moths)).toBe(false);
    expect(await storedVersion()).toBe(4);

    const events = await db
      .select({
        action: schema.mapEvents.action,
        actor: schema.mapEvents.actorId,
        version: schema.mapEvents.mapVersion,
      })
      .from(schema.mapEvents)
      .where(eq(schema.mapEvents.anthologyId, anthologyId))
      .orderBy(schema.mapEvents.id);
    expect(events).toEqual([
      { action: "place", actor: people.lead.id, version: 1 },
      { action: "place", actor: people.lead.id, version: 2 },
      { action: "move", actor: people.lead.id, version: 3 },
      { action: "remove", actor: people.lead.id, version: 4 },
    ]);
    const { body } = await getMap();
    expect((body.events as Json[])[0]?.summary).toMatch(
      /Took “Moths at the Porch Light” off page 3/,
    );
  });

  it("lets exactly one of two changes made against the same version through; the other gets 409 and the fresh map", async () => {
    as(people.lead);
    const version = await storedVersion();
    const [first, second] = await Promise.all([
      change(version, { op: "place", pieceId: piece.heron, startPage: 6 }),
      change(version, { op: "place", pieceId: piece.dunes, startPage: 6 }),
    ]);
    const statuses = [first.status, second.status].sort();
    expect(statuses).toEqual([200, 409]);
    const loser = first.status === 409 ? first : second;
    const winner = first.status === 200 ? first : second;
    expect(loser.body.error).toMatch(/Someone else changed the map/);
    expect(loser.body.map.version).toBe(version + 1);
    expect(loser.body.map.state.slots.find((s: Json) => s.page === 6).pieceId).toBe(
      winner === first ? piece.heron : piece.dunes,
    );
    const onSix = (await slotRows()).filter((r) => r.page === 6);
    expect(onSix).toHaveLength(1);
    expect([piece.heron, piece.dunes]).toContain(onSix[0]!.pieceId);
    expect(await storedVersion()).toBe(version + 1);
    const [count] = await db
      .select({ n: sql<number>`count(*)` })
      .from(schema.mapEvents)
      .where(
        and(
          eq(schema.mapEvents.anthologyId, anthologyId),
          eq(schema.mapEvents.mapVersion, version + 1),
        ),
      );
    expect(Number(count!.n)).toBe(1);
    // Clean up for the next tests: take whichever piece won off again.
    const off = await change(version + 1, { op: "remove", pieceId: onSix[0]!.pieceId! });
    expect(off.status).toBe(200);
  });

  it("adds 4 pages at a chosen place and refuses a removal that would drop a placed piece, naming it", async () => {
    as(people.lead);
    let version = await storedVersion();
    const grown = await change(version, { op: "resize", delta: 4, atPage: 2 });
    expect(grown.status).toBe(200);
    expect(grown.body.state.pageCount).toBe(12);
    const rows = await slotRows();
    expect(rows).toHaveLength(12);
    // The spread on 4–5 moved back by four pages, still a left–right pair.
    expect(rows.filter((r) => r.pieceId === piece.kelp).map((r) => r.page)).toEqual([8, 9]);
    expect(rows.filter((r) => r.reservation === "cover").map((r) => r.page)).toEqual([1, 12]);
    const [target] = await db
      .select({ n: schema.anthologies.pageCountTarget })
      .from(schema.anthologies)
      .where(eq(schema.anthologies.id, anthologyId));
    expect(target!.n).toBe(12);
    version++;

    const dropping = await change(version, { op: "resize", delta: -4, atPage: 6 });
    expect(dropping.status).toBe(422);
    expect(dropping.body.error).toContain("Kelp Forest");
    expect(dropping.body.pieceIds).toEqual([piece.kelp]);
    expect(await slotRows()).toHaveLength(12);

    // Asked for explicitly, the removal goes through and sends the piece back to the tray.
    const forced = await change(version, { op: "resize", delta: -4, atPage: 6, force: true });
    expect(forced.status).toBe(200);
    expect(forced.body.summary).toMatch(/sending “Kelp Forest” back to the tray/);
    expect((await slotRows()).some((r) => r.pieceId === piece.kelp)).toBe(false);
    version++;
    const regrown = await change(version, { op: "resize", delta: 4, atPage: 2 });
    expect(regrown.status).toBe(200);
    version++;
    const back = await change(version, { op: "place", pieceId: piece.kelp, startPage: 8 });
    expect(back.status).toBe(200);
    version++;

    const shrunk = await change(version, { op: "resize", delta: -4, atPage: 2 });
    expect(shrunk.status).toBe(200);
    expect((await slotRows()).filter((r) => r.pieceId === piece.kelp).map((r) => r.page)).toEqual([
      4, 5,
    ]);
  });

  it("answers 400 with field messages for a malformed change", async () => {
    as(people.lead);
    const response = await mapRoute.POST(
      new Request(url(), {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ version: 0, change: { op: "place" } }),
      }),
      ctx(),
    );
    expect(response.status).toBe(400);
    expect(((await response.json()) as Json).fields).toBeTruthy();
  });
});

describe("the automatic proposal", () => {
  it("is not saved until accepted, and accepting saves it as one change", async () => {
    as(people.lead);
    const version = await storedVersion();
    const before = await slotRows();
    const response = await proposalRoute.POST(
      new Request(url("/proposal"), {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ version, copies: 50 }),
      }),
      ctx(),
    );
    expect(response.status).toBe(200);
    const answer = (await response.json()) as Json;
    expect(answer.version).toBe(version);
    expect(answer.proposal.placed.length).toBeGreaterThan(0);
    expect(answer.passes.copies).toBe(50);
    expect(await slotRows()).toEqual(before);
    expect(await storedVersion()).toBe(version);

    const stale = await proposalRoute.POST(
      new Request(url("/proposal"), {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ version: version - 1 }),
      }),
      ctx(),
    );
    expect(stale.status).toBe(409);

    const accepted = await change(version, {
      op: "apply-proposal",
      placements: answer.proposal.placed,
    });
    expect(accepted.status).toBe(200);
    expect(accepted.body.version).toBe(version + 1);
    const rows = await slotRows();
    for (const p of answer.proposal.placed as { pieceId: number; pages: number[] }[]) {
      expect(rows.filter((r) => r.pieceId === p.pieceId).map((r) => r.page)).toEqual(p.pages);
    }
    const pagesUsed = rows.filter((r) => r.pieceId !== null).map((r) => r.page);
    expect(new Set(pagesUsed).size).toBe(pagesUsed.length);
    const events = await db
      .select({ action: schema.mapEvents.action })
      .from(schema.mapEvents)
      .where(
        and(
          eq(schema.mapEvents.anthologyId, anthologyId),
          eq(schema.mapEvents.mapVersion, version + 1),
        ),
      );
    expect(events).toEqual([{ action: "apply-proposal" }]);
  });
});

describe("page notices", () => {
  it("e-mails each contributor with placed pieces their pages once, and not again for the same pages", async () => {
    as(people.finisher);
    const forbidden = await noticesRoute.POST(
      new Request(url("/notices"), { method: "POST" }),
      ctx(),
    );
    expect(forbidden.status).toBe(403);

    as(people.lead);
    const rows = await slotRows();
    const owners = await db
      .select({ id: schema.pieces.id, owner: schema.pieces.contributorId })
      .from(schema.pieces)
      .where(eq(schema.pieces.anthologyId, anthologyId));
    const placedOwners = new Set(
      rows
        .filter((r) => r.pieceId !== null)
        .map((r) => owners.find((o) => o.id === r.pieceId)!.owner),
    );
    expect(placedOwners.size).toBeGreaterThan(0);

    const first = await noticesRoute.POST(new Request(url("/notices"), { method: "POST" }), ctx());
    expect(first.status).toBe(200);
    const firstBody = (await first.json()) as Json;
    expect(firstBody).toMatchObject({
      sent: placedOwners.size,
      alreadySent: 0,
      failed: 0,
      contributors: placedOwners.size,
    });

    const kelpOwner = people.artistB;
    const message = await waitForMessage({
      to: kelpOwner.email,
      subject: /Your pages in Map Test Quarterly/,
    });
    expect(message.text).toContain("Kelp Forest");
    expect(message.text).toContain("pages 4 and 5");

    const again = await noticesRoute.POST(new Request(url("/notices"), { method: "POST" }), ctx());
    expect((await again.json()) as Json).toMatchObject({ sent: 0, alreadySent: placedOwners.size });
    expect(await listMessages({ to: kelpOwner.email })).toHaveLength(1);
    const [logged] = await db
      .select({ n: sql<number>`count(*)` })
      .from(schema.emailLog)
      .where(like(schema.emailLog.dedupeKey, `page-notice:${anthologyId}:%`));
    expect(Number(logged!.n)).toBe(placedOwners.size);
  });
});

describe("people without a name", () => {
  // Accounts made by e-mail link have no name until their owner gives one.
  const unnamedContributor = { id: crypto.randomUUID(), email: uniqueEmail("map-unnamed-artist") };
  const unnamedEditor = { id: crypto.randomUUID(), email: uniqueEmail("map-unnamed-editor") };
  const anyAddress = /[^\s"@]+@[^\s"@]+\.[a-z]+/i;

  beforeAll(async () => {
    await db.insert(schema.users).values([
      { ...unnamedContributor, name: null },
      { ...unnamedEditor, name: null },
    ]);
    await db.insert(schema.memberships).values([
      { anthologyId, userId: unnamedContributor.id, role: "contributor" },
      { anthologyId, userId: unnamedEditor.id, role: "editor" },
    ]);
    await db.insert(schema.pieces).values({
      anthologyId,
      contributorId: unnamedContributor.id,
      title: "Untitled Tide Chart",
      kind: "single",
      pageCount: 1,
      inks: ["black"],
      creditLine: "Anonymous",
      status: "accepted",
    });
    // The unnamed editor makes a change, so the history names them too.
    authState.session = { user: { ...unnamedEditor, name: null as never } };
    const locked = await change(await storedVersion(), { op: "lock", page: 2, locked: true });
    expect(locked.status).toBe(200);
  });

  afterAll(async () => {
    await db.delete(schema.pieces).where(eq(schema.pieces.contributorId, unnamedContributor.id));
    for (const id of [unnamedContributor.id, unnamedEditor.id])
      await db.delete(schema.users).where(eq(schema.users.id, id));
  });

  it("shows the finisher no one's e-mail address, on the cards or in the history", async () => {
    as(people.finisher);
    const { status, body } = await getMap();
    expect(status).toBe(200);
    const card = (body.cards as Json[]).find((c) =>
      (body.state.pieces as Json[]).some((p) => p.id === c.id && p.title === "Untitled Tide Chart"),
    );
    expect(card?.contributorName).toBe("Unnamed contributor");
    expect((body.events as Json[])[0]?.actorName).not.toMatch(anyAddress);
    expect(JSON.stringify(body)).not.toMatch(anyAddress);
  });

  it("still shows editors the address in place of a missing name", async () => {
    as(people.lead);
    const { body } = await getMap();
    expect((body.cards as Json[]).map((c) => c.contributorName)).toContain(
      unnamedContributor.email,
    );
    expect((body.events as Json[])[0]?.actorName).toBe(unnamedEditor.email);
  });
});

describe("a change that leaves the map as it was", () => {
  async function eventCount(): Promise<number> {
    const [row] = await db
      .select({ n: sql<number>`count(*)` })
      .from(schema.mapEvents)
      .where(eq(schema.mapEvents.anthologyId, anthologyId));
    return Number(row!.n);
  }

  it("made twice, raises the version once and writes one history entry", async () => {
    as(people.lead);
    const start = await storedVersion();
    const events = await eventCount();
    const first = await change(start, { op: "lock", page: 3, locked: true });
    expect(first.status).toBe(200);
    expect(first.body.version).toBe(start + 1);
    const again = await change(start + 1, { op: "lock", page: 3, locked: true });
    expect(again.status).toBe(200);
    expect(again.body.version).toBe(start + 1);
    expect(again.body.summary).toMatch(/^Nothing changed/);
    expect(again.body.state.slots.find((s: Json) => s.page === 3).locked).toBe(true);
    expect(await storedVersion()).toBe(start + 1);
    expect(await eventCount()).toBe(events + 1);
    expect((again.body.events as Json[]).filter((e) => e.mapVersion === start + 1)).toHaveLength(1);
  });

  it("saves nothing for a piece placed or moved where it already is, an unlocked page unlocked, a page kept for what it is kept for", async () => {
    as(people.lead);
    const { body } = await getMap();
    const version = body.version as number;
    const slots = body.state.slots as Json[];
    const lockedPieces = new Set(slots.filter((s) => s.locked).map((s) => s.pieceId));
    const start = slots.find(
      (s) => s.pieceId !== null && s.piecePageIndex === 1 && !lockedPieces.has(s.pieceId),
    )!;
    const unlocked = slots.find((s) => !s.locked)!;
    const events = await eventCount();
    for (const same of [
      { op: "place", pieceId: start.pieceId, startPage: start.page },
      { op: "move", pieceId: start.pieceId, startPage: start.page },
      { op: "lock", page: unlocked.page, locked: false },
      { op: "reserve", page: 1, reservation: "cover" },
    ]) {
      const answer = await change(version, same);
      expect(answer.status, JSON.stringify(same)).toBe(200);
      expect(answer.body.version, JSON.stringify(same)).toBe(version);
      expect(answer.body.summary, JSON.stringify(same)).toMatch(/^Nothing changed/);
    }
    expect(await storedVersion()).toBe(version);
    expect(await eventCount()).toBe(events);
  });
});
