// The test runners: which files go to vitest and which to Playwright, their JSON results, and
// the closing `N passed, N failed` line.

import fs from "node:fs";
import path from "node:path";

import { Fatal, note, rel, RESULTS, ROOT, step } from "./common.mjs";
import { runToEnd } from "./processes.mjs";

/** Splits `npm test -- …` arguments between vitest and Playwright. */
export function splitFilters(args) {
  const isPath = (a) => a.includes("/") || /\.[cm]?[jt]sx?$/.test(a);
  const isE2E = (a) => {
    const r = path.isAbsolute(a) ? path.relative(ROOT, a) : path.normalize(a);
    return (
      r === path.join("tests", "e2e") ||
      r.startsWith(path.join("tests", "e2e") + path.sep) ||
      /\.spec\.[cm]?[jt]sx?$/.test(a)
    );
  };
  const vitest = [];
  const playwright = [];
  let files = 0;
  let last = null;
  let flagWantsValue = false;
  for (const a of args) {
    if (a.startsWith("-")) {
      if (!last)
        throw new Fatal(`put a test file before ${a}, so it is clear which runner it is for`);
      last.push(a);
      flagWantsValue = !a.includes("=");
    } else if (flagWantsValue && !isPath(a)) {
      last.push(a);
      flagWantsValue = false;
    } else {
      last = isE2E(a) ? playwright : vitest;
      last.push(a);
      files++;
      flagWantsValue = false;
    }
  }
  const unitOnly =
    files > 0 &&
    playwright.length === 0 &&
    vitest
      .filter((a) => isPath(a))
      .every((a) => {
        const r = path.isAbsolute(a) ? path.relative(ROOT, a) : path.normalize(a);
        return r.startsWith(path.join("tests", "unit") + path.sep);
      }) &&
    vitest.some((a) => isPath(a));
  return {
    vitest,
    playwright,
    // Unit tests are pure: a run that names only unit test files needs no build and no app.
    needsApp: !unitOnly,
    runVitest: files === 0 || vitest.some((a) => !a.startsWith("-")),
    runPlaywright: files === 0 || playwright.some((a) => !a.startsWith("-")),
  };
}

function readJson(file) {
  try {
    return JSON.parse(fs.readFileSync(file, "utf8"));
  } catch {
    return null;
  }
}

export async function runVitest(env, filters) {
  const out = path.join(RESULTS, "vitest.json");
  fs.rmSync(out, { force: true });
  const bin = path.join(ROOT, "node_modules", "vitest", "vitest.mjs");
  const args = [
    bin,
    "run",
    "--reporter=default",
    "--reporter=json",
    `--outputFile=${out}`,
    ...filters,
  ];
  step(`running vitest${filters.length ? ` ${filters.join(" ")}` : ""}`);
  const r = await runToEnd("vitest", process.execPath, args, { env });
  const report = readJson(out);
  if (!report)
    return {
      passed: 0,
      failed: 0,
      skipped: 0,
      error: `vitest wrote no results (exit ${r.code ?? r.signal})`,
    };
  let failed = report.numFailedTests ?? 0;
  // A file that failed without a failing test (an import error, a failing hook) counts once.
  for (const file of report.testResults ?? []) {
    if (
      file.status === "failed" &&
      !(file.assertionResults ?? []).some((t) => t.status === "failed")
    )
      failed++;
  }
  const result = {
    passed: report.numPassedTests ?? 0,
    failed,
    skipped: (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0),
    error: null,
  };
  if (r.code !== 0 && failed === 0)
    result.error = `vitest exited with code ${r.code ?? r.signal} (see its output above)`;
  return result;
}

export async function runPlaywright(env, filters) {
  const out = path.join(RESULTS, "playwright.json");
  fs.rmSync(out, { force: true });
  const bin = path.join(ROOT, "node_modules", "@playwright", "test", "cli.js");
  const args = [bin, "test", "--reporter=list,json", ...filters];
  step(`running Playwright${filters.length ? ` ${filters.join(" ")}` : ""}`);
  const r = await runToEnd("playwright", process.execPath, args, {
    env: {
      ...env,
      PLAYWRIGHT_JSON_OUTPUT_FILE: out,
      FORCE_COLOR: process.stdout.isTTY ? "1" : "0",
    },
  });
  const report = readJson(out);
  if (!report?.stats) {
    return {
      passed: 0,
      failed: 0,
      skipped: 0,
      error: `Playwright wrote no results (exit ${r.code ?? r.signal})`,
    };
  }
  const s = report.stats;
  const result = {
    passed: (s.expected ?? 0) + (s.flaky ?? 0),
    failed: s.unexpected ?? 0,
    skipped: s.skipped ?? 0,
    error: null,
  };
  if ((report.errors ?? []).length) {
    result.error = `Playwright reported ${report.errors.length} error(s) outside tests (see its output above)`;
  } else if (r.code !== 0 && result.failed === 0) {
    result.error = `Playwright exited with code ${r.code ?? r.signal} (see its output above)`;
  }
  return result;
}

/**
 * Prints each runner's counts and the closing `N passed, N failed` line CI reads.
 * @returns {number} the exit code: 1 when anything failed, erred or nothing ran
 */
export function report(results) {
  let passed = 0;
  let failed = 0;
  let skipped = 0;
  const errors = [];
  for (const [name, r] of results) {
    passed += r.passed;
    failed += r.failed;
    skipped += r.skipped;
    note(
      `${name}: ${r.passed} passed, ${r.failed} failed${r.skipped ? `, ${r.skipped} skipped` : ""}`,
    );
    if (r.error) errors.push(r.error);
  }
  if (passed + failed === 0) errors.push("no tests ran");
  for (const e of errors) note(`error: ${e}`);
  note(`results: ${rel(RESULTS)}/`);
  console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ""}`);
  return failed > 0 || errors.length ? 1 : 0;
}
