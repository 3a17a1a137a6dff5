// The print queue: a private Redis (scripts/redis.mjs), started before the fakes, and the print
// worker (server/print/worker.ts), its own process, started once the app's environment is ready.
// Both are process groups in `running`, so the shutdown stops them in reverse start order: the
// app, then the worker, then the fakes, then Redis (SIGTERM: Redis writes its append-only file
// and exits), then the database.

import fs from "node:fs";
import path from "node:path";

import * as redis from "../redis.mjs";
import { Fatal, logPath, note, rel, ROOT, sleep, step, throwaway } from "./common.mjs";
import { launch, lines } from "./processes.mjs";

/** Starts the private Redis unless REDIS_URL names one; returns the URL and the entry (or null). */
export async function startRedis(mode, ports) {
  const given = process.env.REDIS_URL;
  if (given) {
    let u;
    try {
      u = new URL(given);
    } catch {
      throw new Fatal("REDIS_URL is not a valid URL (expected redis://host:port)");
    }
    if (!/^rediss?:$/.test(u.protocol))
      throw new Fatal("REDIS_URL must start with redis:// or rediss://");
    step(`print queue: using REDIS_URL (${u.hostname}:${u.port || 6379}); no private Redis`);
    return { url: given, entry: null };
  }
  try {
    redis.ensureInstalled();
  } catch (err) {
    throw new Fatal(err.message);
  }
  const dir = redis.dataDir(mode);
  // The test and bench queues start empty every run; start and dev keep their queued jobs.
  if (throwaway(mode)) fs.rmSync(dir, { recursive: true, force: true });
  fs.mkdirSync(dir, { recursive: true });
  const port = ports.redis;
  step(`print queue: starting a private Redis on 127.0.0.1:${port} (data in ${rel(dir)})`);
  const logFile = logPath(mode, "redis.log") ?? path.join(dir, "redis.log");
  const fd = fs.openSync(logFile, "a");
  const { cmd, args } = redis.serverCommand(port, dir);
  const entry = launch("redis", cmd, args, { stdio: ["ignore", fd, fd] });
  fs.closeSync(fd);
  const deadline = Date.now() + 15_000;
  while (!redis.ping(port)) {
    if (entry.exited || Date.now() > deadline) {
      let tail = "";
      try {
        tail = fs.readFileSync(logFile, "utf8").trimEnd().split("\n").slice(-15).join("\n");
      } catch {
        // no log
      }
      throw new Fatal(
        `redis-server ${entry.exited ? "exited during start-up" : "did not answer ping within 15 s"}` +
          ` (log: ${rel(logFile)}):\n${tail || "(empty)"}`,
      );
    }
    await sleep(100);
  }
  note(`ready (log: ${rel(logFile)})`);
  return { url: redis.url(port), entry };
}

/**
 * Runs server/print/worker.ts with tsx (the '@/' aliases from tsconfig, `server-only` as a no-op
 * under react-server, as the seed runs) and waits for its ready line.
 */
export async function startWorker(mode, env) {
  const script = "server/print/worker.ts";
  if (!fs.existsSync(path.join(ROOT, script))) throw new Fatal(`${script} does not exist`);
  step("starting the print worker (server/print/worker.ts)");
  const logFile = logPath(mode, "worker.log");
  const log = logFile ? fs.createWriteStream(logFile, { flags: "w" }) : null;
  const entry = launch(
    "print worker",
    process.execPath,
    ["--conditions=react-server", "--import", "tsx", script],
    { env, stdio: ["ignore", "pipe", "pipe"] },
  );
  const seen = [];
  let ready = false;
  let resolveReady;
  const readyPromise = new Promise((r) => (resolveReady = r));
  const out = (line, isErr) => {
    if (!ready) seen.push(line);
    if (log) log.write(`${line}\n`);
    else if (ready) (isErr ? console.error : console.log)(`[worker] ${line}`);
  };
  lines(entry.child.stdout, (line) => {
    if (!ready) {
      try {
        if (JSON.parse(line)?.ready === true) {
          ready = true;
          resolveReady();
        }
      } catch {
        // not a JSON line
      }
    }
    out(line, false);
  });
  lines(entry.child.stderr, (line) => out(line, true));
  const outcome = await Promise.race([
    readyPromise.then(() => "ready"),
    entry.exit.then(() => "exited"),
    sleep(60_000).then(() => "timeout"),
  ]);
  if (outcome !== "ready") {
    throw new Fatal(
      `the print worker ${outcome === "exited" ? "exited" : "did not report ready within 60 s"}. Its output:\n` +
        (seen.join("\n") || "(none)"),
    );
  }
  note(logFile ? `ready (log: ${rel(logFile)})` : "ready");
  return entry;
}
