// The ports each mode uses, and a clear message naming whoever holds one already.

import { spawnSync } from "node:child_process";
import fs from "node:fs";
import net from "node:net";

import { Fatal } from "./common.mjs";

// QUIRELINE_TEST_PORT_OFFSET moves every `npm test` and `npm run bench` port by that much, so a
// second checkout can run its tests at the same time (give it its own QUIRELINE_DB_PORT too).
const testOffset = Number.parseInt(process.env.QUIRELINE_TEST_PORT_OFFSET ?? "", 10) || 0;
const shift = (ports, by) => Object.fromEntries(Object.entries(ports).map(([k, v]) => [k, v + by]));
// QUIRELINE_REDIS_PORT puts the private Redis of the print queue elsewhere (after the offset).
const redisPort = Number.parseInt(process.env.QUIRELINE_REDIS_PORT ?? "", 10) || 0;
const withRedis = (ports) => (redisPort ? { ...ports, redis: redisPort } : ports);

const TEST_PORTS = {
  app: 3100,
  upload: 4690,
  smtp: 4625,
  outbox: 4626,
  payments: 4612,
  redis: 6490,
};

export const PORTS = {
  start: withRedis({
    app: 3000,
    upload: 4590,
    smtp: 4525,
    outbox: 4526,
    payments: 4512,
    redis: 6390,
  }),
  dev: withRedis({
    app: 3000,
    upload: 4590,
    smtp: 4525,
    outbox: 4526,
    payments: 4512,
    redis: 6390,
  }),
  test: withRedis(shift(TEST_PORTS, testOffset)),
  // The bench's own stack, 200 above the test ports, so it runs beside `npm test` and `npm start`.
  bench: withRedis(shift(TEST_PORTS, testOffset + 200)),
};
const PORT_OWNERS = {
  3000: "the web app of a Quireline `npm start` or `npm run dev`",
  3100: "the web app of a Quireline `npm test`",
  4590: "the upload fake of a Quireline `npm start`",
  4525: "the SMTP sink of a Quireline `npm start`",
  4526: "the outbox API of a Quireline `npm start`",
  4690: "the upload fake of a Quireline `npm test`",
  4625: "the SMTP sink of a Quireline `npm test`",
  4626: "the outbox API of a Quireline `npm test`",
  6390: "the print queue's Redis of a Quireline `npm start` or `npm run dev`",
  6490: "the print queue's Redis of a Quireline `npm test`",
  4512: "the payments fake of a Quireline `npm start`",
  4612: "the payments fake of a Quireline `npm test`",
  3300: "the web app of a Quireline `npm run bench`",
  4890: "the upload fake of a Quireline `npm run bench`",
  4825: "the SMTP sink of a Quireline `npm run bench`",
  4826: "the outbox API of a Quireline `npm run bench`",
  4812: "the payments fake of a Quireline `npm run bench`",
  6690: "the print queue's Redis of a Quireline `npm run bench`",
};

function portFree(port, host) {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.once("error", (err) =>
      resolve(err.code === "EADDRNOTAVAIL" || err.code === "EAFNOSUPPORT"),
    );
    server.listen({ port, host, exclusive: true }, () => server.close(() => resolve(true)));
  });
}

function describeHolder(port) {
  let holder = "";
  const r = spawnSync("ss", ["-Hltnp", `sport = :${port}`], { encoding: "utf8" });
  const pid = /pid=(\d+)/.exec(r.stdout ?? "")?.[1];
  if (pid) {
    let cmdline = "";
    try {
      cmdline = fs
        .readFileSync(`/proc/${pid}/cmdline`, "utf8")
        .split("\0")
        .filter(Boolean)
        .join(" ");
    } catch {
      // the process went away or is not ours to read
    }
    holder = ` by pid ${pid}${cmdline ? ` (${cmdline.slice(0, 160)})` : ""}`;
  }
  const ours =
    !holder || /next-server|next (start|dev)|storage-fake|launch\.mjs|redis-server/.test(holder);
  const guess =
    ours && PORT_OWNERS[port]
      ? `It is probably ${PORT_OWNERS[port]} that is still running`
      : "It is not part of Quireline";
  return { holder, guess, pid };
}

export async function checkPorts(ports) {
  const labels = {
    app: "web app",
    upload: "upload fake",
    smtp: "SMTP sink",
    outbox: "outbox API",
    redis: "print queue's Redis",
    payments: "payments fake",
  };
  const problems = [];
  for (const [key, port] of Object.entries(ports)) {
    // With REDIS_URL no private Redis is started, so its port may be anyone's.
    if (key === "redis" && process.env.REDIS_URL) continue;
    if ((await portFree(port, "127.0.0.1")) && (await portFree(port, "::1"))) continue;
    const { holder, guess, pid } = describeHolder(port);
    problems.push(
      `port ${port} (${labels[key]}) is already in use${holder}.` +
        `\n  ${guess}; stop it (Ctrl-C in its terminal${pid ? `, or kill ${pid}` : ""}) and try again.`,
    );
  }
  if (problems.length) throw new Fatal(problems.join("\n"));
}
