import "server-only";
import { errorSummary, log, pathOf } from "@/server/log";
import type { z } from "zod";
import { findAnthologyAccess, findRole } from "@/db/queries/anthologies";
import { findPieceAnthologySlug } from "@/db/queries/review";
import { findPieceAccess } from "@/db/queries/submissions";
import { can, maySeePiece, type Action } from "@/lib/auth/policy";
import type { Role, SessionUser } from "@/lib/domain";
import { Refusal } from "@/lib/refusal";
import { isSameSiteRequest } from "@/lib/request-origin";
import { env } from "@/lib/env";
import { parseId } from "@/lib/ids";
import { currentUser, type AnthologyAccess } from "@/server/auth/guard";

/**
 * The route-handler kit. Every handler under app/api is `apiRoute(async (request, ctx) => …)` and
 * reads as authorise (requireApi*), validate (readJson, readQuery, idParam), call db/ and lib/,
 * answer. Anything thrown as an HttpError or a Refusal becomes a JSON answer with its status.
 */

/** An error that becomes a JSON answer with this status. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly extra: Record<string, unknown> = {},
  ) {
    super(message);
  }
}

/** Field messages keyed by dotted path, the shape forms show beside their inputs. */
export function fieldErrors(error: z.ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

/** 401 without a session. */
export async function requireApiUser(): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) throw new HttpError(401, "Sign in first.");
  return user;
}

/** 401 without a session, 404 for an unknown anthology, 403 when the role does not allow `action`. */
export async function requireApiAccess(slug: string, action: Action): Promise<AnthologyAccess> {
  const user = await requireApiUser();
  const found = await findAnthologyAccess(slug, user.id);
  if (!found) throw new HttpError(404, `No anthology called "${slug}".`);
  const { anthology, role } = found;
  if (!can(role, action))
    throw new HttpError(
      403,
      role
        ? "Your role in this anthology does not allow that."
        : "You are not a member of this anthology.",
    );
  return { user, anthology, role };
}

/** Whether the signed-in person, if any, may do `action` in an anthology (for routes open to the public too). */
export async function currentUserMay(anthologyId: number, action: Action): Promise<boolean> {
  const user = await currentUser();
  return Boolean(user) && can(await findRole(anthologyId, user!.id), action);
}

/**
 * For route handlers under /api/pieces/[id]: 401 without a session, 404 for an unknown piece,
 * 403 when the person's role in the piece's anthology does not allow `action`.
 */
export async function requirePieceApiAccess(
  idParamValue: string,
  action: Action,
): Promise<AnthologyAccess & { pieceId: number }> {
  await requireApiUser();
  const pieceId = idParam(idParamValue, "piece");
  const slug = await findPieceAnthologySlug(pieceId);
  if (!slug) throw new HttpError(404, "There is no such piece.");
  return { ...(await requireApiAccess(slug, action)), pieceId };
}

/**
 * 404 for someone outside the piece's anthology (they may not learn it exists), 403 for a member
 * whom the policy does not let see it (see `maySeePiece`).
 */
export function assertMaySeePiece(role: Role | null, isOwner: boolean, what = "piece"): void {
  if (role === null) throw new HttpError(404, `There is no such ${what}.`);
  if (!maySeePiece(role, isOwner))
    throw new HttpError(
      403,
      "Only the piece's contributor and the anthology's editors can see it and its files.",
    );
}

/** For /api/pieces/[id] as the contributor or an editor sees it: 401, 404, or 403 (assertMaySeePiece). */
export async function requirePieceViewer(idParamValue: string) {
  const user = await requireApiUser();
  const pieceId = idParam(idParamValue, "piece");
  const found = await findPieceAccess(pieceId, user.id);
  if (!found) throw new HttpError(404, "There is no such piece.");
  assertMaySeePiece(found.role, found.isOwner);
  return { user, pieceId, ...found };
}

/** A numeric id from a route segment, or a 404 naming what was looked for. */
export function idParam(value: string, what: string): number {
  const id = parseId(value);
  if (id === null) throw new HttpError(404, `There is no such ${what}.`);
  return id;
}

/** The most a JSON body may hold; anything larger is refused with 413 before it is read whole. */
export const MAX_JSON_BYTES = 1024 * 1024;

/** Reads at most `limit` bytes of a body as text, or throws 413 as soon as it grows past it. */
export async function readTextCapped(request: Request, limit: number): Promise<string> {
  const tooLarge = () =>
    new HttpError(413, `The request body is larger than ${Math.round(limit / 1024)} KB.`);
  const declared = Number(request.headers.get("content-length") ?? "");
  if (Number.isFinite(declared) && declared > limit) throw tooLarge();
  if (!request.body) return "";
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge();
    }
    chunks.push(value);
  }
  return new TextDecoder().decode(Buffer.concat(chunks));
}

/** Reads a JSON body and validates it: 413 past MAX_JSON_BYTES, 400 with field messages when it is not JSON or fails the schema. */
export async function readJson<S extends z.ZodType>(
  request: Request,
  schema: S,
  { limit = MAX_JSON_BYTES }: { limit?: number } = {},
): Promise<z.output<S>> {
  const text = await readTextCapped(request, limit);
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw new HttpError(400, "The request body is not valid JSON.");
  }
  const parsed = schema.safeParse(raw);
  if (!parsed.success) {
    throw new HttpError(400, "Some fields need attention.", { fields: fieldErrors(parsed.error) });
  }
  return parsed.data;
}

/** How deep a JSON value nests (objects and arrays), counted without recursion. */
export function jsonDepth(value: unknown): number {
  let deepest = 0;
  const stack: [unknown, number][] = [[value, 0]];
  while (stack.length) {
    const [v, depth] = stack.pop()!;
    if (v === null || typeof v !== "object") continue;
    deepest = Math.max(deepest, depth + 1);
    for (const child of Object.values(v)) stack.push([child, depth + 1]);
  }
  return deepest;
}

/** Query parameters as a record: a parameter given once is a string, given more than once an array. */
export function searchParamsRecord(params: URLSearchParams): Record<string, string | string[]> {
  const raw: Record<string, string | string[]> = {};
  for (const key of new Set(params.keys())) {
    const all = params.getAll(key);
    raw[key] = all.length === 1 ? all[0]! : all;
  }
  return raw;
}

/**
 * Reads the query string and validates it (after `shape`, which turns the parameters into the
 * object the schema reads). 400 with field messages keyed by the parameter's own name.
 */
export function readQuery<S extends z.ZodType>(
  request: Request,
  schema: S,
  shape: (params: URLSearchParams) => unknown = searchParamsRecord,
): z.output<S> {
  const parsed = schema.safeParse(shape(new URL(request.url).searchParams));
  if (!parsed.success) {
    // A bad entry in a list (status.1) is reported under the parameter's own name.
    const fields: Record<string, string[]> = {};
    for (const [path, messages] of Object.entries(fieldErrors(parsed.error))) {
      (fields[path.split(".")[0]!] ??= []).push(...messages);
    }
    throw new HttpError(400, "Some query parameters need attention.", { fields });
  }
  return parsed.data;
}

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/** 403 for a state-changing request a browser marks as coming from another site. */
function refuseCrossSite(request: Request): void {
  if (SAFE_METHODS.has(request.method.toUpperCase())) return;
  const ok = isSameSiteRequest({
    method: request.method,
    origin: request.headers.get("origin"),
    secFetchSite: request.headers.get("sec-fetch-site"),
    ownOrigins: [new URL(request.url).origin, new URL(env().AUTH_URL).origin],
  });
  if (!ok)
    throw new HttpError(403, "This request came from another site, so it was refused.", {
      code: "cross-site",
    });
}

type Handler<C> = (request: Request, context: C) => Promise<Response>;

/**
 * Wraps a route handler: refuses cross-site writes, and turns HttpErrors, Refusals (and anything
 * unexpected) into JSON answers.
 */
export function apiRoute<C>(handler: Handler<C>): Handler<C> {
  return async (request, context) => {
    const started = performance.now();
    const response = await answer(handler, request, context);
    log.info(
      {
        kind: "request",
        method: request.method,
        path: pathOf(request.url),
        status: response.status,
        ms: Math.round(performance.now() - started),
      },
      "request",
    );
    return response;
  };
}

async function answer<C>(handler: Handler<C>, request: Request, context: C): Promise<Response> {
  try {
    refuseCrossSite(request);
    return await handler(request, context);
  } catch (error) {
    if (error instanceof HttpError) {
      return Response.json({ error: error.message, ...error.extra }, { status: error.status });
    }
    if (error instanceof Refusal) {
      return Response.json({ error: error.message }, { status: error.status });
    }
    // The error's name and message only: a stack or a driver's error object can carry SQL
    // parameters (people's text) with it.
    log.error(
      {
        kind: "request-failed",
        method: request.method,
        path: pathOf(request.url),
        error: errorSummary(error),
      },
      "route handler failed",
    );
    return Response.json(
      { error: "Something went wrong on our side; nothing was saved." },
      { status: 500 },
    );
  }
}
