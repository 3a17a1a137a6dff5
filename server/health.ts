import "server-only";
import net from "node:net";
import IORedis from "ioredis";
import { pool } from "@/db";
import { env } from "@/lib/env";
import type { ServiceReport } from "@/lib/health";

/** Each probe gets this long before its service counts as down. */
export const PROBE_TIMEOUT_MS = 2_000;

async function timed(probe: (signal: AbortSignal) => Promise<void>): Promise<ServiceReport> {
  const started = performance.now();
  const controller = new AbortController();
  const timer = setTimeout(() => controller.abort(), PROBE_TIMEOUT_MS);
  try {
    await Promise.race([
      probe(controller.signal),
      new Promise<never>((_, reject) =>
        controller.signal.addEventListener("abort", () =>
          reject(new Error(`no answer within ${PROBE_TIMEOUT_MS} ms`)),
        ),
      ),
    ]);
    return { state: "up", ms: Math.round(performance.now() - started) };
  } catch (error) {
    const reason = error instanceof Error ? error.message : "the probe failed";
    return { state: "down", ms: Math.round(performance.now() - started), reason: plain(reason) };
  } finally {
    clearTimeout(timer);
  }
}

/** Drops anything that looks like an address or a credential from a driver's message. */
function plain(message: string): string {
  return message
    .replace(/[a-z]+:\/\/\S+/gi, "<url>")
    .replace(/\b\d{1,3}(\.\d{1,3}){3}(:\d+)?\b/g, "<address>")
    .slice(0, 200);
}

/** The database answers a trivial query. */
export const probeDatabase = () =>
  timed(async () => {
    await pool.query("SELECT 1");
  });

/** The upload host answers HTTP at all (any status: it is up and speaking). */
export const probeUploads = () =>
  timed(async (signal) => {
    const base = env().UPLOADTHING_INGEST_URL ?? "https://api.uploadthing.com";
    await fetch(base, { method: "HEAD", signal });
  });

/** The mail server greets with 220 (RFC 5321 §4.2: the greeting reply). */
export const probeMail = () =>
  timed(
    (signal) =>
      new Promise<void>((resolve, reject) => {
        const socket = net.connect({ host: env().SMTP_HOST, port: env().SMTP_PORT });
        const done = (error?: Error) => {
          socket.destroy();
          if (error) reject(error);
          else resolve();
        };
        signal.addEventListener("abort", () => done(new Error("no greeting in time")));
        socket.once("error", (e) =>
          done(new Error(`cannot connect (${(e as NodeJS.ErrnoException).code ?? "error"})`)),
        );
        socket.once("data", (chunk) => {
          const line = chunk.toString("latin1");
          if (line.startsWith("220")) {
            socket.write("QUIT\r\n");
            done();
          } else done(new Error(`unexpected greeting ${JSON.stringify(line.slice(0, 3))}`));
        });
      }),
  );

/** The print queue's Redis answers PING with PONG; a fresh connection that does not retry. */
export const probeQueue = () =>
  timed(async (signal) => {
    const redis = new IORedis(env().REDIS_URL, {
      lazyConnect: true,
      maxRetriesPerRequest: 0,
      retryStrategy: () => null,
      connectTimeout: PROBE_TIMEOUT_MS,
      enableOfflineQueue: false,
    });
    redis.on("error", () => undefined);
    signal.addEventListener("abort", () => redis.disconnect());
    try {
      await redis.connect();
      const answer = await redis.ping();
      if (answer !== "PONG") throw new Error(`unexpected answer to PING`);
    } catch (error) {
      const code = (error as NodeJS.ErrnoException).code;
      throw new Error(code ? `cannot connect (${code})` : "cannot connect", { cause: error });
    } finally {
      redis.disconnect();
    }
  });

/** Every probe, run at once. */
export async function probeAll(): Promise<Record<string, ServiceReport>> {
  const [database, uploads, mail, queue] = await Promise.all([
    probeDatabase(),
    probeUploads(),
    probeMail(),
    probeQueue(),
  ]);
  return { database, uploads, mail, queue };
}
