// `npm run bench`: the compute figures (tests/bench/run.ts, pure, no stack), then the load figures
// (tests/bench/load.ts) against the bench's own stack, then the hardening checks' counts (the
// authorization matrix and the bad-input sweep, run by vitest against the same stack). Each part
// prints one JSON document on stdout; the launcher's lines and every other child's output go to
// stderr.

import fs from "node:fs";
import path from "node:path";

import { BENCH_RESULTS, Fatal, ROOT, step } from "./common.mjs";
import { runToEnd } from "./processes.mjs";

const PARTS = ["compute", "load", "checks"];

/** `npm run bench [-- --only compute|load|checks]`: which parts to run. */
export function benchParts(args) {
  let only = null;
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a === "--only") only = args[++i] ?? "";
    else if (a.startsWith("--only=")) only = a.slice("--only=".length);
    else
      throw new Fatal(`\`bench\` takes only --only compute|load|checks (not ${JSON.stringify(a)})`);
  }
  if (only !== null && !PARTS.includes(only))
    throw new Fatal(`--only takes compute, load or checks (not ${JSON.stringify(only)})`);
  const part = (name) => only === null || only === name;
  return { compute: part("compute"), load: part("load"), checks: part("checks") };
}

async function runPart(label, script, args, env) {
  step(`running the ${label} bench (${script})`);
  const r = await runToEnd(`${label} bench`, process.execPath, [...args, script], {
    env,
    stdio: "stdout",
  });
  if (r.code === 0) return true;
  step(`the ${label} bench failed (exit ${r.code ?? r.signal ?? r.error?.message})`);
  return false;
}

/** The pure figures, as `node --import tsx tests/bench/run.ts` prints them; needs no stack. */
export const runComputeBench = () =>
  runPart("compute", "tests/bench/run.ts", ["--import", "tsx"], process.env);

/** The load figures against the running app; server modules load as the seed loads them. */
export const runLoadBench = (env) =>
  runPart("load", "tests/bench/load.ts", ["--conditions=react-server", "--import", "tsx"], env);

/** The test files whose figures the issue asks for in the bench, and the file each writes. */
const CHECKS = [
  [
    "authorizationMatrix",
    "tests/integration/authorization-matrix.test.ts",
    "authorization-matrix.json",
  ],
  ["badInput", "tests/integration/bad-input.test.ts", "bad-input.json"],
];

/**
 * The authorization matrix and the bad-input sweep against the bench's stack: vitest runs them
 * (its output to stderr, writing their figures under .data/bench-results), then one JSON document
 * on stdout with each one's counts and whether its tests passed.
 */
export async function runChecksBench(env) {
  step("running the hardening checks (authorization matrix, bad-input sweep)");
  for (const [, , file] of CHECKS) fs.rmSync(path.join(BENCH_RESULTS, file), { force: true });
  const bin = path.join(ROOT, "node_modules", "vitest", "vitest.mjs");
  const r = await runToEnd(
    "checks bench",
    process.execPath,
    [bin, "run", ...CHECKS.map((c) => c[1])],
    {
      env: { ...env, QUIRELINE_RESULTS_DIR: BENCH_RESULTS, TZ: "UTC" },
    },
  );
  const figures = { testsPassed: r.code === 0 };
  for (const [name, , file] of CHECKS) {
    try {
      figures[name] = JSON.parse(fs.readFileSync(path.join(BENCH_RESULTS, file), "utf8"));
    } catch {
      figures[name] = null;
    }
  }
  const badInput = figures.badInput;
  if (badInput) {
    // The counts only: every 500 and leak, if any, is listed in the file itself.
    figures.badInput = {
      tried: badInput.tried,
      status500: badInput.status500,
      byStatus: badInput.byStatus,
      file: path.relative(ROOT, path.join(BENCH_RESULTS, "bad-input.json")),
    };
  }
  fs.writeSync(1, `${JSON.stringify({ checks: figures }, null, 2)}\n`);
  if (!r.code) return true;
  step(`the hardening checks failed (exit ${r.code ?? r.signal ?? r.error?.message})`);
  return false;
}
