import { loadStock } from "@/db/queries/run";
import { can } from "@/lib/auth/policy";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { StockScreen } from "./_components/stock-screen";

export const metadata = { title: "Stock" };

export default async function StockPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { anthology, role } = await requireAnthologyAccess(
    slug,
    "stock:view",
    `/studio/${slug}/stock`,
  );
  const initial = await loadStock(anthology, {
    canMove: can(role, "stock:move"),
    mayShowEmail: can(role, "contributors:private-data"),
  });
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-3xl font-extrabold">Stock</h1>
        <p className="max-w-3xl text-sm text-ink-soft">
          Printed sheets waiting to be finished, finished copies on hand, and every movement with
          its reason and the person who made it. Counts never go below zero; a mistake is put right
          with a correction of its own.
        </p>
      </div>
      <StockScreen slug={slug} initial={initial} />
    </div>
  );
}
