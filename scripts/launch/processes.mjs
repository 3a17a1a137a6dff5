// Child processes. Every child gets its own process group (detached), so Ctrl-C in the terminal
// reaches only this launcher, which then stops the groups in order: app, fakes, database.

import { spawn } from "node:child_process";
import readline from "node:readline";

import { note, ROOT, sleep } from "./common.mjs";

/** @type {Set<{ name: string, child: import("node:child_process").ChildProcess, exit: Promise<{code: number|null, signal: string|null}>, exited: boolean }>} */
export const running = new Set();

/** Where a child's inherited output goes: the launcher's stdout, or its stderr for the bench. */
let inheritedOut = "inherit";

/**
 * `npm run bench` keeps stdout for its JSON: children that would inherit it write to stderr,
 * except those started with `stdio: "stdout"`.
 */
export function inheritToStderr() {
  inheritedOut = 2;
}

function stdioOf(stdio) {
  if (Array.isArray(stdio)) return stdio;
  if (stdio === "stdout") return ["ignore", 1, 2];
  const out = stdio === "inherit" ? inheritedOut : stdio;
  return ["ignore", out, out];
}

export function launch(name, cmd, args, { env, stdio = "inherit" } = {}) {
  const child = spawn(cmd, args, {
    cwd: ROOT,
    env,
    detached: true,
    stdio: stdioOf(stdio),
  });
  const entry = { name, child, exited: false, exit: null };
  entry.exit = new Promise((resolve) => {
    child.once("error", (err) => {
      entry.exited = true;
      entry.error = err;
      resolve({ code: null, signal: null, error: err });
    });
    child.once("exit", (code, signal) => {
      entry.exited = true;
      resolve({ code, signal });
    });
  });
  running.add(entry);
  entry.exit.then(() => {
    // The group may still hold grandchildren; only forget the entry once it is empty.
    if (!groupAlive(child.pid)) running.delete(entry);
  });
  return entry;
}

export function groupAlive(pgid) {
  if (!pgid) return false;
  try {
    process.kill(-pgid, 0);
    return true;
  } catch (err) {
    return err.code === "EPERM";
  }
}

export function signalGroup(pgid, sig) {
  try {
    process.kill(-pgid, sig);
  } catch {
    // the group is gone
  }
}

export async function stopGroup(entry, graceMs = 10_000) {
  const pgid = entry.child.pid;
  if (pgid && groupAlive(pgid)) {
    signalGroup(pgid, "SIGTERM");
    const until = Date.now() + graceMs;
    while (groupAlive(pgid) && Date.now() < until) await sleep(100);
    if (groupAlive(pgid)) {
      note(`${entry.name} did not stop on SIGTERM; sending SIGKILL`);
      signalGroup(pgid, "SIGKILL");
      const until2 = Date.now() + 5000;
      while (groupAlive(pgid) && Date.now() < until2) await sleep(100);
    }
  }
  running.delete(entry);
}

/** Runs a command to completion, streaming or capturing its output. */
export async function runToEnd(name, cmd, args, { env, capture = false, stdio = "inherit" } = {}) {
  if (!capture) {
    const entry = launch(name, cmd, args, { env, stdio });
    const r = await entry.exit;
    await stopGroup(entry, 2000);
    return { ...r, output: "" };
  }
  const entry = launch(name, cmd, args, { env, stdio: ["ignore", "pipe", "pipe"] });
  let output = "";
  entry.child.stdout.on("data", (d) => (output += d));
  entry.child.stderr.on("data", (d) => (output += d));
  const closed = Promise.all(
    [entry.child.stdout, entry.child.stderr].map((s) => new Promise((r) => s.once("close", r))),
  );
  const r = await entry.exit;
  await stopGroup(entry, 2000);
  // Output may still be in flight after "exit"; the pipes close once the group is gone.
  await Promise.race([closed, sleep(2000)]);
  return { ...r, output };
}

/** Reads a child's output line by line, sending each line to `sink`. */
export function lines(stream, sink) {
  readline.createInterface({ input: stream, crlfDelay: Infinity }).on("line", sink);
}
