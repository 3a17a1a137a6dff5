// Starts the local stand-ins for hosted services: the upload fake, the SMTP sink and the payments fake.
//
// env: UPLOADTHING_TOKEN (required, same as the app), FAKE_UPLOAD_PORT (4590), FAKE_SMTP_PORT (4525),
//      FAKE_OUTBOX_PORT (4526), FAKE_PAYMENTS_PORT (4512), FAKE_PAYMENTS_WEBHOOK_URL,
//      FAKE_PAYMENTS_WEBHOOK_SECRET, FAKE_PAYMENTS_API_KEY, FAKE_PAYMENTS_RETRY_MS, FAKE_PAYMENTS_BALANCE_CENTS, FAKE_DATA_DIR (<project>/.data/fakes), FAKE_PUBLIC_URL,
//      FAKE_VERIFY_SIGNATURES=0, FAKE_CALLBACK_TIMEOUT_MS, FAKE_METADATA_TIMEOUT_MS,
//      FAKE_DEV_STREAM_TIMEOUT_MS, FAKE_LOG=1|2
//
// Prints one JSON line on stdout once everything listens:
//   {"ready":true,"pid":123,"uploads":"http://127.0.0.1:4590","smtp":4525,"outbox":"http://127.0.0.1:4526",
//    "payments":"http://127.0.0.1:4512"}

import { startSmtpSink } from "./smtp-sink.mjs";
import { paymentOptionsFromEnv, startPaymentsFake } from "./payments.mjs";
import { startUploadFake, uploadOptionsFromEnv } from "./uploads.mjs";

function portFromEnv(name, fallback) {
  const raw = process.env[name];
  if (raw == null || raw === "") return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 0 || n > 65535) {
    throw new Error(`${name} must be a port number (0-65535), got "${raw}"`);
  }
  return n;
}

function fatal(message) {
  process.stderr.write(`storage-fake: ${message}\n`);
  process.exit(1);
}

let uploadPort, smtpPort, outboxPort, paymentsPort, uploadOptions, paymentOptions;
try {
  uploadPort = portFromEnv("FAKE_UPLOAD_PORT", 4590);
  smtpPort = portFromEnv("FAKE_SMTP_PORT", 4525);
  outboxPort = portFromEnv("FAKE_OUTBOX_PORT", 4526);
  paymentsPort = portFromEnv("FAKE_PAYMENTS_PORT", 4512);
  uploadOptions = uploadOptionsFromEnv();
  paymentOptions = paymentOptionsFromEnv();
} catch (err) {
  fatal(err.message);
}
if (!process.env.UPLOADTHING_TOKEN) {
  fatal(
    "UPLOADTHING_TOKEN is required (use the same token as the app; see storage-fake/README.md)",
  );
}

/** @type {{close: () => Promise<void>}[]} */
const running = [];
const stopAll = () => Promise.allSettled(running.map((s) => s.close()));

async function start(what, envName, port, fn) {
  try {
    const s = await fn();
    running.push(s);
    return s;
  } catch (err) {
    await stopAll();
    if (err?.code === "EADDRINUSE") {
      fatal(
        `${what}: port ${err.port ?? port} on 127.0.0.1 is already in use (set ${envName} or stop the other process)`,
      );
    }
    fatal(`could not start ${what}: ${err?.message ?? err}`);
  }
}

const uploads = await start("upload fake", "FAKE_UPLOAD_PORT", uploadPort, () =>
  startUploadFake({ ...uploadOptions, port: uploadPort }),
);
const sink = await start(
  "SMTP sink",
  "FAKE_SMTP_PORT / FAKE_OUTBOX_PORT",
  `${smtpPort}/${outboxPort}`,
  () =>
    startSmtpSink({
      smtpPort,
      httpPort: outboxPort,
      dataDir: uploadOptions.dataDir,
      log: uploadOptions.log,
    }),
);

const payments = await start("payments fake", "FAKE_PAYMENTS_PORT", paymentsPort, () =>
  startPaymentsFake({
    ...paymentOptions,
    port: paymentsPort,
    dataDir: uploadOptions.dataDir,
    log: uploadOptions.log,
  }),
);

process.stdout.write(
  JSON.stringify({
    ready: true,
    pid: process.pid,
    uploads: uploads.baseUrl,
    smtp: sink.smtpPort,
    outbox: sink.outboxUrl,
    payments: payments.baseUrl,
  }) + "\n",
);

let stopping = false;
const shutdown = (signal) => {
  if (stopping) return;
  stopping = true;
  const force = setTimeout(() => process.exit(0), 3000);
  force.unref();
  stopAll().then(() => {
    if (uploadOptions.log) process.stderr.write(`storage-fake: stopped on ${signal}\n`);
    process.exit(0);
  });
};
process.on("SIGTERM", () => shutdown("SIGTERM"));
process.on("SIGINT", () => shutdown("SIGINT"));
