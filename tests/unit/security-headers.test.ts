import { describe, expect, it } from "vitest";
import { contentSecurityPolicy, originOf, securityHeaders } from "@/lib/security/headers";

const base = {
  nonce: "bm9uY2UtdmFsdWU=",
  development: false,
  connectOrigins: ["http://127.0.0.1:4590"],
  https: false,
};

function directives(csp: string): Map<string, string[]> {
  return new Map(
    csp.split("; ").map((d) => {
      const [name, ...values] = d.split(" ");
      return [name!, values];
    }),
  );
}

describe("contentSecurityPolicy", () => {
  it("lets scripts run only with this request's nonce, never inline", () => {
    const d = directives(contentSecurityPolicy(base));
    expect(d.get("script-src")).toEqual(["'self'", "'nonce-bm9uY2UtdmFsdWU='", "'strict-dynamic'"]);
    expect(d.get("script-src")).not.toContain("'unsafe-inline'");
    expect(d.get("script-src")).not.toContain("'unsafe-eval'");
  });

  it("refuses framing and plugins", () => {
    const d = directives(contentSecurityPolicy(base));
    expect(d.get("frame-ancestors")).toEqual(["'none'"]);
    expect(d.get("object-src")).toEqual(["'none'"]);
    expect(d.get("base-uri")).toEqual(["'self'"]);
  });

  it("lets the browser send files to the upload host and nowhere else", () => {
    const d = directives(contentSecurityPolicy(base));
    expect(d.get("connect-src")).toEqual(["'self'", "http://127.0.0.1:4590"]);
  });

  it("allows eval and the refresh socket only on a development server", () => {
    const d = directives(contentSecurityPolicy({ ...base, development: true }));
    expect(d.get("script-src")).toContain("'unsafe-eval'");
    expect(d.get("connect-src")).toContain("ws:");
  });
});

describe("securityHeaders", () => {
  it("sends the fixed headers on every page", () => {
    const h = securityHeaders(base);
    expect(h["Referrer-Policy"]).toBe("strict-origin-when-cross-origin");
    expect(h["X-Content-Type-Options"]).toBe("nosniff");
    expect(h["Permissions-Policy"]).toContain("camera=()");
    expect(h["Strict-Transport-Security"]).toBeUndefined();
  });

  it("adds HSTS only over https (RFC 6797 §7.2: ignored over plain http)", () => {
    const h = securityHeaders({ ...base, https: true });
    expect(h["Strict-Transport-Security"]).toBe("max-age=31536000; includeSubDomains");
    expect(h["Content-Security-Policy"]).toContain("upgrade-insecure-requests");
  });
});

describe("originOf", () => {
  it("keeps scheme, host and port only", () => {
    expect(originOf("http://127.0.0.1:4590/some/path?x=1")).toBe("http://127.0.0.1:4590");
    expect(originOf("not a url")).toBeNull();
    expect(originOf(undefined)).toBeNull();
  });
});
