import "server-only";
import { eq, inArray } from "drizzle-orm";
import { db, schema } from "@/db";

/** MariaDB's error number for a duplicate key (ER_DUP_ENTRY). */
const ER_DUP_ENTRY = 1062;

function isDuplicateKey(error: unknown): boolean {
  for (let e: unknown = error; e && typeof e === "object"; e = (e as { cause?: unknown }).cause) {
    const { errno, code } = e as { errno?: number; code?: unknown };
    if (errno === ER_DUP_ENTRY || code === "ER_DUP_ENTRY") return true;
  }
  return false;
}

/**
 * Writes the log row for a mail about to be sent. With a dedupe key that another row already
 * holds, nothing is written and "duplicate" comes back: that mail was sent, or is being sent.
 */
export async function claimMailLog(row: {
  anthologyId: number | null;
  pieceId: number | null;
  toEmail: string;
  subject: string;
  kind: string;
  dedupeKey: string | null;
}): Promise<number | "duplicate"> {
  try {
    const [inserted] = await db
      .insert(schema.emailLog)
      .values({ ...row, subject: row.subject.slice(0, 255), error: null, sentAt: null })
      .$returningId();
    if (!inserted) throw new Error("e-mail log insert returned no id");
    return inserted.id;
  } catch (error) {
    if (row.dedupeKey && isDuplicateKey(error)) return "duplicate";
    throw error;
  }
}

/** Which of these dedupe keys a log row already holds: mails sent, or being sent. */
export async function claimedDedupeKeys(keys: string[]): Promise<Set<string>> {
  if (keys.length === 0) return new Set();
  const rows = await db
    .select({ key: schema.emailLog.dedupeKey })
    .from(schema.emailLog)
    .where(inArray(schema.emailLog.dedupeKey, keys));
  return new Set(rows.map((r) => r.key).filter((k): k is string => k !== null));
}

/** Records how the send went; a failure gives up the dedupe key so a retry can claim it again. */
export async function finishMailLog(id: number, outcome: { error: string | null }): Promise<void> {
  await db
    .update(schema.emailLog)
    .set(
      outcome.error === null
        ? { sentAt: new Date(), error: null }
        : { sentAt: null, error: outcome.error.slice(0, 4000), dedupeKey: null },
    )
    .where(eq(schema.emailLog.id, id));
}
