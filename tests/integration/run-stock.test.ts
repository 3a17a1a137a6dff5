// The print-run routes against the real MariaDB: who may plan, tick and move stock, bad input
// refused with field messages and nothing changed, and 20 stock movements at once with none lost.
import { eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { assertTestDatabase } from "../helpers/env";
import {
  makeAnthologyWithCall,
  makePerson,
  makePiece,
  type TestPerson,
} from "../helpers/submissions";

const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/auth", () => ({
  auth: vi.fn(async () =>
    session.userId ? { user: { id: session.userId, name: "Test person", email: null } } : null,
  ),
}));

const { db, pool, schema } = await import("@/db");
const runRoute = await import("@/app/api/anthologies/[slug]/run/route");
const priceListsRoute = await import("@/app/api/anthologies/[slug]/run/price-lists/route");
const quotesRoute = await import("@/app/api/anthologies/[slug]/run/quotes/route");
const eventsRoute = await import("@/app/api/anthologies/[slug]/run/events/route");
const batchesRoute = await import("@/app/api/anthologies/[slug]/run/batches/route");
const finishingRoute = await import("@/app/api/anthologies/[slug]/finishing/route");
const tickRoute = await import("@/app/api/anthologies/[slug]/finishing/[batchId]/route");
const stockRoute = await import("@/app/api/anthologies/[slug]/stock/route");
const copiesRoute =
  await import("@/app/api/anthologies/[slug]/stock/contributor-copies/[id]/route");
const { addDays, todayIn } = await import("@/lib/run/batches");

assertTestDatabase(process.env.DATABASE_URL);

let lead: TestPerson;
let finisher: TestPerson;
let contributor: TestPerson;
const anthologyIds: number[] = [];
const listIds: number[] = [];
const quoteIds: number[] = [];
const as = (who: TestPerson | null) => {
  session.userId = who?.id ?? null;
};
const tag = Math.random().toString(36).slice(2, 8);

function call(
  handler: (r: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>,
  method: string,
  params: Record<string, string>,
  body?: unknown,
) {
  return handler(
    new Request("http://localhost/api/test", {
      method,
      headers: body === undefined ? {} : { "content-type": "application/json" },
      body: body === undefined ? undefined : JSON.stringify(body),
    }),
    { params: Promise.resolve(params) },
  );
}
// The handlers' context types differ per route; the test passes the params each one reads.
type Handler = (r: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;
const h = (f: unknown) => f as Handler;

const prices = {
  insidePaper: { priceCents: 1000, perQuantity: 500 },
  coverPaper: { priceCents: 3000, perQuantity: 100 },
  copyShopSide: { priceCents: 8, perQuantity: 1 },
  inkPass: { priceCents: 50, perQuantity: 100 },
  master: { priceCents: 200, perQuantity: 1 },
  staples: { priceCents: 500, perQuantity: 1000 },
  finishingCentsPerHour: 1200,
  spoilageBasisPoints: 0,
};

async function newAnthology() {
  const anthology = await makeAnthologyWithCall([
    { person: lead, role: "lead" },
    { person: finisher, role: "finisher" },
    { person: contributor, role: "contributor" },
  ]);
  anthologyIds.push(anthology.id);
  return anthology;
}

async function movementCount(anthologyId: number) {
  const rows = await db
    .select({ id: schema.stockMovements.id })
    .from(schema.stockMovements)
    .where(eq(schema.stockMovements.anthologyId, anthologyId));
  return rows.length;
}

beforeAll(async () => {
  [lead, finisher, contributor] = await Promise.all([
    makePerson("run-lead"),
    makePerson("run-finisher"),
    makePerson("run-contributor"),
  ]);
});

afterAll(async () => {
  if (anthologyIds.length)
    await db.delete(schema.anthologies).where(inArray(schema.anthologies.id, anthologyIds));
  if (listIds.length)
    await db.delete(schema.priceLists).where(inArray(schema.priceLists.id, listIds));
  if (quoteIds.length)
    await db.delete(schema.shopQuotes).where(inArray(schema.shopQuotes.id, quoteIds));
  await pool.end();
});

describe("planning the run", () => {
  it("a lead saves prices and a quote for the press; a finisher may not; bad input changes nothing", async () => {
    const a = await newAnthology();
    as(finisher);
    expect(
      (await call(h(priceListsRoute.POST), "POST", { slug: a.slug }, { name: `x ${tag}`, prices }))
        .status,
    ).toBe(403);
    expect((await call(h(runRoute.GET), "GET", { slug: a.slug })).status).toBe(403);

    as(lead);
    const negative = await call(
      h(priceListsRoute.POST),
      "POST",
      { slug: a.slug },
      {
        name: `Bad ${tag}`,
        prices: { ...prices, inkPass: { priceCents: -5, perQuantity: 100 } },
      },
    );
    expect(negative.status).toBe(400);
    expect(((await negative.json()) as { fields: Record<string, string[]> }).fields).toEqual({
      "prices.inkPass.priceCents": ["Ink per pass cannot be negative"],
    });

    const saved = await call(
      h(priceListsRoute.POST),
      "POST",
      { slug: a.slug },
      { name: `Studio ${tag}`, prices },
    );
    expect(saved.status).toBe(201);
    listIds.push(((await saved.json()) as { id: number }).id);

    const outOfOrder = await call(
      h(quotesRoute.POST),
      "POST",
      { slug: a.slug },
      {
        shopName: `Gullrock ${tag}`,
        turnaroundDays: 10,
        tiers: [
          { copies: 100, totalCents: 20_000 },
          { copies: 25, totalCents: 10_000 },
        ],
      },
    );
    expect(outOfOrder.status).toBe(400);
    const quote = await call(
      h(quotesRoute.POST),
      "POST",
      { slug: a.slug },
      {
        shopName: `Gullrock ${tag}`,
        turnaroundDays: 10,
        tiers: [
          { copies: 25, totalCents: 10_000 },
          { copies: 100, totalCents: 20_000 },
        ],
      },
    );
    expect(quote.status).toBe(201);
    quoteIds.push(((await quote.json()) as { id: number }).id);

    // The next anthology of the same press sees both.
    const b = await newAnthology();
    const plan = (await (await call(h(runRoute.GET), "GET", { slug: b.slug })).json()) as {
      priceLists: { name: string }[];
      quotes: { shopName: string }[];
      counts: { insideSheets: number };
    };
    expect(plan.priceLists.map((l) => l.name)).toContain(`Studio ${tag}`);
    expect(plan.quotes.map((q) => q.shopName)).toContain(`Gullrock ${tag}`);
    // 16 pages, self cover: 4 sheets (a sheet folded once carries 4 pages, common practice, no source).
    expect(plan.counts.insideSheets).toBe(4);
    const stored = await db
      .select()
      .from(schema.priceLists)
      .where(eq(schema.priceLists.name, `Bad ${tag}`));
    expect(stored).toEqual([]);
  });

  it("an event in the past is refused; events make batches; the finisher ticks and finishes one", async () => {
    const a = await newAnthology();
    as(lead);
    const today = todayIn("UTC");
    const past = await call(
      h(eventsRoute.POST),
      "POST",
      { slug: a.slug },
      { name: "Old fair", kind: "fair", date: addDays(today, -1), copies: 10 },
    );
    expect(past.status).toBe(400);
    expect(
      ((await past.json()) as { fields: Record<string, string[]> }).fields.date?.[0],
    ).toContain("in the past");
    for (const [name, days, copies] of [
      ["Launch", 10, 12],
      ["Fair", 30, 20],
    ] as const)
      expect(
        (
          await call(
            h(eventsRoute.POST),
            "POST",
            { slug: a.slug },
            { name, kind: "launch", date: addDays(today, days), copies },
          )
        ).status,
      ).toBe(201);
    expect((await call(h(batchesRoute.POST), "POST", { slug: a.slug })).status).toBe(200);

    as(finisher);
    const board = (await (await call(h(finishingRoute.GET), "GET", { slug: a.slug })).json()) as {
      batches: { id: number; copies: number }[];
      checklist: { id: string }[];
    };
    expect(board.batches.map((b) => b.copies)).toEqual([12, 20]);
    const first = board.batches[0]!;
    // Finishing needs its printed sheets and every step ticked first.
    expect(
      (
        await call(
          h(tickRoute.POST),
          "POST",
          { slug: a.slug, batchId: String(first.id) },
          { stepId: "batch", done: true },
        )
      ).status,
    ).toBe(409);
    expect(
      (
        await call(
          h(stockRoute.POST),
          "POST",
          { slug: a.slug },
          { kind: "printed", batchId: first.id, quantity: 12 },
        )
      ).status,
    ).toBe(201);
    for (const step of board.checklist)
      expect(
        (
          await call(
            h(tickRoute.POST),
            "POST",
            { slug: a.slug, batchId: String(first.id) },
            { stepId: step.id, done: true },
          )
        ).status,
      ).toBe(200);
    expect(
      (
        await call(
          h(tickRoute.POST),
          "POST",
          { slug: a.slug, batchId: String(first.id) },
          { stepId: "batch", done: true },
        )
      ).status,
    ).toBe(200);
    // Batches under way are not re-planned.
    as(lead);
    expect((await call(h(batchesRoute.POST), "POST", { slug: a.slug })).status).toBe(409);

    as(finisher);
    const stock = (await (await call(h(stockRoute.GET), "GET", { slug: a.slug })).json()) as {
      copiesOnHand: number;
      batches: { sheetSets: number }[];
    };
    expect(stock.copiesOnHand).toBe(12);
    expect(stock.batches[0]!.sheetSets).toBe(0);
  });

  it("contributor copies follow the call's terms; the finisher sees names, never addresses", async () => {
    const a = await newAnthology();
    await db
      .update(schema.calls)
      .set({ contributorCopies: 2 })
      .where(eq(schema.calls.anthologyId, a.id));
    await makePiece(a.id, contributor.id, { status: "accepted" });
    await db.update(schema.users).set({ name: null }).where(eq(schema.users.id, contributor.id));
    as(finisher);
    const stock = (await (await call(h(stockRoute.GET), "GET", { slug: a.slug })).json()) as {
      contributorCopies: { id: number; name: string; quantity: number }[];
    };
    expect(stock.contributorCopies).toEqual([
      expect.objectContaining({ name: "Unnamed contributor", quantity: 2 }),
    ]);
    expect(JSON.stringify(stock)).not.toContain(contributor.email);
    // Handing them over with nothing in stock is refused and records nothing.
    const id = String(stock.contributorCopies[0]!.id);
    const refused = await call(
      h(copiesRoute.PATCH),
      "PATCH",
      { slug: a.slug, id },
      { delivery: "post", eventId: null, done: true },
    );
    expect(refused.status).toBe(409);
    expect(await movementCount(a.id)).toBe(0);
    as(lead);
    await call(
      h(stockRoute.POST),
      "POST",
      { slug: a.slug },
      {
        kind: "correction",
        batchId: null,
        quantity: 5,
        target: "copies",
        reason: "Counted the shelf",
      },
    );
    expect(
      (
        await call(
          h(copiesRoute.PATCH),
          "PATCH",
          { slug: a.slug, id },
          { delivery: "post", eventId: null, done: true },
        )
      ).status,
    ).toBe(200);
    const after = (await (await call(h(stockRoute.GET), "GET", { slug: a.slug })).json()) as {
      copiesOnHand: number;
    };
    expect(after.copiesOnHand).toBe(3);
  });
});

describe("stock under concurrency", () => {
  it("20 movements at once: every one is recorded and the counts are their sum", async () => {
    const a = await newAnthology();
    as(lead);
    await call(
      h(stockRoute.POST),
      "POST",
      { slug: a.slug },
      {
        kind: "correction",
        batchId: null,
        quantity: 100,
        target: "copies",
        reason: "Opening count",
      },
    );
    const answers = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        call(
          h(stockRoute.POST),
          "POST",
          { slug: a.slug },
          { kind: i % 2 ? "sold" : "spare", batchId: null, quantity: 3 },
        ),
      ),
    );
    expect(answers.map((r) => r.status)).toEqual(Array.from({ length: 20 }, () => 201));
    expect(await movementCount(a.id)).toBe(21);
    const stock = (await (await call(h(stockRoute.GET), "GET", { slug: a.slug })).json()) as {
      copiesOnHand: number;
    };
    expect(stock.copiesOnHand).toBe(40); // 100 − 20 × 3
    const [lock] = await db
      .select()
      .from(schema.runStock)
      .where(eq(schema.runStock.anthologyId, a.id));
    expect(lock!.movementCount).toBe(21);
  });

  it("20 at once against 10 copies: exactly 10 succeed, the rest are refused, the count ends at 0", async () => {
    const a = await newAnthology();
    as(lead);
    await call(
      h(stockRoute.POST),
      "POST",
      { slug: a.slug },
      {
        kind: "correction",
        batchId: null,
        quantity: 10,
        target: "copies",
        reason: "Opening count",
      },
    );
    const answers = await Promise.all(
      Array.from({ length: 20 }, () =>
        call(
          h(stockRoute.POST),
          "POST",
          { slug: a.slug },
          { kind: "sold", batchId: null, quantity: 1 },
        ),
      ),
    );
    const statuses = answers.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 201)).toHaveLength(10);
    expect(statuses.filter((s) => s === 409)).toHaveLength(10);
    const stock = (await (await call(h(stockRoute.GET), "GET", { slug: a.slug })).json()) as {
      copiesOnHand: number;
    };
    expect(stock.copiesOnHand).toBe(0);
  });
});
