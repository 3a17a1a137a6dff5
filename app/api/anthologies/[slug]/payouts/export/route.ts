import { ledgerCsv, salesCsv } from "@/lib/payouts-csv";
import { exportQuery } from "@/lib/validations/payouts";
import { apiRoute, readQuery, requireApiAccess } from "@/server/api";
import { ledgerView, salesView } from "@/server/payouts-view";

/** CSV downloads of the ledger (?what=ledger) or of sales (?what=sales). */
export const GET = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const slug = (await params).slug;
  const { anthology } = await requireApiAccess(slug, "payouts:manage");
  const { what } = readQuery(request, exportQuery);
  const body =
    what === "ledger"
      ? ledgerCsv((await ledgerView(anthology)).people)
      : salesCsv((await salesView(anthology)).sales, anthology.currency);
  return new Response(body, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${slug}-${what}.csv"`,
      "cache-control": "private, no-store",
    },
  });
});
