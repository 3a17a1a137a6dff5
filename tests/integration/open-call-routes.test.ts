import { eq, inArray } from "drizzle-orm";
import { PDFDocument } from "pdf-lib";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { uniqueEmail } from "../helpers/demo";
import { halfLetterDuplicatorSpec } from "../helpers/anthology-spec";

// The route handlers read the session through `auth()`; each test says who is signed in.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/auth", () => ({
  auth: vi.fn(async () =>
    session.userId ? { user: { id: session.userId, name: "Test person", email: null } } : null,
  ),
}));

const { db, pool, schema } = await import("@/db");
const { createAnthology } = await import("@/db/queries/anthologies");
const callRoute = await import("@/app/api/anthologies/[slug]/call/route");
const templateRoute = await import("@/app/api/anthologies/[slug]/call/template/route");
const stageRoute = await import("@/app/api/anthologies/[slug]/stage/route");
const { utcToZonedLocal } = await import("@/lib/time-zones");

const ZONE = "America/Halifax";
const DAY = 86_400_000;
const people = { lead: "", editor: "", contributor: "", outsider: "" };
const anthologyIds: number[] = [];
let slug = "";

const context = (s: string) => ({ params: Promise.resolve({ slug: s }) });
const as = (who: keyof typeof people | null) => {
  session.userId = who ? people[who] : null;
};
const local = (offsetMs: number) => utcToZonedLocal(new Date(Date.now() + offsetMs), ZONE);

function request(method: string, path: string, body?: unknown, raw?: string) {
  return new Request(`http://localhost${path}`, {
    method,
    headers: { "content-type": "application/json" },
    body: raw ?? (body === undefined ? undefined : JSON.stringify(body)),
  });
}
const getCall = (s = slug) =>
  callRoute.GET(request("GET", `/api/anthologies/${s}/call`), context(s));
const putCall = (body: unknown, s = slug, raw?: string) =>
  callRoute.PUT(request("PUT", `/api/anthologies/${s}/call`, body, raw), context(s));
const moveTo = (to: string, s = slug) =>
  stageRoute.POST(request("POST", `/api/anthologies/${s}/stage`, { to }), context(s));
const template = (format: string, s = slug) =>
  templateRoute.GET(
    request("GET", `/api/anthologies/${s}/call/template?format=${format}`),
    context(s),
  );

const validCall = () => ({
  theme: "Salt marsh at night",
  brief:
    "Drawings and short comics about the salt marsh after dark: herons, lamps, the sound of the tide.",
  opensAt: local(-DAY),
  closesAt: local(10 * DAY),
  timeZone: ZONE,
  allowedKinds: ["single", "spread"],
  maxRunPages: 4,
  piecesPerPerson: 2,
  allowedInks: ["black", "teal"],
  feeKind: "per-piece",
  fee: "40.00",
  salesSharePercent: "5",
  contributorCopies: 3,
  rightsAsked: "First printing rights for this edition; all rights return to you after printing.",
});

async function makeAnthology(title: string) {
  const anthology = await createAnthology(
    people.lead,
    {
      title,
      pressName: "Marrowbend Print Collective",
      stage: "planning",
      ...halfLetterDuplicatorSpec,
      currency: "USD",
    },
    `call-routes-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 7)}`,
  );
  anthologyIds.push(anthology.id);
  await db.insert(schema.memberships).values([
    { anthologyId: anthology.id, userId: people.editor, role: "editor" },
    { anthologyId: anthology.id, userId: people.contributor, role: "contributor" },
  ]);
  return anthology;
}

beforeAll(async () => {
  for (const key of Object.keys(people) as (keyof typeof people)[]) {
    const id = crypto.randomUUID();
    await db
      .insert(schema.users)
      .values({ id, name: `Call test ${key}`, email: uniqueEmail(`call-${key}`) });
    people[key] = id;
  }
  slug = (await makeAnthology("Salt Marsh Nocturnes")).slug;
});

afterAll(async () => {
  if (anthologyIds.length)
    await db.delete(schema.anthologies).where(inArray(schema.anthologies.id, anthologyIds));
  await db
    .delete(schema.users)
    .where(inArray(schema.users.id, Object.values(people).filter(Boolean)));
  await pool.end();
});

describe("who may read and write the call", () => {
  it("answers 401 without a session", async () => {
    as(null);
    expect((await getCall()).status).toBe(401);
    expect((await putCall(validCall())).status).toBe(401);
    expect((await moveTo("call-open")).status).toBe(401);
  });

  it("answers 403 to a contributor and to someone outside the anthology", async () => {
    for (const who of ["contributor", "outsider"] as const) {
      as(who);
      expect((await getCall()).status).toBe(403);
      expect((await putCall(validCall())).status).toBe(403);
      expect((await moveTo("call-open")).status).toBe(403);
    }
  });

  it("answers 404 for an anthology that does not exist", async () => {
    as("lead");
    expect((await getCall("no-such-anthology-here")).status).toBe(404);
    expect((await template("png", "no-such-anthology-here")).status).toBe(404);
  });
});

describe("writing the call", () => {
  it("offers defaults before anything is written", async () => {
    as("lead");
    const response = await getCall();
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body.call).toBeNull();
    expect(body.canEditTerms).toBe(true);
    expect(body.form.allowedInks).toEqual(["black", "teal"]);
    // Half letter + 0.125 in bleed at 300 ppi = 5.75 x 8.75 in x 300 = 1725 x 2625 px (pixels = inches x ppi,
    // Haematologica "Image resolution" advisor, submit.haematologica.org/image_analysis/advisor/image_resolution.html).
    expect(body.spec.pixels).toEqual({ widthPx: 1725, heightPx: 2625, ppi: 300 });
  });

  it("answers 400 to a body that is not JSON", async () => {
    as("lead");
    const response = await putCall(undefined, slug, "{ theme: oops");
    expect(response.status).toBe(400);
    expect((await response.json()).error).toBe("The request body is not valid JSON.");
  });

  it("answers 400 with a field message when the call closes before it opens", async () => {
    as("lead");
    const response = await putCall({ ...validCall(), closesAt: local(-2 * DAY) });
    expect(response.status).toBe(400);
    expect((await response.json()).fields).toEqual({
      closesAt: ["The call must close after it opens"],
    });
  });

  it("refuses inks the anthology does not print with", async () => {
    as("lead");
    const response = await putCall({ ...validCall(), allowedInks: ["black", "gold"] });
    expect(response.status).toBe(400);
    expect((await response.json()).fields.allowedInks[0]).toMatch(
      /gold is not among the anthology's inks/,
    );
  });

  it("saves the lead's call with UTC instants, cents and basis points", async () => {
    as("lead");
    const input = validCall();
    const created = await putCall(input);
    expect(created.status).toBe(201);
    const body = await created.json();
    expect(body.call).toMatchObject({
      feeKind: "per-piece",
      feeCents: 4000,
      salesShareBasisPoints: 500,
      contributorCopies: 3,
      timeZone: ZONE,
    });
    expect(body.form.opensAt).toBe(input.opensAt);
    const [row] = await db
      .select()
      .from(schema.calls)
      .innerJoin(schema.anthologies, eq(schema.anthologies.id, schema.calls.anthologyId))
      .where(eq(schema.anthologies.slug, slug));
    expect(utcToZonedLocal(row!.open_call.closesAt, ZONE)).toBe(input.closesAt);
    expect(row!.open_call.publishedAt).toBeNull();
    expect((await putCall({ ...input, theme: "Salt marsh after dark" })).status).toBe(200);
  });

  it("lets an editor change the brief but not the payment terms", async () => {
    as("editor");
    const read = await (await getCall()).json();
    expect(read.canEditTerms).toBe(false);
    const edited = await putCall({ ...read.form, brief: `${read.form.brief} Beginners welcome.` });
    expect(edited.status).toBe(200);
    const refused = await putCall({ ...read.form, fee: "80.00", contributorCopies: 5 });
    expect(refused.status).toBe(403);
    const body = await refused.json();
    expect(body.error).toMatch(/Only the lead editor can change the payment terms/);
    expect(body.terms).toEqual(["fee", "contributor copies"]);
    const after = await (await getCall()).json();
    expect(after.call).toMatchObject({ feeCents: 4000, contributorCopies: 3 });
    expect(after.call.brief).toMatch(/Beginners welcome\.$/);
  });
});

describe("stages and the published call", () => {
  it("keeps the template from strangers until the call is published, but not from members", async () => {
    as(null);
    expect((await template("png")).status).toBe(404);
    as("contributor");
    const png = await template("png");
    expect(png.status).toBe(200);
    expect(png.headers.get("content-type")).toBe("image/png");
    expect(png.headers.get("content-disposition")).toMatch(/page-template-1725x2625px-300ppi\.png/);
    const meta = await sharp(Buffer.from(await png.arrayBuffer())).metadata();
    expect([meta.width, meta.height]).toEqual([1725, 2625]);
    as("lead");
    expect((await template("svg")).status).toBe(400);
  });

  it("refuses to skip a stage or to open a call that is not written", async () => {
    as("lead");
    const skipped = await moveTo("call-closed");
    expect(skipped.status).toBe(409);
    expect((await skipped.json()).error).toMatch(/after "Planning" comes "Call open"/);
    const empty = await makeAnthology("Unwritten Almanac");
    const unwritten = await moveTo("call-open", empty.slug);
    expect(unwritten.status).toBe(409);
    expect((await unwritten.json()).problems).toEqual(["Write and save the open call first."]);
    expect((await moveTo("opened")).status).toBe(400);
  });

  it("opens the call, publishing it to anyone", async () => {
    as("editor");
    const opened = await moveTo("call-open");
    expect(opened.status).toBe(200);
    expect(await opened.json()).toMatchObject({ stage: "call-open", from: "planning" });
    const [anthology] = await db
      .select()
      .from(schema.anthologies)
      .where(eq(schema.anthologies.slug, slug));
    expect(anthology!.stage).toBe("call-open");
    const [call] = await db
      .select()
      .from(schema.calls)
      .where(eq(schema.calls.anthologyId, anthology!.id));
    expect(call!.publishedAt).not.toBeNull();
    expect((await moveTo("call-open")).status).toBe(409);

    as(null);
    const pdf = await template("pdf");
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get("content-type")).toBe("application/pdf");
    const page = (await PDFDocument.load(await pdf.arrayBuffer())).getPage(0);
    // Half letter + 0.125 in bleed = 5.75 x 8.75 in = 414 x 630 pt (the BleedBox is the TrimBox grown by the
    // bleed, ISO 32000-1:2008 Table 30; 1 pt = 1/72 in, ISO 32000-1 Table 30 UserUnit).
    expect(page.getMediaBox().width).toBeCloseTo(414, 6);
    expect(page.getTrimBox().x).toBeCloseTo(9, 6);
  });

  it("closes the call early, bringing its closing time forward to now", async () => {
    as("lead");
    const before = Date.now();
    const closed = await moveTo("call-closed");
    expect(closed.status).toBe(200);
    const [row] = await db
      .select()
      .from(schema.calls)
      .innerJoin(schema.anthologies, eq(schema.anthologies.id, schema.calls.anthologyId))
      .where(eq(schema.anthologies.slug, slug));
    expect(row!.anthology.stage).toBe("call-closed");
    // DATETIME keeps whole seconds.
    expect(row!.open_call.closesAt.getTime()).toBeGreaterThanOrEqual(
      Math.floor(before / 1000) * 1000,
    );
    expect(row!.open_call.closesAt.getTime()).toBeLessThanOrEqual(Date.now());
  });

  it("will not start laying out before a piece is accepted", async () => {
    as("lead");
    const response = await moveTo("laying-out");
    expect(response.status).toBe(409);
    expect((await response.json()).problems).toEqual([
      "Accept at least one piece before laying out the pages.",
    ]);
  });
});
