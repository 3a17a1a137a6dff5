// The bad-input sweep: every route handler under app/api (read from the file tree, so a new route is
// swept without a new row) gets malformed, oversized, mistyped and hostile input over HTTP, as a
// careless script or an attacker would send it. No answer may be a 500, hang, or leak a stack.
// Bodies start from one valid body per route and break one field at a time.
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import type mysql from "mysql2/promise";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { SALE_CHANNELS } from "@/lib/domain";
import { EVENT_KINDS, PRINT_MODES } from "@/lib/run/batches";
import { hashPassword } from "@/server/auth/password";
import { testEnv } from "../helpers/env";
import { sessionCookie } from "../helpers/http-session";
import { apiRoutes, type ApiRoute, type Method } from "../helpers/routes";
import {
  connect,
  createAnthology,
  createPerson,
  createPiece,
  type FixturePerson,
} from "../helpers/review-fixtures";

const PASSWORD = "sweep-lantern-quartz-31";
const BASE = testEnv.appUrl;
const RESULTS = path.resolve(testEnv.resultsDir);
/** Requests in flight at once: enough to finish quickly, few enough for a 2-core machine. */
const PARALLEL = 6;
/** A request that takes longer than this counts as a hang. */
const HANG_MS = 30_000;

let conn: mysql.Connection;
const people: FixturePerson[] = [];
let lead: FixturePerson;
let contributor: FixturePerson;
let anthology: { id: number; slug: string; title: string };
let leadCookie = "";
let contributorCookie = "";
/** Real ids of this file's own fixtures, for `[param]`s. */
const ids: Record<string, number | string> = {};

// ---------------------------------------------------------------------------------------------
// The inputs

/** A day `n` days from today (UTC), YYYY-MM-DD. */
const dayFromNow = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

/** Raw JSON tokens JSON.stringify cannot write (1e400, -0, a lone surrogate escape), by number. */
const RAW_TOKENS: string[] = [];
const raw = (token: string) => `\u0001raw:${RAW_TOKENS.push(token) - 1}`;

/** Serialises with the raw tokens spliced in where their placeholders stand. */
function toJson(value: unknown): string {
  return JSON.stringify(value).replace(
    /"\\u0001raw:(\d+)"/g,
    (_, n: string) => RAW_TOKENS[Number(n)]!,
  );
}

const LONG = "ä".repeat(100_000);
const deepObject = (depth: number): unknown => {
  let v: unknown = "x";
  for (let i = 0; i < depth; i++) v = { a: v };
  return v;
};

/** Values put in place of any field, whatever its type. */
const ANY_FIELD: [string, unknown][] = [
  ["null", null],
  ["true", true],
  ["empty array", []],
  ["array of junk", [1, "a", null, {}]],
  ["empty object", {}],
  ["deeply nested object", deepObject(2000)],
  ["__proto__ object", JSON.parse('{"__proto__":{"polluted":1}}')],
];
const NUMBER_FIELD: [string, unknown][] = [
  ["number as string", "12"],
  ["negative", -1],
  ["zero", 0],
  ["negative zero", raw("-0")],
  ["fraction", 0.5],
  ["huge 1e308", 1e308],
  ["overflow 1e400", raw("1e400")],
  ["2^63", raw("9223372036854775808")],
  ["2^53+1", raw("9007199254740993")],
  ["NaN string", "NaN"],
  ["Infinity string", "Infinity"],
  ["hex string", "0x10"],
  ["empty string", ""],
];
const STRING_FIELD: [string, unknown][] = [
  ["number for string", 12],
  ["empty string", ""],
  ["100 000 characters", LONG],
  ["RTL override", "\u202Eevil\u202C txt.exe"],
  ["emoji", "🧵📚👩🏽‍🎨🏳️‍🌈"],
  ["mixed scripts", "Zürich – 東京 – القاهرة – Ελλάδα"],
  ["NUL byte", "a\u0000b"],
  ["lone high surrogate", raw('"a\\ud800b"')],
  ["lone low surrogate", raw('"\\udc00"')],
  ["control characters", "\u0007\u001b[31mred\u001b[0m"],
  ["path traversal", "../../etc/passwd"],
  ["markup", '<script>alert(1)</script>"><img src=x onerror=alert(1)>'],
  ["SQL", "'; DROP TABLE piece; --"],
  ["template", "{{7*7}}${7*7}"],
];

/** Whole bodies that are not what any route reads. */
const BODY_JUNK: { label: string; body: string | Buffer | null; type?: string }[] = [
  { label: "truncated JSON", body: '{"a":' },
  { label: "trailing comma", body: '{"a":1,}' },
  { label: "lone bracket", body: "[" },
  { label: "single quotes", body: "{'a':1}" },
  { label: "JSON with comments", body: '{"a":1 /* c */}' },
  { label: "empty body", body: null },
  { label: "empty body with JSON type", body: "" },
  { label: "whitespace body", body: "   \n" },
  { label: "null", body: "null" },
  { label: "array for object", body: "[1,2,3]" },
  { label: "string for object", body: '"hello"' },
  { label: "number for object", body: "12" },
  { label: "boolean for object", body: "true" },
  { label: "deeply nested arrays", body: "[".repeat(20_000) + "]".repeat(20_000) },
  { label: "BOM then JSON", body: '\uFEFF{"a":1}' },
  {
    label: "invalid UTF-8",
    body: Buffer.from([
      0x7b, 0x22, 0x61, 0x22, 0x3a, 0x22, 0xff, 0xfe, 0xed, 0xa0, 0x80, 0x22, 0x7d,
    ]),
  },
  { label: "UTF-16 JSON", body: Buffer.from('{"a":1}', "utf16le") },
  { label: "plain text", body: "hello there", type: "text/plain" },
  {
    label: "form encoded",
    body: "a=1&b=2&__proto__[x]=1",
    type: "application/x-www-form-urlencoded",
  },
  { label: "XML", body: '<?xml version="1.0"?><a>1</a>', type: "application/xml" },
  { label: "multipart junk", body: "--x\r\nnot a part", type: "multipart/form-data; boundary=x" },
];

/** Junk for a `[param]`, already written as it goes into the URL. */
const PARAM_JUNK: [string, string][] = [
  ["encoded traversal", "..%2F..%2Fetc%2Fpasswd"],
  ["dot dot", ".."],
  ["encoded NUL", "%00"],
  ["NUL in the middle", "12%0034"],
  ["very long", "9".repeat(3000)],
  ["minus one", "-1"],
  ["zero", "0"],
  ["exponent", "1e9"],
  ["hex", "0x10"],
  ["fraction", "1.5"],
  ["2^53+1", "9007199254740993"],
  ["2^63", "9223372036854775808"],
  ["NaN", "NaN"],
  ["RTL mark", "%E2%80%AE1"],
  ["emoji", "%F0%9F%98%80"],
  ["invalid UTF-8", "%ED%A0%80"],
  ["lone percent", "%"],
  ["SQL", "1%27%20OR%20%271%27%3D%271"],
  ["markup", "%3Cscript%3Ex%3C%2Fscript%3E"],
  ["unknown id", "999999999"],
];

/** Query strings every GET receives. */
const QUERY_JUNK: [string, string][] = [
  ["repeated keys", "a=1&a=2&a=3"],
  ["NUL", "%00=%00"],
  ["lone percent", "a=%"],
  ["invalid UTF-8", "a=%ED%A0%80"],
  ["prototype keys", "__proto__=1&constructor=x&toString=y"],
  ["bracket keys", "a[]=1&a[b]=2"],
  ["long value", `a=${"x".repeat(6000)}`],
  ["empty key", "=&&="],
];

/** Query parameters some routes read, swept with bad values each. */
const QUERY_PARAMS: Record<string, string[]> = {
  "/api/anthologies/[slug]/submissions": [
    "page",
    "pageSize",
    "sort",
    "dir",
    "q",
    "status",
    "verdict",
  ],
  "/api/anthologies/[slug]/map": ["copies"],
  "/api/anthologies/[slug]/call/template": ["format"],
  "/api/anthologies/[slug]/payouts/export": ["what"],
  "/api/anthologies/[slug]/payouts/statement": ["period", "contributor"],
  "/api/uploadthing": ["actionType", "slug"],
};
const QUERY_VALUES: [string, string][] = [
  ["empty", ""],
  ["minus one", "-1"],
  ["zero", "0"],
  ["fraction", "1.5"],
  ["1e308", "1e308"],
  ["1e400", "1e400"],
  ["2^63", "9223372036854775808"],
  ["NaN", "NaN"],
  ["Infinity", "Infinity"],
  ["hex", "0x10"],
  ["traversal", "..%2F..%2Fetc%2Fpasswd"],
  ["NUL", "%00"],
  ["RTL mark", "%E2%80%AE"],
  ["invalid UTF-8", "%ED%A0%80"],
  ["long", "y".repeat(5000)],
  ["list", "a,b,,c"],
  ["SQL", "%27%20OR%201%3D1%20--"],
];

// ---------------------------------------------------------------------------------------------
// One valid body per route and method; the sweep breaks it a field at a time

type Who = "lead" | "contributor" | "none";
type Target = { bodies: unknown[]; who?: Who; query?: string; headers?: Record<string, string> };

const PRICES = {
  insidePaper: { priceCents: 1200, perQuantity: 500 },
  coverPaper: { priceCents: 900, perQuantity: 100 },
  copyShopSide: { priceCents: 10, perQuantity: 1 },
  inkPass: { priceCents: 50, perQuantity: 1 },
  master: { priceCents: 120, perQuantity: 1 },
  staples: { priceCents: 300, perQuantity: 1000 },
  finishingCentsPerHour: 1500,
  spoilageBasisPoints: 500,
};

function targets(): Record<string, Target> {
  const half = {
    trimChoice: "half-letter",
    orientation: "portrait",
    unit: "in",
    bleed: 0.125,
    safeMargin: 0.25,
    binding: "saddle-stitch",
    pageCountTarget: 16,
    maxPages: 32,
    coverStock: "self",
    paperGsm: 90,
    paperCaliperMm: 0.1,
    printMethod: "duplicator",
    inks: ["black", "teal"],
    inksPerPass: 1,
    minPpi: 300,
  };
  const quote = {
    shopName: "Sweep Copy Shop",
    tiers: [{ copies: 50, totalCents: 9000 }],
    turnaroundDays: 5,
  };
  const pieceId = ids.piece as number;
  return {
    "POST /api/anthologies": {
      bodies: [
        { title: "Sweep probe", pressName: "Sweep", summary: "s", currency: "USD", ...half },
      ],
    },
    "PUT /api/anthologies/[slug]/call": { bodies: [callBody()] },
    "PATCH /api/anthologies/[slug]/credits/[pieceId]": { bodies: [{ creditLine: "Ada Sweep" }] },
    "POST /api/anthologies/[slug]/credits": {
      bodies: [{ scope: "pieces", pieceIds: [pieceId] }, { scope: "outstanding" }],
    },
    "POST /api/anthologies/[slug]/finishing/[batchId]": {
      bodies: [{ stepId: "fold", done: true }],
    },
    "POST /api/anthologies/[slug]/invitations": {
      bodies: [{ email: "sweep-invitee@example.test", role: "finisher" }],
    },
    "PUT /api/anthologies/[slug]/map/copies": { bodies: [{ copies: 100 }] },
    "POST /api/anthologies/[slug]/map/proposal": { bodies: [{ version: 0, copies: 100 }] },
    "POST /api/anthologies/[slug]/map": {
      bodies: [
        { version: 0, change: { op: "place", pieceId, startPage: 1 } },
        { version: 0, change: { op: "reserve", page: 2, reservation: null } },
        { version: 0, change: { op: "resize", delta: 4, atPage: 1, force: false } },
        { version: 0, change: { op: "apply-proposal", placements: [{ pieceId, pages: [3] }] } },
      ],
    },
    "PUT /api/anthologies/[slug]/notifications": { bodies: [{ newPieces: true }] },
    "POST /api/anthologies/[slug]/payouts/entries/[id]/cancel": {
      bodies: [{ reason: "Entered twice" }],
    },
    "POST /api/anthologies/[slug]/payouts/entries/[id]/paid-by-hand": {
      bodies: [{ reference: "cash at the fair" }],
    },
    "POST /api/anthologies/[slug]/payouts/periods": {
      bodies: [{ label: "Sweep season", startsOn: "2026-01-01", endsOn: "2026-03-31" }],
    },
    "POST /api/anthologies/[slug]/payouts/statements": { bodies: [{ periodId: ids.period }] },
    "POST /api/anthologies/[slug]/pieces": {
      who: "contributor",
      bodies: [
        {
          title: "Sweep piece",
          kind: "single",
          pageCount: 1,
          inks: ["black"],
          creditLine: "Ada Sweep",
          statement: "About it",
          altTexts: ["A drawing"],
        },
      ],
    },
    "GET /api/anthologies/[slug]/pieces": { who: "contributor", bodies: [] },
    "POST /api/anthologies/[slug]/print-files": {
      bodies: [{ sheet: "sra3" }, { sheet: { widthMm: 320, heightMm: 450 } }],
    },
    "PUT /api/anthologies/[slug]/run/price-lists/[id]": {
      bodies: [{ name: "Sweep prices", prices: PRICES }],
    },
    "POST /api/anthologies/[slug]/run/price-lists": {
      bodies: [{ name: "Sweep prices 2", prices: PRICES }],
    },
    "PUT /api/anthologies/[slug]/run/quotes/[id]": { bodies: [quote] },
    "POST /api/anthologies/[slug]/run/quotes": { bodies: [{ ...quote, shopName: "Sweep Shop 2" }] },
    "PUT /api/anthologies/[slug]/run": {
      bodies: [
        {
          quantities: [50, 100],
          priceListId: ids.priceList,
          shopQuoteId: null,
          timings: { fold: { setupMinutes: 5, minutesPerCopy: 0.5 } },
          minutesPerWeek: 600,
          printMode: PRINT_MODES[0],
        },
      ],
    },
    "POST /api/anthologies/[slug]/run/events": {
      bodies: [{ name: "Sweep fair", kind: EVENT_KINDS[0], date: dayFromNow(30), copies: 20 }],
    },
    "POST /api/anthologies/[slug]/sales": {
      bodies: [
        {
          channel: SALE_CHANNELS[0],
          label: "Sweep fair",
          soldOn: dayFromNow(-1),
          copies: 2,
          unitPriceCents: 800,
          discountCents: 0,
          channelFeesCents: 0,
          recoverableCostsCents: 0,
          note: "cash",
        },
      ],
    },
    "PATCH /api/anthologies/[slug]/spec": { bodies: [{ ...half, confirm: false }] },
    "POST /api/anthologies/[slug]/stage": { bodies: [{ to: "call-open" }] },
    "PATCH /api/anthologies/[slug]/stock/contributor-copies/[id]": {
      bodies: [{ delivery: "post", eventId: null, done: false }],
    },
    "POST /api/anthologies/[slug]/stock": {
      bodies: [
        {
          kind: "correction",
          batchId: null,
          quantity: -1,
          target: "copies",
          reason: "Counted again",
        },
        { kind: "printed", batchId: 999999, quantity: 5, reason: "" },
      ],
    },
    "POST /api/anthologies/[slug]/submissions/status": {
      bodies: [{ pieceIds: [pieceId], to: "shortlisted", message: "Lovely", confirm: false }],
    },
    "GET /api/anthologies/[slug]/my-payouts": { who: "contributor", bodies: [] },
    "POST /api/anthologies/[slug]/my-payouts/account": { who: "contributor", bodies: [] },
    "POST /api/credits/[token]": { who: "none", bodies: [{ creditLine: "Ada Sweep" }] },
    "POST /api/pieces/[id]/notes": { bodies: [{ body: "A note from the sweep" }] },
    "PATCH /api/pieces/[id]": {
      who: "contributor",
      bodies: [
        { action: "alt-text", pageIndex: 1, altText: "A drawing" },
        { action: "credit-line", creditLine: "Ada Sweep" },
        { action: "use-version", pageIndex: 1, versionId: 1, expectedRevision: 0 },
        { action: "withdraw", reason: "Changed my mind" },
      ],
    },
    "GET /api/pieces/[id]/proof/[page]": { who: "contributor", bodies: [] },
    "POST /api/pieces/[id]/status": {
      bodies: [{ to: "shortlisted", message: "Lovely", confirm: false }],
    },
    "POST /api/uploadthing": {
      who: "contributor",
      query: "actionType=upload&slug=artworkPage",
      bodies: [
        {
          input: { pieceId, pageIndex: 1, expectedRevision: 0 },
          files: [{ name: "p1.png", size: 10, type: "image/png", lastModified: 1 }],
        },
      ],
    },
    "POST /api/payments/webhook": {
      who: "none",
      headers: { "stripe-signature": "t=1,v1=00" },
      bodies: [{ id: "evt_sweep", type: "account.updated", data: { object: { id: "acct_x" } } }],
    },
  };
}

function callBody() {
  return {
    theme: "Tides and thresholds",
    brief: "Send us a page about the edges of things: shorelines, doorways, margins.",
    opensAt: `${dayFromNow(-2)}T09:00`,
    closesAt: `${dayFromNow(40)}T23:59`,
    timeZone: "UTC",
    allowedKinds: ["single", "spread", "run"],
    maxRunPages: 4,
    piecesPerPerson: 20,
    allowedInks: ["black", "teal"],
    feeKind: "none",
    fee: "0",
    salesSharePercent: "10",
    shareSplit: "per-page",
    contributorCopies: 1,
    rightsAsked: "One-time printing rights for this edition; every other right stays with you.",
  };
}

/** Leaf paths of a value (object keys and array indexes), with the leaf's type. */
function leaves(
  value: unknown,
  at: (string | number)[] = [],
): { path: (string | number)[]; type: string }[] {
  if (Array.isArray(value)) {
    const own = [{ path: at, type: "array" }];
    return value.length ? [...own, ...leaves(value[0], [...at, 0])] : own;
  }
  if (value && typeof value === "object") {
    const own = at.length ? [{ path: at, type: "object" }] : [];
    return [...own, ...Object.entries(value).flatMap(([k, v]) => leaves(v, [...at, k]))];
  }
  return [{ path: at, type: value === null ? "null" : typeof value }];
}

/** A deep copy of `body` with the value at `at` replaced (or deleted when `value` is DELETE). */
const DELETE = Symbol("delete");
function withValue(body: unknown, at: (string | number)[], value: unknown): unknown {
  const copy = structuredClone(body) as Record<string | number, unknown>;
  let node = copy;
  for (const key of at.slice(0, -1)) node = node[key] as Record<string | number, unknown>;
  const last = at.at(-1)!;
  if (value === DELETE) {
    if (Array.isArray(node)) node.splice(Number(last), 1);
    else delete node[last];
  } else node[last] = value;
  return copy;
}

// ---------------------------------------------------------------------------------------------
// Sending and counting

type Probe = {
  method: Method;
  url: string;
  label: string;
  body?: string | Buffer | null;
  type?: string;
  who: Who;
  headers?: Record<string, string>;
  /** The status this input must get (else any status but 500). */
  expect?: number;
};
type Finding = { method: string; path: string; label: string; status: number; snippet: string };

const byStatus: Record<string, number> = {};
const findings: Finding[] = [];
const leaks: Finding[] = [];
const wrongStatus: Finding[] = [];
let tried = 0;

// A stack frame ("    at fn (/path/file.js:1:2)") or an error's own name and message in an answer.
const STACK =
  /\n\s+at [^\n]+:\d+:\d+\)?|\b(?:TypeError|RangeError|ReferenceError|SyntaxError|Error): |node_modules|webpack-internal|ER_[A-Z_]+|sqlMessage/;

async function send(probe: Probe): Promise<void> {
  const headers: Record<string, string> = { ...probe.headers };
  const cookie =
    probe.who === "lead" ? leadCookie : probe.who === "contributor" ? contributorCookie : "";
  if (cookie) headers.cookie = cookie;
  if (probe.body !== undefined && probe.body !== null)
    headers["content-type"] = probe.type ?? "application/json";
  let status = 0;
  let text: string;
  try {
    const response = await fetch(`${BASE}${probe.url}`, {
      method: probe.method,
      headers,
      body:
        probe.method === "GET" || probe.method === "HEAD" || probe.body == null
          ? undefined
          : typeof probe.body === "string"
            ? probe.body
            : new Uint8Array(probe.body),
      redirect: "manual",
      signal: AbortSignal.timeout(HANG_MS),
    });
    status = response.status;
    text = await response.text();
  } catch (error) {
    text = `no answer: ${(error as Error).name} ${(error as Error).message}`;
  }
  tried++;
  byStatus[status] = (byStatus[status] ?? 0) + 1;
  const finding = {
    method: probe.method,
    path: probe.url.length > 160 ? `${probe.url.slice(0, 160)}…` : probe.url,
    label: probe.label,
    status,
    snippet: text.slice(0, 200).replace(/\s+/g, " "),
  };
  if (status >= 500 || status === 0) findings.push(finding);
  // HTML pages carry the framework's own scripts; look at what is not a page.
  const isPage = /^\s*<!DOCTYPE html/i.test(text);
  const scanned = isPage ? text.replace(/<script[\s\S]*?<\/script>/g, "") : text;
  if (STACK.test(scanned))
    leaks.push({ ...finding, snippet: (scanned.match(STACK)?.[0] ?? "").slice(0, 200) });
  if (probe.expect !== undefined && status !== probe.expect) wrongStatus.push(finding);
}

async function runAll(probes: Probe[]): Promise<void> {
  let next = 0;
  await Promise.all(
    Array.from({ length: PARALLEL }, async () => {
      while (next < probes.length) await send(probes[next++]!);
    }),
  );
}

/** The route's URL with its params filled; `override` replaces one param with raw URL text. */
function urlOf(route: ApiRoute, override?: { name: string; text: string }): string {
  return route.pattern.replace(/\[(\.\.\.)?([^\]]+)\]/g, (_, _rest: string, name: string) => {
    if (override?.name === name) return override.text;
    const value = name === "id" ? ids[idKindOf(route.pattern)] : ids[name];
    if (value === undefined)
      throw new Error(`the sweep has no value for [${name}] in ${route.pattern}`);
    return String(value);
  });
}

/** What `[id]` names in a route: the fixture whose id fills it. */
function idKindOf(pattern: string): string {
  const kinds: [RegExp, string][] = [
    [/\/run\/events\/\[id\]/, "event"],
    [/\/run\/price-lists\/\[id\]/, "priceList"],
    [/\/run\/quotes\/\[id\]/, "quote"],
    [/\/payouts\/periods\/\[id\]/, "period"],
    [/^\/api\/pieces\/\[id\]/, "piece"],
  ];
  // Ledger lines, contributor copies, file versions and print files: an unknown id.
  return kinds.find(([re]) => re.test(pattern))?.[1] ?? "unknown";
}

/** Auth.js's own endpoints under the catch-all, and junk ones. */
const AUTH_PATHS = [
  "session",
  "csrf",
  "providers",
  "signin",
  "signout",
  "error",
  "verify-request",
  "callback/credentials",
  "signin/nodemailer",
  "callback/nodemailer?token=%00&email=..%2F..",
  "callback/nope",
  "..%2F..%2Fetc%2Fpasswd",
  "%00",
  "%ED%A0%80",
  "x".repeat(3000),
];

const TWENTY_MB = Buffer.from(`{"a":"${"x".repeat(20 * 1024 * 1024)}"}`);

function probesFor(route: ApiRoute, method: Method, table: Record<string, Target>): Probe[] {
  const key = `${method} ${route.pattern}`;
  const target = table[key] ?? { bodies: [] };
  const who: Who = target.who ?? "lead";
  const query = target.query ? `?${target.query}` : "";
  const base = { method, who, headers: target.headers };
  const out: Probe[] = [];
  const isAuth = route.pattern.startsWith("/api/auth/");
  const urls = isAuth ? AUTH_PATHS.map((p) => `/api/auth/${p}`) : [`${urlOf(route)}${query}`];
  const hasBody = method !== "GET" && method !== "HEAD";

  for (const url of urls) {
    const at = (label: string) => `${label}${isAuth ? ` at ${url.slice(10, 40)}` : ""}`;
    if (hasBody) {
      for (const junk of BODY_JUNK)
        out.push({ ...base, url, label: at(junk.label), body: junk.body, type: junk.type });
    }
    // The valid body itself, as JSON and under the wrong content type.
    for (const [i, body] of target.bodies.entries()) {
      out.push({ ...base, url, label: `valid body ${i + 1}`, body: toJson(body) });
      out.push({
        ...base,
        url,
        label: `valid body ${i + 1} as text/plain`,
        body: toJson(body),
        type: "text/plain",
      });
    }
    if (!hasBody) {
      for (const [label, q] of QUERY_JUNK)
        out.push({
          ...base,
          url: `${url}${url.includes("?") ? "&" : "?"}${q}`,
          label: at(`query: ${label}`),
        });
    }
  }
  if (hasBody) {
    // 413 from any route that reads a JSON body; any route that does not must still answer.
    out.push({
      ...base,
      url: urls[0]!,
      label: "20 MB JSON body",
      body: TWENTY_MB,
      expect: target.bodies.length && !key.includes("webhook") ? 413 : undefined,
    });
  }
  for (const name of QUERY_PARAMS[route.pattern] ?? []) {
    for (const [label, value] of QUERY_VALUES)
      out.push({
        ...base,
        url: `${urls[0]!.split("?")[0]}?${name}=${value}`,
        label: `?${name}: ${label}`,
      });
    if (route.pattern === "/api/uploadthing") continue;
  }

  // One field at a time.
  for (const [i, body] of target.bodies.entries()) {
    for (const leaf of leaves(body)) {
      if (!leaf.path.length) continue;
      const name = `body ${i + 1} ${leaf.path.join(".")}`;
      const values = [
        ...ANY_FIELD,
        ...(leaf.type === "number" ? NUMBER_FIELD : []),
        ...(leaf.type === "string" ? STRING_FIELD : []),
        ...(leaf.type === "boolean"
          ? [["string for boolean", "true"] as [string, unknown], ["one", 1] as [string, unknown]]
          : []),
      ];
      for (const [label, value] of values)
        out.push({
          ...base,
          url: urls[0]!,
          label: `${name}: ${label}`,
          body: toJson(withValue(body, leaf.path, value)),
        });
      out.push({
        ...base,
        url: urls[0]!,
        label: `${name}: missing`,
        body: toJson(withValue(body, leaf.path, DELETE)),
      });
    }
    if (body && typeof body === "object" && !Array.isArray(body)) {
      out.push({
        ...base,
        url: urls[0]!,
        label: `body ${i + 1}: unknown extra field`,
        body: toJson({ ...body, extra: LONG }),
      });
      out.push({
        ...base,
        url: urls[0]!,
        label: `body ${i + 1}: wrapped in an array`,
        body: toJson([body]),
      });
    }
  }

  // Junk in each [param], the other params real.
  if (!isAuth) {
    for (const m of route.pattern.matchAll(/\[(?:\.\.\.)?([^\]]+)\]/g)) {
      for (const [label, text] of PARAM_JUNK) {
        out.push({
          ...base,
          url: `${urlOf(route, { name: m[1]!, text })}${query}`,
          label: `[${m[1]}]: ${label}`,
          body: hasBody ? toJson(target.bodies[0] ?? {}) : undefined,
        });
      }
    }
  }
  return out;
}

// ---------------------------------------------------------------------------------------------
// Fixtures

async function person(name: string, label: string) {
  const p = await createPerson(conn, name, label);
  await conn.query("UPDATE user SET password_hash = ? WHERE id = ?", [
    await hashPassword(PASSWORD),
    p.id,
  ]);
  people.push(p);
  return p;
}

async function apiAs(cookie: string, method: string, url: string, body?: unknown) {
  const response = await fetch(`${BASE}${url}`, {
    method,
    headers: { cookie, "content-type": "application/json" },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await response.text();
  if (response.status >= 300)
    throw new Error(`${method} ${url} gave ${response.status}: ${text.slice(0, 300)}`);
  return text ? (JSON.parse(text) as Record<string, unknown>) : {};
}

async function firstId(sql: string, params: unknown[]): Promise<number> {
  const [rows] = await conn.query<mysql.RowDataPacket[]>(sql, params);
  const id = rows[0]?.id as number | undefined;
  if (!id) throw new Error(`no row for ${sql}`);
  return id;
}

beforeAll(async () => {
  conn = await connect();
  lead = await person("Sweep Lead", "sweep-lead");
  contributor = await person("Sweep Contributor", "sweep-contrib");
  anthology = await createAnthology(conn, "Sweep Anthology", lead.id, [
    { userId: lead.id, role: "lead" },
    { userId: contributor.id, role: "contributor" },
  ]);
  // Its own press, so price lists and quotes kept by press are this file's alone.
  await conn.query("UPDATE anthology SET press_name = ? WHERE id = ?", [
    `Sweep press ${anthology.slug}`,
    anthology.id,
  ]);
  leadCookie = await sessionCookie(lead.email, PASSWORD);
  contributorCookie = await sessionCookie(contributor.email, PASSWORD);
  const s = anthology.slug;
  await apiAs(leadCookie, "PUT", `/api/anthologies/${s}/call`, callBody());
  await conn.query("UPDATE open_call SET published_at = NOW(3) WHERE anthology_id = ?", [
    anthology.id,
  ]);
  ids.slug = s;
  ids.piece = await createPiece(conn, anthology.id, {
    title: "Sweep fixture piece",
    contributorId: contributor.id,
    creditLine: "Ada Sweep",
  });
  ids.pieceId = ids.piece;
  ids.page = 1;
  ids.unknown = 999_999;
  await apiAs(leadCookie, "POST", `/api/anthologies/${s}/run/price-lists`, {
    name: "Sweep fixture prices",
    prices: PRICES,
  });
  ids.priceList = await firstId(
    "SELECT id FROM price_list WHERE updated_by = ? ORDER BY id LIMIT 1",
    [lead.id],
  );
  await apiAs(leadCookie, "POST", `/api/anthologies/${s}/run/quotes`, {
    shopName: "Sweep fixture shop",
    tiers: [{ copies: 50, totalCents: 9000 }],
    turnaroundDays: 5,
  });
  ids.quote = await firstId("SELECT id FROM shop_quote WHERE updated_by = ? ORDER BY id LIMIT 1", [
    lead.id,
  ]);
  await apiAs(leadCookie, "POST", `/api/anthologies/${s}/run/events`, {
    name: "Sweep fixture fair",
    kind: EVENT_KINDS[0],
    date: dayFromNow(20),
    copies: 10,
  });
  ids.event = await firstId("SELECT id FROM run_event WHERE anthology_id = ? ORDER BY id LIMIT 1", [
    anthology.id,
  ]);
  await apiAs(leadCookie, "POST", `/api/anthologies/${s}/payouts/periods`, {
    label: "Sweep fixture period",
    startsOn: "2025-01-01",
    endsOn: "2025-12-31",
  });
  ids.period = await firstId(
    "SELECT id FROM payout_period WHERE anthology_id = ? ORDER BY id LIMIT 1",
    [anthology.id],
  );
  // Ids the sweep cannot cheaply make real: an unknown one, so the route gets past parsing.
  ids.batchId = 999_999;
  ids.token = "sweep-token-that-is-not-one";
}, 60_000);

afterAll(async () => {
  if (!conn) return;
  const ids = people.map((p) => p.id);
  if (ids.length) {
    const [rows] = await conn.query<mysql.RowDataPacket[]>(
      "SELECT id FROM anthology WHERE created_by IN (?)",
      [ids],
    );
    const anthologyIds = rows.map((r) => r.id as number);
    if (anthologyIds.length) {
      await conn.query("DELETE FROM email_log WHERE anthology_id IN (?)", [anthologyIds]);
      await conn.query("DELETE FROM anthology WHERE id IN (?)", [anthologyIds]);
    }
    await conn.query("DELETE FROM price_list WHERE updated_by IN (?)", [ids]);
    await conn.query("DELETE FROM shop_quote WHERE updated_by IN (?)", [ids]);
    await conn.query("DELETE FROM rate_limit WHERE `key` LIKE ? OR `key` LIKE ?", [
      `%${people[0]!.id}%`,
      `%${people[1]!.id}%`,
    ]);
    await conn.query("DELETE FROM user WHERE id IN (?)", [ids]);
  }
  await conn.end();
});

// ---------------------------------------------------------------------------------------------

describe("bad input at every API route", () => {
  it("answers every malformed, oversized, mistyped and hostile input without a 500, a hang or a stack", async () => {
    const routes = apiRoutes();
    expect(routes.length).toBeGreaterThan(40);
    const table = targets();
    // A row for a route that is gone would sweep nothing: the table follows the file tree.
    const known = new Set(routes.flatMap((r) => r.methods.map((m) => `${m} ${r.pattern}`)));
    expect(Object.keys(table).filter((k) => !known.has(k))).toEqual([]);

    const probes: Probe[] = [];
    // The stage move last: it may change what the other routes allow.
    const ordered = [...routes].sort(
      (a, b) => Number(a.pattern.endsWith("/stage")) - Number(b.pattern.endsWith("/stage")),
    );
    for (const route of ordered)
      for (const method of route.methods) probes.push(...probesFor(route, method, table));
    const started = Date.now();
    await runAll(probes);
    const seconds = ((Date.now() - started) / 1000).toFixed(1);

    mkdirSync(RESULTS, { recursive: true });
    const status500 = findings.filter((f) => f.status >= 500).length;
    writeFileSync(
      path.join(RESULTS, "bad-input.json"),
      `${JSON.stringify({ tried, status500, noAnswer: byStatus[0] ?? 0, leaked: leaks.length, byStatus, findings, leaks, wrongStatus }, null, 2)}\n`,
    );
    console.log(
      `bad-input sweep: ${tried} inputs tried over ${known.size} route methods in ${seconds} s; ${status500} answered 5xx, ${byStatus[0] ?? 0} got no answer, ${leaks.length} leaked internals; by status ${JSON.stringify(byStatus)}`,
    );
    const list = (rows: Finding[]) =>
      rows
        .slice(0, 60)
        .map((f) => `${f.status} ${f.method} ${f.path} [${f.label}] ${f.snippet}`)
        .join("\n");
    expect(findings, `5xx or no answer:\n${list(findings)}`).toEqual([]);
    expect(leaks, `internals in answers:\n${list(leaks)}`).toEqual([]);
    expect(wrongStatus, `oversized bodies not refused with 413:\n${list(wrongStatus)}`).toEqual([]);
    expect(tried).toBe(probes.length);
  }, 170_000);
});
