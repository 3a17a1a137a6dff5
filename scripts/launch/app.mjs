// Building and serving the app, and the welcome block `npm start` and `npm run dev` print.

import fs from "node:fs";
import path from "node:path";

import { APP_BIND_HOST, Fatal, logPath, note, rel, ROOT, sleep, step } from "./common.mjs";
import { launch, runToEnd } from "./processes.mjs";

function nextBin() {
  const bin = path.join(ROOT, "node_modules", "next", "dist", "bin", "next");
  if (!fs.existsSync(bin))
    throw new Fatal("node_modules/next is missing; the install step did not install next");
  return bin;
}

export async function buildApp(env) {
  step(`building the app: next build (into ${env.NEXT_DIST_DIR})`);
  const started = Date.now();
  const r = await runToEnd("next build", process.execPath, [nextBin(), "build"], { env });
  if (r.code !== 0)
    throw new Fatal(`next build failed (exit ${r.code ?? r.signal ?? r.error?.message})`);
  note(`built in ${((Date.now() - started) / 1000).toFixed(1)} s`);
}

export async function startApp(mode, ports, env) {
  const args =
    mode === "dev"
      ? ["dev", "-H", APP_BIND_HOST, "-p", String(ports.app)]
      : ["start", "-H", APP_BIND_HOST, "-p", String(ports.app)];
  step(`starting the app: next ${args.join(" ")}`);
  const logFile = logPath(mode, "app.log");
  let stdio = "inherit";
  if (logFile) {
    const fd = fs.openSync(logFile, "w");
    stdio = ["ignore", fd, fd];
  }
  const entry = launch("web app", process.execPath, [nextBin(), ...args], { env, stdio });
  if (Array.isArray(stdio)) fs.closeSync(stdio[1]);

  const base = `http://127.0.0.1:${ports.app}`;
  const timeoutMs = mode === "dev" ? 180_000 : 90_000;
  const deadline = Date.now() + timeoutMs;
  let last = "no answer yet";
  while (Date.now() < deadline) {
    if (entry.exited) {
      const tail = logFile ? `\n${tailOf(logFile)}` : "";
      throw new Fatal(`the app exited before it was ready${tail}`);
    }
    try {
      const res = await fetch(`${base}/api/health`, {
        signal: AbortSignal.timeout(30_000),
        redirect: "manual",
      });
      await res.arrayBuffer().catch(() => {});
      if (res.status === 200) {
        last = "";
        break;
      }
      last = `/api/health answered ${res.status}`;
      if (res.status === 404) {
        // No health route (yet): any HTTP answer from / will do.
        const home = await fetch(`${base}/`, {
          signal: AbortSignal.timeout(30_000),
          redirect: "manual",
        });
        await home.arrayBuffer().catch(() => {});
        last = "";
        note(`/api/health answered 404; / answered ${home.status}`);
        break;
      }
    } catch (err) {
      last = err.cause?.code ?? err.message;
    }
    await sleep(500);
  }
  if (last) {
    const tail = logFile ? `\n${tailOf(logFile)}` : "";
    throw new Fatal(`the app was not ready within ${timeoutMs / 1000} s (${last})${tail}`);
  }
  note(`ready${logFile ? ` (log: ${rel(logFile)})` : ""}`);
  return entry;
}

function tailOf(file, n = 40) {
  try {
    return fs.readFileSync(file, "utf8").trimEnd().split("\n").slice(-n).join("\n");
  } catch {
    return "";
  }
}

export function printWelcome(ports) {
  const url = `http://localhost:${ports.app}`;
  console.log("");
  console.log(`Quireline is running at ${url}`);
  let accounts = null;
  try {
    accounts = JSON.parse(fs.readFileSync(path.join(ROOT, "db", "demo-accounts.json"), "utf8"));
  } catch {
    // no demo accounts file (yet)
  }
  if (Array.isArray(accounts) && accounts.length) {
    const rows = [["role", "name", "e-mail", "password"]];
    for (const a of accounts)
      rows.push([a.role, a.name, a.email, a.password].map((v) => String(v ?? "")));
    const widths = rows[0].map((_, i) => Math.max(...rows.map((r) => r[i].length)));
    const fmt = (r) =>
      "  " +
      r
        .map((v, i) => v.padEnd(widths[i]))
        .join("  ")
        .trimEnd();
    console.log("");
    console.log("Demo sign-ins:");
    console.log(fmt(rows[0]));
    console.log(fmt(widths.map((w) => "-".repeat(w))));
    for (const r of rows.slice(1)) console.log(fmt(r));
  }
  console.log("");
  console.log(`Mail is caught by a local sink; signed in, read yours at ${url}/dev/outbox.`);
  // Said plainly because the outbox holds sign-in links: it is a local tool, not a mail service.
  console.log(
    "The mail sink and its /dev/outbox page are for local use only: they show only the signed-in\n" +
      "person's own mail, and nothing is served when the app is not bound to loopback (127.0.0.1).",
  );
  console.log("");
  console.log("Press Ctrl-C to stop.");
}
