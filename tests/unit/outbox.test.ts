// The local outbox page's exposure rule. Loopback names: RFC 6761 §6.3 (localhost), RFC 1122
// §3.2.1.3 (127.0.0.0/8), RFC 4291 §2.5.3 (::1).
import { describe, expect, it } from "vitest";
import { isLoopbackHost, mailFor, outboxServed } from "@/lib/outbox";

describe("isLoopbackHost", () => {
  it("accepts loopback names and addresses, with or without a port", () => {
    for (const host of [
      "localhost",
      "localhost:3000",
      "127.0.0.1",
      "127.8.9.10:80",
      "[::1]:3000",
      "::1",
      "app.localhost",
    ])
      expect(isLoopbackHost(host), host).toBe(true);
  });
  it("refuses everything else", () => {
    for (const host of [
      "0.0.0.0",
      "192.168.1.20",
      "quireline.example",
      "127.0.0.1.example",
      "128.0.0.1",
      "",
      null,
      undefined,
    ])
      expect(isLoopbackHost(host), String(host)).toBe(false);
  });
});

describe("outboxServed", () => {
  const local = {
    outboxUrl: "http://127.0.0.1:4526",
    bindHost: "127.0.0.1",
    requestHost: "localhost:3000",
  };
  it("is served on loopback with a sink configured", () => {
    expect(outboxServed(local)).toBe(true);
  });
  it("is not served without a sink, when bound elsewhere, or asked for by another name", () => {
    expect(outboxServed({ ...local, outboxUrl: undefined })).toBe(false);
    expect(outboxServed({ ...local, bindHost: "0.0.0.0" })).toBe(false);
    expect(outboxServed({ ...local, bindHost: undefined })).toBe(false);
    expect(outboxServed({ ...local, requestHost: "studio.example.org" })).toBe(false);
  });
});

describe("mailFor", () => {
  it("keeps only mail addressed to the person", () => {
    const messages = [
      { id: "1", to: ["odile@example.org"] },
      { id: "2", to: ["Bea@Example.org", "odile@example.org"] },
      { id: "3", to: ["cass@example.org"] },
    ];
    expect(mailFor(messages, "bea@example.org").map((m) => m.id)).toEqual(["2"]);
  });
});
