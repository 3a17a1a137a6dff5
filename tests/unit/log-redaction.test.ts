import { Writable } from "node:stream";
import pino from "pino";
import { describe, expect, it } from "vitest";
import { errorSummary, LOG_OPTIONS, pathOf } from "@/server/log";

/** A logger made with the app's own options, writing to lines the test reads. */
function capture() {
  const lines: string[] = [];
  const sink = new Writable({
    write(chunk, _enc, done) {
      lines.push(String(chunk));
      done();
    },
  });
  return { lines, logger: pino({ ...LOG_OPTIONS, level: "info" }, sink) };
}

describe("the app log", () => {
  it("redacts secrets and private fields by name, at the top and one level down", () => {
    const { lines, logger } = capture();
    logger.info(
      {
        kind: "request",
        password: "hunter22",
        user: { email: "ysolde@example.test", token: "t0k-1234" },
        body: "page bytes",
        headers: { cookie: "authjs.session-token=abc", authorization: "Bearer xyz" },
        status: 200,
      },
      "request",
    );
    const line = JSON.parse(lines[0]!) as Record<string, unknown>;
    expect(lines[0]).not.toMatch(/hunter22|ysolde@example\.test|t0k-1234|page bytes|abc|xyz/);
    expect(line.password).toBe("[redacted]");
    expect(line.status).toBe(200);
    expect(line.kind).toBe("request");
  });

  it("logs a path without its query string, where tokens travel", () => {
    expect(pathOf("http://localhost:3000/api/credits/abc?token=secret")).toBe("/api/credits/abc");
    expect(pathOf("not a url")).toBe("?");
  });

  it("gives a database error's code only, never its message quoting the values", () => {
    const driver = Object.assign(
      new Error("Duplicate entry 'ysolde@example.test' for key 'email'"),
      { code: "ER_DUP_ENTRY", sqlMessage: "Duplicate entry 'ysolde@example.test' for key 'email'" },
    );
    expect(errorSummary(driver)).toBe("Error ER_DUP_ENTRY");
    // A query builder's wrapper names the parameters in its message; only the code stays.
    const wrapped = Object.assign(
      new Error(
        "Failed query: insert into `user` (`email`) values (?)\nparams: ysolde@example.test",
      ),
      { name: "DrizzleQueryError", cause: driver },
    );
    expect(errorSummary(wrapped)).toBe(
      "DrizzleQueryError Error ER_DUP_ENTRY in insert into `user`",
    );
    expect(errorSummary(new RangeError("page 9 is outside 1..8"))).toBe(
      "RangeError: page 9 is outside 1..8",
    );
    expect(errorSummary("nope")).toBe("unknown");
  });
});
