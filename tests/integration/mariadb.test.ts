import mysql from "mysql2/promise";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { assertTestDatabase, mysqlOptions, testEnv } from "../helpers/env";

type Row = Record<string, unknown>;

describe("the test database server", () => {
  let conn: mysql.Connection;
  const dbName = assertTestDatabase();

  beforeAll(async () => {
    conn = await mysql.createConnection(mysqlOptions());
  });
  afterAll(async () => {
    await conn?.end();
  });

  async function one(sql: string, params: unknown[] = []): Promise<Row> {
    const [rows] = await conn.query(sql, params);
    const row = (rows as Row[])[0];
    if (!row) throw new Error(`no row from ${sql}`);
    return row;
  }

  it("is connected to the test database named in DATABASE_URL", async () => {
    const row = await one("SELECT DATABASE() AS db");
    expect(row.db).toBe(dbName);
    expect(dbName).toMatch(/_test$/);
  });

  it("stores text as utf8mb4 with the unicode collation", async () => {
    const server = await one("SELECT @@character_set_server AS cs, @@collation_server AS coll");
    expect(server).toEqual({ cs: "utf8mb4", coll: "utf8mb4_unicode_ci" });
    const schema = await one(
      "SELECT default_character_set_name AS cs, default_collation_name AS coll FROM information_schema.schemata WHERE schema_name = ?",
      [dbName],
    );
    expect(schema).toEqual({ cs: "utf8mb4", coll: "utf8mb4_unicode_ci" });
  });

  it("round-trips four-byte characters and compares case- and accent-insensitively", async () => {
    await conn.query(
      "CREATE TEMPORARY TABLE plumbing_probe (id INT PRIMARY KEY, title VARCHAR(100) NOT NULL)",
    );
    const title = "Zine № 7 — ✂️ cut & 📎 paste, ça va";
    await conn.query("INSERT INTO plumbing_probe (id, title) VALUES (1, ?)", [title]);
    const back = await one(
      "SELECT title, CHAR_LENGTH(title) AS chars FROM plumbing_probe WHERE id = 1",
    );
    expect(back.title).toBe(title);
    expect(Number(back.chars)).toBe([...title].length);
    const match = await one("SELECT COUNT(*) AS n FROM plumbing_probe WHERE title = ?", [
      title.toUpperCase().replace("Ç", "C"),
    ]);
    expect(Number(match.n)).toBe(1);
    await conn.query("DROP TEMPORARY TABLE plumbing_probe");
  });

  it("runs in UTC", async () => {
    const tz = await one(
      "SELECT @@global.time_zone AS global_tz, @@session.time_zone AS session_tz",
    );
    expect(tz.global_tz).toBe("+00:00");
    const drift = await one("SELECT TIMESTAMPDIFF(SECOND, UTC_TIMESTAMP(), NOW()) AS seconds");
    expect(Number(drift.seconds)).toBe(0);
    const instant = new Date("2024-03-31T01:30:00.000Z");
    const row = await one(
      "SELECT CAST(? AS DATETIME) AS at, UNIX_TIMESTAMP(CAST(? AS DATETIME)) AS epoch",
      [instant, instant],
    );
    expect((row.at as Date).toISOString()).toBe(instant.toISOString());
    expect(Number(row.epoch)).toBe(instant.getTime() / 1000);
  });

  it.runIf(testEnv.privateDatabase)(
    "is the private server: bound to 127.0.0.1 on its own port",
    async () => {
      const row = await one(
        "SELECT @@bind_address AS bind, @@port AS port, @@skip_networking AS no_tcp",
      );
      expect(row.bind).toBe("127.0.0.1");
      expect(Number(row.no_tcp)).toBe(0);
      const u = new URL(testEnv.databaseUrl);
      expect(u.hostname).toBe("127.0.0.1");
      // 3307 unless a second checkout on this machine moved it with QUIRELINE_DB_PORT.
      expect(Number(row.port)).toBe(Number(process.env.QUIRELINE_DB_PORT || 3307));
      expect(Number(u.port)).toBe(Number(row.port));
    },
  );

  it.runIf(testEnv.privateDatabase)(
    "lets the app user reach only the project's databases",
    async () => {
      const who = await one("SELECT CURRENT_USER() AS user");
      expect(who.user).toBe("quireline@127.0.0.1");
      await expect(conn.query("CREATE DATABASE plumbing_probe_forbidden")).rejects.toThrow(
        /denied/i,
      );
    },
  );
});
