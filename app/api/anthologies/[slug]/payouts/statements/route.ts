import { statementsSchema } from "@/lib/validations/payouts";
import type { StatementsAnswer } from "@/lib/wire/payouts";
import { apiRoute, readJson, requireApiAccess } from "@/server/api";
import { sendStatements } from "@/server/statements";

/** E-mails each contributor their statement for a closed period (once each). */
export const POST = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const { anthology } = await requireApiAccess((await params).slug, "payouts:manage");
  const { periodId } = await readJson(request, statementsSchema);
  return Response.json((await sendStatements(anthology, periodId)) satisfies StatementsAnswer);
});
