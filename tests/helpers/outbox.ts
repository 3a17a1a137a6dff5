// Typed client for the SMTP sink's outbox HTTP API (storage-fake/smtp-sink.mjs).
// The base URL comes from the `baseUrl` option, else OUTBOX_URL, else the `npm test` port 4626.

export interface OutboxAttachment {
  filename: string | null;
  contentType: string;
  size: number;
}

export interface OutboxMessage {
  id: string;
  /** The From header as text, e.g. `"Quireline" <no-reply@quireline.test>` */
  from: string;
  /** Every recipient: To and Cc headers plus the SMTP envelope (so Bcc too) */
  to: string[];
  cc: string[];
  subject: string;
  /** Decoded plain-text body (quoted-printable/base64 already undone) */
  text: string;
  html: string | null;
  /** ISO timestamp from the Date header (or receipt time) */
  date: string;
  receivedAt: string;
  messageId: string | null;
  envelopeFrom: string | null;
  attachments: OutboxAttachment[];
}

export interface OutboxOptions {
  baseUrl?: string;
}

export function outboxBaseUrl(opts?: OutboxOptions): string {
  return (opts?.baseUrl ?? process.env.OUTBOX_URL ?? "http://127.0.0.1:4626").replace(/\/+$/, "");
}

async function request(url: string, init?: RequestInit): Promise<unknown> {
  const res = await fetch(url, init);
  const body = await res.text();
  if (!res.ok) {
    throw new Error(
      `outbox ${init?.method ?? "GET"} ${url} answered ${res.status}: ${body.slice(0, 300)}`,
    );
  }
  return body === "" ? null : (JSON.parse(body) as unknown);
}

/** All messages, oldest first; with `to`, only those with that recipient (case-insensitive). */
export async function listMessages(
  opts: OutboxOptions & { to?: string } = {},
): Promise<OutboxMessage[]> {
  const url = new URL(`${outboxBaseUrl(opts)}/messages`);
  if (opts.to) url.searchParams.set("to", opts.to);
  return (await request(url.href)) as OutboxMessage[];
}

export async function getMessage(id: string, opts: OutboxOptions = {}): Promise<OutboxMessage> {
  return (await request(
    `${outboxBaseUrl(opts)}/messages/${encodeURIComponent(id)}`,
  )) as OutboxMessage;
}

/** Empties the outbox. */
export async function clearMessages(opts: OutboxOptions = {}): Promise<void> {
  await request(`${outboxBaseUrl(opts)}/messages`, { method: "DELETE" });
}

/**
 * Polls until a message to `to` (and, if given, with a subject matching `subject`) is in the
 * outbox; returns the newest such message. Throws after `timeoutMs` (default 10 s), listing
 * what the outbox held for that address.
 */
export async function waitForMessage(
  opts: OutboxOptions & { to: string; subject?: RegExp; timeoutMs?: number; intervalMs?: number },
): Promise<OutboxMessage> {
  const timeoutMs = opts.timeoutMs ?? 10_000;
  const intervalMs = opts.intervalMs ?? 150;
  const deadline = Date.now() + timeoutMs;
  let seen: OutboxMessage[];
  for (;;) {
    seen = await listMessages({ baseUrl: opts.baseUrl, to: opts.to });
    const matching = seen.filter((m) => !opts.subject || opts.subject.test(m.subject));
    const newest = matching[matching.length - 1];
    if (newest) return newest;
    if (Date.now() >= deadline) break;
    await new Promise((r) => setTimeout(r, intervalMs));
  }
  const subjects = seen.map((m) => JSON.stringify(m.subject)).join(", ") || "none";
  throw new Error(
    `No message to ${opts.to}${opts.subject ? ` with subject ${opts.subject}` : ""} within ${timeoutMs} ms ` +
      `(messages to that address: ${subjects})`,
  );
}

/**
 * The http(s) links in a text or HTML body, in order, without duplicates. Trailing sentence
 * punctuation is dropped and HTML `&amp;` is decoded, so links can be fetched as they are.
 */
export function extractLinks(text: string): string[] {
  const found: string[] = [];
  for (const match of text.matchAll(/https?:\/\/[^\s"'<>`]+/gi)) {
    let link = match[0].replace(/&amp;/gi, "&");
    // Drop trailing punctuation, and a closing bracket that has no opening one inside the link.
    for (;;) {
      const last = link.at(-1) ?? "";
      if (/[.,;:!?]/.test(last)) {
        link = link.slice(0, -1);
        continue;
      }
      const pairs: Record<string, string> = { ")": "(", "]": "[", "}": "{" };
      const open = pairs[last];
      if (open && link.split(open).length <= link.split(last).length - 1) {
        link = link.slice(0, -1);
        continue;
      }
      break;
    }
    if (!found.includes(link)) found.push(link);
  }
  return found;
}
