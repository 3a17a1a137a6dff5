/** Applies the SQL migrations in drizzle/ to DATABASE_URL; exits non-zero with the reason. */
import { drizzle } from "drizzle-orm/mysql2";
import { migrate } from "drizzle-orm/mysql2/migrator";
import mysql from "mysql2/promise";
import { parseEnv } from "../lib/env";

async function main() {
  const { DATABASE_URL } = parseEnv(process.env);
  const connection = await mysql.createConnection({
    uri: DATABASE_URL,
    timezone: "Z",
    multipleStatements: true,
  });
  try {
    await migrate(drizzle(connection), {
      migrationsFolder: new URL("../drizzle", import.meta.url).pathname,
    });
    console.log("migrations applied");
  } finally {
    await connection.end();
  }
}

main().catch((error: unknown) => {
  console.error("migration failed:", error instanceof Error ? error.message : error);
  process.exit(1);
});
