import { loadStock, recordMovement } from "@/db/queries/run";
import { can } from "@/lib/auth/policy";
import type { OkAnswer, StockPayload } from "@/lib/wire/run";
import { stockMovementSchema } from "@/lib/validations/run";
import { apiRoute, readJson, requireApiAccess } from "@/server/api";

type Ctx = { params: Promise<{ slug: string }> };

/** Stock counts, batches, movements and contributor copies. */
export const GET = apiRoute(async (_request, { params }: Ctx) => {
  const { slug } = await params;
  const { anthology, role } = await requireApiAccess(slug, "stock:view");
  return Response.json(
    (await loadStock(anthology, {
      canMove: can(role, "stock:move"),
      mayShowEmail: can(role, "contributors:private-data"),
    })) satisfies StockPayload,
  );
});

/** Records one movement; one that would take a count below zero answers 409 and records nothing. */
export const POST = apiRoute(async (request, { params }: Ctx) => {
  const { slug } = await params;
  const { anthology, user } = await requireApiAccess(slug, "stock:move");
  const input = await readJson(request, stockMovementSchema);
  await recordMovement(anthology, user, input);
  return Response.json({ ok: true, message: "Recorded." } satisfies OkAnswer, { status: 201 });
});
