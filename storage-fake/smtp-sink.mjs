// Local SMTP sink: accepts every message on 127.0.0.1 (no TLS, any or no auth),
// decodes it with mailparser and exposes it through a small HTTP "outbox" API.
// Messages are kept in memory and appended to <dataDir>/outbox.jsonl (reloaded on start).
//
//   GET    /messages[?to=<address>]   → [{id, from, to, subject, text, html, date, ...}] oldest first
//   GET    /messages/<id>             → one message (404 if unknown)
//   DELETE /messages                  → empties the outbox
//   DELETE /messages/<id>             → removes one message

import { randomUUID } from "node:crypto";
import {
  appendFileSync,
  existsSync,
  mkdirSync,
  readFileSync,
  realpathSync,
  writeFileSync,
} from "node:fs";
import { createServer } from "node:http";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

const HOST = "127.0.0.1";

/** @typedef {{id: string, from: string, to: string[], cc: string[], subject: string, text: string, html: string | null, date: string, receivedAt: string, messageId: string | null, envelopeFrom: string | null, attachments: {filename: string | null, contentType: string, size: number}[]}} OutboxMessage */

function addressList(field) {
  if (!field) return [];
  const groups = Array.isArray(field) ? field : [field];
  const out = [];
  const walk = (entries) => {
    for (const e of entries ?? []) {
      if (e.group) walk(e.group);
      else if (e.address) out.push(e.address);
    }
  };
  for (const g of groups) walk(g.value);
  return out;
}

function uniqueCaseless(list) {
  const seen = new Set();
  const out = [];
  for (const item of list) {
    const k = item.toLowerCase();
    if (!seen.has(k)) {
      seen.add(k);
      out.push(item);
    }
  }
  return out;
}

/** Turn raw RFC 5322 bytes plus the SMTP envelope into an outbox record. */
export async function parseMessage(raw, envelope = { mailFrom: null, rcptTo: [] }) {
  const parsed = await simpleParser(raw, { skipImageLinks: true });
  const envelopeTo = (envelope.rcptTo ?? []).map((r) => r.address).filter(Boolean);
  const headerTo = addressList(parsed.to);
  const cc = addressList(parsed.cc);
  const receivedAt = new Date();
  return /** @type {OutboxMessage} */ ({
    id: randomUUID(),
    from: parsed.from?.text ?? envelope.mailFrom?.address ?? "",
    to: uniqueCaseless([...headerTo, ...cc, ...envelopeTo]),
    cc,
    subject: parsed.subject ?? "",
    text: parsed.text ?? "",
    html: typeof parsed.html === "string" ? parsed.html : null,
    date: (parsed.date ?? receivedAt).toISOString(),
    receivedAt: receivedAt.toISOString(),
    messageId: parsed.messageId ?? null,
    envelopeFrom: envelope.mailFrom?.address ?? null,
    attachments: (parsed.attachments ?? []).map((a) => ({
      filename: a.filename ?? null,
      contentType: a.contentType,
      size: a.size,
    })),
  });
}

/**
 * Start the SMTP sink and its outbox HTTP API.
 * @param {{smtpPort?: number, httpPort?: number, dataDir: string, log?: number}} options
 * @returns {Promise<{smtpPort: number, httpPort: number, outboxUrl: string, messages: () => OutboxMessage[], close: () => Promise<void>}>}
 */
export async function startSmtpSink(options) {
  const { smtpPort = 4525, httpPort = 4526, dataDir, log = 0 } = options ?? {};
  if (!dataDir) throw new Error("startSmtpSink: dataDir is required");
  const dir = resolve(dataDir);
  const file = join(dir, "outbox.jsonl");
  const say = (level, ...parts) => {
    if (log >= level) process.stderr.write(`[smtp-sink] ${parts.join(" ")}\n`);
  };

  /** @type {OutboxMessage[]} */
  let messages = [];
  if (existsSync(file)) {
    for (const line of readFileSync(file, "utf8").split("\n")) {
      if (!line.trim()) continue;
      try {
        messages.push(JSON.parse(line));
      } catch {
        say(0, "skipping unreadable line in", file);
      }
    }
  }

  // If someone removed the outbox file (a reset of the data folder), the outbox is empty.
  const current = () => {
    if (messages.length > 0 && !existsSync(file)) messages = [];
    return messages;
  };

  const persistAll = () => {
    mkdirSync(dir, { recursive: true });
    writeFileSync(file, messages.map((m) => JSON.stringify(m) + "\n").join(""));
  };

  const store = (msg) => {
    current();
    messages.push(msg);
    mkdirSync(dir, { recursive: true });
    appendFileSync(file, JSON.stringify(msg) + "\n");
  };

  const smtp = new SMTPServer({
    secure: false,
    disabledCommands: ["STARTTLS"],
    authOptional: true,
    allowInsecureAuth: true,
    logger: false,
    banner: "Quireline local SMTP sink",
    size: 50 * 1024 * 1024,
    onAuth(auth, _session, callback) {
      callback(null, { user: auth.username || "anonymous" });
    },
    onData(stream, session, callback) {
      const chunks = [];
      stream.on("data", (c) => chunks.push(c));
      stream.on("error", (err) => callback(err));
      stream.on("end", () => {
        if (stream.sizeExceeded) {
          // smtp-server answers with the error's responseCode.
          const err = Object.assign(new Error("Message exceeds the size limit"), {
            responseCode: 552,
          });
          return callback(err);
        }
        parseMessage(Buffer.concat(chunks), session.envelope)
          .then((msg) => {
            store(msg);
            say(1, "received", msg.id, JSON.stringify(msg.subject), "→", msg.to.join(", "));
            callback(null, `Queued as ${msg.id}`);
          })
          .catch((err) => {
            say(0, "could not parse message:", err?.message ?? err);
            callback(err);
          });
      });
    },
  });

  const send = (req, res, status, body) => {
    const text = body === undefined ? "" : JSON.stringify(body);
    res.writeHead(status, {
      "content-type": "application/json; charset=utf-8",
      "content-length": Buffer.byteLength(text),
      "cache-control": "no-store",
      "access-control-allow-origin": req.headers.origin || "*",
      "access-control-allow-methods": "GET, DELETE, OPTIONS",
      "access-control-allow-headers": req.headers["access-control-request-headers"] || "*",
    });
    res.end(req.method === "HEAD" ? undefined : text);
  };

  const http = createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://sink.invalid");
    const parts = url.pathname.split("/").filter(Boolean);
    const method = req.method ?? "GET";
    req.resume();
    if (method === "OPTIONS") return send(req, res, 204);
    if (parts.length === 0 && (method === "GET" || method === "HEAD")) {
      return send(req, res, 200, {
        ok: true,
        service: "smtp-sink",
        smtpPort: actualSmtpPort,
        count: current().length,
      });
    }
    if (parts[0] !== "messages" || parts.length > 2)
      return send(req, res, 404, { error: "Not found" });
    if (parts.length === 1) {
      if (method === "GET" || method === "HEAD") {
        const to = url.searchParams.get("to");
        let list = current();
        if (to) {
          const wanted = to.trim().toLowerCase();
          list = list.filter((m) => m.to.some((a) => a.toLowerCase() === wanted));
        }
        return send(req, res, 200, list);
      }
      if (method === "DELETE") {
        const deleted = current().length;
        messages = [];
        persistAll();
        say(1, "cleared", deleted, "messages");
        return send(req, res, 200, { ok: true, deleted });
      }
      return send(req, res, 405, { error: `${method} not allowed` });
    }
    const id = decodeURIComponent(parts[1]);
    const found = current().find((m) => m.id === id);
    if (method === "GET" || method === "HEAD") {
      return found ? send(req, res, 200, found) : send(req, res, 404, { error: "No such message" });
    }
    if (method === "DELETE") {
      if (!found) return send(req, res, 404, { error: "No such message" });
      messages = messages.filter((m) => m !== found);
      persistAll();
      return send(req, res, 200, { ok: true, deleted: 1 });
    }
    return send(req, res, 405, { error: `${method} not allowed` });
  });

  const listen = (server, port) =>
    new Promise((res, rej) => {
      const onError = (err) => rej(err);
      server.once("error", onError);
      server.listen(port, HOST, () => {
        server.off("error", onError);
        res(undefined);
      });
    });

  await listen(smtp, smtpPort);
  const actualSmtpPort = smtp.server.address().port;
  smtp.on("error", (err) => say(0, "smtp error:", err?.message ?? err));
  try {
    await listen(http, httpPort);
  } catch (err) {
    await new Promise((res) => smtp.close(() => res(undefined)));
    throw err;
  }
  const actualHttpPort = /** @type {import("node:net").AddressInfo} */ (http.address()).port;

  let closed = false;
  return {
    smtpPort: actualSmtpPort,
    httpPort: actualHttpPort,
    outboxUrl: `http://${HOST}:${actualHttpPort}`,
    messages: () => [...current()],
    async close() {
      if (closed) return;
      closed = true;
      await Promise.all([
        new Promise((res) => smtp.close(() => res(undefined))),
        new Promise((res) => {
          http.close(() => res(undefined));
          http.closeAllConnections?.();
        }),
      ]);
    },
  };
}

export const defaultDataDir = resolve(
  dirname(fileURLToPath(import.meta.url)),
  "..",
  ".data",
  "fakes",
);

function isMain() {
  if (!process.argv[1]) return false;
  try {
    return import.meta.url === pathToFileURL(realpathSync(process.argv[1])).href;
  } catch {
    return false;
  }
}

if (isMain()) {
  const smtpPort = Number(process.env.FAKE_SMTP_PORT || 4525);
  const httpPort = Number(process.env.FAKE_OUTBOX_PORT || 4526);
  try {
    const sink = await startSmtpSink({
      smtpPort,
      httpPort,
      dataDir: process.env.FAKE_DATA_DIR || defaultDataDir,
      log: Number(process.env.FAKE_LOG || 0),
    });
    process.stdout.write(
      JSON.stringify({
        ready: true,
        pid: process.pid,
        smtp: sink.smtpPort,
        outbox: sink.outboxUrl,
      }) + "\n",
    );
    const stop = () => sink.close().then(() => process.exit(0));
    process.once("SIGTERM", stop);
    process.once("SIGINT", stop);
  } catch (err) {
    if (err?.code === "EADDRINUSE") {
      process.stderr.write(`smtp-sink: port ${err.port} on ${HOST} is already in use\n`);
    } else {
      process.stderr.write(`smtp-sink: ${err?.message ?? err}\n`);
    }
    process.exit(1);
  }
}
