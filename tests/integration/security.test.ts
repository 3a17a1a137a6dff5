// Security defects that let a visitor act as someone else or strain the server: cross-site writes
// through the route wrapper, oversized JSON bodies, and invitations accepted by the wrong account.
// Route modules are called directly with a mocked session; data is made fresh for this file.
import { createHash, randomBytes } from "node:crypto";
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
const { acceptInvitation } = await import("@/db/queries/invitations");
const { changeMemberRole } = await import("@/db/queries/anthologies");
const { MAX_JSON_BYTES } = await import("@/server/api");
const { pool } = await import("@/db");

let conn: mysql.Connection;
const people = {} as Record<"lead" | "editor" | "invitee" | "outsider", FixturePerson>;
let book: { id: number; slug: string; title: string };
let pieceId = 0;

function postNote(body: BodyInit, headers: Record<string, string> = {}) {
  return notesRoute.POST(
    new Request(`http://localhost:3100/api/pieces/${pieceId}/notes`, {
      method: "POST",
      headers: { "content-type": "application/json", ...headers },
      body,
      // Node's fetch needs this for a streamed body.
      ...(body instanceof ReadableStream ? { duplex: "half" } : {}),
    } as RequestInit),
    { params: Promise.resolve({ id: String(pieceId) }) },
  );
}

async function noteCount() {
  const [rows] = await conn.query<mysql.RowDataPacket[]>(
    "SELECT COUNT(*) AS n FROM editor_note WHERE piece_id = ?",
    [pieceId],
  );
  return Number(rows[0]!.n);
}

beforeAll(async () => {
  conn = await connect();
  people.lead = await createPerson(conn, "Wren Halloway");
  people.editor = await createPerson(conn, "Piet Amsel");
  people.invitee = await createPerson(conn, "Juno Castellan");
  people.outsider = await createPerson(conn, "Mallory Fisk");
  book = await createAnthology(conn, "Tidewrack Papers", people.lead.id, [
    { userId: people.lead.id, role: "lead" },
    { userId: people.editor.id, role: "editor" },
  ]);
  pieceId = await createPiece(conn, book.id, {
    title: "Eelgrass",
    contributorId: people.lead.id,
  });
});

afterAll(async () => {
  await removeFixtures(conn, [book.id], Object.values(people));
  await conn.end();
  await pool.end();
});

describe("cross-site writes through the route wrapper", () => {
  it("refuses a foreign Origin carrying a valid session, and saves nothing", async () => {
    session.user = people.editor;
    const before = await noteCount();
    const response = await postNote(JSON.stringify({ body: "planted by another site" }), {
      origin: "https://attacker.example",
    });
    expect(response.status).toBe(403);
    expect((await response.json()).code).toBe("cross-site");
    expect(await noteCount()).toBe(before);
  });

  it("refuses Sec-Fetch-Site: cross-site even without an Origin", async () => {
    session.user = people.editor;
    const response = await postNote(JSON.stringify({ body: "also planted" }), {
      "sec-fetch-site": "cross-site",
    });
    expect(response.status).toBe(403);
  });

  it("lets this site's own pages write", async () => {
    session.user = people.editor;
    const response = await postNote(JSON.stringify({ body: "Check the registration marks." }), {
      origin: "http://localhost:3100",
      "sec-fetch-site": "same-origin",
    });
    expect(response.status).toBe(201);
  });
});

describe("JSON body size", () => {
  it("refuses a declared body over the cap with 413 before reading it", async () => {
    session.user = people.editor;
    const big = JSON.stringify({ body: "x".repeat(MAX_JSON_BYTES + 10) });
    const response = await postNote(big);
    expect(response.status).toBe(413);
  });

  it("stops reading a streamed body with no length as soon as it passes the cap", async () => {
    session.user = people.editor;
    const chunk = new Uint8Array(64 * 1024).fill(0x78);
    let pulled = 0;
    const endless = new ReadableStream<Uint8Array>({
      pull(controller) {
        pulled += chunk.byteLength;
        // Would go on for 100 MB; the reader must give up after about 1 MB.
        if (pulled > 100 * 1024 * 1024) controller.close();
        else controller.enqueue(chunk);
      },
    });
    const response = await postNote(endless);
    expect(response.status).toBe(413);
    expect(pulled).toBeLessThan(MAX_JSON_BYTES + 4 * chunk.byteLength);
  });
});

describe("invitations are bound to the invited address", () => {
  async function invite(email: string, opts: { expiresAt?: Date } = {}) {
    const token = randomBytes(24).toString("base64url");
    await conn.query(
      `INSERT INTO invitation (anthology_id, email, role, token_hash, invited_by, expires_at, created_at)
       VALUES (?, ?, 'editor', ?, ?, ?, NOW(3))`,
      [
        book.id,
        email,
        createHash("sha256").update(token).digest("hex"),
        people.lead.id,
        opts.expiresAt ?? new Date(Date.now() + 86_400_000),
      ],
    );
    return token;
  }

  async function roleOf(userId: string) {
    const [rows] = await conn.query<mysql.RowDataPacket[]>(
      "SELECT role FROM membership WHERE anthology_id = ? AND user_id = ?",
      [book.id, userId],
    );
    return (rows[0]?.role as string | undefined) ?? null;
  }

  it("refuses an outsider who opens someone else's editor invitation", async () => {
    const token = await invite(people.invitee.email);
    expect(await acceptInvitation(token, people.outsider.id)).toEqual({
      ok: false,
      reason: "other-address",
    });
    expect(await roleOf(people.outsider.id)).toBeNull();
  });

  it("asks an account whose address was never confirmed to confirm it first", async () => {
    const token = await invite(people.invitee.email);
    await conn.query("UPDATE user SET emailVerified = NULL WHERE id = ?", [people.invitee.id]);
    expect(await acceptInvitation(token, people.invitee.id)).toEqual({
      ok: false,
      reason: "unconfirmed",
    });
    await conn.query("UPDATE user SET emailVerified = NOW(3) WHERE id = ?", [people.invitee.id]);
  });

  it("lets the invited, confirmed address accept once, and never again", async () => {
    const token = await invite(people.invitee.email.toUpperCase());
    expect(await acceptInvitation(token, people.invitee.id)).toMatchObject({ ok: true });
    expect(await roleOf(people.invitee.id)).toBe("editor");
    expect(await acceptInvitation(token, people.invitee.id)).toEqual({
      ok: false,
      reason: "used",
    });
  });

  it("refuses an expired or revoked invitation", async () => {
    const expired = await invite(people.outsider.email, { expiresAt: new Date(Date.now() - 1000) });
    expect(await acceptInvitation(expired, people.outsider.id)).toEqual({
      ok: false,
      reason: "expired",
    });
    const revoked = await invite(people.outsider.email);
    await conn.query("UPDATE invitation SET revoked_at = NOW() WHERE token_hash = ?", [
      createHash("sha256").update(revoked).digest("hex"),
    ]);
    expect(await acceptInvitation(revoked, people.outsider.id)).toEqual({
      ok: false,
      reason: "revoked",
    });
    expect(await roleOf(people.outsider.id)).toBeNull();
  });
});

describe("removing a role", () => {
  async function sessionVersion(userId: string) {
    const [rows] = await conn.query<mysql.RowDataPacket[]>(
      "SELECT session_version AS v FROM user WHERE id = ?",
      [userId],
    );
    return Number(rows[0]!.v);
  }

  it("keeps the last lead, and ends the sessions of a person who is removed", async () => {
    expect(await changeMemberRole(book.id, people.lead.id, "editor")).toEqual({
      ok: false,
      reason: "last-lead",
    });
    const before = await sessionVersion(people.editor.id);
    expect(await changeMemberRole(book.id, people.editor.id, null)).toEqual({ ok: true });
    expect(await sessionVersion(people.editor.id)).toBe(before + 1);
    const [rows] = await conn.query<mysql.RowDataPacket[]>(
      "SELECT COUNT(*) AS n FROM membership WHERE anthology_id = ? AND user_id = ?",
      [book.id, people.editor.id],
    );
    expect(Number(rows[0]!.n)).toBe(0);
  });
});
