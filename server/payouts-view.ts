import "server-only";
/** The read side of sales and payouts: what the screens show and the GET routes answer. */
import type { Anthology } from "@/db/queries/anthologies";
import {
  contributorWork,
  findPayoutTerms,
  ledgerFor,
  listPeriods,
  listSales,
  payoutAccountsFor,
  transfersIn,
  type EntryRow,
  type PeriodRow,
  type SaleRow,
  type TransferRow,
} from "@/db/queries/payouts";
import { ledgerTotals, periodSales, saleNet, sharePool, type PayoutTerms } from "@/lib/payouts";
import { personLabel } from "@/lib/people";
import type {
  LedgerAnswer,
  LedgerLineWire,
  MyPayoutsAnswer,
  PeriodWire,
  PersonLedger,
  SaleWire,
  SalesAnswer,
} from "@/lib/wire/payouts";
import { periodRange } from "./payouts";

const dayOf = (d: Date) => d.toISOString().slice(0, 10);

export function saleWire(s: SaleRow): SaleWire {
  const { grossCents, netCents } = saleNet(s);
  return {
    id: s.id,
    channel: s.channel,
    label: s.label,
    soldOn: dayOf(s.soldOn),
    copies: s.copies,
    unitPriceCents: s.unitPriceCents,
    discountCents: s.discountCents,
    channelFeesCents: s.channelFeesCents,
    recoverableCostsCents: s.recoverableCostsCents,
    grossCents,
    netCents,
    note: s.note,
  };
}

function periodWire(p: PeriodRow, sales: SaleRow[], terms: PayoutTerms | null): PeriodWire {
  const { from, to } = periodRange(p);
  const inside = sales.filter((s) => s.soldOn >= from && s.soldOn <= to);
  const figures = periodSales(inside);
  const stored = p.computation as { poolCents?: number } | null;
  return {
    id: p.id,
    label: p.label,
    startsOn: dayOf(p.startsOn),
    endsOn: dayOf(p.endsOn),
    closedAt: p.closedAt?.toISOString() ?? null,
    copies: figures.copies,
    grossCents: figures.grossCents,
    netCents: figures.netCents,
    poolCents:
      p.closedAt && typeof stored?.poolCents === "number"
        ? stored.poolCents
        : sharePool(figures.shareBaseCents, terms?.salesShareBasisPoints ?? 0),
  };
}

export async function salesView(anthology: Anthology): Promise<SalesAnswer> {
  const [sales, periods, terms] = await Promise.all([
    listSales(anthology.id),
    listPeriods(anthology.id),
    findPayoutTerms(anthology.id),
  ]);
  return {
    currency: anthology.currency,
    terms,
    sales: sales.map(saleWire),
    periods: periods.map((p) => periodWire(p, sales, terms)),
  };
}

function lineStatus(
  line: EntryRow,
  all: EntryRow[],
  transfers: TransferRow[],
): LedgerLineWire["status"] {
  if (line.kind !== "owed") return null;
  if (all.some((l) => l.kind === "reversed" && l.reversesEntryId === line.id)) return "cancelled";
  const paid = all.find((l) => l.kind === "paid" && l.settlesEntryId === line.id);
  if (paid && !all.some((l) => l.kind === "reversed" && l.reversesEntryId === paid.id))
    return "paid";
  if (transfers.some((t) => t.entryId === line.id && t.state !== "failed")) return "sending";
  return "open";
}

function personLedger(
  person: { contributorId: string; label: string; pieces: number; pages: number },
  account: { transfersActive: boolean } | undefined,
  lines: EntryRow[],
  transfers: TransferRow[],
  periodLabels: Map<number, string>,
): PersonLedger {
  const totals = ledgerTotals(lines);
  return {
    ...person,
    account: !account ? "none" : account.transfersActive ? "ready" : "started",
    ...totals,
    lines: lines.map((l) => ({
      id: l.id,
      kind: l.kind,
      source: l.source,
      amountCents: l.amountCents,
      currency: l.currency,
      periodLabel: l.periodId ? (periodLabels.get(l.periodId) ?? null) : null,
      settlesEntryId: l.settlesEntryId,
      reversesEntryId: l.reversesEntryId,
      reference: l.reference,
      working: l.computation.working,
      createdAt: l.createdAt.toISOString(),
      status: lineStatus(l, lines, transfers),
    })),
  };
}

/** Every contributor's lines, for the lead and editors. */
export async function ledgerView(anthology: Anthology): Promise<LedgerAnswer> {
  const [entries, work, periods, sales, terms, transfers] = await Promise.all([
    ledgerFor(anthology.id),
    contributorWork(anthology.id),
    listPeriods(anthology.id),
    listSales(anthology.id),
    findPayoutTerms(anthology.id),
    transfersIn(anthology.id),
  ]);
  const people = new Map(
    work.map((w) => [
      w.contributorId,
      {
        contributorId: w.contributorId,
        label: personLabel(w, { mayShowEmail: true }),
        pieces: w.pieces,
        pages: w.pages,
      },
    ]),
  );
  // Someone with lines but no accepted work now (a piece withdrawn later) still has a ledger.
  for (const e of entries)
    if (!people.has(e.contributorId))
      people.set(e.contributorId, {
        contributorId: e.contributorId,
        label: "A former contributor",
        pieces: 0,
        pages: 0,
      });
  const accounts = new Map((await payoutAccountsFor([...people.keys()])).map((a) => [a.userId, a]));
  const labels = new Map(periods.map((p) => [p.id, p.label]));
  return {
    currency: anthology.currency,
    people: [...people.values()].map((p) =>
      personLedger(
        p,
        accounts.get(p.contributorId),
        entries.filter((e) => e.contributorId === p.contributorId),
        transfers,
        labels,
      ),
    ),
    periods: periods.map((p) => periodWire(p, sales, terms)),
  };
}

/** The signed-in contributor's own lines and nothing of anyone else's. */
export async function myPayoutsView(
  anthology: Anthology,
  user: { id: string; name: string | null; email: string | null },
): Promise<MyPayoutsAnswer> {
  const [entries, work, periods, transfers] = await Promise.all([
    ledgerFor(anthology.id, user.id),
    contributorWork(anthology.id),
    listPeriods(anthology.id),
    transfersIn(anthology.id),
  ]);
  const mine = work.find((w) => w.contributorId === user.id);
  const [account] = await payoutAccountsFor([user.id]);
  const periodIds = new Set(entries.map((e) => e.periodId));
  return {
    currency: anthology.currency,
    me: personLedger(
      {
        contributorId: user.id,
        label: personLabel(user, { mayShowEmail: true }),
        pieces: mine?.pieces ?? 0,
        pages: mine?.pages ?? 0,
      },
      account,
      entries,
      transfers.filter((t) => entries.some((e) => e.id === t.entryId)),
      new Map(periods.map((p) => [p.id, p.label])),
    ),
    // Only the periods the person has lines in; the press's sales figures stay with the editors.
    periods: periods
      .filter((p) => p.closedAt && periodIds.has(p.id))
      .map((p) => ({
        id: p.id,
        label: p.label,
        startsOn: dayOf(p.startsOn),
        endsOn: dayOf(p.endsOn),
        closedAt: p.closedAt!.toISOString(),
        copies: 0,
        grossCents: 0,
        netCents: 0,
        poolCents: 0,
      })),
  };
}
