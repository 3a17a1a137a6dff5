// Accepting a piece that cannot print (no files, pages still without a file, a file whose report
// has a blocker) answers 409 with the reason and `needsConfirm`, moves nothing, and goes ahead
// once the request carries `confirm: true`; one piece at a time and in bulk.
import type mysql from "mysql2/promise";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
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

const { POST: bulkRoute } = await import("@/app/api/anthologies/[slug]/submissions/status/route");
const { POST: statusRoute } = await import("@/app/api/pieces/[id]/status/route");
const { pool } = await import("@/db");

let conn: mysql.Connection;
let editor: FixturePerson;
let poet: FixturePerson;
let book: { id: number; slug: string; title: string };
const ids: Record<"bare" | "half" | "blocked" | "sound" | "bulkBare" | "bulkSound", number> =
  {} as never;

/** Pages for a piece; the first `withFiles` get a current file whose report has `verdict`. */
async function addPages(pieceId: number, pages: number, withFiles: number, verdict = "pass") {
  for (let index = 1; index <= pages; index++) {
    const [page] = await conn.query<mysql.ResultSetHeader>(
      "INSERT INTO piece_page (piece_id, page_index, revision) VALUES (?, ?, 0)",
      [pieceId, index],
    );
    if (index > withFiles) continue;
    const [version] = await conn.query<mysql.ResultSetHeader>(
      `INSERT INTO file_version (piece_page_id, version_number, storage_key, file_name, mime_type, size_bytes, report, verdict, uploaded_by, created_at)
       VALUES (?, 1, ?, 'page.png', 'image/png', 1000, '{}', ?, ?, NOW(3))`,
      [page.insertId, `test-${pieceId}-${index}`, verdict, poet.id],
    );
    await conn.query("UPDATE piece_page SET current_version_id = ? WHERE id = ?", [
      version.insertId,
      page.insertId,
    ]);
  }
}

function post<P>(
  route: (r: Request, c: { params: Promise<P> }) => Promise<Response>,
  params: P,
  body: unknown,
) {
  return route(
    new Request("http://test/api/status", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify(body),
    }),
    { params: Promise.resolve(params) },
  );
}
const move = (pieceId: number, body: unknown) => post(statusRoute, { id: String(pieceId) }, body);
const bulk = (body: unknown) => post(bulkRoute, { slug: book.slug }, body);

async function statusOf(pieceId: number) {
  const [rows] = await conn.query<mysql.RowDataPacket[]>("SELECT status FROM piece WHERE id = ?", [
    pieceId,
  ]);
  return rows[0]?.status as string;
}

type Warning = { error: string; warning: string; needsConfirm: boolean; pieces: unknown[] };

beforeAll(async () => {
  conn = await connect();
  editor = await createPerson(conn, "Nell Hargreave");
  poet = await createPerson(conn, "Piet Scallon");
  book = await createAnthology(conn, "Saltmarsh Broadsides", editor.id, [
    { userId: editor.id, role: "editor" },
    { userId: poet.id, role: "contributor" },
  ]);
  const piece = (title: string, pageCount: number, verdict: "missing" | "blocker" | "pass") =>
    createPiece(conn, book.id, { title, contributorId: poet.id, pageCount, verdict });
  ids.bare = await piece("Bare Bones", 1, "missing");
  await addPages(ids.bare, 1, 0);
  ids.half = await piece("Half Tide", 2, "missing");
  await addPages(ids.half, 2, 1);
  ids.blocked = await piece("Blocked Drain", 1, "blocker");
  await addPages(ids.blocked, 1, 1, "blocker");
  ids.sound = await piece("Sound Hull", 1, "pass");
  await addPages(ids.sound, 1, 1);
  ids.bulkBare = await piece("Empty Creel", 1, "missing");
  await addPages(ids.bulkBare, 1, 0);
  ids.bulkSound = await piece("Full Creel", 1, "pass");
  await addPages(ids.bulkSound, 1, 1);
  session.user = editor;
});

afterAll(async () => {
  if (conn) {
    await removeFixtures(conn, book ? [book.id] : [], [editor, poet].filter(Boolean));
    await conn.end();
  }
  await pool.end();
});

describe("accepting one piece that cannot print", () => {
  it("warns about a piece with no files, and accepts it once confirmed", async () => {
    const first = await move(ids.bare, { to: "accepted" });
    expect(first.status).toBe(409);
    const body = (await first.json()) as Warning;
    expect(body.needsConfirm).toBe(true);
    expect(body.warning).toBe("“Bare Bones” has no files yet, so nothing of it can go to print.");
    expect(await statusOf(ids.bare)).toBe("awaiting-review");

    const confirmed = await move(ids.bare, { to: "accepted", confirm: true });
    expect(confirmed.status).toBe(200);
    expect(await statusOf(ids.bare)).toBe("accepted");
  });

  it("warns about pages still without a file and about a file that won't print", async () => {
    const half = await move(ids.half, { to: "accepted" });
    expect(half.status).toBe(409);
    expect(((await half.json()) as Warning).warning).toBe(
      "“Half Tide” still has 1 of 2 pages without a file.",
    );
    const blocked = await move(ids.blocked, { to: "accepted" });
    expect(blocked.status).toBe(409);
    expect(((await blocked.json()) as Warning).warning).toMatch(
      /^“Blocked Drain” has a file that won't print/,
    );
    expect(await statusOf(ids.half)).toBe("awaiting-review");
    expect(await statusOf(ids.blocked)).toBe("awaiting-review");
  });

  it("accepts a piece whose files print without asking, and other moves never ask", async () => {
    expect((await move(ids.sound, { to: "accepted" })).status).toBe(200);
    expect((await move(ids.half, { to: "shortlisted" })).status).toBe(200);
  });

  it("refuses a confirm flag that is not true or false", async () => {
    const response = await move(ids.half, { to: "accepted", confirm: "yes" });
    expect(response.status).toBe(400);
  });
});

describe("accepting several pieces at once", () => {
  it("moves nothing while one of them cannot print, naming it, and all once confirmed", async () => {
    const first = await bulk({ pieceIds: [ids.bulkBare, ids.bulkSound], to: "accepted" });
    expect(first.status).toBe(409);
    const body = (await first.json()) as Warning;
    expect(body.needsConfirm).toBe(true);
    expect(body.warning).toBe("“Empty Creel” has no files yet, so nothing of it can go to print.");
    expect(body.pieces).toEqual([{ pieceId: ids.bulkBare, warning: body.warning }]);
    expect(await statusOf(ids.bulkBare)).toBe("awaiting-review");
    expect(await statusOf(ids.bulkSound)).toBe("awaiting-review");

    const confirmed = await bulk({
      pieceIds: [ids.bulkBare, ids.bulkSound],
      to: "accepted",
      confirm: true,
    });
    expect(confirmed.status).toBe(200);
    const moved = (await confirmed.json()) as { changed: { pieceId: number }[] };
    expect(moved.changed.map((c) => c.pieceId)).toEqual([ids.bulkBare, ids.bulkSound]);
  });

  it("names every piece that cannot print", async () => {
    const response = await bulk({ pieceIds: [ids.half, ids.blocked], to: "accepted" });
    expect(response.status).toBe(409);
    const body = (await response.json()) as Warning;
    expect(body.warning).toMatch(/^2 of these pieces may not print as they are: /);
    expect(body.pieces).toHaveLength(2);
  });
});
