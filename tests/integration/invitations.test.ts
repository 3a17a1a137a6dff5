// Inviting by e-mail: a body the invitation column cannot hold is a 400 with a field message, never
// a database error. The route module is called directly with a mocked session; data is made fresh.
import type mysql from "mysql2/promise";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { uniqueEmail } from "../helpers/demo";
import {
  connect,
  createAnthology,
  createPerson,
  removeFixtures,
  type FixturePerson,
} from "../helpers/review-fixtures";

const session = vi.hoisted(() => ({
  user: null as null | { id: string; name: string; email: string },
}));
vi.mock("@/auth", () => ({ auth: async () => (session.user ? { user: session.user } : null) }));

const { POST: inviteRoute } = await import("@/app/api/anthologies/[slug]/invitations/route");
const { pool } = await import("@/db");

let conn: mysql.Connection;
let lead: FixturePerson;
let book: { id: number; slug: string; title: string };

function invite(body: unknown) {
  return inviteRoute(
    new Request(`http://test/api/anthologies/${book.slug}/invitations`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify(body),
    }),
    { params: Promise.resolve({ slug: book.slug }) },
  );
}

async function invitationsTo(email: string) {
  const [rows] = await conn.query<mysql.RowDataPacket[]>(
    "SELECT email FROM invitation WHERE anthology_id = ? AND email = ?",
    [book.id, email],
  );
  return rows.length;
}

beforeAll(async () => {
  conn = await connect();
  lead = await createPerson(conn, "Maren Ostrowe");
  book = await createAnthology(conn, "Tideline Ledger", lead.id, [
    { userId: lead.id, role: "lead" },
  ]);
  session.user = lead;
});

afterAll(async () => {
  await removeFixtures(conn, [book.id], [lead]);
  await conn.end();
  await pool.end();
});

describe("inviting by e-mail", () => {
  it("refuses a 300-character e-mail with 400 and a message on the e-mail field, storing nothing", async () => {
    // invitation.email is varchar(255); this one is 300 characters long.
    const email = `${"k".repeat(300 - "@example.org".length)}@example.org`;
    expect(email).toHaveLength(300);
    const response = await invite({ email, role: "contributor" });
    const body = (await response.json()) as { error: string; fields: Record<string, string[]> };
    expect(response.status, JSON.stringify(body)).toBe(400);
    expect(body.fields.email).toEqual(["At most 255 characters"]);
    expect(await invitationsTo(email)).toBe(0);
  });

  it("still invites an ordinary address (201)", async () => {
    const email = uniqueEmail("pell");
    const response = await invite({ email, role: "contributor" });
    expect(response.status, JSON.stringify(await response.clone().json())).toBe(201);
    expect(await invitationsTo(email)).toBe(1);
  });
});
