// What a submission sends: the contributor's receipt (once per piece, even when sent again), read
// back from the SMTP sink's outbox. Route modules are called directly with a stubbed session.
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
const { mailPieceSubmitted } = await import("@/server/piece-submitted");

let lead: TestPerson, editor: TestPerson, poet: TestPerson;
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

const logFor = (pieceId: number, kind: string) =>
  db
    .select()
    .from(schema.emailLog)
    .where(and(eq(schema.emailLog.pieceId, pieceId), eq(schema.emailLog.kind, kind)));

beforeAll(async () => {
  [lead, editor, poet] = await Promise.all([
    makePerson("lead"),
    makePerson("editor"),
    makePerson("poet"),
  ]);
  anthology = await makeAnthologyWithCall([
    { person: lead, role: "lead" },
    { person: editor, role: "editor" },
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
