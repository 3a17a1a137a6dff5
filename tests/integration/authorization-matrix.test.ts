// The authorization matrix: every route handler and method under app/api and every page under
// /studio, called over HTTP against the running app as each of seven callers (signed out, an
// outsider with an account, a contributor of this anthology, a contributor of another anthology,
// a finisher, an editor, the lead), with real sign-ins. Each cell asserts the status and that no
// private field the caller may not see appears anywhere in the answer (JSON, HTML and the React
// payload inside it). Guessed ids (other people's pieces and files, another anthology's ledger
// entries, outputs, batches and events, ids that do not exist) are callers too. The list of routes
// comes from the file tree (tests/helpers/routes.ts): a route without a row here fails the test.
//
// The world is the demo anthology "low-tide-almanac" (read, never changed: writes from allowed
// callers are sent in a form that passes authorization and is then refused, as malformed JSON or
// an id that does not exist) plus three people and two rows this file adds and removes.
import { randomBytes } from "node:crypto";
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import type mysql from "mysql2/promise";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { hashPassword } from "@/server/auth/password";
import { demoAccount } from "../helpers/demo";
import { assertTestDatabase, testEnv } from "../helpers/env";
import { sessionCookie } from "../helpers/http-session";
import { connect, createPerson, type FixturePerson } from "../helpers/review-fixtures";
import { apiRoutes, fillPattern, studioPages, type Method } from "../helpers/routes";

assertTestDatabase(testEnv.databaseUrl);

const CALLERS = [
  "signedOut",
  "outsider",
  "contributor",
  "otherContributor",
  "finisher",
  "editor",
  "lead",
] as const;
type Caller = (typeof CALLERS)[number];
const SIGNED_IN = CALLERS.filter((c) => c !== "signedOut");
const STAFF: Caller[] = ["editor", "lead"];
const PRODUCTION: Caller[] = ["finisher", "editor", "lead"];
const MEMBERS: Caller[] = ["contributor", "finisher", "editor", "lead"];

const ALMANAC = "low-tide-almanac";
const JAM = "heron-street-comics-jam";
/** An id no row has. */
const NO_SUCH_ID = 987_654_321;

/** What the test knows about the world, read from the database in beforeAll. */
type World = {
  almanacId: number;
  jamId: number;
  contributorId: string;
  /** The contributor's placed piece and its first page number, and a current file of theirs. */
  ownPiece: number;
  ownPage: number;
  ownFile: number;
  /** A piece of another contributor of the almanac that is not public, with a file and a note. */
  othersPiece: number;
  othersFile: number;
  /** Pieces of the almanac that are not the contributor's, and the jam's pieces. */
  notOwnPieces: number[];
  jamPieces: number[];
  entry: number;
  period: number;
  batch: number;
  event: number;
  priceList: number;
  quote: number;
  output: number;
  copy: number;
};

let conn: mysql.Connection;
let world: World;
const cookies = {} as Record<Caller, string>;
const fixturePeople: FixturePerson[] = [];
let jamLeadCookie = "";

// ---------------------------------------------------------------------------------------------
// Private fields, and who may see each

type Marker = { label: string; text: string; visibleTo: readonly Caller[] };
const markers: Marker[] = [];

/** Adds markers for every value of a column the query returns, skipping short, common strings. */
async function markRows(label: string, sql: string, args: unknown[], visibleTo: Caller[]) {
  const [rows] = await conn.query<mysql.RowDataPacket[]>(sql, args);
  for (const row of rows) {
    const text = String(Object.values(row)[0] ?? "");
    if (text.length >= 8) markers.push({ label, text, visibleTo });
  }
}

/** The markers `caller` must never see in `body`, by label. */
function leaksIn(body: string, caller: Caller): string[] {
  return markers
    .filter((m) => !m.visibleTo.includes(caller) && body.includes(m.text))
    .map((m) => `${m.label} (${m.text.slice(0, 40)})`);
}

// ---------------------------------------------------------------------------------------------
// The table

type Params = Record<string, string | number>;
type Probe =
  /** Malformed JSON: refused by readJson with 400 once the caller is through. */
  | { kind: "bad-json" }
  /** The same route with ids no row has: refused with 404 once the caller is through. */
  | { kind: "no-such-id"; params: (w: World) => Params }
  /** Allowed callers are not sent this request: it changes the demo and has no harmless form. */
  | { kind: "not-sent"; why: string };

type Row = {
  method: Method;
  pattern: string;
  /** Callers that get through. "anyone" includes the signed-out visitor. */
  allow: readonly Caller[] | "anyone";
  params?: (w: World) => Params;
  query?: string;
  /** For a state-changing method: how an allowed caller is probed without changing anything. */
  probe?: Probe;
  /** Statuses an allowed caller may get; by default 200 for GET (and 2xx for pages). */
  ok?: readonly number[];
  /** What a non-2xx answer to an allowed caller must say, so it is not mistaken for a refusal. */
  okBody?: RegExp;
  /** The body refused callers send to a state-changing route; by default `{}`. */
  body?: (w: World) => unknown;
  /** Statuses a refused caller may get; by default 401 signed out, else 403 or 404. */
  refused?: readonly number[];
};

const slug = { slug: ALMANAC };
const BAD_JSON: Probe = { kind: "bad-json" };
const withSlug = (extra: (w: World) => Params) => (w: World) => ({ ...slug, ...extra(w) });

const API_ROWS: Row[] = [
  { method: "GET", pattern: "/api/anthologies", allow: SIGNED_IN },
  { method: "POST", pattern: "/api/anthologies", allow: SIGNED_IN, probe: BAD_JSON },
  { method: "GET", pattern: "/api/anthologies/[slug]", allow: MEMBERS },
  { method: "GET", pattern: "/api/anthologies/[slug]/call", allow: STAFF },
  { method: "PUT", pattern: "/api/anthologies/[slug]/call", allow: STAFF, probe: BAD_JSON },
  {
    // The call's templates are linked from the public call page: anyone may fetch them.
    method: "GET",
    pattern: "/api/anthologies/[slug]/call/template",
    allow: "anyone",
  },
  {
    method: "PATCH",
    pattern: "/api/anthologies/[slug]/credits/[pieceId]",
    allow: STAFF,
    params: withSlug((w) => ({ pieceId: w.ownPiece })),
    probe: BAD_JSON,
  },
  { method: "GET", pattern: "/api/anthologies/[slug]/credits", allow: STAFF },
  { method: "POST", pattern: "/api/anthologies/[slug]/credits", allow: STAFF, probe: BAD_JSON },
  {
    method: "POST",
    pattern: "/api/anthologies/[slug]/finishing/[batchId]",
    allow: PRODUCTION,
    params: withSlug((w) => ({ batchId: w.batch })),
    probe: BAD_JSON,
  },
  { method: "GET", pattern: "/api/anthologies/[slug]/finishing", allow: PRODUCTION },
  {
    method: "POST",
    pattern: "/api/anthologies/[slug]/invitations",
    allow: STAFF,
    probe: BAD_JSON,
  },
  { method: "PUT", pattern: "/api/anthologies/[slug]/map/copies", allow: STAFF, probe: BAD_JSON },
  { method: "GET", pattern: "/api/anthologies/[slug]/map/notices", allow: STAFF },
  {
    method: "POST",
    pattern: "/api/anthologies/[slug]/map/notices",
    allow: STAFF,
    probe: { kind: "not-sent", why: "sends page notices; tests/integration/page-map.test.ts" },
  },
  {
    method: "POST",
    pattern: "/api/anthologies/[slug]/map/proposal",
    allow: STAFF,
    probe: BAD_JSON,
  },
  { method: "GET", pattern: "/api/anthologies/[slug]/map", allow: PRODUCTION },
  { method: "POST", pattern: "/api/anthologies/[slug]/map", allow: STAFF, probe: BAD_JSON },
  {
    method: "POST",
    pattern: "/api/anthologies/[slug]/my-payouts/account",
    allow: ["contributor"],
    probe: {
      kind: "not-sent",
      why: "opens a payout account with the payments fake; tests/integration/payouts.test.ts",
    },
  },
  { method: "GET", pattern: "/api/anthologies/[slug]/my-payouts", allow: ["contributor"] },
  { method: "GET", pattern: "/api/anthologies/[slug]/notifications", allow: STAFF },
  {
    method: "PUT",
    pattern: "/api/anthologies/[slug]/notifications",
    allow: STAFF,
    probe: BAD_JSON,
  },
  ...(["cancel", "paid-by-hand"] as const).map((what): Row => ({
    method: "POST",
    pattern: `/api/anthologies/[slug]/payouts/entries/[id]/${what}`,
    allow: ["lead"],
    params: withSlug((w) => ({ id: w.entry })),
    probe: BAD_JSON,
  })),
  {
    method: "POST",
    pattern: "/api/anthologies/[slug]/payouts/entries/[id]/pay",
    allow: ["lead"],
    params: withSlug((w) => ({ id: w.entry })),
    probe: { kind: "no-such-id", params: () => ({ ...slug, id: NO_SUCH_ID }) },
  },
  {
    method: "GET",
    pattern: "/api/anthologies/[slug]/payouts/export",
    allow: ["lead"],
    query: "what=ledger",
  },
  {
    method: "POST",
    pattern: "/api/anthologies/[slug]/payouts/periods/[id]/close",
    allow: ["lead"],
    params: withSlug((w) => ({ id: w.period })),
    probe: { kind: "no-such-id", params: () => ({ ...slug, id: NO_SUCH_ID }) },
  },
  {
    method: "POST",
    pattern: "/api/anthologies/[slug]/payouts/periods",
    allow: ["lead"],
    probe: BAD_JSON,
  },
  { method: "GET", pattern: "/api/anthologies/[slug]/payouts", allow: ["lead"] },
  {
    method: "GET",
    pattern: "/api/anthologies/[slug]/payouts/statement",
    // The lead asks for anyone's statement, a contributor for their own (the query names the period).
    allow: ["contributor", "lead"],
    query: "period=PERIOD&contributor=CONTRIBUTOR",
  },
  {
    method: "POST",
    pattern: "/api/anthologies/[slug]/payouts/statements",
    allow: ["lead"],
    probe: BAD_JSON,
  },
  { method: "GET", pattern: "/api/anthologies/[slug]/pieces", allow: ["contributor"] },
  {
    method: "POST",
    pattern: "/api/anthologies/[slug]/pieces",
    // Anyone with an account may join an open call by sending a piece; its staff may not.
    allow: ["outsider", "contributor", "otherContributor"],
    probe: BAD_JSON,
  },
  { method: "GET", pattern: "/api/anthologies/[slug]/print-files", allow: PRODUCTION },
  {
    method: "POST",
    pattern: "/api/anthologies/[slug]/print-files",
    allow: STAFF,
    probe: BAD_JSON,
  },
  {
    method: "POST",
    pattern: "/api/anthologies/[slug]/run/batches",
    allow: STAFF,
    probe: { kind: "not-sent", why: "plans batches; tests/integration/run-stock.test.ts" },
  },
  {
    method: "DELETE",
    pattern: "/api/anthologies/[slug]/run/events/[id]",
    allow: STAFF,
    params: withSlug((w) => ({ id: w.event })),
    probe: { kind: "no-such-id", params: () => ({ ...slug, id: NO_SUCH_ID }) },
  },
  { method: "POST", pattern: "/api/anthologies/[slug]/run/events", allow: STAFF, probe: BAD_JSON },
  {
    method: "PUT",
    pattern: "/api/anthologies/[slug]/run/price-lists/[id]",
    allow: STAFF,
    params: withSlug((w) => ({ id: w.priceList })),
    probe: BAD_JSON,
  },
  {
    method: "POST",
    pattern: "/api/anthologies/[slug]/run/price-lists",
    allow: STAFF,
    probe: BAD_JSON,
  },
  {
    method: "PUT",
    pattern: "/api/anthologies/[slug]/run/quotes/[id]",
    allow: STAFF,
    params: withSlug((w) => ({ id: w.quote })),
    probe: BAD_JSON,
  },
  { method: "POST", pattern: "/api/anthologies/[slug]/run/quotes", allow: STAFF, probe: BAD_JSON },
  { method: "GET", pattern: "/api/anthologies/[slug]/run", allow: STAFF },
  { method: "PUT", pattern: "/api/anthologies/[slug]/run", allow: STAFF, probe: BAD_JSON },
  { method: "GET", pattern: "/api/anthologies/[slug]/sales", allow: STAFF },
  { method: "POST", pattern: "/api/anthologies/[slug]/sales", allow: STAFF, probe: BAD_JSON },
  { method: "PATCH", pattern: "/api/anthologies/[slug]/spec", allow: STAFF, probe: BAD_JSON },
  { method: "POST", pattern: "/api/anthologies/[slug]/stage", allow: STAFF, probe: BAD_JSON },
  {
    method: "PATCH",
    pattern: "/api/anthologies/[slug]/stock/contributor-copies/[id]",
    allow: PRODUCTION,
    params: withSlug((w) => ({ id: w.copy })),
    probe: BAD_JSON,
  },
  {
    method: "POST",
    pattern: "/api/anthologies/[slug]/stock/printed",
    allow: PRODUCTION,
    probe: { kind: "not-sent", why: "records printed sheets; tests/integration/run-stock.test.ts" },
  },
  { method: "GET", pattern: "/api/anthologies/[slug]/stock", allow: PRODUCTION },
  { method: "POST", pattern: "/api/anthologies/[slug]/stock", allow: PRODUCTION, probe: BAD_JSON },
  { method: "GET", pattern: "/api/anthologies/[slug]/submissions", allow: STAFF },
  {
    method: "POST",
    pattern: "/api/anthologies/[slug]/submissions/status",
    allow: STAFF,
    probe: BAD_JSON,
  },
  {
    // Auth.js's own endpoints: the session answers everyone with their own session only.
    method: "GET",
    pattern: "/api/auth/[...nextauth]",
    allow: "anyone",
    params: () => ({ nextauth: "session" }),
  },
  {
    // A sign-out without Auth.js's CSRF token is refused for everyone, with a redirect.
    method: "POST",
    pattern: "/api/auth/[...nextauth]",
    allow: "anyone",
    params: () => ({ nextauth: "signout" }),
    ok: [302, 400],
    probe: BAD_JSON,
  },
  {
    // A credit approval is authorised by its signed link alone: a made-up token is refused for all.
    method: "POST",
    pattern: "/api/credits/[token]",
    allow: [],
    params: () => ({ token: "not-a-real-token" }),
    refused: [400, 403, 404],
  },
  {
    method: "GET",
    pattern: "/api/file-versions/[id]/thumbnail",
    allow: ["contributor", ...STAFF],
    params: (w) => ({ id: w.ownFile }),
  },
  { method: "GET", pattern: "/api/health", allow: "anyone" },
  {
    // Authorised by the payments service's signature alone: unsigned calls are refused for all.
    method: "POST",
    pattern: "/api/payments/webhook",
    allow: [],
    refused: [400],
  },
  {
    method: "GET",
    pattern: "/api/pieces/[id]/notes",
    allow: STAFF,
    // A piece in review that carries an editor's note.
    params: (w) => ({ id: w.othersPiece }),
  },
  {
    method: "POST",
    pattern: "/api/pieces/[id]/notes",
    allow: STAFF,
    params: (w) => ({ id: w.ownPiece }),
    probe: BAD_JSON,
  },
  {
    method: "GET",
    pattern: "/api/pieces/[id]/proof/[page]",
    allow: ["contributor"],
    params: (w) => ({ id: w.ownPiece, page: w.ownPage }),
    // The demo's placed piece has no file yet: its own contributor is told so, others are refused.
    ok: [200, 404],
    okBody: /has no preview yet/,
  },
  {
    method: "GET",
    pattern: "/api/pieces/[id]",
    allow: ["contributor", ...STAFF],
    params: (w) => ({ id: w.ownPiece }),
  },
  {
    method: "PATCH",
    pattern: "/api/pieces/[id]",
    allow: ["contributor"],
    params: (w) => ({ id: w.ownPiece }),
    probe: BAD_JSON,
  },
  {
    method: "POST",
    pattern: "/api/pieces/[id]/status",
    allow: STAFF,
    params: (w) => ({ id: w.ownPiece }),
    probe: BAD_JSON,
  },
  {
    method: "GET",
    pattern: "/api/print-files/[id]/download",
    allow: PRODUCTION,
    params: (w) => ({ id: w.output }),
    // The output failed, so there is nothing to download: refused with 404 or 409 once through.
    ok: [404, 409],
  },
  {
    // The upload SDK's route settings: the same for everyone, no private field.
    method: "GET",
    pattern: "/api/uploadthing",
    allow: "anyone",
  },
  {
    // Upload starts: only the piece's own contributor may send its files.
    method: "POST",
    pattern: "/api/uploadthing",
    allow: ["contributor"],
    query: "actionType=upload&slug=artworkPage",
    body: (w) => ({
      files: [{ name: "p1.png", size: 10, type: "image/png" }],
      input: { pieceId: w.ownPiece, pageIndex: 1, expectedRevision: 0 },
    }),
    refused: [401, 403, 404],
    probe: BAD_JSON,
    ok: [400],
  },
];

const PAGE_ROWS: Row[] = [
  { method: "GET", pattern: "/studio", allow: SIGNED_IN },
  { method: "GET", pattern: "/studio/account", allow: SIGNED_IN },
  { method: "GET", pattern: "/studio/new", allow: SIGNED_IN },
  { method: "GET", pattern: "/studio/[slug]", allow: MEMBERS },
  { method: "GET", pattern: "/studio/[slug]/call", allow: STAFF },
  { method: "GET", pattern: "/studio/[slug]/credits", allow: STAFF },
  { method: "GET", pattern: "/studio/[slug]/finishing", allow: PRODUCTION },
  { method: "GET", pattern: "/studio/[slug]/map", allow: PRODUCTION },
  // Editors invite people (members:invite); only the lead changes roles on the same page.
  { method: "GET", pattern: "/studio/[slug]/members", allow: STAFF },
  { method: "GET", pattern: "/studio/[slug]/my-payouts", allow: ["contributor"] },
  { method: "GET", pattern: "/studio/[slug]/my-pieces", allow: ["contributor"] },
  {
    method: "GET",
    pattern: "/studio/[slug]/my-pieces/[pieceId]",
    allow: ["contributor"],
    params: withSlug((w) => ({ pieceId: w.ownPiece })),
  },
  { method: "GET", pattern: "/studio/[slug]/payouts", allow: ["lead"] },
  { method: "GET", pattern: "/studio/[slug]/print", allow: PRODUCTION },
  { method: "GET", pattern: "/studio/[slug]/run", allow: STAFF },
  { method: "GET", pattern: "/studio/[slug]/sales", allow: STAFF },
  { method: "GET", pattern: "/studio/[slug]/spec", allow: STAFF },
  { method: "GET", pattern: "/studio/[slug]/stock", allow: PRODUCTION },
  {
    method: "GET",
    pattern: "/studio/[slug]/submissions/[pieceId]",
    allow: STAFF,
    params: withSlug((w) => ({ pieceId: w.othersPiece })),
  },
  { method: "GET", pattern: "/studio/[slug]/submissions", allow: STAFF },
];

// ---------------------------------------------------------------------------------------------
// Calling the app

type Answer = { status: number; body: string; location: string | null };

async function call(
  method: Method,
  urlPath: string,
  cookie: string,
  body?: string,
  headers: Record<string, string> = {},
): Promise<Answer> {
  const response = await fetch(`${testEnv.appUrl}${urlPath}`, {
    method,
    redirect: "manual",
    headers: {
      ...(cookie ? { cookie } : {}),
      // A same-site request, as the app's own screens send it, so the origin check passes.
      ...(method === "GET" ? {} : { origin: testEnv.appUrl, "content-type": "application/json" }),
      ...headers,
    },
    body: method === "GET" || method === "HEAD" ? undefined : body,
  });
  const text = await response.text();
  return { status: response.status, body: text, location: response.headers.get("location") };
}

function urlOf(row: Row, params: Params | undefined): string {
  const filled = fillPattern(row.pattern, params ?? slug);
  const query = row.query
    ?.replace("PERIOD", String(world.period))
    .replace("CONTRIBUTOR", world.contributorId);
  return query ? `${filled}?${query}` : filled;
}

const isPage = (row: Row) => row.pattern === "/studio" || row.pattern.startsWith("/studio/");
const isWrite = (m: Method) => m !== "GET" && m !== "HEAD";
const allows = (row: Row, caller: Caller) => row.allow === "anyone" || row.allow.includes(caller);

/** Refused statuses for a caller: a page sends the signed-out visitor to sign in. */
function refusedStatuses(row: Row, caller: Caller): readonly number[] {
  if (row.refused) return row.refused;
  if (caller === "signedOut") return isPage(row) ? [307, 302] : [401];
  return [403, 404];
}

type Cell = {
  row: string;
  caller: Caller;
  status: number;
  problem?: string;
  leaks: string[];
  /** Labels of every marker in the answer, allowed or not. */
  seen: string[];
};
const cells: Cell[] = [];
let notSent = 0;
let guessCount = 0;

async function runCell(row: Row, caller: Caller): Promise<Cell> {
  const key = `${row.method} ${row.pattern}`;
  const allowed = allows(row, caller);
  let answer: Answer;
  let problem: string | undefined;
  if (allowed && isWrite(row.method)) {
    const probe = row.probe;
    if (!probe) throw new Error(`${key}: a write row needs a probe`);
    if (probe.kind === "not-sent") {
      notSent++;
      return { row: key, caller, status: 0, leaks: [], seen: [] };
    }
    const params = probe.kind === "no-such-id" ? probe.params(world) : row.params?.(world);
    answer = await call(row.method, urlOf(row, params), cookies[caller], "{not json");
    const ok = row.ok ?? (probe.kind === "bad-json" ? [400] : [404]);
    if (!ok.includes(answer.status))
      problem = `allowed write answered ${answer.status}, expected ${ok.join("/")}`;
  } else {
    const body = JSON.stringify(row.body?.(world) ?? {});
    answer = await call(row.method, urlOf(row, row.params?.(world)), cookies[caller], body);
    if (allowed) {
      const ok = row.ok ?? [200];
      if (!ok.includes(answer.status))
        problem = `allowed answered ${answer.status}, expected ${ok.join("/")}`;
      else if (answer.status >= 300 && row.okBody && !row.okBody.test(answer.body))
        problem = `allowed answered ${answer.status} without ${row.okBody}: ${answer.body.slice(0, 120)}`;
    } else {
      const refused = refusedStatuses(row, caller);
      if (!refused.includes(answer.status))
        problem = `refused answered ${answer.status}, expected ${refused.join("/")}`;
      else if (caller === "signedOut" && isPage(row) && !answer.location?.includes("/sign-in"))
        problem = `signed-out page redirected to ${answer.location}, not to sign-in`;
    }
  }
  if (answer.status >= 500) problem = `${answer.status}: ${answer.body.slice(0, 200)}`;
  return {
    row: key,
    caller,
    status: answer.status,
    problem,
    leaks: leaksIn(answer.body, caller),
    seen: markers.filter((m) => answer.body.includes(m.text)).map((m) => m.label),
  };
}

/** Runs `work` over `items` with at most `limit` at once, in order of results. */
async function pool<T, R>(items: T[], limit: number, work: (item: T) => Promise<R>) {
  const results: R[] = new Array(items.length);
  let next = 0;
  await Promise.all(
    Array.from({ length: limit }, async () => {
      while (next < items.length) {
        const i = next++;
        results[i] = await work(items[i]!);
      }
    }),
  );
  return results;
}

// ---------------------------------------------------------------------------------------------
// Set-up

const PASSWORD = `matrix-${randomBytes(6).toString("hex")}`;

async function fixturePerson(name: string, label: string): Promise<FixturePerson> {
  const person = await createPerson(conn, name, label);
  await conn.query("UPDATE user SET password_hash = ? WHERE id = ?", [
    await hashPassword(PASSWORD),
    person.id,
  ]);
  fixturePeople.push(person);
  return person;
}

async function one<T = number>(sql: string, args: unknown[] = []): Promise<T> {
  const [rows] = await conn.query<mysql.RowDataPacket[]>(sql, args);
  const value = rows[0] && Object.values(rows[0])[0];
  if (value === undefined || value === null) throw new Error(`no demo row for: ${sql}`);
  return value as T;
}

async function ids(sql: string, args: unknown[] = []): Promise<number[]> {
  const [rows] = await conn.query<mysql.RowDataPacket[]>(sql, args);
  return rows.map((r) => Number(Object.values(r)[0]));
}

let addedOutput = 0;
let addedCopy = 0;

beforeAll(async () => {
  conn = await connect();
  const almanacId = await one("SELECT id FROM anthology WHERE slug = ?", [ALMANAC]);
  const jamId = await one("SELECT id FROM anthology WHERE slug = ?", [JAM]);
  const people = {
    lead: demoAccount("odile"),
    finisher: demoAccount("cass"),
    contributor: demoAccount("tomasz"),
  };
  const contributorId = await one<string>("SELECT id FROM user WHERE email = ?", [
    people.contributor.email,
  ]);

  const editor = await fixturePerson("Matrix Editor", "matrix-editor");
  const outsider = await fixturePerson("Matrix Outsider", "matrix-outsider");
  const other = await fixturePerson("Matrix Jam Contributor", "matrix-jam");
  await conn.query(
    `INSERT INTO membership (anthology_id, user_id, role, created_at)
     VALUES (?, ?, 'editor', NOW(3)), (?, ?, 'contributor', NOW(3))`,
    [almanacId, editor.id, jamId, other.id],
  );

  // The contributor's placed piece, and a private piece of someone else with a file.
  const [own] = await conn.query<mysql.RowDataPacket[]>(
    `SELECT s.piece_id AS piece, MIN(s.page_number) AS page FROM page_slot s JOIN piece p ON p.id = s.piece_id
     WHERE s.anthology_id = ? AND p.contributor_id = ? GROUP BY s.piece_id ORDER BY s.piece_id LIMIT 1`,
    [almanacId, contributorId],
  );
  if (!own[0]) throw new Error("the demo contributor has no placed piece");
  const fileOf = (piece: number) =>
    one(
      `SELECT fv.id FROM file_version fv JOIN piece_page pp ON pp.current_version_id = fv.id
       WHERE pp.piece_id = ? ORDER BY pp.page_index LIMIT 1`,
      [piece],
    );
  const othersPiece = await one(
    `SELECT p.id FROM piece p JOIN piece_page pp ON pp.piece_id = p.id
     WHERE p.anthology_id = ? AND p.contributor_id <> ? AND p.credit_approved_at IS NULL
       AND pp.current_version_id IS NOT NULL
     ORDER BY EXISTS (SELECT 1 FROM editor_note n WHERE n.piece_id = p.id) DESC, p.id LIMIT 1`,
    [almanacId, contributorId],
  );
  const [output] = await conn.query<mysql.ResultSetHeader>(
    `INSERT INTO print_output (anthology_id, kind, state, map_version, error, requested_by, created_at)
     VALUES (?, 'print', 'failed', 0, 'matrix: a failed output with nothing to download', ?, NOW(3))`,
    [almanacId, await one<string>("SELECT id FROM user WHERE email = ?", [people.lead.email])],
  );
  addedOutput = output.insertId;
  const [copy] = await conn.query<mysql.ResultSetHeader>(
    `INSERT INTO contributor_copy (anthology_id, contributor_id, quantity, delivery)
     VALUES (?, ?, 2, 'collect')`,
    [almanacId, contributorId],
  );
  addedCopy = copy.insertId;

  world = {
    almanacId,
    jamId,
    contributorId,
    ownPiece: Number(own[0].piece),
    ownPage: Number(own[0].page),
    ownFile: await one(
      `SELECT fv.id FROM file_version fv JOIN piece_page pp ON pp.current_version_id = fv.id
       JOIN piece p ON p.id = pp.piece_id WHERE p.anthology_id = ? AND p.contributor_id = ?
       ORDER BY fv.id LIMIT 1`,
      [almanacId, contributorId],
    ),
    othersPiece,
    othersFile: await fileOf(othersPiece),
    notOwnPieces: await ids(
      "SELECT id FROM piece WHERE anthology_id = ? AND contributor_id <> ? ORDER BY id",
      [almanacId, contributorId],
    ),
    jamPieces: await ids("SELECT id FROM piece WHERE anthology_id = ? ORDER BY id", [jamId]),
    entry: await one("SELECT MIN(id) FROM payout_entry WHERE anthology_id = ?", [almanacId]),
    period: await one("SELECT MIN(id) FROM payout_period WHERE anthology_id = ?", [almanacId]),
    batch: await one("SELECT MIN(id) FROM finishing_batch WHERE anthology_id = ?", [almanacId]),
    event: await one("SELECT MIN(id) FROM run_event WHERE anthology_id = ?", [almanacId]),
    priceList: await one("SELECT MIN(id) FROM price_list"),
    quote: await one("SELECT MIN(id) FROM shop_quote"),
    output: addedOutput,
    copy: addedCopy,
  };

  // Private fields. E-mail addresses: the lead and editors (contributors:private-data) and the
  // person themselves. Password hashes: no one.
  const contributorEmails = await conn.query<mysql.RowDataPacket[]>(
    `SELECT DISTINCT u.email FROM user u JOIN membership m ON m.user_id = u.id
     WHERE m.anthology_id = ? AND m.role = 'contributor'`,
    [almanacId],
  );
  for (const row of contributorEmails[0]) {
    const email = String(row.email);
    markers.push({
      label: "a contributor's e-mail",
      text: email,
      visibleTo: email === people.contributor.email ? [...STAFF, "contributor"] : STAFF,
    });
  }
  markers.push(
    { label: "an outsider's e-mail", text: outsider.email, visibleTo: ["outsider"] },
    { label: "a jam contributor's e-mail", text: other.email, visibleTo: ["otherContributor"] },
  );
  await markRows(
    "a password hash",
    "SELECT password_hash FROM user WHERE password_hash IS NOT NULL",
    [],
    [],
  );
  // Editors' private notes on pieces.
  await markRows(
    "an editor's note",
    "SELECT n.body FROM editor_note n JOIN piece p ON p.id = n.piece_id WHERE p.anthology_id = ?",
    [almanacId],
    STAFF,
  );
  // Pieces not yet public: their titles, file names and stored file keys. A contributor's own
  // are theirs to see; finishers see only what is on the map (placed, accepted pieces).
  for (const [label, column] of [
    ["the title of a piece in review", "p.title"],
    ["a file name of a piece in review", "fv.file_name"],
    ["a file key of a piece in review", "fv.storage_key"],
  ] as const) {
    await markRows(
      label,
      `SELECT DISTINCT ${column} FROM piece p LEFT JOIN piece_page pp ON pp.piece_id = p.id
       LEFT JOIN file_version fv ON fv.piece_page_id = pp.id
       WHERE p.anthology_id = ? AND p.contributor_id <> ? AND p.status NOT IN ('accepted')`,
      [almanacId, contributorId],
      STAFF,
    );
    await markRows(
      `${label} (the contributor's own)`,
      `SELECT DISTINCT ${column} FROM piece p LEFT JOIN piece_page pp ON pp.piece_id = p.id
       LEFT JOIN file_version fv ON fv.piece_page_id = pp.id
       WHERE p.anthology_id = ? AND p.contributor_id = ? AND p.status NOT IN ('accepted')`,
      [almanacId, contributorId],
      [...STAFF, "contributor"],
    );
  }
  // Payout details at the payments service. The lead manages payouts and the contributor sees
  // their own transfers.
  await markRows(
    "a payout account id",
    "SELECT provider_account_id FROM payout_account",
    [],
    // The payments service's own account id: no screen needs it, so no answer carries it.
    [],
  );
  await markRows(
    "a payout transfer id",
    "SELECT provider_transfer_id FROM payout_transfer WHERE anthology_id = ?",
    [almanacId],
    ["lead", "contributor"],
  );

  cookies.signedOut = "";
  cookies.lead = await sessionCookie(people.lead.email, people.lead.password);
  cookies.finisher = await sessionCookie(people.finisher.email, people.finisher.password);
  cookies.contributor = await sessionCookie(people.contributor.email, people.contributor.password);
  cookies.editor = await sessionCookie(editor.email, PASSWORD);
  cookies.outsider = await sessionCookie(outsider.email, PASSWORD);
  cookies.otherContributor = await sessionCookie(other.email, PASSWORD);
  const jamLead = demoAccount("bea");
  jamLeadCookie = await sessionCookie(jamLead.email, jamLead.password);
}, 120_000);

afterAll(async () => {
  if (conn) {
    if (addedOutput) await conn.query("DELETE FROM print_output WHERE id = ?", [addedOutput]);
    if (addedCopy) await conn.query("DELETE FROM contributor_copy WHERE id = ?", [addedCopy]);
    if (fixturePeople.length) {
      const peopleIds = fixturePeople.map((p) => p.id);
      await conn.query("DELETE FROM membership WHERE user_id IN (?)", [peopleIds]);
      await conn.query("DELETE FROM user WHERE id IN (?)", [peopleIds]);
    }
    await conn.end();
  }
});

// ---------------------------------------------------------------------------------------------

describe("the authorization matrix", () => {
  it("has a row for every route method under app/api and every studio page, and no row for a route that is gone", () => {
    const inTree = [
      ...apiRoutes().flatMap((r) => r.methods.map((m) => `${m} ${r.pattern}`)),
      ...studioPages().map((p) => `GET ${p}`),
    ].sort();
    const inTable = [...API_ROWS, ...PAGE_ROWS].map((r) => `${r.method} ${r.pattern}`).sort();
    expect(
      inTable.filter((k) => !inTree.includes(k)),
      "rows without a route",
    ).toEqual([]);
    expect(
      inTree.filter((k) => !inTable.includes(k)),
      "routes without a row",
    ).toEqual([]);
    expect(new Set(inTable).size, "duplicate rows").toBe(inTable.length);
  });

  it("answers every caller of every route with its status, and leaks no private field", async () => {
    const work = [...API_ROWS, ...PAGE_ROWS].flatMap((row) =>
      CALLERS.map((caller) => ({ row, caller })),
    );
    const results = await pool(work, 4, ({ row, caller }) => runCell(row, caller));
    cells.push(...results.filter((c) => c.status !== 0));
    const wrong = results
      .filter((c) => c.problem)
      .map((c) => `${c.row} as ${c.caller}: ${c.problem}`);
    const leaks = results
      .filter((c) => c.leaks.length)
      .map((c) => `${c.row} as ${c.caller} (${c.status}) shows ${c.leaks.join(", ")}`);
    expect({ wrong, leaks }, "wrong statuses and private fields shown").toEqual({
      wrong: [],
      leaks: [],
    });
    // The markers are real: those allowed to see them do, somewhere, so finding no leak is not
    // a blind test.
    const seen = new Set(results.flatMap((c) => c.seen));
    for (const label of [
      "a contributor's e-mail",
      "an editor's note",
      "the title of a piece in review",
      "a file name of a piece in review",
      "a payout transfer id",
    ])
      expect(seen, `some allowed caller sees ${label}`).toContain(label);
  });
});

// ---------------------------------------------------------------------------------------------
// Guessed ids

type Guess = { caller: Caller | "jamLead"; method: Method; path: string; body?: string };

function guesses(): Guess[] {
  const w = world;
  const list: Guess[] = [];
  // A contributor guessing other people's pieces, files and proofs, in this anthology and the jam.
  for (const id of [...w.notOwnPieces, ...w.jamPieces, NO_SUCH_ID, 0, -1]) {
    list.push({ caller: "contributor", method: "GET", path: `/api/pieces/${id}` });
    list.push({ caller: "contributor", method: "GET", path: `/api/pieces/${id}/proof/1` });
    list.push({ caller: "contributor", method: "GET", path: `/studio/${ALMANAC}/my-pieces/${id}` });
  }
  list.push({
    caller: "contributor",
    method: "GET",
    path: `/api/file-versions/${w.othersFile}/thumbnail`,
  });
  // A finisher may see the map but never a piece's own record, files or notes.
  list.push({ caller: "finisher", method: "GET", path: `/api/pieces/${w.othersPiece}` });
  list.push({
    caller: "finisher",
    method: "GET",
    path: `/api/file-versions/${w.othersFile}/thumbnail`,
  });
  list.push({ caller: "finisher", method: "GET", path: `/api/pieces/${w.othersPiece}/notes` });
  // The almanac's editor guessing the jam's pieces, and ids that do not exist.
  for (const id of [...w.jamPieces, NO_SUCH_ID]) {
    list.push({ caller: "editor", method: "GET", path: `/api/pieces/${id}` });
    list.push({ caller: "editor", method: "GET", path: `/api/pieces/${id}/notes` });
    list.push({ caller: "editor", method: "GET", path: `/studio/${ALMANAC}/submissions/${id}` });
    list.push({
      caller: "editor",
      method: "PATCH",
      path: `/api/anthologies/${ALMANAC}/credits/${id}`,
      body: JSON.stringify({ creditLine: "guessed" }),
    });
  }
  // The jam's lead, under the jam's own slug, guessing the almanac's ledger, outputs, batches,
  // events, copies and pieces: each must be unknown there.
  const jam = `/api/anthologies/${JAM}`;
  for (const what of ["cancel", "paid-by-hand", "pay"])
    list.push({
      caller: "jamLead",
      method: "POST",
      path: `${jam}/payouts/entries/${w.entry}/${what}`,
      body: JSON.stringify({ reason: "guessed", note: "guessed" }),
    });
  list.push({
    caller: "jamLead",
    method: "POST",
    path: `${jam}/payouts/periods/${w.period}/close`,
  });
  list.push({
    caller: "jamLead",
    method: "POST",
    path: `${jam}/finishing/${w.batch}`,
    body: JSON.stringify({ step: "fold", done: true }),
  });
  list.push({ caller: "jamLead", method: "DELETE", path: `${jam}/run/events/${w.event}` });
  list.push({
    caller: "jamLead",
    method: "PATCH",
    path: `${jam}/stock/contributor-copies/${w.copy}`,
    body: JSON.stringify({ handedOver: true }),
  });
  list.push({
    caller: "jamLead",
    method: "PATCH",
    path: `${jam}/credits/${w.othersPiece}`,
    body: JSON.stringify({ creditLine: "guessed" }),
  });
  list.push({ caller: "jamLead", method: "GET", path: `/api/print-files/${w.output}/download` });
  list.push({
    caller: "jamLead",
    method: "GET",
    path: `${jam}/payouts/statement?period=${w.period}`,
  });
  return list;
}

describe("guessed ids", () => {
  it("never answers another person's or another anthology's record to a guess", async () => {
    const list = guesses();
    const answers = await pool(list, 4, (g) =>
      call(
        g.method,
        g.path,
        g.caller === "jamLead" ? jamLeadCookie : cookies[g.caller],
        g.body ?? "{}",
      ),
    );
    const wrong = list
      .map((g, i) => ({ g, a: answers[i]! }))
      .filter(({ a }) => ![400, 403, 404].includes(a.status))
      .map(
        ({ g, a }) => `${g.method} ${g.path} as ${g.caller}: ${a.status} ${a.body.slice(0, 120)}`,
      );
    expect(wrong).toEqual([]);
    const leaks = list
      .map((g, i) => ({ g, a: answers[i]! }))
      .map(({ g, a }) => ({
        g,
        found: leaksIn(a.body, g.caller === "jamLead" ? "otherContributor" : g.caller),
      }))
      .filter(({ found }) => found.length)
      .map(({ g, found }) => `${g.method} ${g.path} as ${g.caller} shows ${found.join(", ")}`);
    expect(leaks).toEqual([]);
    guessCount = list.length;
  });
});

afterAll(() => {
  // The figures for the closing note and the README: cells, guesses, leaks.
  const out = path.resolve(testEnv.resultsDir);
  mkdirSync(out, { recursive: true });
  const summary = {
    routeMethods: API_ROWS.length,
    pages: PAGE_ROWS.length,
    callers: CALLERS.length,
    cellsTested: cells.length,
    cellsNotSent: notSent,
    guessedIds: guessCount,
    leaks: cells.filter((c) => c.leaks.length).length,
    wrongStatus: cells.filter((c) => c.problem).length,
    markers: markers.length,
  };
  writeFileSync(
    path.join(out, "authorization-matrix.json"),
    `${JSON.stringify(summary, null, 2)}\n`,
  );
  console.log(`authorization matrix: ${JSON.stringify(summary)}`);
});
