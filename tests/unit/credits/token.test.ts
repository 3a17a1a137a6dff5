import { createHmac } from "node:crypto";
import { describe, expect, it } from "vitest";
import {
  CREDIT_TOKEN_TTL_MS,
  creditLineHash,
  creditTokenState,
  readCreditToken,
  signCreditToken,
} from "@/lib/credits/token";

const SECRET = "a-test-secret-of-32-characters!!";
const requestedAt = new Date("2026-11-20T10:15:00.250Z");
const token = signCreditToken({ pieceId: 42, creditLine: "Wren Halloway", requestedAt }, SECRET);

describe("the primitive", () => {
  it("is HMAC-SHA256 as RFC 4231 test case 2 gives it", () => {
    // RFC 4231 §4.3: key "Jefe", data "what do ya want for nothing?"
    expect(createHmac("sha256", "Jefe").update("what do ya want for nothing?").digest("hex")).toBe(
      "5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843",
    );
  });

  it("hashes the line with SHA-256: FIPS 180-4 example 'abc' begins ba7816bf", () => {
    // FIPS 180-4 / NIST CSRC example: SHA-256("abc") = ba7816bf 8f01cfea ...; base64url of those bytes begins "ungWv48B"
    expect(creditLineHash("abc")).toBe(
      Buffer.from("ba7816bf8f01cfea414140de", "hex").toString("base64url"),
    );
  });
});

describe("signing and reading a credit token", () => {
  it("reads back the piece, the request time to the millisecond and the line's hash", () => {
    expect(readCreditToken(token, SECRET)).toEqual({
      pieceId: 42,
      requestedAt,
      lineHash: creditLineHash("Wren Halloway"),
    });
  });

  it("is URL-safe and short enough for a mail line", () => {
    expect(token).toMatch(/^[A-Za-z0-9._-]+$/);
    expect(token.length).toBeLessThan(100);
  });

  it("refuses a token signed with another secret", () => {
    expect(readCreditToken(token, "another-secret-of-32-characters!")).toBeNull();
  });

  it("refuses any change to the piece, the time, the hash or the signature", () => {
    const parts = token.split(".");
    const swap = (i: number, value: string) => parts.map((p, n) => (n === i ? value : p)).join(".");
    expect(readCreditToken(swap(1, "43"), SECRET)).toBeNull();
    expect(readCreditToken(swap(2, (requestedAt.getTime() + 1).toString(36)), SECRET)).toBeNull();
    expect(readCreditToken(swap(3, creditLineHash("Someone Else")), SECRET)).toBeNull();
    const sig = parts[4]!;
    const flipped = (sig[0] === "A" ? "B" : "A") + sig.slice(1);
    expect(readCreditToken(swap(4, flipped), SECRET)).toBeNull();
  });

  it("refuses malformed tokens without throwing", () => {
    for (const bad of [
      "",
      "c1",
      token.slice(0, -1),
      `${token}x`,
      token.replace("c1", "c2"),
      "c1.0.a.b.c",
    ])
      expect(readCreditToken(bad, SECRET)).toBeNull();
  });

  it("will not sign with a short secret", () => {
    expect(() => signCreditToken({ pieceId: 1, creditLine: "x", requestedAt }, "short")).toThrow();
  });
});

describe("what a genuine token may still do", () => {
  const claims = readCreditToken(token, SECRET)!;
  const open = {
    creditLine: "Wren Halloway",
    creditApprovedAt: null,
    creditRequestedAt: requestedAt,
  };
  const soon = new Date(requestedAt.getTime() + 60_000);

  it("approves while the request is open and the line unchanged", () => {
    expect(creditTokenState(claims, open, soon)).toBe("good");
  });

  it("says approved once the line is approved", () => {
    expect(
      creditTokenState(claims, { ...open, creditApprovedAt: soon, creditRequestedAt: null }, soon),
    ).toBe("approved");
  });

  it("says changed when the line is not the one mailed, even by one character", () => {
    expect(creditTokenState(claims, { ...open, creditLine: "Wren Halloway." }, soon)).toBe(
      "changed",
    );
  });

  it("says changed when the request was withdrawn", () => {
    expect(creditTokenState(claims, { ...open, creditRequestedAt: null }, soon)).toBe("changed");
  });

  it("keeps an earlier mail good after asking again for the same line", () => {
    const later = new Date(requestedAt.getTime() + 86_400_000);
    expect(creditTokenState(claims, { ...open, creditRequestedAt: later }, later)).toBe("good");
  });

  it("expires 30 days after the request, not a millisecond before", () => {
    const edge = new Date(requestedAt.getTime() + CREDIT_TOKEN_TTL_MS);
    expect(creditTokenState(claims, open, edge)).toBe("good");
    expect(creditTokenState(claims, open, new Date(edge.getTime() + 1))).toBe("expired");
  });
});
