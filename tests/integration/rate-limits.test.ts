// Rate limits on password sign-in (per account and per address), sign-in links and upload starts,
// against the running app over HTTP, as a script guessing passwords would call it.
import type mysql from "mysql2/promise";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { LIMITS } from "@/lib/rate-limits";
import { hashPassword } from "@/server/auth/password";
import { check, consume } from "@/server/rate-limit";
import { testEnv } from "../helpers/env";
import { authPost, cookieHeader, signInWith } from "../helpers/http-session";
import { listMessages } from "../helpers/outbox";
import { connect, createPerson, type FixturePerson } from "../helpers/review-fixtures";

const PASSWORD = "tidepool-lantern-88";
let conn: mysql.Connection;
const people: FixturePerson[] = [];

async function person(label: string): Promise<FixturePerson> {
  const p = await createPerson(conn, `Rate ${label}`, `rate-${label}`);
  await conn.query("UPDATE user SET password_hash = ? WHERE id = ?", [
    await hashPassword(PASSWORD),
    p.id,
  ]);
  people.push(p);
  return p;
}

beforeAll(async () => {
  conn = await connect();
});

afterAll(async () => {
  for (const p of people) {
    await conn.query("DELETE FROM rate_limit WHERE `key` LIKE ?", [`%${p.email}%`]);
    await conn.query("DELETE FROM rate_limit WHERE `key` = ?", [`uploadStart:user:${p.id}`]);
    await conn.query("DELETE FROM user WHERE id = ?", [p.id]);
  }
  await conn.end();
});

describe("password sign-in", () => {
  it("answers 429 with Retry-After once an account's wrong passwords are used up, even for the right one", async () => {
    const p = await person("guessed");
    for (let i = 0; i < LIMITS.signInAccount.points; i++) {
      const wrong = await signInWith(p.email, `wrong-${i}`);
      expect(wrong.status, `try ${i + 1}`).not.toBe(429);
      expect(wrong.headers.get("location") ?? "").toContain("error=");
    }
    const blocked = await signInWith(p.email, "wrong-again");
    expect(blocked.status).toBe(429);
    const retryAfter = Number(blocked.headers.get("retry-after"));
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(LIMITS.signInAccount.durationSec);
    expect(((await blocked.json()) as { error: string }).error).toMatch(
      /^Too many tries at signing in\. Try again in \d+ minutes?\.$/,
    );
    const right = await signInWith(p.email, PASSWORD);
    expect(right.status).toBe(429);
  });

  it("clears an account's failures when the right password comes in time", async () => {
    const p = await person("forgetful");
    for (let i = 0; i < 3; i++) await signInWith(p.email, `nearly-${i}`);
    const [before] = await conn.query("SELECT points FROM rate_limit WHERE `key` = ?", [
      `signInAccount:${p.email}`,
    ]);
    expect((before as { points: number }[])[0]?.points).toBe(3);
    const jar = new Map<string, string>();
    const ok = await signInWith(p.email, PASSWORD, jar);
    expect(ok.status).toBe(302);
    expect(ok.headers.get("location")).toMatch(/\/studio$/);
    expect([...jar.keys()].some((k) => k.includes("session-token"))).toBe(true);
    const [after] = await conn.query("SELECT points FROM rate_limit WHERE `key` = ?", [
      `signInAccount:${p.email}`,
    ]);
    expect(after as unknown[]).toHaveLength(0);
  });

  it("limits an address over all accounts, and another address is not affected", async () => {
    // Addresses from RFC 5737's documentation range, so no real client shares them.
    const guesser = "198.51.100.23";
    for (let i = 0; i < LIMITS.signInAddress.points; i++) {
      expect((await consume("signInAddress", guesser)).ok).toBe(true);
    }
    const refused = await consume("signInAddress", guesser);
    expect(refused.ok).toBe(false);
    expect((await check("signInAddress", guesser)).ok).toBe(false);
    expect((await check("signInAddress", "198.51.100.24")).ok).toBe(true);
    await conn.query("DELETE FROM rate_limit WHERE `key` LIKE 'signInAddress:198.51.100.%'");
  });
});

describe("sign-in links", () => {
  it("sends a few links to one address, then answers 429 and sends no more", async () => {
    const p = await person("linked");
    for (let i = 0; i < LIMITS.emailLinkAccount.points; i++) {
      const sent = await authPost("/api/auth/signin/nodemailer", { email: p.email });
      expect(sent.status, `link ${i + 1}`).toBe(302);
    }
    const blocked = await authPost("/api/auth/signin/nodemailer", { email: p.email });
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers.get("retry-after"))).toBeGreaterThan(0);
    const mails = await listMessages({ to: p.email });
    expect(mails).toHaveLength(LIMITS.emailLinkAccount.points);
  });
});

describe("upload starts", () => {
  it("answers 429 with Retry-After once a person has started too many", async () => {
    const p = await person("uploader");
    const jar = new Map<string, string>();
    expect((await signInWith(p.email, PASSWORD, jar)).status).toBe(302);
    for (let i = 0; i < LIMITS.uploadStart.points; i++)
      await consume("uploadStart", `user:${p.id}`);
    const cookie = cookieHeader(jar);
    const response = await fetch(
      `${testEnv.appUrl}/api/uploadthing?actionType=upload&slug=artworkPage`,
      {
        method: "POST",
        headers: { "content-type": "application/json", cookie },
        body: JSON.stringify({ files: [{ name: "p1.png", size: 10, type: "image/png" }] }),
      },
    );
    expect(response.status).toBe(429);
    expect(Number(response.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(((await response.json()) as { error: string }).error).toContain("starting uploads");
  });
});
