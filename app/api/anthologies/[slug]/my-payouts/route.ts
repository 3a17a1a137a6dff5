import type { MyPayoutsAnswer } from "@/lib/wire/payouts";
import { apiRoute, requireApiAccess } from "@/server/api";
import { myPayoutsView } from "@/server/payouts-view";

/** The signed-in contributor's own ledger lines, totals and payout-account state. */
export const GET = apiRoute(async (_request, { params }: { params: Promise<{ slug: string }> }) => {
  const { anthology, user } = await requireApiAccess((await params).slug, "payouts:view-own");
  return Response.json((await myPayoutsView(anthology, user)) satisfies MyPayoutsAnswer);
});
