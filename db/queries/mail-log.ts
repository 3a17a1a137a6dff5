import "server-only";
import { eq } from "drizzle-orm";
import { db, schema } from "@/db";
import { sendMail } from "@/server/mail";

/** Sends a mail and writes it to the e-mail log; with a dedupe key, a second send is skipped. */
export async function sendLoggedMail(mail: {
  anthologyId?: number | null;
  pieceId?: number | null;
  kind: string;
  to: string;
  subject: string;
  text: string;
  html?: string;
  dedupeKey?: string;
}): Promise<{ sent: boolean }> {
  if (mail.dedupeKey) {
    const [already] = await db
      .select({ id: schema.emailLog.id })
      .from(schema.emailLog)
      .where(eq(schema.emailLog.dedupeKey, mail.dedupeKey))
      .limit(1);
    if (already) return { sent: false };
  }
  let error: string | null = null;
  try {
    await sendMail({ to: mail.to, subject: mail.subject, text: mail.text, html: mail.html });
  } catch (e) {
    error = e instanceof Error ? e.message : String(e);
  }
  await db.insert(schema.emailLog).values({
    anthologyId: mail.anthologyId ?? null,
    pieceId: mail.pieceId ?? null,
    toEmail: mail.to,
    subject: mail.subject,
    kind: mail.kind,
    dedupeKey: error ? null : (mail.dedupeKey ?? null),
    error,
    sentAt: error ? null : new Date(),
  });
  return { sent: error === null };
}
