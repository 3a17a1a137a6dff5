/**
 * The load bench's baseline: a bare node:http server on loopback that answers every request with
 * the same small JSON, so the app's figures can be read against what the harness reaches on this
 * machine. Started by ./load.ts in its own process, as the app is; prints `{"port":N}` once it
 * listens.
 */
import http from "node:http";

const body = JSON.stringify({
  status: "ok",
  checks: [
    { name: "database", state: "up", ms: 1 },
    { name: "uploads", state: "up", ms: 1 },
    { name: "mail", state: "up", ms: 1 },
    { name: "queue", state: "up", ms: 1 },
  ],
});

const server = http.createServer((_request, response) => {
  response.writeHead(200, {
    "content-type": "application/json",
    "content-length": Buffer.byteLength(body),
    "cache-control": "no-store",
  });
  response.end(body);
});

server.listen(0, "127.0.0.1", () => {
  const address = server.address();
  if (address && typeof address === "object") console.log(JSON.stringify({ port: address.port }));
});

for (const signal of ["SIGTERM", "SIGINT"] as const) process.on(signal, () => process.exit(0));
