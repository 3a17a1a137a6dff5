// Backup and restore of Quireline's data: the database and the upload fake's files.
//
//   npm run db:backup                     → .data/backups/<timestamp>/
//   npm run db:restore -- <folder>        ← brings that folder back
//
// The database is DATABASE_URL when set, else the private MariaDB's `quireline` database (started
// if it is not running). The files are FAKE_DATA_DIR when set, else .data/fakes. The dump is taken
// first, with `mariadb-dump --single-transaction` (one consistent snapshot without locking the
// tables), then the files are copied: a file is always stored before the row that names it, so
// every file a dumped row names is in the copy. A manifest records each table's row count and
// each file's SHA-256, and restore checks the folder against it before it changes anything.
//
// Plain Node ESM with no dependencies beyond the MariaDB client tools.

import { spawnSync } from "node:child_process";
import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";

import * as mariadb from "./mariadb.mjs";

const say = (msg) => process.stdout.write(`[backup] ${msg}\n`);

export class BackupError extends Error {}

/** Where the data lives, from the environment. */
export async function target(env = process.env) {
  let url = env.DATABASE_URL;
  if (!url) {
    mariadb.ensureInstalled();
    await mariadb.ensureServer({ owner: "cli" });
    url = mariadb.ensureDatabase("quireline");
  }
  const u = new URL(url);
  const database = decodeURIComponent(u.pathname.replace(/^\//, ""));
  if (!/^[A-Za-z0-9_]{1,64}$/.test(database))
    throw new BackupError(`DATABASE_URL names no usable database: ${JSON.stringify(database)}`);
  return {
    database,
    host: u.hostname || "127.0.0.1",
    port: u.port || "3306",
    user: decodeURIComponent(u.username),
    password: decodeURIComponent(u.password),
    filesDir: path.resolve(env.FAKE_DATA_DIR || path.join(mariadb.ROOT, ".data", "fakes")),
  };
}

function client(t, name, args, input) {
  const r = spawnSync(
    mariadb.bin(name),
    ["--protocol=TCP", `--host=${t.host}`, `--port=${t.port}`, `--user=${t.user}`, ...args],
    {
      // The password goes by environment, not on the command line where `ps` shows it.
      env: { ...process.env, MYSQL_PWD: t.password },
      input,
      encoding: input === undefined ? "buffer" : "utf8",
      maxBuffer: 1024 * 1024 * 1024,
      timeout: 10 * 60_000,
    },
  );
  if (r.status !== 0)
    throw new BackupError(`${name} failed: ${String(r.stderr || r.error?.message || "").trim()}`);
  return r.stdout;
}

/** Row count of every table, sorted by name: what the manifest records and restore checks. */
export function tableCounts(t) {
  const tables = client(
    t,
    "mariadb",
    ["--batch", "--skip-column-names", t.database],
    "SHOW TABLES;",
  )
    .split("\n")
    .filter(Boolean)
    .sort();
  if (tables.length === 0) return {};
  const query = tables
    .map((name) => `SELECT '${name}', COUNT(*) FROM \`${name}\``)
    .join(" UNION ALL ");
  const out = client(t, "mariadb", ["--batch", "--skip-column-names", t.database], `${query};`);
  return Object.fromEntries(
    out
      .split("\n")
      .filter(Boolean)
      .map((line) => {
        const [name, n] = line.split("\t");
        return [name, Number(n)];
      }),
  );
}

function walk(dir, base = dir) {
  if (!fs.existsSync(dir)) return [];
  const out = [];
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) out.push(...walk(full, base));
    else if (entry.isFile()) out.push(path.relative(base, full));
  }
  return out.sort();
}

const sha256 = (file) => crypto.createHash("sha256").update(fs.readFileSync(file)).digest("hex");

/** SHA-256 of every file under a folder, by relative path; in-flight `.part` files are skipped. */
export function fileHashes(dir) {
  return Object.fromEntries(
    walk(dir)
      .filter((f) => !f.endsWith(".part"))
      .map((f) => [f, sha256(path.join(dir, f))]),
  );
}

function stamp(date = new Date()) {
  return date.toISOString().replace(/[:.]/g, "-");
}

/** Writes a backup folder and returns its path and manifest. */
export async function backup({ env = process.env, out } = {}) {
  const t = await target(env);
  const folder = path.resolve(out ?? path.join(mariadb.ROOT, ".data", "backups", stamp()));
  if (fs.existsSync(folder) && fs.readdirSync(folder).length > 0)
    throw new BackupError(`${folder} exists and is not empty; choose a new folder`);
  fs.mkdirSync(folder, { recursive: true });

  say(`dumping ${t.database} on ${t.host}:${t.port}`);
  const dump = client(t, "mariadb-dump", [
    "--single-transaction",
    "--quick",
    "--hex-blob",
    "--routines",
    "--triggers",
    "--skip-lock-tables",
    t.database,
  ]);
  fs.writeFileSync(path.join(folder, "database.sql"), dump);
  // Counted after the dump; writes in between would show as a mismatch, so say so rather than guess.
  const tables = tableCounts(t);

  say(`copying files from ${t.filesDir}`);
  const filesOut = path.join(folder, "files");
  fs.mkdirSync(filesOut, { recursive: true });
  for (const rel of walk(t.filesDir).filter((f) => !f.endsWith(".part"))) {
    fs.mkdirSync(path.dirname(path.join(filesOut, rel)), { recursive: true });
    fs.copyFileSync(path.join(t.filesDir, rel), path.join(filesOut, rel));
  }
  const manifest = {
    format: "quireline-backup/1",
    createdAt: new Date().toISOString(),
    database: t.database,
    databaseSha256: sha256(path.join(folder, "database.sql")),
    tables,
    files: fileHashes(filesOut),
  };
  fs.writeFileSync(path.join(folder, "manifest.json"), JSON.stringify(manifest, null, 2) + "\n");
  say(
    `wrote ${folder}: ${Object.keys(tables).length} tables, ${Object.values(tables).reduce((a, b) => a + b, 0)} rows, ${Object.keys(manifest.files).length} files`,
  );
  return { folder, manifest };
}

function readManifest(folder) {
  const file = path.join(folder, "manifest.json");
  if (!fs.existsSync(file))
    throw new BackupError(`${folder} has no manifest.json: not a backup folder`);
  const manifest = JSON.parse(fs.readFileSync(file, "utf8"));
  if (manifest.format !== "quireline-backup/1")
    throw new BackupError(`${folder}: unknown backup format ${JSON.stringify(manifest.format)}`);
  if (sha256(path.join(folder, "database.sql")) !== manifest.databaseSha256)
    throw new BackupError(
      `${folder}/database.sql does not match its manifest; it was changed or cut short`,
    );
  const files = fileHashes(path.join(folder, "files"));
  for (const [rel, hash] of Object.entries(manifest.files)) {
    if (files[rel] !== hash) throw new BackupError(`${folder}/files/${rel} is missing or changed`);
  }
  return manifest;
}

/** Brings a backup folder back: the database is replaced, then the files. */
export async function restore(folder, { env = process.env } = {}) {
  if (!folder) throw new BackupError("name the backup folder: npm run db:restore -- <folder>");
  const from = path.resolve(folder);
  const manifest = readManifest(from);
  const t = await target(env);

  say(`restoring ${t.database} from ${from}`);
  // Drop every table (the dump recreates them) rather than the database, which the app user may not recreate.
  const existing = client(
    t,
    "mariadb",
    ["--batch", "--skip-column-names", t.database],
    "SHOW TABLES;",
  )
    .split("\n")
    .filter(Boolean);
  if (existing.length) {
    client(
      t,
      "mariadb",
      [t.database],
      `SET FOREIGN_KEY_CHECKS=0; ${existing.map((n) => `DROP TABLE \`${n}\`;`).join(" ")} SET FOREIGN_KEY_CHECKS=1;`,
    );
  }
  client(t, "mariadb", [t.database], fs.readFileSync(path.join(from, "database.sql"), "utf8"));

  say(`restoring files into ${t.filesDir}`);
  // The upload fake reads its index from disk when the file changes, so a running fake sees this.
  fs.rmSync(t.filesDir, { recursive: true, force: true });
  fs.mkdirSync(t.filesDir, { recursive: true });
  fs.cpSync(path.join(from, "files"), t.filesDir, { recursive: true });

  const now = tableCounts(t);
  for (const [name, n] of Object.entries(manifest.tables)) {
    if (now[name] !== n)
      throw new BackupError(`after restore, ${name} has ${now[name]} rows, the backup ${n}`);
  }
  say(`restored ${Object.keys(now).length} tables and ${Object.keys(manifest.files).length} files`);
  return manifest;
}

async function main(argv) {
  const [cmd, ...rest] = argv.filter((a, i) => !(i === 1 && a === "--"));
  if (cmd === "backup") {
    const outIdx = rest.indexOf("--out");
    await backup({ out: outIdx >= 0 ? rest[outIdx + 1] : undefined });
    return 0;
  }
  if (cmd === "restore") {
    await restore(rest[0]);
    return 0;
  }
  console.error("usage: node scripts/backup.mjs backup [--out <folder>] | restore <folder>");
  return 2;
}

if (process.argv[1] && import.meta.url === pathToFileURL(fs.realpathSync(process.argv[1])).href) {
  main(process.argv.slice(2)).then(
    (code) => process.exit(code),
    (err) => {
      console.error(`[backup] ${err instanceof BackupError ? err.message : (err?.stack ?? err)}`);
      process.exit(1);
    },
  );
}
