// Cross-site write refusal, decided from Fetch Metadata (W3C "Fetch Metadata Request Headers",
// Sec-Fetch-Site values same-origin | same-site | cross-site | none) and the Origin header
// (RFC 6454 §7.2; the WHATWG Fetch standard sends Origin on every request whose method is not GET/HEAD).
import { describe, expect, it } from "vitest";
import { isSameSiteRequest } from "@/lib/request-origin";

const own = ["http://localhost:3000"];
const post = (origin: string | null, secFetchSite: string | null) =>
  isSameSiteRequest({ method: "POST", origin, secFetchSite, ownOrigins: own });

describe("isSameSiteRequest", () => {
  it("lets a same-origin page write", () => {
    expect(post("http://localhost:3000", "same-origin")).toBe(true);
    expect(post("http://LOCALHOST:3000", null)).toBe(true);
  });

  it("refuses a foreign Origin, with or without Fetch Metadata", () => {
    expect(post("https://attacker.example", "cross-site")).toBe(false);
    expect(post("https://attacker.example", null)).toBe(false);
    // Same host, other port: another origin (RFC 6454 §4: scheme, host and port).
    expect(post("http://localhost:3001", null)).toBe(false);
  });

  it("refuses same-site and cross-site Fetch Metadata even when Origin is missing", () => {
    expect(post(null, "cross-site")).toBe(false);
    expect(post(null, "same-site")).toBe(false);
  });

  it('refuses the opaque origin "null"', () => {
    expect(post("null", null)).toBe(false);
  });

  it("lets non-browser clients (no Origin, no Fetch Metadata) through", () => {
    expect(post(null, null)).toBe(true);
  });

  it("never refuses safe methods", () => {
    for (const method of ["GET", "HEAD", "OPTIONS"])
      expect(
        isSameSiteRequest({
          method,
          origin: "https://attacker.example",
          secFetchSite: "cross-site",
          ownOrigins: own,
        }),
      ).toBe(true);
  });
});
