/** Seeds the demo (idempotent: safe to run on every start). Run with the react-server condition. */
import { db, pool } from "@/db";
import { seedDemoPress } from "./seed/demo-press";
import { seedOpenCall } from "./seed/open-call";
import { seedSubmissions } from "./seed/submissions";
import { seedReview } from "./seed/review";
import { seedPageMap } from "./seed/page-map";
import { seedPrintRun } from "./seed/print-run";

async function main() {
  const demo = await seedDemoPress(db);
  console.log(
    `demo seeded: ${demo.people.length} people, anthologies ${demo.almanac.slug} and ${demo.jam.slug}`,
  );
  await seedOpenCall(db);
  const submissions = await seedSubmissions(db); // needs the upload fake running (see db/seed/submissions.ts)
  if (submissions) console.log(`demo submissions seeded: ${submissions} pieces`);
  await seedReview(db); // after any seed that adds pieces: it lays history and a note over them
  // Last: the page map places accepted pieces that the seeds above may have added.
  const map = await seedPageMap(db);
  if (map)
    console.log(`page map seeded: ${map.placed} pieces placed, ${map.waiting} waiting in the tray`);
  // After the map: the run's counts come from it.
  const run = await seedPrintRun(db);
  if (run) console.log(`demo print run seeded: ${run.events} events, ${run.batches} batches`);
}

main()
  .then(() => pool.end())
  .catch(async (error: unknown) => {
    console.error("seeding failed:", error);
    await pool.end().catch(() => {});
    process.exit(1);
  });
