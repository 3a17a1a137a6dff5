import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/env";

export type OutgoingMail = { to: string; subject: string; text: string; html?: string };

let transport: Transporter | undefined;

/** The SMTP transport, configured from the environment (the local sink in development and tests). */
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

/** Escapes text for the small HTML bodies Quireline writes. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

/** A plain, readable HTML body: paragraphs and one optional button-style link. */
export function simpleHtml(paragraphs: string[], link?: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 12px">${escapeHtml(p)}</p>`).join("");
  const button = link
    ? `<p><a href="${escapeHtml(link.href)}" style="background:#1f3b2d;color:#fdf8ee;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(link.label)}</a></p>`
    : "";
  return `<div style="font-family:system-ui,sans-serif;color:#1d1b16;max-width:560px">${body}${button}<p style="color:#6b6457;font-size:12px">Quireline</p></div>`;
}
