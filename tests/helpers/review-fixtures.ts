// Builds review fixtures straight in the database: people, an anthology with members, pieces.
// Used by the review tests so they never depend on another part's demo seed.
import mysql from "mysql2/promise";
import { randomUUID } from "node:crypto";
import { mysqlOptions } from "./env";
import { uniqueEmail } from "./demo";

export type FixturePerson = { id: string; name: string; email: string };

export type FixturePiece = {
  title: string;
  contributorId: string;
  kind?: "single" | "spread" | "run";
  pageCount?: number;
  inks?: string[];
  verdict?: "blocker" | "missing" | "warning" | "note" | "pass";
  status?:
    "awaiting-review" | "fix-requested" | "shortlisted" | "accepted" | "declined" | "withdrawn";
  creditLine?: string;
  updatedAt?: Date;
};

/** A connection to the test database named by DATABASE_URL. Close it with `end()`. */
export function connect() {
  return mysql.createConnection(mysqlOptions());
}

export async function createPerson(
  conn: mysql.Connection,
  name: string,
  label = name.split(" ")[0]!.toLowerCase(),
): Promise<FixturePerson> {
  const person = { id: randomUUID(), name, email: uniqueEmail(label) };
  await conn.query(
    "INSERT INTO user (id, name, email, emailVerified, created_at) VALUES (?, ?, ?, NOW(3), NOW(3))",
    [person.id, person.name, person.email],
  );
  return person;
}

/** An anthology with the given members; its slug is unique to this run. */
export async function createAnthology(
  conn: mysql.Connection,
  title: string,
  createdBy: string,
  members: { userId: string; role: "lead" | "editor" | "finisher" | "contributor" }[],
): Promise<{ id: number; slug: string; title: string }> {
  const slug =
    `${title.toLowerCase().replace(/[^a-z0-9]+/g, "-")}-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`.slice(
      0,
      80,
    );
  const [result] = await conn.query<mysql.ResultSetHeader>(
    `INSERT INTO anthology (slug, title, press_name, stage, trim_preset, trim_width_mm, trim_height_mm, bleed_mm, safe_margin_mm,
       binding, page_count_target, max_pages, cover_stock, paper_gsm, paper_caliper_mm, print_method, inks, inks_per_pass,
       min_ppi, currency, map_version, created_by, created_at, updated_at)
     VALUES (?, ?, 'Test press', 'call-open', 'a6', 105, 148, 3, 5, 'saddle-stitch', 16, 32, 'self', 80, 0.1, 'duplicator',
       '["black","teal"]', 1, 300, 'USD', 0, ?, NOW(3), NOW(3))`,
    [slug, title, createdBy],
  );
  const id = result.insertId;
  for (const member of members) {
    await conn.query(
      "INSERT INTO membership (anthology_id, user_id, role, created_at) VALUES (?, ?, ?, NOW(3))",
      [id, member.userId, member.role],
    );
  }
  return { id, slug, title };
}

export async function createPiece(
  conn: mysql.Connection,
  anthologyId: number,
  piece: FixturePiece,
): Promise<number> {
  const updatedAt = piece.updatedAt ?? new Date();
  const [result] = await conn.query<mysql.ResultSetHeader>(
    `INSERT INTO piece (anthology_id, contributor_id, title, kind, page_count, inks, credit_line, status, verdict, left_out, created_at, updated_at)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, 0, ?, ?)`,
    [
      anthologyId,
      piece.contributorId,
      piece.title,
      piece.kind ?? "single",
      piece.pageCount ?? 1,
      JSON.stringify(piece.inks ?? ["black"]),
      piece.creditLine ?? piece.title,
      piece.status ?? "awaiting-review",
      piece.verdict ?? "missing",
      updatedAt,
      updatedAt,
    ],
  );
  return result.insertId;
}

/** Removes anthologies (pieces, notes and history go with them), their mail log and the people. */
export async function removeFixtures(
  conn: mysql.Connection,
  anthologyIds: number[],
  people: FixturePerson[],
) {
  if (anthologyIds.length) {
    await conn.query("DELETE FROM email_log WHERE anthology_id IN (?)", [anthologyIds]);
    await conn.query("DELETE FROM anthology WHERE id IN (?)", [anthologyIds]);
  }
  if (people.length)
    await conn.query("DELETE FROM user WHERE id IN (?)", [people.map((p) => p.id)]);
}

/** Adds a person to an existing anthology (found by slug) with a role. */
export async function addMember(
  conn: mysql.Connection,
  slug: string,
  userId: string,
  role: "lead" | "editor" | "finisher" | "contributor",
) {
  const [rows] = await conn.query<mysql.RowDataPacket[]>(
    "SELECT id FROM anthology WHERE slug = ?",
    [slug],
  );
  const id = rows[0]?.id as number | undefined;
  if (!id) throw new Error(`no anthology ${slug}: seed the demo first`);
  await conn.query(
    "INSERT INTO membership (anthology_id, user_id, role, created_at) VALUES (?, ?, ?, NOW(3))",
    [id, userId, role],
  );
  return id;
}

/** Removes pieces (with their history, notes and mail log) and then the people who sent them. */
export async function removePiecesAndPeople(
  conn: mysql.Connection,
  pieceIds: number[],
  people: FixturePerson[],
) {
  if (pieceIds.length) {
    await conn.query("DELETE FROM email_log WHERE piece_id IN (?)", [pieceIds]);
    await conn.query("DELETE FROM piece WHERE id IN (?)", [pieceIds]);
  }
  if (people.length)
    await conn.query("DELETE FROM user WHERE id IN (?)", [people.map((p) => p.id)]);
}
