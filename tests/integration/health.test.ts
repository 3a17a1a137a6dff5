// GET /api/health over HTTP against the running stack, and the route with two services pointed
// at ports where nothing listens.
import net from "node:net";
import { describe, expect, it, vi } from "vitest";
import { testEnv } from "../helpers/env";

/** A loopback port with nothing listening on it (bound, noted, closed). */
async function closedPort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as net.AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

describe("GET /api/health", () => {
  it("answers 200 with every service up when the stack runs", async () => {
    const response = await fetch(`${testEnv.appUrl}/api/health`);
    expect(response.status).toBe(200);
    expect(response.headers.get("cache-control")).toBe("no-store");
    const body = (await response.json()) as {
      status: string;
      down: string[];
      services: Record<string, { state: string }>;
    };
    expect(body.status).toBe("ok");
    expect(body.down).toEqual([]);
    expect(Object.keys(body.services).sort()).toEqual(["database", "mail", "queue", "uploads"]);
    expect(JSON.stringify(body)).not.toMatch(/127\.0\.0\.1|password|mysql:/);
  });

  it("answers 503 and names the services that are down", async () => {
    const [mailPort, uploadPort, redisPort] = [
      await closedPort(),
      await closedPort(),
      await closedPort(),
    ];
    vi.resetModules();
    vi.doMock("@/lib/env", async (importOriginal) => {
      const real = await importOriginal<typeof import("@/lib/env")>();
      const e = real.env();
      return {
        ...real,
        env: () => ({
          ...e,
          SMTP_PORT: mailPort,
          UPLOADTHING_INGEST_URL: `http://127.0.0.1:${uploadPort}`,
          REDIS_URL: `redis://127.0.0.1:${redisPort}`,
        }),
      };
    });
    const route = await import("@/app/api/health/route");
    const response = await route.GET();
    expect(response.status).toBe(503);
    const body = (await response.json()) as {
      status: string;
      down: string[];
      services: Record<string, { state: string; reason?: string }>;
    };
    expect(body.status).toBe("degraded");
    expect(body.down).toEqual(["mail", "queue", "uploads"]);
    expect(body.services.database!.state).toBe("up");
    expect(body.services.mail!.reason).toContain("cannot connect");
    expect(body.services.queue!.reason).toContain("cannot connect");
    // Reasons never carry an address.
    expect(JSON.stringify(body)).not.toMatch(/127\.0\.0\.1/);
    vi.doUnmock("@/lib/env");
  });
});
