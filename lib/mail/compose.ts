/**
 * The shape of every e-mail Quireline writes, and the one place its plain-text and HTML bodies
 * are made. Templates in lib/mail/templates return a `Mail`; server/mail.ts sends it.
 */

export type MailLink = { href: string; label: string };

/** A message ready to send: its subject and both bodies. */
export type Mail = { subject: string; text: string; html: string };

/** Escapes text for the small HTML bodies Quireline writes. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

/** A plain, readable HTML body: paragraphs and one optional button-style link. */
export function simpleHtml(paragraphs: string[], link?: MailLink): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 12px">${escapeHtml(p)}</p>`).join("");
  const button = link
    ? `<p><a href="${escapeHtml(link.href)}" style="background:#1f3b2d;color:#fdf8ee;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(link.label)}</a></p>`
    : "";
  return `<div style="font-family:system-ui,sans-serif;color:#1d1b16;max-width:560px">${body}${button}<p style="color:#6b6457;font-size:12px">Quireline</p></div>`;
}

/**
 * A mail from paragraphs and an optional link: the text body has the paragraphs, blank-line
 * separated, and the link on its own line as "label: href"; empty paragraphs are dropped.
 */
export function composeMail(subject: string, paragraphs: string[], link?: MailLink): Mail {
  const kept = paragraphs.filter((p) => p.trim() !== "");
  const text = `${kept.join("\n\n")}${link ? `\n\n${link.label}: ${link.href}` : ""}\n`;
  return { subject, text, html: simpleHtml(kept, link) };
}
