// The local stand-ins for hosted services (storage-fake/start.mjs), started before the seed.

import fs from "node:fs";
import path from "node:path";

import { Fatal, logPath, note, rel, ROOT, sleep, step, throwaway } from "./common.mjs";
import { launch, lines } from "./processes.mjs";

export async function startFakes(mode, env) {
  const script = "storage-fake/start.mjs";
  if (!fs.existsSync(path.join(ROOT, script))) throw new Fatal(`${script} does not exist`);
  if (throwaway(mode)) fs.rmSync(env.FAKE_DATA_DIR, { recursive: true, force: true });
  fs.mkdirSync(env.FAKE_DATA_DIR, { recursive: true });
  step(
    `starting the local fakes (uploads :${env.FAKE_UPLOAD_PORT}, SMTP :${env.FAKE_SMTP_PORT}, outbox :${env.FAKE_OUTBOX_PORT}, payments :${env.FAKE_PAYMENTS_PORT})`,
  );

  const logFile = logPath(mode, "fakes.log");
  const log = logFile ? fs.createWriteStream(logFile, { flags: "w" }) : null;
  const entry = launch("fakes", process.execPath, [script], {
    env,
    stdio: ["ignore", "pipe", "pipe"],
  });
  const seen = [];
  let ready = false;
  let resolveReady;
  const readyPromise = new Promise((r) => (resolveReady = r));
  const out = (line) => {
    if (log) log.write(`${line}\n`);
    else if (ready) console.log(`[fakes] ${line}`);
  };
  lines(entry.child.stdout, (line) => {
    if (!ready) {
      seen.push(line);
      try {
        const msg = JSON.parse(line);
        if (msg && msg.ready === true) {
          ready = true;
          resolveReady();
        }
      } catch {
        // not a JSON line
      }
    }
    out(line);
  });
  lines(entry.child.stderr, (line) => {
    if (!ready) seen.push(line);
    if (log) log.write(`${line}\n`);
    else console.error(`[fakes] ${line}`);
  });

  const outcome = await Promise.race([
    readyPromise.then(() => "ready"),
    entry.exit.then(() => "exited"),
    sleep(30_000).then(() => "timeout"),
  ]);
  if (outcome !== "ready") {
    throw new Fatal(
      `the fakes ${outcome === "exited" ? "exited" : "did not report ready within 30 s"}. Their output:\n` +
        (seen.join("\n") || "(none)"),
    );
  }
  note(logFile ? `ready (log: ${rel(logFile)})` : "ready");
  return entry;
}
