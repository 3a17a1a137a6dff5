/**
 * Stock of a run as an append-only list of movements: printed sheets per batch (sets of one
 * copy's sheets, not yet finished) and finished copies on hand. Counts are sums of movements;
 * a movement that would take a count below zero is refused, and a correction is a movement of
 * its own with a reason, never an edit of an earlier one.
 */

export const STOCK_KINDS = [
  "printed",
  "finished",
  "contributor-copy",
  "sold",
  "spare",
  "correction",
] as const;
export type StockKind = (typeof STOCK_KINDS)[number];

export const STOCK_KIND_LABELS: Record<StockKind, string> = {
  printed: "Sheets printed",
  finished: "Copies finished",
  "contributor-copy": "Contributor copies given",
  sold: "Sold at an event",
  spare: "Kept as spares",
  correction: "Correction",
};

export interface Movement {
  kind: StockKind;
  batchId: number | null;
  /** Change to the batch's printed, unfinished sheet sets (one set = one copy's sheets). */
  sheetSets: number;
  /** Change to finished copies on hand. */
  copies: number;
}

export interface StockCounts {
  copiesOnHand: number;
  /** Printed, unfinished sheet sets by batch id. */
  sheetSetsByBatch: Record<number, number>;
}

/** Counts as sums of the movements. */
export function stockCounts(movements: readonly Movement[]): StockCounts {
  const counts: StockCounts = { copiesOnHand: 0, sheetSetsByBatch: {} };
  for (const m of movements) {
    counts.copiesOnHand += m.copies;
    if (m.batchId !== null && m.sheetSets !== 0)
      counts.sheetSetsByBatch[m.batchId] = (counts.sheetSetsByBatch[m.batchId] ?? 0) + m.sheetSets;
  }
  return counts;
}

/** What a request to move stock asks for, before it becomes signed deltas. */
export interface MovementRequest {
  kind: StockKind;
  batchId: number | null;
  /** A positive quantity for every kind but a correction, which is signed. */
  quantity: number;
  /** For a correction: which count it corrects. */
  target?: "copies" | "sheets";
}

/** The signed deltas of a movement: printing adds sheets, finishing turns sheets into copies, the rest take copies out. */
export function movementOf(request: MovementRequest): Movement {
  const q = request.quantity;
  const base = { kind: request.kind, batchId: request.batchId };
  switch (request.kind) {
    case "printed":
      return { ...base, sheetSets: q, copies: 0 };
    case "finished":
      return { ...base, sheetSets: -q, copies: q };
    case "contributor-copy":
    case "sold":
    case "spare":
      return { ...base, sheetSets: 0, copies: -q };
    case "correction":
      return request.target === "sheets"
        ? { ...base, sheetSets: q, copies: 0 }
        : { ...base, sheetSets: 0, copies: q };
  }
}

/** Why a movement cannot be recorded against these counts, or null when it may. */
export function movementRefusal(counts: StockCounts, movement: Movement): string | null {
  if (movement.sheetSets === 0 && movement.copies === 0) return "The movement changes nothing.";
  if (movement.sheetSets !== 0 && movement.batchId === null)
    return "Printed sheets belong to a batch: choose the batch.";
  if (movement.sheetSets !== 0) {
    const have = counts.sheetSetsByBatch[movement.batchId!] ?? 0;
    if (have + movement.sheetSets < 0)
      return `That batch has printed sheets for ${have} ${have === 1 ? "copy" : "copies"}; it cannot give ${-movement.sheetSets}.`;
  }
  if (counts.copiesOnHand + movement.copies < 0)
    return `There ${counts.copiesOnHand === 1 ? "is" : "are"} ${counts.copiesOnHand} finished ${counts.copiesOnHand === 1 ? "copy" : "copies"} on hand; ${-movement.copies} cannot come out.`;
  return null;
}

/** Counts after a movement (the caller has checked movementRefusal). */
export function applyMovement(counts: StockCounts, movement: Movement): StockCounts {
  return stockCounts([
    { kind: "correction", batchId: null, sheetSets: 0, copies: counts.copiesOnHand },
    ...Object.entries(counts.sheetSetsByBatch).map(([id, n]) => ({
      kind: "correction" as const,
      batchId: Number(id),
      sheetSets: n,
      copies: 0,
    })),
    movement,
  ]);
}
