import { apiRoute, HttpError, readJson, requireApiAccess } from "@/server/api";
import { produceRequestSchema } from "@/lib/validations/print-files";
import type { PrintFilesAnswer, ProduceAnswer, ProduceRefusedAnswer } from "@/lib/wire/print-files";
import { PreflightBlocked, printFilesView, requestPrintFiles } from "@/server/print/service";

type Ctx = { params: Promise<{ slug: string }> };

/** The preflight, the sheets that suit the trim and every output with its progress. */
export const GET = apiRoute(async (_request, { params }: Ctx) => {
  const { slug } = await params;
  const { anthology, role } = await requireApiAccess(slug, "print:view");
  return Response.json((await printFilesView(anthology, role)) satisfies PrintFilesAnswer);
});

/**
 * Produces the print files on a press sheet: refused (409, with the preflight) while anything
 * blocks, 400 for a sheet that does not suit the trim, 202 once the outputs are queued.
 */
export const POST = apiRoute(async (request, { params }: Ctx) => {
  const { slug } = await params;
  const { anthology, user } = await requireApiAccess(slug, "print:produce");
  const input = await readJson(request, produceRequestSchema);
  try {
    const outputs = await requestPrintFiles(anthology, user, input.sheet);
    return Response.json({ outputs } satisfies ProduceAnswer, { status: 202 });
  } catch (error) {
    if (error instanceof PreflightBlocked)
      throw new HttpError(409, error.message, {
        preflight: error.preflight.entries,
      } satisfies Omit<ProduceRefusedAnswer, "error">);
    throw error;
  }
});
