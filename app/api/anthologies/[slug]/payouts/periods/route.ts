import { insertPeriod } from "@/db/queries/payouts";
import { periodSchema } from "@/lib/validations/payouts";
import type { IdAnswer } from "@/lib/wire/payouts";
import { apiRoute, HttpError, readJson, requireApiAccess } from "@/server/api";

/** Opens a period whose sales are shared out when it is closed. */
export const POST = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const { anthology } = await requireApiAccess((await params).slug, "payouts:manage");
  const period = await readJson(request, periodSchema);
  const id = await insertPeriod({ anthologyId: anthology.id, ...period });
  if (id === null)
    throw new HttpError(409, `There is already a period called “${period.label}”.`, {
      fields: { label: ["Choose another name"] },
    });
  return Response.json({ id } satisfies IdAnswer, { status: 201 });
});
