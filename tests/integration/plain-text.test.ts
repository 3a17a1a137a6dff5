// Text with a NUL byte or a lone surrogate is refused at the route with a field message and never
// reaches the database (where a NUL would be kept invisibly and a lone surrogate silently turned
// into U+FFFD). The route module is called directly with a mocked session; data is made fresh.
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

const notesRoute = await import("@/app/api/pieces/[id]/notes/route");
const { pool } = await import("@/db");

let conn: mysql.Connection;
let editor: FixturePerson;
let contributor: FixturePerson;
let book: { id: number; slug: string; title: string };
let pieceId = 0;

function addNote(body: unknown) {
  return notesRoute.POST(
    new Request(`http://test/api/pieces/${pieceId}/notes`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      // JSON.stringify writes NUL as \u0000 and a lone surrogate as \ud800: valid JSON for both.
      body: JSON.stringify(body),
    }),
    { params: Promise.resolve({ id: String(pieceId) }) },
  );
}

async function storedNotes(): Promise<string[]> {
  const [rows] = await conn.query<mysql.RowDataPacket[]>(
    "SELECT body FROM editor_note WHERE piece_id = ? ORDER BY id",
    [pieceId],
  );
  return rows.map((r) => r.body as string);
}

beforeAll(async () => {
  conn = await connect();
  editor = await createPerson(conn, "Ines Farraday");
  contributor = await createPerson(conn, "Tobin Achterberg");
  book = await createAnthology(conn, "Quiet Harbour Sheets", editor.id, [
    { userId: editor.id, role: "lead" },
    { userId: contributor.id, role: "contributor" },
  ]);
  pieceId = await createPiece(conn, book.id, {
    title: "Lamp at the Slipway",
    contributorId: contributor.id,
  });
  session.user = editor;
});

afterAll(async () => {
  await removeFixtures(conn, [book.id], [editor, contributor]);
  await conn.end();
  await pool.end();
});

describe("an editors' note", () => {
  it("with a NUL byte is refused with 400 and a message on body, and nothing is stored", async () => {
    const response = await addNote({ body: "Check the gutter\u0000 on page 2" });
    const answer = (await response.json()) as { fields?: Record<string, string[]> };
    expect(response.status, JSON.stringify(answer)).toBe(400);
    expect(answer.fields?.body).toEqual([
      "Remove the invisible control character (NUL) from this text.",
    ]);
    expect(await storedNotes()).toEqual([]);
  });

  it("with a lone surrogate is refused with 400 and a message on body, and nothing is stored", async () => {
    const response = await addNote({ body: "Lovely heron \ud83d" });
    const answer = (await response.json()) as { fields?: Record<string, string[]> };
    expect(response.status, JSON.stringify(answer)).toBe(400);
    expect(answer.fields?.body).toEqual([
      "This text has a broken character (a lone surrogate); retype it.",
    ]);
    expect(await storedNotes()).toEqual([]);
  });

  it("in plain text, line breaks and a four-byte character included, is stored as written", async () => {
    const body = "Lovely heron 🐟\nAsk for 3 mm bleed on page 2.";
    const response = await addNote({ body });
    expect(response.status, JSON.stringify(await response.clone().json())).toBe(201);
    expect(await storedNotes()).toEqual([body]);
  });
});
