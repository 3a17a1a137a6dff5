// Logged sending through the SMTP sink: a mail with a dedupe key goes out once, even when two
// sends race, because the log row is claimed (inserted under the unique key) before sending.
import type mysql from "mysql2/promise";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { listMessages } from "../helpers/outbox";
import { uniqueEmail } from "../helpers/demo";
import { connect } from "../helpers/review-fixtures";

const { sendLoggedMail } = await import("@/server/mail");
const { composeMail } = await import("@/lib/mail/compose");
const { pool } = await import("@/db");

let conn: mysql.Connection;
const to = uniqueEmail("dedupe");
const key = `test-dedupe:${to}`;

beforeAll(async () => {
  conn = await connect();
});

afterAll(async () => {
  await conn.query("DELETE FROM email_log WHERE to_email = ?", [to]);
  await conn.end();
  await pool.end();
});

describe("sendLoggedMail", () => {
  it("sends a deduplicated mail once when five sends race, and logs it once", async () => {
    const mail = composeMail("Your pages in Low Tide Almanac", ["Pages 4 and 5."]);
    const outcomes = await Promise.all(
      Array.from({ length: 5 }, () =>
        sendLoggedMail({ kind: "page-notice", to, dedupeKey: key }, mail),
      ),
    );
    expect(outcomes.filter((o) => o.sent)).toHaveLength(1);
    expect(outcomes.filter((o) => o.duplicate)).toHaveLength(4);
    const [rows] = await conn.query<mysql.RowDataPacket[]>(
      "SELECT sent_at, error FROM email_log WHERE dedupe_key = ?",
      [key],
    );
    expect(rows).toHaveLength(1);
    expect(rows[0]!.sent_at).not.toBeNull();
    expect(await listMessages({ to })).toHaveLength(1);
  });

  it("sends mail without a key every time", async () => {
    const mail = composeMail("Spec check", ["Nothing to fix."]);
    await sendLoggedMail({ kind: "spec-report", to }, mail);
    await sendLoggedMail({ kind: "spec-report", to }, mail);
    expect(await listMessages({ to })).toHaveLength(3);
  });
});
