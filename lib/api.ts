import "server-only";
import type { z } from "zod";
import { currentUser, type AnthologyAccess, type SessionUser } from "@/lib/auth/guard";
import { can, type Action } from "@/lib/auth/policy";
import { findAnthologyBySlug, findRole } from "@/db/queries/anthologies";

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
  const anthology = await findAnthologyBySlug(slug);
  if (!anthology) throw new HttpError(404, `No anthology called "${slug}".`);
  const role = await findRole(anthology.id, user.id);
  if (!can(role, action))
    throw new HttpError(403, "Your role in this anthology does not allow that.");
  return { user, anthology, role };
}

/** Reads a JSON body and validates it: 400 with field messages when it is not JSON or fails the schema. */
export async function readJson<S extends z.ZodType>(
  request: Request,
  schema: S,
): Promise<z.output<S>> {
  let raw: unknown;
  try {
    raw = await request.json();
  } catch {
    throw new HttpError(400, "The request body is not valid JSON.");
  }
  const parsed = schema.safeParse(raw);
  if (!parsed.success) {
    throw new HttpError(400, "Some fields need attention.", { fields: fieldErrors(parsed.error) });
  }
  return parsed.data;
}

type Handler<C> = (request: Request, context: C) => Promise<Response>;

/** Wraps a route handler so HttpErrors (and anything unexpected) become JSON answers. */
export function apiRoute<C>(handler: Handler<C>): Handler<C> {
  return async (request, context) => {
    try {
      return await handler(request, context);
    } catch (error) {
      if (error instanceof HttpError) {
        return Response.json({ error: error.message, ...error.extra }, { status: error.status });
      }
      console.error("route handler failed", error);
      return Response.json(
        { error: "Something went wrong on our side; nothing was saved." },
        { status: 500 },
      );
    }
  };
}
