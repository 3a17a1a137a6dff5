/** What the sales and payouts routes answer; shared by the handlers and the screens. */
import type { LedgerKind, LedgerSource, SaleChannel, ShareSplit } from "@/lib/domain";

export interface SaleWire {
  id: number;
  channel: SaleChannel;
  label: string;
  /** YYYY-MM-DD, UTC. */
  soldOn: string;
  copies: number;
  unitPriceCents: number;
  discountCents: number;
  channelFeesCents: number;
  recoverableCostsCents: number;
  grossCents: number;
  netCents: number;
  note: string | null;
}

export interface PeriodWire {
  id: number;
  label: string;
  startsOn: string;
  endsOn: string;
  closedAt: string | null;
  copies: number;
  grossCents: number;
  netCents: number;
  /** The contributors' pool: the share of the net (worked out now for an open period). */
  poolCents: number;
}

export interface TermsWire {
  feeKind: "none" | "per-piece" | "per-page";
  feeCents: number;
  salesShareBasisPoints: number;
  shareSplit: ShareSplit;
}

/** GET /api/anthologies/[slug]/sales */
export interface SalesAnswer {
  currency: string;
  terms: TermsWire | null;
  sales: SaleWire[];
  periods: PeriodWire[];
}

export interface LedgerLineWire {
  id: number;
  kind: LedgerKind;
  source: LedgerSource;
  amountCents: number;
  currency: string;
  periodLabel: string | null;
  settlesEntryId: number | null;
  reversesEntryId: number | null;
  reference: string | null;
  working: string[];
  createdAt: string;
  /** For an owed line: still to pay, a transfer on its way, paid or cancelled. */
  status: "open" | "sending" | "paid" | "cancelled" | null;
}

export interface PersonLedger {
  contributorId: string;
  label: string;
  pieces: number;
  pages: number;
  account: "none" | "started" | "ready";
  owedCents: number;
  paidCents: number;
  outstandingCents: number;
  lines: LedgerLineWire[];
}

/** GET /api/anthologies/[slug]/payouts */
export interface LedgerAnswer {
  currency: string;
  people: PersonLedger[];
  periods: PeriodWire[];
}

/** GET /api/anthologies/[slug]/my-payouts */
export interface MyPayoutsAnswer {
  currency: string;
  me: PersonLedger;
  periods: PeriodWire[];
}

export interface IdAnswer {
  id: number;
}

export interface CloseAnswer {
  linesWritten: number;
  poolCents: number;
  netCents: number;
}

export interface PayAnswer {
  state: "sent" | "paid";
  transferId: string;
}

/** 409 from the pay route for a line the service had already confirmed paid: nothing more is paid. */
export interface AlreadyPaidAnswer extends PayAnswer {
  error: string;
  state: "paid";
}

export interface OnboardingAnswer {
  url: string;
}

export interface StatementsAnswer {
  sent: number;
  alreadySent: number;
  failed: number;
}
