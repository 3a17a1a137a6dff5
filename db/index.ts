import "server-only";
import { drizzle } from "drizzle-orm/mysql2";
import mysql from "mysql2/promise";
import { env } from "@/lib/env";
import * as schema from "./schema";

type Pool = mysql.Pool;
const globalForDb = globalThis as unknown as { quirelinePool?: Pool };

function makePool(): Pool {
  return mysql.createPool({
    uri: env().DATABASE_URL,
    connectionLimit: env().DATABASE_POOL_SIZE,
    timezone: "Z",
    dateStrings: false,
    charset: "utf8mb4_unicode_ci",
  });
}

/** One pool per process; kept on globalThis so dev reloads do not leak connections. */
export const pool: Pool = globalForDb.quirelinePool ?? makePool();
if (env().NODE_ENV !== "production") globalForDb.quirelinePool = pool;

export const db = drizzle(pool, { schema, mode: "default" });
export type Db = typeof db;
export { schema };
