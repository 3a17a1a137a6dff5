/**
 * The health report's shape and verdict. Pure: server/health.ts runs the probes.
 * A service is "up" when its probe answered in time; the whole report is "ok" only when every
 * service is up, and then the endpoint answers 200, else 503 (RFC 9110 §15.6.4: Service Unavailable).
 */

export type ServiceState = "up" | "down";

export interface ServiceReport {
  state: ServiceState;
  /** How long the probe took, whole milliseconds. */
  ms: number;
  /** Why it is down, in plain words (never a secret or an address). */
  reason?: string;
}

export interface HealthReport {
  status: "ok" | "degraded";
  /** The services that are down, by name, for a reader who only wants the answer. */
  down: string[];
  services: Record<string, ServiceReport>;
}

export function healthReport(services: Record<string, ServiceReport>): HealthReport {
  const down = Object.entries(services)
    .filter(([, s]) => s.state === "down")
    .map(([name]) => name)
    .sort();
  return { status: down.length === 0 ? "ok" : "degraded", down, services };
}

export function healthStatusCode(report: HealthReport): 200 | 503 {
  return report.status === "ok" ? 200 : 503;
}
