import "server-only";
import { SubmissionRefused } from "@/db/queries/submissions";
import { HttpError } from "@/lib/api";

/** Runs `work`, turning a SubmissionRefused into the HttpError a route handler answers with. */
export async function refusalsAsHttp<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if (error instanceof SubmissionRefused) throw new HttpError(error.status, error.message);
    throw error;
  }
}

/** A numeric id from a route segment, or a 404. */
export function idFromParam(value: string, what: string): number {
  const id = /^\d{1,15}$/.test(value) ? Number(value) : NaN;
  if (!Number.isSafeInteger(id) || id <= 0) throw new HttpError(404, `There is no such ${what}.`);
  return id;
}
