/** An answer from our API that was not 2xx: its message, status and any field messages. */
export class ApiError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly fields: Record<string, string[]> = {},
    readonly body: Record<string, unknown> = {},
  ) {
    super(message);
  }
}

/** fetch() that returns parsed JSON or throws an ApiError with the server's own words. */
export async function fetchJson<T>(
  url: string,
  init?: RequestInit & { json?: unknown },
): Promise<T> {
  const { json, ...rest } = init ?? {};
  let response: Response;
  try {
    response = await fetch(url, {
      ...rest,
      headers:
        json === undefined ? rest.headers : { "content-type": "application/json", ...rest.headers },
      body: json === undefined ? rest.body : JSON.stringify(json),
    });
  } catch {
    throw new ApiError("Quireline could not be reached. Check the connection and try again.", 0);
  }
  let body: Record<string, unknown> = {};
  try {
    body = (await response.json()) as Record<string, unknown>;
  } catch {
    // A non-JSON answer (a proxy page, an empty body) is reported by status below.
  }
  if (!response.ok) {
    const message =
      typeof body.error === "string" ? body.error : `The server answered ${response.status}.`;
    throw new ApiError(
      message,
      response.status,
      (body.fields as Record<string, string[]>) ?? {},
      body,
    );
  }
  return body as T;
}
