// Editors' review: the submissions table API (paging, sorting, filtering in SQL), status changes
// one at a time and in bulk with the contributor's e-mails, and the editors' notes. Route modules
// are called directly with a mocked session; data is made fresh for this file.
import type mysql from "mysql2/promise";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { waitForMessage } from "../helpers/outbox";
import {
  connect,
  createAnthology,
  createPerson,
  createPiece,
  removeFixtures,
  type FixturePerson,
} from "../helpers/review-fixtures";

const session = vi.hoisted(() => ({
  user: null as null | { id: string; name: string; email: string },
}));
vi.mock("@/auth", () => ({ auth: async () => (session.user ? { user: session.user } : null) }));

const { GET: listRoute } = await import("@/app/api/anthologies/[slug]/submissions/route");
const { POST: bulkRoute } = await import("@/app/api/anthologies/[slug]/submissions/status/route");
const { POST: statusRoute } = await import("@/app/api/pieces/[id]/status/route");
const notesRoute = await import("@/app/api/pieces/[id]/notes/route");
const { pool } = await import("@/db");

let conn: mysql.Connection;
const people: Record<"lead" | "editor" | "finisher" | "ada" | "bram" | "outsider", FixturePerson> =
  {} as never;
let book: { id: number; slug: string; title: string };
let otherBook: { id: number; slug: string; title: string };
const ids: Record<string, number> = {};
let otherPieceId = 0;

const as = (who: FixturePerson | null) => {
  session.user = who;
};

async function list(query: string, slug = book.slug) {
  const response = await listRoute(
    new Request(`http://test/api/anthologies/${slug}/submissions?${query}`),
    {
      params: Promise.resolve({ slug }),
    },
  );
  return { status: response.status, body: (await response.json()) as ListBody };
}

/** The list answer, or the error answer, as the tests read it. */
type ListBody = {
  rows: { id: number }[];
  total: number;
  page: number;
  pageSize: number;
  fields: Record<string, string[]>;
};
type Outcome = { pieceId: number; changed: boolean; reason?: string };

/** The fixture names of the rows, in the order the API gave them. */
async function order(query: string) {
  const { status, body } = await list(query);
  expect(status, JSON.stringify(body)).toBe(200);
  const byId = Object.fromEntries(Object.entries(ids).map(([k, v]) => [v, k]));
  return (body.rows as { id: number }[]).map((r) => byId[r.id]);
}

type PostRoute<P> = (request: Request, context: { params: Promise<P> }) => Promise<Response>;

function post<P>(route: PostRoute<P>, url: string, params: P, body: unknown) {
  return route(
    new Request(url, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify(body),
    }),
    { params: Promise.resolve(params) },
  );
}

const bulk = (body: unknown, slug = book.slug) =>
  post(bulkRoute, `http://test/api/anthologies/${slug}/submissions/status`, { slug }, body);
const move = (pieceId: number | string, body: unknown) =>
  post(statusRoute, `http://test/api/pieces/${pieceId}/status`, { id: String(pieceId) }, body);

async function statusOf(pieceId: number) {
  const [rows] = await conn.query<mysql.RowDataPacket[]>("SELECT status FROM piece WHERE id = ?", [
    pieceId,
  ]);
  return rows[0]?.status as string;
}

beforeAll(async () => {
  conn = await connect();
  people.lead = await createPerson(conn, "Lior Vantongeren");
  people.editor = await createPerson(conn, "Esme Caddow");
  people.finisher = await createPerson(conn, "Fenn Marlowe");
  people.ada = await createPerson(conn, "Ada Quill");
  people.bram = await createPerson(conn, "Bram Oyelaran");
  people.outsider = await createPerson(conn, "Otto Brisk");
  book = await createAnthology(conn, "Brackish Water Review", people.lead.id, [
    { userId: people.lead.id, role: "lead" },
    { userId: people.editor.id, role: "editor" },
    { userId: people.finisher.id, role: "finisher" },
    { userId: people.ada.id, role: "contributor" },
    { userId: people.bram.id, role: "contributor" },
  ]);
  otherBook = await createAnthology(conn, "Other Shore Quarterly", people.outsider.id, [
    { userId: people.outsider.id, role: "lead" },
  ]);

  const t0 = Date.UTC(2031, 4, 1, 9, 0, 0);
  const at = (minutes: number) => new Date(t0 + minutes * 60_000);
  const ada = people.ada.id;
  const bram = people.bram.id;
  const pieces = {
    barnacle: {
      title: "Barnacle Census",
      contributorId: ada,
      kind: "single",
      pageCount: 1,
      inks: ["black"],
      verdict: "pass",
      status: "awaiting-review",
      creditLine: "Ada Quill",
      updatedAt: at(1),
    },
    cormorant: {
      title: "Cormorant Weather",
      contributorId: ada,
      kind: "spread",
      pageCount: 2,
      inks: ["black", "teal"],
      verdict: "warning",
      status: "shortlisted",
      creditLine: "A. Quill",
      updatedAt: at(2),
    },
    driftwood: {
      title: "Driftwood Index",
      contributorId: bram,
      kind: "run",
      pageCount: 4,
      inks: ["teal"],
      verdict: "blocker",
      status: "awaiting-review",
      creditLine: "Bram O.",
      updatedAt: at(3),
    },
    eelgrass: {
      title: "Eelgrass Lullaby",
      contributorId: bram,
      kind: "single",
      pageCount: 1,
      inks: ["black"],
      verdict: "missing",
      status: "fix-requested",
      creditLine: "Bram Oyelaran with the Tuesday tide club",
      updatedAt: at(4),
    },
    foghorn: {
      title: "Foghorn Choir",
      contributorId: ada,
      kind: "single",
      pageCount: 1,
      inks: ["black", "teal"],
      verdict: "note",
      status: "accepted",
      creditLine: "Ada Quill",
      updatedAt: at(5),
    },
    gull: {
      title: "Gull Ledger",
      contributorId: bram,
      kind: "spread",
      pageCount: 2,
      inks: ["black"],
      verdict: "pass",
      status: "declined",
      creditLine: "Bram Oyelaran",
      updatedAt: at(6),
    },
    heron: {
      title: "Heron 100% Study_2",
      contributorId: ada,
      kind: "single",
      pageCount: 1,
      inks: ["black"],
      verdict: "warning",
      status: "withdrawn",
      creditLine: "Ada Quill",
      updatedAt: at(7),
    },
  } as const;
  for (const [key, piece] of Object.entries(pieces))
    ids[key] = await createPiece(conn, book.id, { ...piece, inks: [...piece.inks] });
  otherPieceId = await createPiece(conn, otherBook.id, {
    title: "Across the Bay",
    contributorId: people.outsider.id,
  });
});

afterAll(async () => {
  if (conn) {
    await removeFixtures(
      conn,
      [book?.id, otherBook?.id].filter(Boolean) as number[],
      Object.values(people),
    );
    await conn.end();
  }
  await pool.end();
});

describe("who may read the submissions table", () => {
  it("answers 401 without a session", async () => {
    as(null);
    expect((await list("")).status).toBe(401);
  });
  it("answers 404 for an unknown anthology", async () => {
    as(people.lead);
    expect((await list("", "no-such-anthology-anywhere")).status).toBe(404);
  });
  it("refuses the finisher, a contributor and another anthology's lead with 403", async () => {
    for (const who of [people.finisher, people.ada, people.outsider]) {
      as(who);
      expect((await list("")).status, who.name).toBe(403);
    }
  });
  it("serves the lead and the editor", async () => {
    for (const who of [people.lead, people.editor]) {
      as(who);
      const { status, body } = await list("");
      expect(status).toBe(200);
      expect(body.total).toBe(7);
    }
  });
});

describe("paging, sorting and filtering, done by the database", () => {
  beforeAll(() => as(people.editor));

  it("lists the most recently changed first by default, with the total", async () => {
    const { body } = await list("");
    expect(body).toMatchObject({ total: 7, page: 1, pageSize: 25 });
    expect(await order("")).toEqual([
      "heron",
      "gull",
      "foghorn",
      "eelgrass",
      "driftwood",
      "cormorant",
      "barnacle",
    ]);
    const heron = body.rows[0];
    expect(heron).toMatchObject({
      title: "Heron 100% Study_2",
      kind: "single",
      pageCount: 1,
      inks: ["black"],
      verdict: "warning",
      status: "withdrawn",
      contributor: { id: people.ada.id, name: "Ada Quill", email: people.ada.email },
      updatedAt: "2031-05-01T09:07:00.000Z",
    });
  });

  it("pages through titles A to Z three at a time", async () => {
    expect(await order("sort=title&dir=asc&pageSize=3&page=1")).toEqual([
      "barnacle",
      "cormorant",
      "driftwood",
    ]);
    expect(await order("sort=title&dir=asc&pageSize=3&page=2")).toEqual([
      "eelgrass",
      "foghorn",
      "gull",
    ]);
    expect(await order("sort=title&dir=asc&pageSize=3&page=3")).toEqual(["heron"]);
    const past = await list("sort=title&dir=asc&pageSize=3&page=9");
    expect(past.body).toMatchObject({ rows: [], total: 7, page: 9 });
  });

  it("sorts by every column, ties broken by the order pieces came in", async () => {
    // contributor: Ada Quill (barnacle, cormorant, foghorn, heron) before Bram Oyelaran
    expect(await order("sort=contributor&dir=asc")).toEqual([
      "barnacle",
      "cormorant",
      "foghorn",
      "heron",
      "driftwood",
      "eelgrass",
      "gull",
    ]);
    expect(await order("sort=contributor&dir=desc")).toEqual([
      "driftwood",
      "eelgrass",
      "gull",
      "barnacle",
      "cormorant",
      "foghorn",
      "heron",
    ]);
    // kind in its natural order: one page, spread, run of pages
    expect(await order("sort=kind&dir=asc")).toEqual([
      "barnacle",
      "eelgrass",
      "foghorn",
      "heron",
      "cormorant",
      "gull",
      "driftwood",
    ]);
    expect(await order("sort=pages&dir=desc")).toEqual([
      "driftwood",
      "cormorant",
      "gull",
      "barnacle",
      "eelgrass",
      "foghorn",
      "heron",
    ]);
    // inks: fewer first, then by name (black before teal)
    expect(await order("sort=inks&dir=asc")).toEqual([
      "barnacle",
      "eelgrass",
      "gull",
      "heron",
      "driftwood",
      "cormorant",
      "foghorn",
    ]);
    // verdict, worst first: won't print, files missing, needs a look, notes only, meets the spec
    expect(await order("sort=verdict&dir=desc")).toEqual([
      "driftwood",
      "eelgrass",
      "cormorant",
      "heron",
      "foghorn",
      "barnacle",
      "gull",
    ]);
    // status in the order a piece moves through review
    expect(await order("sort=status&dir=asc")).toEqual([
      "barnacle",
      "driftwood",
      "eelgrass",
      "cormorant",
      "foghorn",
      "gull",
      "heron",
    ]);
    expect(await order("sort=updated&dir=asc")).toEqual([
      "barnacle",
      "cormorant",
      "driftwood",
      "eelgrass",
      "foghorn",
      "gull",
      "heron",
    ]);
  });

  it("filters by several statuses and several verdicts", async () => {
    expect(await order("status=awaiting-review,fix-requested")).toEqual([
      "eelgrass",
      "driftwood",
      "barnacle",
    ]);
    expect(await order("status=awaiting-review&status=fix-requested")).toEqual([
      "eelgrass",
      "driftwood",
      "barnacle",
    ]);
    expect(await order("verdict=warning&status=shortlisted,withdrawn")).toEqual([
      "heron",
      "cormorant",
    ]);
    expect(await order("verdict=pass,note")).toEqual(["gull", "foghorn", "barnacle"]);
    expect((await list("verdict=blocker&status=accepted")).body).toMatchObject({
      rows: [],
      total: 0,
    });
  });

  it("searches titles, contributor names and credit lines, case-insensitively and literally", async () => {
    expect(await order("q=tide%20club")).toEqual(["eelgrass"]);
    expect(await order("q=BRAM")).toEqual(["gull", "eelgrass", "driftwood"]);
    expect(await order("q=a.%20quill")).toEqual(["cormorant"]);
    // % and _ are letters in a search, not wildcards
    expect(await order("q=100%25")).toEqual(["heron"]);
    expect(await order("q=_")).toEqual(["heron"]);
  });

  it("combines search, filters, sort and paging, and counts the whole match", async () => {
    const query =
      "q=quill&status=awaiting-review,shortlisted,accepted&sort=title&dir=desc&pageSize=2";
    expect(await order(`${query}&page=1`)).toEqual(["foghorn", "cormorant"]);
    expect(await order(`${query}&page=2`)).toEqual(["barnacle"]);
    expect((await list(`${query}&page=2`)).body.total).toBe(3);
  });

  it("answers 400 naming each bad parameter", async () => {
    const { status, body } = await list(
      "page=0&pageSize=1000&sort=colour&dir=up&status=lost&verdict=fine",
    );
    expect(status).toBe(400);
    expect(Object.keys(body.fields).sort()).toEqual([
      "dir",
      "page",
      "pageSize",
      "sort",
      "status",
      "verdict",
    ]);
    expect(body.fields.status?.[0]).toMatch(/^"lost" is not a status/);
    expect(body.fields.pageSize).toEqual(["pageSize must be at most 100"]);
  });
});

describe("moving pieces", () => {
  it("moves many at once, refusing the ones that cannot go, each with its reason", async () => {
    as(people.editor);
    const response = await bulk({
      pieceIds: [ids.barnacle, ids.heron, ids.foghorn, ids.driftwood, 987654321, otherPieceId],
      to: "accepted",
      message: "Welcome aboard.",
      // The fixtures have no files; the warning about that is tested in accept-warning.test.ts.
      confirm: true,
    });
    expect(response.status).toBe(200);
    const body = (await response.json()) as { changed: Outcome[]; refused: Outcome[] };
    expect(body.changed.map((c) => c.pieceId)).toEqual([ids.barnacle, ids.driftwood]);
    expect(body.changed[0]).toMatchObject({
      from: "awaiting-review",
      to: "accepted",
      mailed: true,
    });
    const reasons = Object.fromEntries(body.refused.map((r) => [r.pieceId, r.reason]));
    expect(Object.keys(reasons).map(Number).sort()).toEqual(
      [ids.heron, ids.foghorn, 987654321, otherPieceId].sort(),
    );
    expect(reasons[ids.heron!]).toMatch(/withdrew/);
    expect(reasons[ids.foghorn!]).toMatch(/already "In the book"/);
    expect(reasons[987654321]).toMatch(/no such piece in this anthology/);
    expect(reasons[otherPieceId]).toMatch(/no such piece in this anthology/);

    expect(await statusOf(ids.barnacle!)).toBe("accepted");
    expect(await statusOf(ids.driftwood!)).toBe("accepted");
    expect(await statusOf(ids.heron!)).toBe("withdrawn");
    expect(await statusOf(otherPieceId)).toBe("awaiting-review");

    const [events] = await conn.query<mysql.RowDataPacket[]>(
      "SELECT piece_id, actor_id, from_status, to_status, message FROM piece_event WHERE piece_id IN (?) ORDER BY piece_id",
      [[ids.barnacle, ids.driftwood, ids.heron, ids.foghorn]],
    );
    expect(events).toEqual([
      {
        piece_id: ids.barnacle,
        actor_id: people.editor.id,
        from_status: "awaiting-review",
        to_status: "accepted",
        message: "Welcome aboard.",
      },
      {
        piece_id: ids.driftwood,
        actor_id: people.editor.id,
        from_status: "awaiting-review",
        to_status: "accepted",
        message: "Welcome aboard.",
      },
    ]);

    const toAda = await waitForMessage({ to: people.ada.email, subject: /Barnacle Census/ });
    expect(toAda.subject).toBe(`"Barnacle Census" is going in ${book.title}`);
    expect(toAda.text).toContain("Welcome aboard.");
    expect(toAda.text).toContain(`/studio/${book.slug}/my-pieces/${ids.barnacle}`);
    const toBram = await waitForMessage({ to: people.bram.email, subject: /Driftwood Index/ });
    expect(toBram.text).toContain("Hello Bram Oyelaran");

    const [log] = await conn.query<mysql.RowDataPacket[]>(
      "SELECT piece_id, kind, to_email, error FROM email_log WHERE anthology_id = ? ORDER BY piece_id",
      [book.id],
    );
    expect(log).toEqual([
      { piece_id: ids.barnacle, kind: "status-accepted", to_email: people.ada.email, error: null },
      {
        piece_id: ids.driftwood,
        kind: "status-accepted",
        to_email: people.bram.email,
        error: null,
      },
    ]);
  });

  it("refuses a bulk change from roles that cannot review, and bad bodies with field messages", async () => {
    as(people.finisher);
    expect((await bulk({ pieceIds: [ids.gull], to: "accepted" })).status).toBe(403);
    as(people.bram);
    expect((await bulk({ pieceIds: [ids.gull], to: "accepted" })).status).toBe(403);
    as(null);
    expect((await bulk({ pieceIds: [ids.gull], to: "accepted" })).status).toBe(401);
    as(people.editor);
    const empty = await bulk({ pieceIds: [], to: "sideways" });
    expect(empty.status).toBe(400);
    const fields = ((await empty.json()) as { fields: Record<string, string[]> }).fields;
    expect(Object.keys(fields).sort()).toEqual(["pieceIds", "to"]);
    const noReason = await bulk({ pieceIds: [ids.gull], to: "fix-requested", message: "   " });
    expect(noReason.status).toBe(400);
    expect(
      ((await noReason.json()) as { fields: Record<string, string[]> }).fields.message?.[0],
    ).toMatch(/Say what to fix/);
    expect(await statusOf(ids.gull!)).toBe("declined");
  });

  it("asks one contributor for a fix with the message, and the piece is open for a new file", async () => {
    as(people.lead);
    const response = await move(ids.cormorant!, {
      to: "fix-requested",
      from: "shortlisted",
      message: "The teal plate is 150 ppi; please send it at 300.",
    });
    expect(response.status).toBe(200);
    expect(await response.json()).toMatchObject({
      changed: true,
      from: "shortlisted",
      to: "fix-requested",
      mailed: true,
    });
    const mail = await waitForMessage({
      to: people.ada.email,
      subject: /A fix for "Cormorant Weather"/,
    });
    expect(mail.text).toContain("The teal plate is 150 ppi; please send it at 300.");
    expect(mail.text).toContain("Lior Vantongeren");
    const { mayUploadFiles } = await import("@/lib/pieces/status");
    expect(mayUploadFiles((await statusOf(ids.cormorant!)) as "fix-requested", false)).toBe(true);
  });

  it("refuses a single move that is not allowed, or that someone else overtook, with 409 and the reason", async () => {
    as(people.editor);
    const withdraw = await move(ids.gull!, { to: "withdrawn" });
    expect(withdraw.status).toBe(409);
    expect(((await withdraw.json()) as { error: string }).error).toMatch(
      /Only the contributor can withdraw/,
    );
    const stale = await move(ids.gull!, { to: "accepted", from: "shortlisted" });
    expect(stale.status).toBe(409);
    expect(((await stale.json()) as { error: string }).error).toMatch(/in the meantime/);
    expect(await statusOf(ids.gull!)).toBe("declined");
  });

  it("moves a piece back to be read again without e-mailing anyone", async () => {
    as(people.editor);
    const response = await move(ids.gull!, {
      to: "awaiting-review",
      message: "Second look after the meeting",
    });
    expect(response.status).toBe(200);
    expect(await response.json()).toMatchObject({
      changed: true,
      to: "awaiting-review",
      mailed: null,
    });
    const [log] = await conn.query<mysql.RowDataPacket[]>(
      "SELECT id FROM email_log WHERE piece_id = ?",
      [ids.gull],
    );
    expect(log).toHaveLength(0);
  });

  it("guards the single-piece route like the table", async () => {
    as(null);
    expect((await move(ids.gull!, { to: "accepted" })).status).toBe(401);
    as(people.editor);
    expect((await move(987654321, { to: "accepted" })).status).toBe(404);
    expect((await move("not-a-number", { to: "accepted" })).status).toBe(404);
    as(people.outsider);
    expect((await move(ids.gull!, { to: "accepted" })).status).toBe(403);
    as(people.bram);
    expect((await move(ids.gull!, { to: "accepted" })).status).toBe(403);
    expect(await statusOf(ids.gull!)).toBe("awaiting-review");
  });
});

describe("editors' notes", () => {
  const getNotes = (pieceId: number) =>
    notesRoute.GET(new Request(`http://test/api/pieces/${pieceId}/notes`), {
      params: Promise.resolve({ id: String(pieceId) }),
    });
  const addNote = (pieceId: number, body: unknown) =>
    post(notesRoute.POST, `http://test/api/pieces/${pieceId}/notes`, { id: String(pieceId) }, body);

  it("are added and listed newest first with their author", async () => {
    as(people.editor);
    expect(
      (await addNote(ids.foghorn!, { body: "Would open the tide section well." })).status,
    ).toBe(201);
    as(people.lead);
    const second = await addNote(ids.foghorn!, { body: "Agreed; page 3?" });
    expect(second.status).toBe(201);
    const response = await getNotes(ids.foghorn!);
    expect(response.status).toBe(200);
    const { notes } = (await response.json()) as {
      notes: { body: string; author: { name: string } }[];
    };
    expect(notes.map((n) => [n.body, n.author.name])).toEqual([
      ["Agreed; page 3?", "Lior Vantongeren"],
      ["Would open the tide section well.", "Esme Caddow"],
    ]);
  });

  it("refuse an empty note with a field message", async () => {
    as(people.editor);
    const response = await addNote(ids.foghorn!, { body: "  " });
    expect(response.status).toBe(400);
    expect(((await response.json()) as { fields: Record<string, string[]> }).fields.body?.[0]).toBe(
      "Write the note first",
    );
  });

  it("are closed to the piece's own contributor, the finisher, other anthologies and strangers", async () => {
    for (const who of [people.ada, people.finisher, people.outsider]) {
      as(who);
      expect((await getNotes(ids.foghorn!)).status, who.name).toBe(403);
      expect((await addNote(ids.foghorn!, { body: "sneaky" })).status, who.name).toBe(403);
    }
    as(null);
    expect((await getNotes(ids.foghorn!)).status).toBe(401);
    as(people.editor);
    expect((await getNotes(987654321)).status).toBe(404);
    const [rows] = await conn.query<mysql.RowDataPacket[]>(
      "SELECT COUNT(*) AS n FROM editor_note WHERE body = 'sneaky'",
    );
    expect(Number(rows[0]?.n)).toBe(0);
  });

  it("do not appear in the piece as its contributor reads it", async () => {
    const pieceRoute = await import("@/app/api/pieces/[id]/route");
    as(people.ada);
    const response = await pieceRoute.GET(new Request(`http://test/api/pieces/${ids.foghorn}`), {
      params: Promise.resolve({ id: String(ids.foghorn) }),
    });
    expect(response.status).toBe(200);
    const text = await response.text();
    expect(text).toContain("Foghorn Choir");
    expect(text).not.toContain("Would open the tide section well.");
    expect(text).not.toContain("Agreed; page 3?");
  });
});
