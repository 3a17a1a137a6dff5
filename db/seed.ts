/** Seeds the demo (idempotent: safe to run on every start). Run with the react-server condition. */
import { db, pool } from "@/db";
import { seedDemoPress } from "./seed/demo-press";
import { seedOpenCall } from "./seed/open-call";
import { seedSubmissions } from "./seed/submissions";
import { seedReview } from "./seed/review";
import { seedPageMap } from "./seed/page-map";
import { seedPrintReady } from "./seed/print-ready";
import { seedCredits } from "./seed/credits";
import { seedPayouts } from "./seed/payouts";
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
  const jam = await seedPrintReady(db); // needs the upload fake, like the submissions
  if (jam) console.log(`demo print-ready map seeded: ${jam.slug}, ${jam.pages} pages`);
  const credits = await seedCredits(db); // after the map: it picks who is still outstanding by spread
  if (credits)
    console.log(`credits seeded: ${credits.approved} approved, ${credits.outstanding} outstanding`);
  // After the map: the run's counts come from it.
  const run = await seedPrintRun(db);
  if (run) console.log(`demo print run seeded: ${run.events} events, ${run.batches} batches`);
  // After the map: the money follows the accepted pieces (needs the payments fake and the SMTP sink).
  const payouts = await seedPayouts(db);
  if (payouts)
    console.log(
      `demo payouts seeded: ${payouts.lines} ledger lines, ${payouts.statements} statements mailed`,
    );
}

main()
  .then(() => pool.end())
  .catch(async (error: unknown) => {
    console.error("seeding failed:", error);
    await pool.end().catch(() => {});
    process.exit(1);
  });
