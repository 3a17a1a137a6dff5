// The client's one way of calling Quireline's JSON routes: what a screen sees for each kind of
// answer. The refusals are shaped as server/api.ts writes them ({ error, fields, ...extra }).
import { afterEach, describe, expect, it, vi } from "vitest";
import { ApiError, fetchJson } from "@/components/api/fetch-json";

type Answer = (request: Request) => Response | Promise<Response>;

/** Sends every fetch() to `answer`, keeping what was asked for. */
function serve(answer: Answer) {
  const seen: Request[] = [];
  vi.stubGlobal("fetch", async (url: string, init?: RequestInit) => {
    const request = new Request(new URL(url, "http://localhost"), init);
    seen.push(request.clone());
    return answer(request);
  });
  return seen;
}

async function refusal(promise: Promise<unknown>): Promise<ApiError> {
  const error = await promise.then(
    () => undefined,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(ApiError);
  return error as ApiError;
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe("fetchJson", () => {
  it("sends `json` as a JSON body and returns the parsed answer", async () => {
    const seen = serve(async (request) =>
      Response.json({ echoed: await request.json() }, { status: 201 }),
    );
    const answer = await fetchJson<{ echoed: unknown }>("/api/pieces/7/notes", {
      method: "POST",
      json: { body: "Pair with the kelp run" },
    });
    expect(answer).toEqual({ echoed: { body: "Pair with the kelp run" } });
    expect(seen[0]!.method).toBe("POST");
    expect(seen[0]!.headers.get("content-type")).toBe("application/json");
  });

  it("leaves a GET without a body or content type", async () => {
    const seen = serve(() => Response.json({ rows: [] }));
    await fetchJson("/api/anthologies/low-tide/submissions?page=2");
    expect(seen[0]!.method).toBe("GET");
    expect(seen[0]!.headers.get("content-type")).toBeNull();
    expect(new URL(seen[0]!.url).search).toBe("?page=2");
  });

  it("turns a 400 into an ApiError with the server's message and its field messages", async () => {
    serve(() =>
      Response.json(
        {
          error: "Some fields need attention.",
          fields: { body: ["Write the note first"], "inks.0": ["Each ink once"] },
        },
        { status: 400 },
      ),
    );
    const error = await refusal(fetchJson("/api/pieces/7/notes", { method: "POST", json: {} }));
    expect(error.status).toBe(400);
    expect(error.message).toBe("Some fields need attention.");
    expect(error.fields).toEqual({
      body: ["Write the note first"],
      "inks.0": ["Each ink once"],
    });
    expect(error.fieldMessage("body")).toBe("Write the note first");
    expect(error.fieldMessage("title")).toBeUndefined();
    expect(error.unreachable).toBe(false);
  });

  it("keeps what a refusal adds beside its message (a 409's fresh state)", async () => {
    serve(() =>
      Response.json(
        { error: "The stage cannot move yet.", problems: ["Write the call", "Set the dates"] },
        { status: 409 },
      ),
    );
    const error = await refusal(fetchJson("/api/anthologies/x/stage", { method: "POST" }));
    expect(error.status).toBe(409);
    expect(error.body.problems).toEqual(["Write the call", "Set the dates"]);
    expect(error.fields).toEqual({});
  });

  it("uses the caller's words when the server refuses without saying why", async () => {
    serve(() => new Response("<html>Bad gateway</html>", { status: 502 }));
    const plain = await refusal(fetchJson("/api/x", { failure: "The call was not saved." }));
    expect(plain.message).toBe("The call was not saved.");
    const withStatus = await refusal(
      fetchJson("/api/x", { failure: (status) => `Not saved (error ${status}).` }),
    );
    expect(withStatus.message).toBe("Not saved (error 502).");
    const generic = await refusal(fetchJson("/api/x"));
    expect(generic.message).toBe("The server answered 502.");
    expect(generic.status).toBe(502);
  });

  it("ignores field messages that are not lists of strings", async () => {
    serve(() => Response.json({ error: "No.", fields: { body: "not a list" } }, { status: 400 }));
    const error = await refusal(fetchJson("/api/x"));
    expect(error.fields).toEqual({});
  });

  it("reports a 2xx answer that is not JSON instead of handing back nothing", async () => {
    serve(() => new Response("", { status: 200 }));
    const error = await refusal(fetchJson("/api/x"));
    expect(error.status).toBe(200);
    expect(error.message).toBe("The server's answer could not be read.");
  });

  it("reports no answer at all as status 0, in the caller's words when given", async () => {
    serve(() => {
      throw new TypeError("Failed to fetch");
    });
    const error = await refusal(fetchJson("/api/x"));
    expect(error.unreachable).toBe(true);
    expect(error.status).toBe(0);
    expect(error.message).toBe(
      "Quireline could not be reached. Check the connection and try again.",
    );
    const own = await refusal(fetchJson("/api/x", { unreachable: "The server did not answer." }));
    expect(own.message).toBe("The server did not answer.");
  });

  it("lets a cancelled request stay a cancellation, not a failure to show", async () => {
    serve(() => {
      throw new DOMException("The operation was aborted.", "AbortError");
    });
    const controller = new AbortController();
    controller.abort();
    const error = await fetchJson("/api/x", { signal: controller.signal }).catch((e) => e);
    expect(error).not.toBeInstanceOf(ApiError);
    expect((error as DOMException).name).toBe("AbortError");
  });
});
