/**
 * The one way client components call Quireline's own JSON routes. A 2xx answer comes back parsed
 * (typed with the route's wire type from lib/wire/ or lib/map-edits/payload.ts); anything else is
 * thrown as an ApiError carrying the status, the server's own message and its field messages.
 */
import type { ErrorAnswer, FieldMessages } from "@/lib/wire/errors";

const UNREACHABLE = "Quireline could not be reached. Check the connection and try again.";
const UNREADABLE = "The server's answer could not be read.";

/** An answer from our API that was not 2xx, or no answer at all (status 0). */
export class ApiError extends Error {
  override readonly name = "ApiError";

  constructor(
    message: string,
    /** The HTTP status; 0 when no answer came back (offline, server down). */
    readonly status: number,
    /** Messages per field, keyed by dotted path, as the route's schema reported them. */
    readonly fields: FieldMessages = {},
    /** The whole refusal, for routes that add to `{ error, fields }` (the fresh map, the problems). */
    readonly body: Partial<ErrorAnswer> & Record<string, unknown> = {},
  ) {
    super(message);
  }

  /** True when the request never got an answer. */
  get unreachable(): boolean {
    return this.status === 0;
  }

  /** The first message for a field (`fieldMessage("body")`), if the server gave one. */
  fieldMessage(name: string): string | undefined {
    return this.fields[name]?.[0];
  }
}

export type FetchJsonInit = Omit<RequestInit, "body"> & {
  /** Sent as the JSON body, with its content type. */
  json?: unknown;
  /** The message when the server refuses without saying why (may name the status). */
  failure?: string | ((status: number) => string);
  /** The message when no answer comes back. */
  unreachable?: string;
};

/** fetch() that returns the parsed JSON of a 2xx answer or throws an ApiError in plain words. */
export async function fetchJson<T>(url: string, init: FetchJsonInit = {}): Promise<T> {
  const { json, failure, unreachable, ...rest } = init;
  const request: RequestInit = { ...rest };
  if (json !== undefined) {
    request.headers = { "content-type": "application/json", ...rest.headers };
    request.body = JSON.stringify(json);
  }
  let response: Response;
  try {
    response = await fetch(url, request);
  } catch (error) {
    // A cancelled request (a query that is no longer wanted) is not a failure to report.
    if (rest.signal?.aborted) throw error;
    throw new ApiError(unreachable ?? UNREACHABLE, 0);
  }
  let body: unknown;
  let readable = true;
  try {
    body = await response.json();
  } catch {
    readable = false;
  }
  if (response.ok) {
    if (!readable) throw new ApiError(UNREADABLE, response.status);
    return body as T;
  }
  const refusal = (readable && typeof body === "object" && body !== null ? body : {}) as Partial<
    ErrorAnswer & Record<string, unknown>
  >;
  const fallback =
    typeof failure === "function"
      ? failure(response.status)
      : (failure ?? `The server answered ${response.status}.`);
  throw new ApiError(
    typeof refusal.error === "string" && refusal.error ? refusal.error : fallback,
    response.status,
    isFieldMessages(refusal.fields) ? refusal.fields : {},
    refusal,
  );
}

function isFieldMessages(value: unknown): value is FieldMessages {
  return (
    typeof value === "object" &&
    value !== null &&
    Object.values(value).every((v) => Array.isArray(v) && v.every((m) => typeof m === "string"))
  );
}
