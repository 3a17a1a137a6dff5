// A private Redis for this checkout: the print queue's store.
//
// Debian's redis-server, bound to 127.0.0.1 on its own port, with its data under
// <project>/.data/redis (npm start / npm run dev) or a throwaway folder (npm test). Run in the
// foreground in its own process group, so the launcher stops it with the rest, after the worker.
// Plain Node ESM with no dependencies: this runs before node_modules exists.
//
// CLI: node scripts/redis.mjs ping [port]

import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
export const HOST = "127.0.0.1";

const isRoot = typeof process.getuid === "function" && process.getuid() === 0;

export class RedisError extends Error {}

const SEARCH_DIRS = [
  ...(process.env.PATH ?? "").split(path.delimiter).filter(Boolean),
  "/usr/bin",
  "/usr/sbin",
  "/usr/local/bin",
];

function which(name) {
  for (const dir of SEARCH_DIRS) {
    const file = path.join(dir, name);
    try {
      fs.accessSync(file, fs.constants.X_OK);
      return file;
    } catch {
      // keep looking
    }
  }
  return null;
}

/** Installs Debian's redis-server (which brings redis-cli) when it is missing; root only. */
export function ensureInstalled() {
  if (which("redis-server") && which("redis-cli")) return;
  if (!isRoot) {
    throw new RedisError(
      "Redis is not installed; the print queue needs it. Install Debian's package first, as root:\n" +
        "  apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends redis-server\n" +
        "or set REDIS_URL to a Redis server you already have (redis://host:port).",
    );
  }
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  for (const args of [["update"], ["install", "-y", "--no-install-recommends", "redis-server"]]) {
    process.stdout.write(`[redis] running: apt-get ${args.join(" ")}\n`);
    const r = spawnSync("apt-get", args, { stdio: "inherit", env });
    if (r.error) throw new RedisError(`apt-get could not run: ${r.error.message}`);
    if (r.status !== 0)
      throw new RedisError(`apt-get ${args[0]} failed with exit code ${r.status}`);
  }
  if (!which("redis-server")) throw new RedisError("apt-get finished but redis-server is missing");
}

/** The folder a mode keeps its Redis data in: kept for start/dev, thrown away for tests and the bench. */
export function dataDir(mode) {
  return path.join(ROOT, ".data", { test: "redis-test", bench: "redis-bench" }[mode] ?? "redis");
}

/**
 * The command line that runs the server in the foreground: loopback only, its own port, the
 * append-only file for durability (queued jobs survive a restart), no RDB snapshots.
 */
export function serverCommand(port, dir) {
  const bin = which("redis-server");
  if (!bin) throw new RedisError("redis-server not found");
  return {
    cmd: bin,
    args: [
      "--bind",
      HOST,
      "--port",
      String(port),
      "--dir",
      dir,
      "--appendonly",
      "yes",
      "--save",
      "",
      "--daemonize",
      "no",
      "--protected-mode",
      "yes",
      "--logfile",
      "",
      "--maxmemory-policy",
      // BullMQ needs keys never evicted (its own documentation asks for noeviction).
      "noeviction",
    ],
  };
}

/** True when a Redis answers PONG on the port. */
export function ping(port) {
  const cli = which("redis-cli");
  if (!cli) return false;
  const r = spawnSync(cli, ["-h", HOST, "-p", String(port), "ping"], {
    encoding: "utf8",
    timeout: 3000,
  });
  return r.status === 0 && r.stdout.trim() === "PONG";
}

/** Asks the server on the port to stop (it writes its append-only file first). */
export function shutdown(port) {
  const cli = which("redis-cli");
  if (!cli) return false;
  const r = spawnSync(cli, ["-h", HOST, "-p", String(port), "shutdown"], {
    encoding: "utf8",
    timeout: 10_000,
  });
  return r.status === 0;
}

export function url(port) {
  return `redis://${HOST}:${port}`;
}

async function main(argv) {
  const [cmd, arg] = argv;
  const port = Number.parseInt(arg ?? "", 10) || 6390;
  if (cmd === "ping") {
    const up = ping(port);
    process.stdout.write(`[redis] ${up ? "answering" : "not answering"} on ${HOST}:${port}\n`);
    return up ? 0 : 3;
  }
  console.error("usage: node scripts/redis.mjs ping [port]");
  return 2;
}

if (process.argv[1] && import.meta.url === pathToFileURL(fs.realpathSync(process.argv[1])).href) {
  main(process.argv.slice(2)).then((code) => process.exit(code));
}
