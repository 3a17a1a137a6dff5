/**
 * Load bench: the running app under autocannon on loopback, and 50 page-map edits made at once
 * against one map version. Run by `npm run bench` (scripts/launch.mjs bench) after the compute
 * figures, against the bench's own stack and throwaway database; `npm run bench -- --only load`
 * runs this part alone. Prints one JSON document.
 *
 * Each target is loaded for DURATION_S seconds at 10 and at 50 connections, after a short
 * unreported warm-up: a bare node:http server answering a fixed JSON (./baseline-server.ts, the
 * harness's own ceiling on this machine), /api/health, the demo's public call page signed out,
 * and as an editor the submissions list (the query the submissions screen sends by default) and
 * the page-map JSON. The goals are printed beside the figures; none fails the run.
 */
import autocannon, { type Result } from "autocannon";
import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes, randomUUID } from "node:crypto";
import os from "node:os";
import { performance } from "node:perf_hooks";
import readline from "node:readline";
import mysql from "mysql2/promise";
import { placePiece, unplacedPieces, type MapState } from "../../lib/map";
import type { MapPayload } from "../../lib/map-edits/payload";
import { queryToSearchParams, submissionsQuerySchema } from "../../lib/validations/review";
import { hashPassword } from "../../server/auth/password";
import { uniqueEmail } from "../helpers/demo";
import { assertTestDatabase, mysqlOptions, testEnv } from "../helpers/env";
import { sessionCookie } from "../helpers/http-session";
import { addMember } from "../helpers/review-fixtures";

const SLUG = "low-tide-almanac";
const DURATION_S = 20;
const WARM_UP_S = 3;
const CONNECTIONS = [10, 50] as const;
/** Seconds before autocannon counts a request as timed out. */
const REQUEST_TIMEOUT_S = 10;
const CONCURRENT_EDITS = 50;
const MAP_P99_GOAL_MS = 150;

type Target = { name: string; url: string; headers?: Record<string, string> };

const progress = (message: string) => console.error(`bench: ${message}`);
const round = (v: number, places = 1) => Math.round(v * 10 ** places) / 10 ** places;

/** Loopback by address: the app listens on 127.0.0.1 only, and `localhost` may try ::1 first. */
function appBase(): string {
  const port = new URL(testEnv.appUrl).port;
  if (!port)
    throw new Error(`APP_URL (${testEnv.appUrl}) names no port; run this with npm run bench`);
  return `http://127.0.0.1:${port}`;
}

/** A person with a password and an editor's membership of the demo anthology, made for this run. */
async function makeEditor(): Promise<{ email: string; password: string }> {
  const conn = await mysql.createConnection(mysqlOptions());
  try {
    const editor = {
      id: randomUUID(),
      email: uniqueEmail("bench-editor"),
      password: randomBytes(12).toString("base64url"),
    };
    await conn.query(
      `INSERT INTO user (id, name, email, emailVerified, password_hash, created_at)
       VALUES (?, 'Wren Calloway', ?, NOW(3), ?, NOW(3))`,
      [editor.id, editor.email, await hashPassword(editor.password)],
    );
    await addMember(conn, SLUG, editor.id, "editor");
    return editor;
  } finally {
    await conn.end();
  }
}

/** One request before the load, so a target that does not answer 2xx stops the bench with a reason. */
async function preflight(target: Target): Promise<{ status: number; bytes: number }> {
  const response = await fetch(target.url, { headers: target.headers, redirect: "manual" });
  const bytes = (await response.arrayBuffer()).byteLength;
  if (response.status < 200 || response.status > 299)
    throw new Error(`${target.name} (${target.url}) answered ${response.status} before the load`);
  return { status: response.status, bytes };
}

function figures(result: Result) {
  return {
    requestsPerSecMean: round(result.requests.mean),
    latencyP50Ms: round(result.latency.p50),
    latencyP99Ms: round(result.latency.p99),
    latencyMaxMs: round(result.latency.max),
    requests: result.requests.total,
    non2xx: result.non2xx,
    errors: result.errors,
    timeouts: result.timeouts,
    statusCodes: Object.fromEntries(
      Object.entries(result.statusCodeStats).map(([code, s]) => [code, s.count]),
    ),
  };
}

type Figures = ReturnType<typeof figures>;

async function loadTarget(target: Target) {
  const answer = await preflight(target);
  const run = (connections: number, duration: number) =>
    autocannon({
      url: target.url,
      connections,
      duration,
      timeout: REQUEST_TIMEOUT_S,
      headers: target.headers,
    });
  progress(`${target.name}: warming up for ${WARM_UP_S} s`);
  await run(CONNECTIONS[0], WARM_UP_S);
  const atConnections: Record<string, Figures> = {};
  for (const connections of CONNECTIONS) {
    progress(`${target.name}: ${connections} connections for ${DURATION_S} s`);
    atConnections[connections] = figures(await run(connections, DURATION_S));
  }
  const path = new URL(target.url);
  return { path: path.pathname + path.search, bytes: answer.bytes, atConnections };
}

/** Starts ./baseline-server.ts in its own process and resolves with it and its port. */
function startBaseline(): Promise<{ child: ChildProcess; port: number }> {
  const child = spawn(
    process.execPath,
    ["--import", "tsx", new URL("./baseline-server.ts", import.meta.url).pathname],
    { stdio: ["ignore", "pipe", "inherit"] },
  );
  return new Promise((resolve, reject) => {
    const timer = setTimeout(
      () => reject(new Error("the baseline server did not start in 20 s")),
      20_000,
    );
    child.once("exit", (code) => reject(new Error(`the baseline server exited (${code})`)));
    readline.createInterface({ input: child.stdout! }).once("line", (line) => {
      clearTimeout(timer);
      resolve({ child, port: (JSON.parse(line) as { port: number }).port });
    });
  });
}

async function readMap(base: string, cookie: string): Promise<MapPayload> {
  const response = await fetch(`${base}/api/anthologies/${SLUG}/map`, { headers: { cookie } });
  if (!response.ok) throw new Error(`reading the map answered ${response.status}`);
  return (await response.json()) as MapPayload;
}

/**
 * Edits that each place an unplaced piece on a page the rules allow, interleaved so that some
 * put different pieces on the same page and some put one piece on different pages.
 */
function placements(state: MapState, count: number): { pieceId: number; startPage: number }[] {
  const options = unplacedPieces(state)
    .map((piece) => ({
      pieceId: piece.id,
      starts: Array.from({ length: state.pageCount }, (_, i) => i + 1).filter(
        (page) => placePiece(state, piece.id, page).ok,
      ),
    }))
    .filter((o) => o.starts.length > 0);
  if (!options.length)
    throw new Error(`the ${SLUG} map has no page an unplaced piece may go on; is the demo seeded?`);
  return Array.from({ length: count }, (_, i) => {
    const option = options[i % options.length]!;
    const startPage = option.starts[Math.floor(i / options.length) % option.starts.length]!;
    return { pieceId: option.pieceId, startPage };
  });
}

/** 50 edits sent at once on one base version, then the database read back for double booking. */
async function concurrentEdits(base: string, cookie: string) {
  const before = await readMap(base, cookie);
  const edits = placements(before.state, CONCURRENT_EDITS);
  progress(`map: ${edits.length} placements at once on version ${before.version}`);
  const started = performance.now();
  const statuses = await Promise.all(
    edits.map(async (change) => {
      const response = await fetch(`${base}/api/anthologies/${SLUG}/map`, {
        method: "POST",
        headers: { cookie, "content-type": "application/json" },
        body: JSON.stringify({ version: before.version, change: { op: "place", ...change } }),
      });
      await response.arrayBuffer();
      return response.status;
    }),
  );
  const wallMs = round(performance.now() - started);

  const byStatus: Record<string, number> = {};
  for (const status of statuses) byStatus[status] = (byStatus[status] ?? 0) + 1;

  const conn = await mysql.createConnection(mysqlOptions());
  try {
    const id = before.anthology.id;
    const rows = async (query: string, values: unknown[]) =>
      (await conn.query<mysql.RowDataPacket[]>(query, values))[0];
    // The unique (anthology, page) index should make this impossible; read it anyway.
    const pagesHeldTwice = await rows(
      `SELECT page_number FROM page_slot WHERE anthology_id = ?
       GROUP BY page_number HAVING COUNT(*) > 1`,
      [id],
    );
    const piecePagesPlacedTwice = await rows(
      `SELECT piece_id, piece_page_index FROM page_slot WHERE anthology_id = ? AND piece_id IS NOT NULL
       GROUP BY piece_id, piece_page_index HAVING COUNT(*) > 1`,
      [id],
    );
    const piecesWithWrongPageCount = await rows(
      `SELECT p.id FROM piece p JOIN page_slot s ON s.piece_id = p.id AND s.anthology_id = p.anthology_id
       WHERE p.anthology_id = ? GROUP BY p.id, p.page_count HAVING COUNT(*) <> p.page_count`,
      [id],
    );
    const editedPieces = [...new Set(edits.map((e) => e.pieceId))];
    const nowPlaced = await rows(
      `SELECT COUNT(DISTINCT piece_id) AS n FROM page_slot WHERE anthology_id = ? AND piece_id IN (?)`,
      [id, editedPieces],
    );
    const [anthology] = await rows("SELECT map_version FROM anthology WHERE id = ?", [id]);
    const history = await rows(
      "SELECT COUNT(*) AS n FROM map_event WHERE anthology_id = ? AND map_version > ?",
      [id, before.version],
    );
    const applied = byStatus["200"] ?? 0;
    const doubleBooked =
      pagesHeldTwice.length + piecePagesPlacedTwice.length + piecesWithWrongPageCount.length;
    return {
      edits: edits.length,
      distinctPieces: editedPieces.length,
      distinctPages: new Set(edits.map((e) => e.startPage)).size,
      baseVersion: before.version,
      wallMs,
      byStatus,
      applied,
      refusedStale: byStatus["409"] ?? 0,
      refusedOther: statuses.filter((s) => s !== 200 && s !== 409).length,
      versionAfter: Number(anthology?.map_version),
      historyEntriesAfter: Number(history[0]?.n),
      editedPiecesNowPlaced: Number(nowPlaced[0]?.n),
      pagesHoldingTwoPieces: pagesHeldTwice.length,
      piecePagesPlacedTwice: piecePagesPlacedTwice.length,
      piecesOnTooManyOrTooFewPages: piecesWithWrongPageCount.length,
      doubleBooked,
    };
  } finally {
    await conn.end();
  }
}

async function main(): Promise<void> {
  // Other work on the machine shows up in every figure; the load average says how much there was.
  const loadAverageAtStart = os.loadavg().map((v) => round(v, 2));
  assertTestDatabase();
  const base = appBase();
  const editor = await makeEditor();
  const cookie = await sessionCookie(editor.email, editor.password, base);
  const asEditor = { cookie };
  const submissionsQuery = queryToSearchParams(submissionsQuerySchema.parse({})).toString();

  const baseline = await startBaseline();
  const targets: Record<string, Target> = {
    baseline: { name: "baseline", url: `http://127.0.0.1:${baseline.port}/` },
    health: { name: "health", url: `${base}/api/health` },
    callPage: { name: "call page", url: `${base}/calls/${SLUG}` },
    submissions: {
      name: "submissions",
      url: `${base}/api/anthologies/${SLUG}/submissions?${submissionsQuery}`,
      headers: asEditor,
    },
    mapJson: { name: "map JSON", url: `${base}/api/anthologies/${SLUG}/map`, headers: asEditor },
  };
  const load: Record<string, Awaited<ReturnType<typeof loadTarget>>> = {};
  try {
    for (const [key, target] of Object.entries(targets)) load[key] = await loadTarget(target);
  } finally {
    baseline.child.kill("SIGTERM");
  }

  const mapEdits = await concurrentEdits(base, cookie);

  const runs = Object.values(load).flatMap((t) => Object.values(t.atConnections));
  const failures = runs.reduce((n, r) => n + r.errors + r.non2xx + r.timeouts, 0);
  const mapP99 = load.mapJson?.atConnections[CONNECTIONS[0]]?.latencyP99Ms ?? Number.NaN;
  console.log(
    JSON.stringify(
      {
        node: process.version,
        cpus: os.cpus().length,
        loadAverageAtStart,
        loadAverageAtEnd: os.loadavg().map((v) => round(v, 2)),
        tool: "autocannon 8 (one process, keep-alive, no pipelining)",
        durationS: DURATION_S,
        warmUpS: WARM_UP_S,
        connections: CONNECTIONS,
        load,
        mapEdits,
        goals: {
          noErrorsOrNon2xx: {
            goal: "0 errors, timeouts and non-2xx answers over every run",
            value: failures,
            met: failures === 0,
          },
          mapJsonP99At10: {
            goal: `map JSON p99 < ${MAP_P99_GOAL_MS} ms at ${CONNECTIONS[0]} connections`,
            valueMs: mapP99,
            met: mapP99 < MAP_P99_GOAL_MS,
          },
          noDoubleBooking: {
            goal: `no page or piece booked twice after ${CONCURRENT_EDITS} edits on one version`,
            value: mapEdits.doubleBooked,
            met: mapEdits.doubleBooked === 0,
          },
        },
      },
      null,
      2,
    ),
  );
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});
