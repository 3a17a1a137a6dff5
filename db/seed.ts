/** Seeds the demo (idempotent: safe to run on every start). Run with the react-server condition. */
import { db, pool } from "@/db";
import { seedDemoPress } from "./seed/demo-press";

async function main() {
  const demo = await seedDemoPress(db);
  console.log(`demo seeded: ${demo.people.length} people, anthologies ${demo.almanac.slug} and ${demo.jam.slug}`);
}

main()
  .then(() => pool.end())
  .catch(async (error: unknown) => {
    console.error("seeding failed:", error);
    await pool.end().catch(() => {});
    process.exit(1);
  });
