import { eq } from "drizzle-orm";
import { db, schema } from "@/db";
import { findOutput } from "@/db/queries/print-files";
import { apiRoute, HttpError, idParam, requireApiAccess, requireApiUser } from "@/server/api";
import { openStoredFile, StoredFileError } from "@/server/uploads";

/** RFC 6266 with RFC 5987: a plain ASCII name, and the exact one percent-encoded in UTF-8. */
function contentDisposition(fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}

/** Streams a finished print file to a member who may see the print files (print:view). */
export const GET = apiRoute(async (_request, { params }: { params: Promise<{ id: string }> }) => {
  await requireApiUser();
  const id = idParam((await params).id, "print file");
  const output = await findOutput(id);
  if (!output) throw new HttpError(404, "There is no such print file.");
  const [anthology] = await db
    .select({ slug: schema.anthologies.slug })
    .from(schema.anthologies)
    .where(eq(schema.anthologies.id, output.anthologyId));
  if (!anthology) throw new HttpError(404, "There is no such print file.");
  await requireApiAccess(anthology.slug, "print:view");
  if (output.state !== "done" || !output.storageKey || !output.fileName)
    throw new HttpError(409, "This print file is not finished.");
  let body: ReadableStream<Uint8Array>;
  try {
    body = await openStoredFile(output.storageKey);
  } catch (error) {
    if (error instanceof StoredFileError)
      throw new HttpError(502, `The file could not be fetched from storage: ${error.message}.`);
    throw error;
  }
  return new Response(body, {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": contentDisposition(output.fileName),
      ...(output.sizeBytes ? { "content-length": String(output.sizeBytes) } : {}),
      "cache-control": "private, no-store",
    },
  });
});
