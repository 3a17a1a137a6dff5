// The environment the app, the fakes, the scripts and the test runners get, and the secret
// Auth.js signs sessions with (kept in .data/auth-secret).

import crypto from "node:crypto";
import fs from "node:fs";
import path from "node:path";

import { APP_BIND_HOST, DATA } from "./common.mjs";
import { db } from "./database.mjs";

// The UploadThing token the app and the upload fake share (see the uploads brief, section a).
export const FAKE_UPLOADTHING_TOKEN = Buffer.from(
  JSON.stringify({
    apiKey: "sk_local_fake_secret_0123456789",
    appId: "localfakeapp",
    regions: ["local1"],
  }),
).toString("base64");

// The payments fake's secret key and webhook signing secret, shared by the app and the fake.
export const FAKE_STRIPE_SECRET_KEY = "sk_test_quireline_local_fake";
export const FAKE_STRIPE_WEBHOOK_SECRET = "whsec_quireline_local_fake_0123456789abcdef";

export function authSecret() {
  if (process.env.AUTH_SECRET) return process.env.AUTH_SECRET;
  const file = path.join(DATA, "auth-secret");
  try {
    const kept = fs.readFileSync(file, "utf8").trim();
    if (kept) return kept;
  } catch {
    // generate below
  }
  fs.mkdirSync(DATA, { recursive: true });
  const secret = crypto.randomBytes(32).toString("base64url");
  fs.writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}

export function appEnv(mode, ports, databaseUrl, secret, redisUrl) {
  const appUrl = `http://localhost:${ports.app}`;
  const env = {
    ...process.env,
    DATABASE_URL: databaseUrl,
    // The print queue (BullMQ): the private Redis of scripts/redis.mjs, or REDIS_URL as given.
    REDIS_URL: redisUrl,
    AUTH_SECRET: secret,
    AUTH_URL: appUrl,
    AUTH_TRUST_HOST: "true",
    APP_URL: appUrl,
    SMTP_HOST: "127.0.0.1",
    SMTP_PORT: String(ports.smtp),
    MAIL_FROM: "Quireline <studio@quireline.test>",
    OUTBOX_URL: `http://127.0.0.1:${ports.outbox}`,
    // Where next start/dev listens (app.mjs); /dev/outbox is served only on loopback.
    APP_BIND_HOST: APP_BIND_HOST,
    UPLOADTHING_TOKEN: FAKE_UPLOADTHING_TOKEN,
    UPLOADTHING_INGEST_URL: `http://127.0.0.1:${ports.upload}`,
    UPLOADTHING_API_URL: `http://127.0.0.1:${ports.upload}`,
    UPLOADTHING_CALLBACK_URL: `http://127.0.0.1:${ports.app}/api/uploadthing`,
    UPLOADTHING_UFS_HOST: `localhost:${ports.upload}`,
    UPLOADTHING_UFS_APP_ID_LOCATION: "path",
    UPLOADTHING_LOG_LEVEL: "Warning",
    STRIPE_SECRET_KEY: FAKE_STRIPE_SECRET_KEY,
    STRIPE_WEBHOOK_SECRET: FAKE_STRIPE_WEBHOOK_SECRET,
    STRIPE_API_HOST: "127.0.0.1",
    STRIPE_API_PORT: String(ports.payments),
    NEXT_TELEMETRY_DISABLED: "1",
    TZ: "UTC",
    // Each kind of run builds into its own folder, so a build never replaces what another serves.
    NEXT_DIST_DIR: { test: ".next-test", bench: ".next-bench" }[mode] ?? ".next",
    FAKE_UPLOAD_PORT: String(ports.upload),
    FAKE_SMTP_PORT: String(ports.smtp),
    FAKE_OUTBOX_PORT: String(ports.outbox),
    FAKE_PAYMENTS_PORT: String(ports.payments),
    FAKE_PAYMENTS_API_KEY: FAKE_STRIPE_SECRET_KEY,
    FAKE_PAYMENTS_WEBHOOK_SECRET: FAKE_STRIPE_WEBHOOK_SECRET,
    FAKE_PAYMENTS_WEBHOOK_URL: `http://127.0.0.1:${ports.app}/api/payments/webhook`,
    FAKE_DATA_DIR: path.join(DATA, { test: "fakes-test", bench: "fakes-bench" }[mode] ?? "fakes"),
    QUIRELINE_PRIVATE_DB: db.private ? "1" : "0",
  };
  // next and vitest set NODE_ENV themselves; an inherited value breaks `next build`.
  delete env.NODE_ENV;
  return env;
}
