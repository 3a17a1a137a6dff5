/**
 * A rule said no. Domain code throws it with the status a route answers with and a plain message
 * for the person; the route wrapper (server/api.ts) and the upload route turn it into an answer.
 */
export class Refusal extends Error {
  constructor(
    readonly status: 400 | 403 | 404 | 409 | 413,
    message: string,
  ) {
    super(message);
  }
}
