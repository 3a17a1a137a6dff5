// `npm run db:backup` and `npm run db:restore`, run as a user would, against a database and a
// files folder of this test's own (so the rest of the suite's data is never touched).
import { execFileSync, spawnSync } from "node:child_process";
import crypto from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import mysql from "mysql2/promise";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { assertTestDatabase, testEnv } from "../helpers/env";

assertTestDatabase();
const dbName = `${new URL(testEnv.databaseUrl).pathname.slice(1)}_backup${process.pid}`;
const dbUrl = (() => {
  const u = new URL(testEnv.databaseUrl);
  u.pathname = `/${dbName}`;
  return u.toString();
})();
const work = fs.mkdtempSync(path.join(os.tmpdir(), "quireline-backup-"));
const filesDir = path.join(work, "fakes");
const env = { ...process.env, DATABASE_URL: dbUrl, FAKE_DATA_DIR: filesDir };
let conn: mysql.Connection;

function run(...args: string[]) {
  return spawnSync(process.execPath, ["scripts/backup.mjs", ...args], { env, encoding: "utf8" });
}

async function checksums(): Promise<Record<string, string>> {
  const [tables] = await conn.query("SHOW TABLES");
  const names = (tables as Record<string, string>[]).map((r) => Object.values(r)[0]!).sort();
  const out: Record<string, string> = {};
  for (const name of names) {
    // CHECKSUM TABLE covers every column of every row (MariaDB KB, "CHECKSUM TABLE").
    const [rows] = await conn.query(`CHECKSUM TABLE \`${name}\``);
    out[name] = String((rows as { Checksum: unknown }[])[0]!.Checksum);
  }
  return out;
}

function hashes(dir: string): Record<string, string> {
  const out: Record<string, string> = {};
  const walk = (d: string) => {
    for (const e of fs.readdirSync(d, { withFileTypes: true })) {
      const full = path.join(d, e.name);
      if (e.isDirectory()) walk(full);
      else
        out[path.relative(dir, full)] = crypto
          .createHash("sha256")
          .update(fs.readFileSync(full))
          .digest("hex");
    }
  };
  walk(dir);
  return out;
}

beforeAll(async () => {
  const admin = await mysql.createConnection({ uri: testEnv.databaseUrl });
  await admin.query(
    `CREATE DATABASE \`${dbName}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
  );
  await admin.end();
  execFileSync(process.execPath, ["--import", "tsx", "db/migrate.ts"], { env, stdio: "pipe" });
  conn = await mysql.createConnection({ uri: dbUrl, multipleStatements: true });

  // Rows with text in several scripts, a NULL, a date and a binary thumbnail.
  await conn.query(
    "INSERT INTO user (id, name, email, session_version) VALUES ('u-1', 'Ysolde Marrow', 'ysolde@example.test', 0), ('u-2', 'محمد الساحل 🌊', 'm@example.test', 0)",
  );
  await conn.query(
    `INSERT INTO anthology (slug, title, trim_preset, trim_width_mm, trim_height_mm, bleed_mm, safe_margin_mm, binding,
      page_count_target, max_pages, cover_stock, paper_gsm, paper_caliper_mm, print_method, inks, min_ppi, created_by, created_at, updated_at)
     VALUES ('brine', 'Brine & Ink', 'half-letter', 139.7, 215.9, 3.175, 6.35, 'saddle-stitch', 16, 32, 'self', 90, 0.11,
      'duplicator', '["black"]', 300, 'u-1', NOW(3), NOW(3))`,
  );
  const [anth] = await conn.query("SELECT id FROM anthology WHERE slug = 'brine'");
  const anthologyId = (anth as { id: number }[])[0]!.id;
  await conn.query(
    `INSERT INTO piece (anthology_id, contributor_id, title, kind, page_count, inks, credit_line, status, verdict, left_out, created_at, updated_at)
     VALUES (?, 'u-2', 'Salt Flats', 'single', 1, '["black"]', 'محمد الساحل', 'accepted', 'pass', 0, NOW(3), NOW(3))`,
    [anthologyId],
  );
  const [piece] = await conn.query("SELECT id FROM piece WHERE title = 'Salt Flats'");
  const pieceId = (piece as { id: number }[])[0]!.id;
  await conn.query("INSERT INTO piece_page (piece_id, page_index, revision) VALUES (?, 1, 0)", [
    pieceId,
  ]);
  const [page] = await conn.query("SELECT id FROM piece_page WHERE piece_id = ?", [pieceId]);
  await conn.query(
    `INSERT INTO file_version (piece_page_id, version_number, storage_key, file_name, mime_type, size_bytes, report, verdict, thumbnail_webp, uploaded_by, created_at)
     VALUES (?, 1, 'key-1', 'salt.png', 'image/png', 3, '{}', 'pass', ?, 'u-2', NOW(3))`,
    [(page as { id: number }[])[0]!.id, crypto.randomBytes(2048)],
  );

  fs.mkdirSync(path.join(filesDir, "files"), { recursive: true });
  fs.writeFileSync(path.join(filesDir, "files", "key-1"), crypto.randomBytes(50_000));
  fs.writeFileSync(path.join(filesDir, "files", "key-2"), crypto.randomBytes(10_000));
  fs.writeFileSync(path.join(filesDir, "index.json"), JSON.stringify({ version: 1, files: [] }));
  fs.writeFileSync(path.join(filesDir, "outbox.jsonl"), '{"subject":"Spec check"}\n');
}, 120_000);

afterAll(async () => {
  await conn?.query(`DROP DATABASE IF EXISTS \`${dbName}\``);
  await conn?.end();
  fs.rmSync(work, { recursive: true, force: true });
});

describe("backup and restore", () => {
  it("brings back every row and file after changes and deletions", async () => {
    const before = await checksums();
    const filesBefore = hashes(filesDir);
    const folder = path.join(work, "backup-1");

    const made = run("backup", "--out", folder);
    expect(made.status, made.stderr).toBe(0);
    const manifest = JSON.parse(fs.readFileSync(path.join(folder, "manifest.json"), "utf8"));
    expect(manifest.tables.user).toBe(2);
    expect(manifest.tables.file_version).toBe(1);
    expect(Object.keys(manifest.files).sort()).toEqual(Object.keys(filesBefore).sort());

    // Change, delete and add, in the database and in the files.
    await conn.query("UPDATE user SET name = 'Someone Else' WHERE id = 'u-1'");
    await conn.query("DELETE FROM file_version");
    await conn.query("DELETE FROM piece");
    await conn.query(
      "INSERT INTO user (id, name, email, session_version) VALUES ('u-3', 'Late', 'late@example.test', 0)",
    );
    fs.rmSync(path.join(filesDir, "files", "key-1"));
    fs.writeFileSync(path.join(filesDir, "files", "key-2"), "overwritten");
    fs.writeFileSync(path.join(filesDir, "files", "key-3"), "new since the backup");
    expect(await checksums()).not.toEqual(before);

    const restored = run("restore", folder);
    expect(restored.status, restored.stderr).toBe(0);
    expect(await checksums()).toEqual(before);
    expect(hashes(filesDir)).toEqual(filesBefore);
    const [names] = await conn.query("SELECT name FROM user ORDER BY id");
    expect((names as { name: string }[]).map((r) => r.name)).toEqual([
      "Ysolde Marrow",
      "محمد الساحل 🌊",
    ]);
  }, 120_000);

  it("refuses a backup folder that was changed, and changes nothing", async () => {
    const folder = path.join(work, "backup-2");
    expect(run("backup", "--out", folder).status).toBe(0);
    const before = await checksums();
    fs.appendFileSync(path.join(folder, "database.sql"), "\nDROP TABLE user;\n");
    const refused = run("restore", folder);
    expect(refused.status).toBe(1);
    expect(refused.stderr).toContain("does not match its manifest");
    expect(await checksums()).toEqual(before);

    const notABackup = run("restore", work);
    expect(notABackup.status).toBe(1);
    expect(notABackup.stderr).toContain("not a backup folder");
  }, 120_000);

  it("will not write into a folder that already holds something", () => {
    const folder = path.join(work, "backup-2");
    const refused = run("backup", "--out", folder);
    expect(refused.status).toBe(1);
    expect(refused.stderr).toContain("is not empty");
  });
});
