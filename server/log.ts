import "server-only";
import pino from "pino";

/**
 * The app's structured log: one JSON object per line on stdout (pino). Request lines carry the
 * method, the path without its query, the status, the time taken and the signed-in person's id;
 * never a body, a header value, a query string, an address, a password, a token or file bytes.
 * Fields that might carry those anyway are redacted by name.
 */
export const LOG_OPTIONS: pino.LoggerOptions = {
  level: process.env.LOG_LEVEL ?? (process.env.NODE_ENV === "test" ? "warn" : "info"),
  base: { app: "quireline" },
  redact: {
    paths: [
      "password",
      "*.password",
      "passwordHash",
      "*.passwordHash",
      "token",
      "*.token",
      "secret",
      "*.secret",
      "authorization",
      "*.authorization",
      "cookie",
      "*.cookie",
      "email",
      "*.email",
      "body",
      "*.body",
      "bytes",
      "*.bytes",
    ],
    censor: "[redacted]",
  },
};

export const log = pino(LOG_OPTIONS);

/** The path of a request URL without its query string (which can hold tokens). */
export function pathOf(url: string): string {
  try {
    return new URL(url).pathname;
  } catch {
    return "?";
  }
}

/**
 * What a failure's log line says: a driver error's code only (its message can quote the values
 * of the statement, people's text among them), else the error's name and message.
 */
export function errorSummary(error: unknown): string {
  if (!(error instanceof Error)) return "unknown";
  const code = (error as { code?: unknown }).code;
  if (typeof code === "string" && "sqlMessage" in error) return `${error.name} ${code}`;
  // Drizzle wraps the driver's error and writes the query's parameters (people's text) into its
  // own message: keep the driver's code and the statement's first words only.
  const cause = (error as { cause?: unknown }).cause;
  if (cause instanceof Error && "sqlMessage" in cause) {
    const statement = error.message
      .replace(/^Failed query: /, "")
      .split(/\s+/)
      .slice(0, 3);
    return `${error.name} ${errorSummary(cause)} in ${statement.join(" ")}`;
  }
  return `${error.name}: ${error.message}`.slice(0, 300);
}
