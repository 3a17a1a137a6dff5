// What `npm start`, `npm run dev`, `npm test` and `npm run bench` run.
//
//   node scripts/launch.mjs start   build, then serve at http://localhost:3000 with the local fakes
//   node scripts/launch.mjs dev     the same with `next dev` (no build)
//   node scripts/launch.mjs test    fresh test database, build, serve on 3100, run vitest and Playwright
//   node scripts/launch.mjs bench   the compute figures, then a fresh bench database, build, serve
//                                   on 3300, the load figures and the hardening checks
//                                   (`-- --only compute|load|checks`)
//
// Plain Node ESM with no dependencies: it installs node_modules itself before using any package.
// The steps live in launch/: processes.mjs (process groups), shutdown.mjs, install.mjs,
// ports.mjs, database.mjs (database, migrations, seed), app-env.mjs, queue.mjs (Redis and the
// print worker), fakes.mjs, app.mjs (build, serve, welcome), tests.mjs (runners and the
// closing line) and bench.mjs (the bench parts); this file runs them per mode.

import fs from "node:fs";

import * as mariadb from "./mariadb.mjs";
import { buildApp, printWelcome, startApp } from "./launch/app.mjs";
import { appEnv, authSecret } from "./launch/app-env.mjs";
import { benchParts, runChecksBench, runComputeBench, runLoadBench } from "./launch/bench.mjs";
import { BENCH_RESULTS, Fatal, note, rel, RESULTS, secs, step } from "./launch/common.mjs";
import { prepareDatabase, runTsScript } from "./launch/database.mjs";
import { startFakes } from "./launch/fakes.mjs";
import { installDependencies, installPdfTools } from "./launch/install.mjs";
import { checkPorts, PORTS } from "./launch/ports.mjs";
import { inheritToStderr } from "./launch/processes.mjs";
import { startRedis, startWorker } from "./launch/queue.mjs";
import { handleSignals, shutdown, shuttingDown, signalled } from "./launch/shutdown.mjs";
import { report, runPlaywright, runVitest, splitFilters } from "./launch/tests.mjs";

handleSignals();

async function main() {
  const mode = process.argv[2];
  if (!PORTS[mode]) {
    console.error(
      "usage: node scripts/launch.mjs start|dev|test|bench [-- test files | --only compute|load|checks]",
    );
    return 2;
  }
  const extra = process.argv.slice(3).filter((a, i) => !(i === 0 && a === "--"));
  if (extra.length && mode !== "test" && mode !== "bench")
    throw new Fatal(`\`${mode}\` takes no arguments`);
  const filters = mode === "test" ? splitFilters(extra) : null;
  const bench = mode === "bench" ? benchParts(extra) : null;
  const ports = PORTS[mode];
  if (bench) {
    // stdout is for the bench's JSON documents; the launcher's own lines go to stderr.
    process.stdout.write = process.stderr.write.bind(process.stderr);
    inheritToStderr();
  }

  await installDependencies(mode, filters?.runPlaywright ?? false);
  installPdfTools(mode);

  // The compute figures need no stack, and nothing this run starts competes with them for the CPU.
  let benchOk = true;
  if (bench?.compute) benchOk = await runComputeBench();
  if (shuttingDown) return shuttingDown.then(() => 130);
  if (bench && !bench.load && !bench.checks) return benchOk ? 0 : 1;

  step("checking ports");
  await checkPorts(ports);

  if (mode === "test") fs.mkdirSync(RESULTS, { recursive: true });
  if (mode === "bench") fs.mkdirSync(BENCH_RESULTS, { recursive: true });
  const db = await prepareDatabase(mode);
  const secret = authSecret();
  // The print queue's Redis next, so the fakes stop before it and the worker before them.
  const queue = await startRedis(mode, ports);
  const env = appEnv(mode, ports, db.url, secret, queue.url);
  note(`DATABASE_URL=${db.url.replace(/:[^:@/]*@/, ":***@")}`);

  // The fakes come first: the demo seed stores its artwork through the upload fake.
  const fakes = await startFakes(mode, env);
  await runTsScript("migrate.ts", env);
  await runTsScript("seed.ts", env);
  // The print worker once the database is migrated and seeded; integration tests use it too.
  const worker = await startWorker(mode, env);

  let app = null;
  if (mode !== "test" || filters.needsApp) {
    if (mode !== "dev") await buildApp(env);
    app = await startApp(mode, ports, env);
  } else {
    step("no build and no app: the filters name only unit tests");
  }

  if (bench) {
    if (bench.load && !(await runLoadBench(env))) benchOk = false;
    if (shuttingDown) return shuttingDown.then(() => 130);
    if (bench.checks && !(await runChecksBench(env))) benchOk = false;
    if (shuttingDown) return shuttingDown.then(() => 130);
    note(`logs of the bench's stack: ${rel(BENCH_RESULTS)}/`);
    await shutdown("bench finished: stopping what this run started");
    return benchOk ? 0 : 1;
  }

  if (mode !== "test") {
    printWelcome(ports);
    const watched = [app, fakes, worker, queue.entry].filter(Boolean);
    const which = await Promise.race(watched.map((e) => e.exit.then(() => e)));
    const r = await which.exit;
    if (shuttingDown) {
      // Stopped by a signal: the handler finishes the shutdown and exits.
      await shuttingDown;
      return 130;
    }
    await shutdown(
      `${which.name} exited unexpectedly (${r.code ?? r.signal}): stopping everything`,
    );
    return 1;
  }

  const results = [];
  if (filters.runVitest) results.push(["vitest", await runVitest(env, filters.vitest)]);
  else step("vitest skipped: the filters name only Playwright tests");
  if (shuttingDown) return shuttingDown.then(() => 130);
  if (filters.runPlaywright)
    results.push(["Playwright", await runPlaywright(env, filters.playwright)]);
  else step("Playwright skipped: the filters name only vitest tests");
  if (shuttingDown) return shuttingDown.then(() => 130);

  await shutdown("tests finished: stopping what this run started");

  return report(results);
}

main().then(
  (code) => process.exit(code),
  async (err) => {
    if (signalled) {
      // Interrupted: whatever failed, failed because its processes were being stopped.
      await shuttingDown;
      process.exit(130);
    }
    const msg =
      err instanceof Fatal || err instanceof mariadb.MariaDbError ? err.message : err.stack;
    console.error(`[quireline ${secs()}s] error: ${msg}`);
    await shutdown();
    if (process.argv[2] === "test") console.log("0 passed, 0 failed");
    process.exit(1);
  },
);
