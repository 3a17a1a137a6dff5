import { Notice } from "@/components/ui/notice";
import { salesShareText } from "@/lib/call-terms";
import { SALE_CHANNEL_LABELS } from "@/lib/domain";
import { formatCents } from "@/lib/money";
import { RECORDS_NOTE } from "@/lib/payouts";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { salesView } from "@/server/payouts-view";
import { SaleForm } from "./_components/sale-form";

export const metadata = { title: "Sales" };

export default async function SalesPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { anthology } = await requireAnthologyAccess(slug, "sales:record", `/studio/${slug}/sales`);
  const view = await salesView(anthology);
  const money = (c: number) => formatCents(c, view.currency);
  return (
    <div className="flex max-w-5xl flex-col gap-8">
      <div className="flex flex-col gap-2">
        <h1 className="text-3xl font-extrabold">Sales of {anthology.title}</h1>
        <p className="text-sm text-ink-soft">
          {view.terms
            ? `${salesShareText(view.terms.salesShareBasisPoints, view.terms.shareSplit)}.`
            : "No open call yet, so no share of sales is set."}{" "}
          Net = copies × price − discounts − channel fees − costs recovered first.
        </p>
        <Notice tone="caution">{RECORDS_NOTE}</Notice>
      </div>

      <section aria-labelledby="record-sale" className="flex flex-col gap-3">
        <h2 id="record-sale" className="text-xl font-bold">
          Record a sale
        </h2>
        <SaleForm
          slug={slug}
          currency={view.currency}
          today={new Date().toISOString().slice(0, 10)}
        />
      </section>

      <section aria-labelledby="periods" className="flex flex-col gap-3">
        <h2 id="periods" className="text-xl font-bold">
          Net sales and the contributors’ share, by period
        </h2>
        {view.periods.length === 0 ? (
          <p className="text-sm text-ink-soft">
            No periods yet. The lead editor opens one on the payouts page and closes it to share its
            sales out.
          </p>
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm" data-testid="periods">
              <thead className="text-ink-faint">
                <tr>
                  <th className="py-1 pr-3">Period</th>
                  <th className="py-1 pr-3">Dates</th>
                  <th className="py-1 pr-3 text-right">Copies</th>
                  <th className="py-1 pr-3 text-right">Gross</th>
                  <th className="py-1 pr-3 text-right">Net</th>
                  <th className="py-1 pr-3 text-right">Contributors’ share</th>
                  <th className="py-1">State</th>
                </tr>
              </thead>
              <tbody>
                {view.periods.map((p) => (
                  <tr key={p.id} className="border-t border-ink/10">
                    <td className="py-1 pr-3 font-semibold">{p.label}</td>
                    <td className="py-1 pr-3 whitespace-nowrap">
                      {p.startsOn} to {p.endsOn}
                    </td>
                    <td className="py-1 pr-3 text-right">{p.copies}</td>
                    <td className="py-1 pr-3 text-right">{money(p.grossCents)}</td>
                    <td className="py-1 pr-3 text-right">{money(p.netCents)}</td>
                    <td className="py-1 pr-3 text-right">{money(p.poolCents)}</td>
                    <td className="py-1">
                      {p.closedAt ? "Closed, shared out" : "Open (figures so far)"}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>

      <section aria-labelledby="sales-list" className="flex flex-col gap-3">
        <h2 id="sales-list" className="text-xl font-bold">
          Every sale
        </h2>
        {view.sales.length === 0 ? (
          <p className="text-sm text-ink-soft">No sales recorded yet.</p>
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm" data-testid="sales">
              <thead className="text-ink-faint">
                <tr>
                  <th className="py-1 pr-3">Date</th>
                  <th className="py-1 pr-3">Where</th>
                  <th className="py-1 pr-3 text-right">Copies</th>
                  <th className="py-1 pr-3 text-right">Gross</th>
                  <th className="py-1 pr-3 text-right">Discounts</th>
                  <th className="py-1 pr-3 text-right">Channel fees</th>
                  <th className="py-1 pr-3 text-right">Costs</th>
                  <th className="py-1 text-right">Net</th>
                </tr>
              </thead>
              <tbody>
                {view.sales.map((s) => (
                  <tr key={s.id} className="border-t border-ink/10">
                    <td className="py-1 pr-3 whitespace-nowrap">{s.soldOn}</td>
                    <td className="py-1 pr-3">
                      {s.label}
                      <span className="block text-xs text-ink-faint">
                        {SALE_CHANNEL_LABELS[s.channel]}
                      </span>
                      {s.note ? (
                        <span className="block max-w-xs text-xs break-words text-ink-soft">
                          {s.note}
                        </span>
                      ) : null}
                    </td>
                    <td className="py-1 pr-3 text-right">{s.copies}</td>
                    <td className="py-1 pr-3 text-right">{money(s.grossCents)}</td>
                    <td className="py-1 pr-3 text-right">{money(s.discountCents)}</td>
                    <td className="py-1 pr-3 text-right">{money(s.channelFeesCents)}</td>
                    <td className="py-1 pr-3 text-right">{money(s.recoverableCostsCents)}</td>
                    <td className="py-1 text-right font-semibold">{money(s.netCents)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
    </div>
  );
}
