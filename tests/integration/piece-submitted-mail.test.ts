// What a submission sends: the contributor's receipt and a notice to each editor who opted in on
// the submissions page (each once per piece, even when sent again), read back from the SMTP
// sink's outbox. Route modules are called directly with a stubbed session.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, pool, schema } from "@/db";
import { assertTestDatabase } from "../helpers/env";
import { listMessages, waitForMessage } from "../helpers/outbox";
import { makeAnthologyWithCall, makePerson, type TestPerson } from "../helpers/submissions";

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
const notificationsRoute = await import("@/app/api/anthologies/[slug]/notifications/route");
const { mailPieceSubmitted } = await import("@/server/piece-submitted");

let lead: TestPerson, editor: TestPerson, finisher: TestPerson, poet: TestPerson, poet2: TestPerson;
let anthology: Awaited<ReturnType<typeof makeAnthologyWithCall>>;

const as = (person: TestPerson | null) => {
  session.user = person ? { id: person.id, name: person.name, email: person.email } : null;
};

async function submit(person: TestPerson, title: string) {
  as(person);
  const response = await piecesRoute.POST(
    new Request("http://localhost/api", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({
        title,
        kind: "spread",
        pageCount: 2,
        inks: ["black"],
        creditLine: "Drawn by a tester",
        altTexts: ["Left: an eel.", "Right: a second eel."],
      }),
    }),
    { params: Promise.resolve({ slug: anthology.slug }) },
  );
  expect(response.status).toBe(201);
  return ((await response.json()) as { piece: { id: number; title: string; pageCount: number } })
    .piece;
}

async function setting(person: TestPerson | null, method: "GET" | "PUT", body?: unknown) {
  as(person);
  const request = new Request("http://localhost/api", {
    method,
    headers: { "content-type": "application/json" },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const route = method === "GET" ? notificationsRoute.GET : notificationsRoute.PUT;
  const response = await route(request, { params: Promise.resolve({ slug: anthology.slug }) });
  return { status: response.status, body: (await response.json()) as { newPieces?: boolean } };
}

const logFor = (pieceId: number, kind: string) =>
  db
    .select()
    .from(schema.emailLog)
    .where(and(eq(schema.emailLog.pieceId, pieceId), eq(schema.emailLog.kind, kind)));

beforeAll(async () => {
  [lead, editor, finisher, poet, poet2] = await Promise.all([
    makePerson("lead"),
    makePerson("editor"),
    makePerson("finisher"),
    makePerson("poet"),
    makePerson("poet2"),
  ]);
  anthology = await makeAnthologyWithCall([
    { person: lead, role: "lead" },
    { person: editor, role: "editor" },
    { person: finisher, role: "finisher" },
  ]);
});

afterAll(async () => {
  await pool.end();
});

describe("the contributor's receipt", () => {
  it("is e-mailed when a piece is submitted, with its pages and a link to it", async () => {
    const title = `Eel Migration ${Date.now().toString(36)}`;
    const piece = await submit(poet, title);
    const mail = await waitForMessage({ to: poet.email, subject: /^We have "Eel Migration/ });
    expect(mail.subject).toBe(`We have "${title}" for ${anthology.title}`);
    expect(mail.text).toContain(`Hello ${poet.name},`);
    expect(mail.text).toContain(`"${title}" (2 pages) has reached the open call`);
    expect(mail.text).toContain(`/studio/${anthology.slug}/my-pieces/${piece.id}`);
    const log = await logFor(piece.id, "piece-receipt");
    expect(log).toHaveLength(1);
    expect(log[0]).toMatchObject({ toEmail: poet.email, dedupeKey: `piece-receipt:${piece.id}` });
  });

  it("goes out once per piece: sending it again sends nothing", async () => {
    const title = `Second Eel ${Date.now().toString(36)}`;
    const piece = await submit(poet, title);
    await waitForMessage({ to: poet.email, subject: new RegExp(title) });
    expect(await mailPieceSubmitted(anthology, piece, poet.id)).toMatchObject({ receipt: false });
    const receipts = (await listMessages({ to: poet.email })).filter((m) =>
      m.subject.includes(title),
    );
    expect(receipts).toHaveLength(1);
    expect(await logFor(piece.id, "piece-receipt")).toHaveLength(1);
  });
});

describe("the editors' notice of a new piece", () => {
  it("is off until an editor turns it on for themselves; other roles may not set it", async () => {
    expect(await setting(editor, "GET")).toEqual({ status: 200, body: { newPieces: false } });
    expect(await setting(editor, "PUT", { newPieces: true })).toEqual({
      status: 200,
      body: { newPieces: true },
    });
    expect(await setting(editor, "GET")).toEqual({ status: 200, body: { newPieces: true } });
    // The lead's own setting is untouched by the editor's.
    expect(await setting(lead, "GET")).toEqual({ status: 200, body: { newPieces: false } });
    expect((await setting(finisher, "PUT", { newPieces: true })).status).toBe(403);
    expect((await setting(null, "PUT", { newPieces: true })).status).toBe(401);
    expect((await setting(editor, "PUT", { newPieces: "yes" })).status).toBe(400);
  });

  it("goes to the editors who opted in, once per piece, and not to the others", async () => {
    // A finisher's flag left on (say, from when they reviewed) sends nothing: the role decides.
    await db
      .update(schema.memberships)
      .set({ notifyNewPieces: true })
      .where(
        and(
          eq(schema.memberships.anthologyId, anthology.id),
          eq(schema.memberships.userId, finisher.id),
        ),
      );
    const title = `Heron Count ${Date.now().toString(36)}`;
    const piece = await submit(poet2, title);
    const notice = await waitForMessage({ to: editor.email, subject: new RegExp(title) });
    expect(notice.subject).toBe(`New piece for ${anthology.title}: "${title}"`);
    expect(notice.text).toContain(`Hello ${editor.name},`);
    expect(notice.text).toContain(`${poet2.name} sent "${title}" (2 pages)`);
    expect(notice.text).toContain(`/studio/${anthology.slug}/submissions/${piece.id}`);
    await waitForMessage({ to: poet2.email, subject: new RegExp(title) });

    expect(await mailPieceSubmitted(anthology, piece, poet2.id)).toEqual({
      receipt: false,
      notices: 0,
    });
    const log = await logFor(piece.id, "new-piece-notice");
    expect(log.map((l) => l.toEmail)).toEqual([editor.email]);
    expect(
      (await listMessages({ to: editor.email })).filter((m) => m.subject.includes(title)),
    ).toHaveLength(1);
    for (const other of [lead, finisher])
      expect(
        (await listMessages({ to: other.email })).filter((m) => m.subject.includes(title)),
      ).toHaveLength(0);
  });

  it("stops once the editor turns it off", async () => {
    expect((await setting(editor, "PUT", { newPieces: false })).body).toEqual({
      newPieces: false,
    });
    const title = `Quiet Heron ${Date.now().toString(36)}`;
    const piece = await submit(poet2, title);
    await waitForMessage({ to: poet2.email, subject: new RegExp(title) });
    expect(await logFor(piece.id, "new-piece-notice")).toHaveLength(0);
  });
});
