// What every launcher step shares: where things are, the log lines and the one error type
// whose message is shown without a stack.

import path from "node:path";

import * as mariadb from "../mariadb.mjs";

export const ROOT = mariadb.ROOT;
export const DATA = path.join(ROOT, ".data");
/** The app listens on loopback only: it is a local workshop tool, and /dev/outbox depends on it. */
export const APP_BIND_HOST = "127.0.0.1";
export const RESULTS = path.join(DATA, "test-results");
/** The logs of the stack `npm run bench` starts (its figures go to stdout). */
export const BENCH_RESULTS = path.join(DATA, "bench-results");
const T0 = Date.now();
export const isRoot = typeof process.getuid === "function" && process.getuid() === 0;

/** A failure the launcher explains in its own words. */
export class Fatal extends Error {}

export const secs = () => ((Date.now() - T0) / 1000).toFixed(1).padStart(5);
export const step = (msg) => console.log(`[quireline ${secs()}s] ${msg}`);
export const note = (msg) => console.log(`                  ${msg}`);
export const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
export const rel = (p) => path.relative(ROOT, p) || ".";

/** Test and bench runs start from nothing: a fresh database, an empty queue, empty fake stores. */
export const throwaway = (mode) => mode === "test" || mode === "bench";

/** Where a test or bench run keeps a process's log; null for start and dev, which print to the terminal. */
export function logPath(mode, name) {
  if (mode === "test") return path.join(RESULTS, name);
  if (mode === "bench") return path.join(BENCH_RESULTS, name);
  return null;
}
