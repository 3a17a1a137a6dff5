/** Wire types of the print-run routes: the planner, the finishing batches and the stock. */
import type { EventKind, PrintMode, RunEvent } from "@/lib/run/batches";
import type { ChecklistStep } from "@/lib/run/checklist";
import type { CopyCounts } from "@/lib/run/plan";
import type { PriceList, QuoteTier, StepTimings } from "@/lib/run/prices";
import type { StockKind } from "@/lib/run/stock";

export interface PriceListView {
  id: number;
  name: string;
  prices: PriceList;
}

export interface ShopQuoteView {
  id: number;
  shopName: string;
  tiers: QuoteTier[];
  turnaroundDays: number;
}

export interface RunPlanSettings {
  quantities: number[];
  priceListId: number | null;
  shopQuoteId: number | null;
  timings: StepTimings;
  minutesPerWeek: number;
  printMode: PrintMode;
}

export interface RunPayload {
  currency: string;
  timeZone: string;
  /** Today in the anthology's zone, YYYY-MM-DD. */
  today: string;
  pressName: string | null;
  counts: CopyCounts & { laidOutPages: number; sheetsPerCopy: number };
  checklist: ChecklistStep[];
  plan: RunPlanSettings;
  priceLists: PriceListView[];
  quotes: ShopQuoteView[];
  events: RunEvent[];
  /** Batches already made from the events, and whether they can still be re-planned. */
  batchCount: number;
  batchesStarted: boolean;
  canPlan: boolean;
}

export interface BatchView {
  id: number;
  position: number;
  label: string;
  copies: number;
  due: string | null;
  eventName: string | null;
  doneAt: string | null;
  doneBy: string | null;
  /** Printed, unfinished sheet sets of this batch. */
  sheetSets: number;
  ticks: Record<string, { at: string; by: string }>;
}

export interface FinishingPayload {
  timeZone: string;
  checklist: ChecklistStep[];
  safety: string;
  batches: BatchView[];
  canTick: boolean;
}

export interface MovementView {
  id: number;
  kind: StockKind;
  batchLabel: string | null;
  sheetSets: number;
  copies: number;
  reason: string;
  by: string;
  at: string;
}

export interface ContributorCopyView {
  id: number;
  name: string;
  quantity: number;
  delivery: "collect" | "post";
  eventId: number | null;
  doneAt: string | null;
}

export interface StockPayload {
  timeZone: string;
  copiesOnHand: number;
  batches: Array<{ id: number; label: string; copies: number; sheetSets: number; done: boolean }>;
  movements: MovementView[];
  contributorCopies: ContributorCopyView[];
  /** Copies each contributor receives under the call's terms; null when there is no call. */
  copiesPerContributor: number | null;
  events: Array<{ id: number; name: string; date: string; kind: EventKind }>;
  canMove: boolean;
}

export interface OkAnswer {
  ok: true;
  message: string;
}
