// Who may accept an invitation, and when it stops working.
import { describe, expect, it } from "vitest";
import {
  acceptanceCheck,
  invitationState,
  maskEmail,
  type InvitationFacts,
} from "@/lib/invitations";

const now = new Date("2026-06-01T12:00:00Z");
const pending: InvitationFacts = {
  email: "juniper@example.org",
  expiresAt: new Date("2026-06-10T00:00:00Z"),
  acceptedAt: null,
  revokedAt: null,
};

describe("invitationState", () => {
  it("is valid until it expires, then expired", () => {
    expect(invitationState(pending, now)).toBe("valid");
    expect(invitationState(pending, pending.expiresAt)).toBe("expired");
  });
  it("is single-use: once accepted it is used, even before it would expire", () => {
    expect(invitationState({ ...pending, acceptedAt: now }, now)).toBe("used");
  });
  it("is dead once revoked", () => {
    expect(invitationState({ ...pending, revokedAt: now }, now)).toBe("revoked");
  });
});

describe("acceptanceCheck", () => {
  const verified = new Date("2026-05-01T00:00:00Z");
  it("lets the invited address accept once it is confirmed", () => {
    expect(
      acceptanceCheck(pending.email, { email: "Juniper@Example.org", emailVerified: verified }),
    ).toBe("ok");
  });
  it("refuses any other account, however it signed in", () => {
    expect(
      acceptanceCheck(pending.email, { email: "mallory@example.org", emailVerified: verified }),
    ).toBe("other-address");
    expect(acceptanceCheck(pending.email, { email: null, emailVerified: null })).toBe(
      "other-address",
    );
  });
  it("asks an account that only typed the address in to confirm it first", () => {
    expect(acceptanceCheck(pending.email, { email: pending.email, emailVerified: null })).toBe(
      "unconfirmed",
    );
  });
});

describe("maskEmail", () => {
  it("keeps the first letter and the domain", () => {
    expect(maskEmail("juniper@example.org")).toBe("j•••@example.org");
    expect(maskEmail("nonsense")).toBe("•••");
  });
});
