import type { LedgerAnswer } from "@/lib/wire/payouts";
import { apiRoute, requireApiAccess } from "@/server/api";
import { ledgerView } from "@/server/payouts-view";

/** Every contributor's ledger lines, totals and payout-account state. */
export const GET = apiRoute(async (_request, { params }: { params: Promise<{ slug: string }> }) => {
  const { anthology } = await requireApiAccess((await params).slug, "payouts:manage");
  return Response.json((await ledgerView(anthology)) satisfies LedgerAnswer);
});
