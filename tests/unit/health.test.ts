import { describe, expect, it } from "vitest";
import { healthReport, healthStatusCode } from "@/lib/health";

describe("healthReport", () => {
  it("is ok with 200 only when every service is up", () => {
    const report = healthReport({
      database: { state: "up", ms: 2 },
      mail: { state: "up", ms: 1 },
    });
    expect(report).toEqual({
      status: "ok",
      down: [],
      services: { database: { state: "up", ms: 2 }, mail: { state: "up", ms: 1 } },
    });
    expect(healthStatusCode(report)).toBe(200);
  });

  it("names the services that are down and answers 503", () => {
    const report = healthReport({
      uploads: { state: "down", ms: 2000, reason: "no answer within 2000 ms" },
      database: { state: "up", ms: 3 },
      mail: { state: "down", ms: 1, reason: "cannot connect (ECONNREFUSED)" },
    });
    expect(report.status).toBe("degraded");
    expect(report.down).toEqual(["mail", "uploads"]);
    // RFC 9110 §15.6.4: 503 Service Unavailable.
    expect(healthStatusCode(report)).toBe(503);
  });
});
