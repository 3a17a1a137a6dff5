import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { claimMailLog, finishMailLog } from "@/db/queries/mail-log";
import { env } from "@/lib/env";
import type { Mail } from "@/lib/mail/compose";

/**
 * The one module that sends mail: the SMTP transport (the local sink in development and tests),
 * logged sending with dedupe, and absolute links into the app. Templates live in lib/mail.
 */

export type OutgoingMail = { to: string; subject: string; text: string; html?: string };

let transport: Transporter | undefined;

/** The SMTP transport, configured from the environment. */
export function mailTransport(): Transporter {
  const { SMTP_HOST, SMTP_PORT, SMTP_USER, SMTP_PASSWORD } = env();
  transport ??= nodemailer.createTransport({
    host: SMTP_HOST,
    port: SMTP_PORT,
    secure: SMTP_PORT === 465,
    ignoreTLS: SMTP_HOST === "127.0.0.1" || SMTP_HOST === "localhost",
    auth: SMTP_USER ? { user: SMTP_USER, pass: SMTP_PASSWORD ?? "" } : undefined,
  });
  return transport;
}

/** Sends one message; throws when the server refuses any recipient. */
export async function sendMail(mail: OutgoingMail): Promise<void> {
  const result = await mailTransport().sendMail({ from: env().MAIL_FROM, ...mail });
  const failed = [...(result.rejected ?? []), ...(result.pending ?? [])].filter(Boolean);
  if (failed.length > 0) throw new Error(`The mail server refused ${failed.join(", ")}`);
}

/** An absolute link into the app, e.g. appUrl("/studio/low-tide-almanac"). */
export function appUrl(path: string): string {
  return `${env().AUTH_URL.replace(/\/$/, "")}${path.startsWith("/") ? path : `/${path}`}`;
}

export type LoggedMail = {
  anthologyId?: number | null;
  pieceId?: number | null;
  kind: string;
  to: string;
  /** A mail that must go out once only carries a key; a second send with it is skipped. */
  dedupeKey?: string;
};

/**
 * Sends a mail and writes it to the e-mail log. With a dedupe key the log row is claimed first
 * (an insert under the unique key), and only the sender that claimed it sends, so two racing
 * sends of the same notice mail it once. A failed send releases the key for a later retry.
 */
export async function sendLoggedMail(
  log: LoggedMail,
  mail: Mail,
): Promise<{ sent: boolean; duplicate: boolean }> {
  const claim = await claimMailLog({
    anthologyId: log.anthologyId ?? null,
    pieceId: log.pieceId ?? null,
    toEmail: log.to,
    subject: mail.subject,
    kind: log.kind,
    dedupeKey: log.dedupeKey ?? null,
  });
  if (claim === "duplicate") return { sent: false, duplicate: true };
  try {
    await sendMail({ to: log.to, ...mail });
  } catch (e) {
    await finishMailLog(claim, { error: e instanceof Error ? e.message : String(e) });
    return { sent: false, duplicate: false };
  }
  await finishMailLog(claim, { error: null });
  return { sent: true, duplicate: false };
}
