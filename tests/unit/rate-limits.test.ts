import { describe, expect, it } from "vitest";
import { clientAddress, LIMITS, refusalMessage, retryAfterSeconds } from "@/lib/rate-limits";

describe("retryAfterSeconds", () => {
  // RFC 9110 §10.2.3: Retry-After is a whole number of seconds.
  it("rounds up to whole seconds and never says 0", () => {
    expect(retryAfterSeconds(1)).toBe(1);
    expect(retryAfterSeconds(0)).toBe(1);
    expect(retryAfterSeconds(1000)).toBe(1);
    expect(retryAfterSeconds(1001)).toBe(2);
    expect(retryAfterSeconds(899_500)).toBe(900);
  });
});

describe("refusalMessage", () => {
  it("says what was tried and how long to wait, in plain words", () => {
    expect(refusalMessage("signInAccount", 240)).toBe(
      "Too many tries at signing in. Try again in 4 minutes.",
    );
    expect(refusalMessage("signInAccount", 61)).toBe(
      "Too many tries at signing in. Try again in 2 minutes.",
    );
    expect(refusalMessage("uploadStart", 1)).toBe(
      "Too many tries at starting uploads. Try again in 1 second.",
    );
    expect(refusalMessage("signUpAddress", 45)).toBe(
      "Too many tries at creating accounts. Try again in 45 seconds.",
    );
  });
});

describe("clientAddress", () => {
  it("takes the entry the server appended, not what the client claimed", () => {
    expect(clientAddress("203.0.113.9, 127.0.0.1")).toBe("127.0.0.1");
    expect(clientAddress("::1")).toBe("::1");
    expect(clientAddress(null)).toBe("unknown");
    expect(clientAddress(" , ")).toBe("unknown");
    expect(clientAddress("x".repeat(65))).toBe("unknown");
  });
});

describe("LIMITS", () => {
  it("gives an address more room than one account, since many people may share it", () => {
    expect(LIMITS.signInAddress.points).toBeGreaterThan(LIMITS.signInAccount.points);
    expect(LIMITS.emailLinkAddress.points).toBeGreaterThan(LIMITS.emailLinkAccount.points);
    for (const rule of Object.values(LIMITS)) {
      expect(Number.isInteger(rule.points) && rule.points > 0).toBe(true);
      expect(Number.isInteger(rule.durationSec) && rule.durationSec > 0).toBe(true);
    }
  });
});
