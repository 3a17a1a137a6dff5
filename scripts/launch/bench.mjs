// `npm run bench`: the compute figures (tests/bench/run.ts, pure, no stack), then the load figures
// (tests/bench/load.ts) against the bench's own stack. Each part prints one JSON document on
// stdout; the launcher's lines and every other child's output go to stderr.

import { Fatal, step } from "./common.mjs";
import { runToEnd } from "./processes.mjs";

const PARTS = ["compute", "load"];

/** `npm run bench [-- --only compute|load]`: which parts to run. */
export function benchParts(args) {
  let only = null;
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a === "--only") only = args[++i] ?? "";
    else if (a.startsWith("--only=")) only = a.slice("--only=".length);
    else throw new Fatal(`\`bench\` takes only --only compute|load (not ${JSON.stringify(a)})`);
  }
  if (only !== null && !PARTS.includes(only))
    throw new Fatal(`--only takes compute or load (not ${JSON.stringify(only)})`);
  return { compute: only !== "load", load: only !== "compute" };
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
