/** Names of the states and kinds Quireline's records move through, with their plain-English labels. */
// Relative, so db/schema.ts (read by drizzle-kit, which knows no "@/" paths) can import this file.
import { PRINT_METHODS, type PrintMethod } from "./print/spec";

export const ROLES = ["lead", "editor", "finisher", "contributor"] as const;
export type Role = (typeof ROLES)[number];
export const ROLE_LABELS: Record<Role, string> = {
  lead: "Lead editor",
  editor: "Editor",
  finisher: "Finisher",
  contributor: "Contributor",
};

/** Where an anthology is in its life, in order; it only moves forward. */
export const ANTHOLOGY_STAGES = [
  "planning",
  "call-open",
  "call-closed",
  "laying-out",
  "printing",
  "wrapped-up",
] as const;
export type AnthologyStage = (typeof ANTHOLOGY_STAGES)[number];
export const STAGE_LABELS: Record<AnthologyStage, string> = {
  planning: "Planning",
  "call-open": "Call open",
  "call-closed": "Call closed",
  "laying-out": "Laying out",
  printing: "Printing and finishing",
  "wrapped-up": "Wrapped up",
};

export const PIECE_KINDS = ["single", "spread", "run"] as const;
export type PieceKind = (typeof PIECE_KINDS)[number];
export const PIECE_KIND_LABELS: Record<PieceKind, string> = {
  single: "One page",
  spread: "Two-page spread",
  run: "Run of pages",
};

export const PIECE_STATUSES = [
  "awaiting-review",
  "fix-requested",
  "shortlisted",
  "accepted",
  "declined",
  "withdrawn",
] as const;
export type PieceStatus = (typeof PIECE_STATUSES)[number];
export const PIECE_STATUS_LABELS: Record<PieceStatus, string> = {
  "awaiting-review": "Waiting for a read",
  "fix-requested": "Fix asked",
  shortlisted: "Shortlisted",
  accepted: "In the book",
  declined: "Not this time",
  withdrawn: "Withdrawn",
};

export const BINDINGS = ["saddle-stitch", "fold-only"] as const;
export type Binding = (typeof BINDINGS)[number];
export const BINDING_LABELS: Record<Binding, string> = {
  "saddle-stitch": "Saddle stitch (folded and stapled)",
  "fold-only": "Fold-only single sheet",
};

export const COVER_STOCKS = ["self", "separate"] as const;
export type CoverStock = (typeof COVER_STOCKS)[number];

// The print engine owns the list of print methods; the labels people read live here.
export { PRINT_METHODS, type PrintMethod };
export const PRINT_METHOD_LABELS: Record<PrintMethod, string> = {
  duplicator: "Stencil duplicator (one drum per ink)",
  "laser-colour": "Colour laser",
  "laser-black": "Black laser",
  inkjet: "Inkjet",
};

export const FEE_KINDS = ["none", "per-piece", "per-page"] as const;
export type FeeKind = (typeof FEE_KINDS)[number];

/** How the contributors' pooled share of net sales is divided among them. */
export const SHARE_SPLITS = ["per-page", "per-piece", "equal"] as const;
export type ShareSplit = (typeof SHARE_SPLITS)[number];
export const SHARE_SPLIT_LABELS: Record<ShareSplit, string> = {
  "per-page": "by pages in the book",
  "per-piece": "by pieces in the book",
  equal: "equally among the contributors",
};

/** Where copies were sold. */
export const SALE_CHANNELS = ["event", "shop", "consignment"] as const;
export type SaleChannel = (typeof SALE_CHANNELS)[number];
export const SALE_CHANNEL_LABELS: Record<SaleChannel, string> = {
  event: "Fair or event table",
  shop: "Online shop",
  consignment: "Bookshop on consignment",
};

/** The kinds of line in the payouts ledger. */
export const LEDGER_KINDS = ["owed", "scheduled", "paid", "reversed"] as const;
export type LedgerKind = (typeof LEDGER_KINDS)[number];
export const LEDGER_KIND_LABELS: Record<LedgerKind, string> = {
  owed: "Owed",
  scheduled: "Transfer sent",
  paid: "Paid",
  reversed: "Cancelled",
};
/** What a ledger line is for. */
export const LEDGER_SOURCES = ["fee", "share", "transfer", "by-hand", "correction"] as const;
export type LedgerSource = (typeof LEDGER_SOURCES)[number];

/** A transfer attempt: asked for, accepted by the service, or refused. */
export const TRANSFER_STATES = ["requesting", "sent", "failed"] as const;
export type TransferState = (typeof TRANSFER_STATES)[number];

export const SLOT_RESERVATIONS = [
  "cover",
  "inside-cover",
  "contents",
  "credits",
  "colophon",
  "ad",
  "blank",
] as const;
export type SlotReservation = (typeof SLOT_RESERVATIONS)[number];

/** What the print worker produces: imposed composite, one ink's masters, reader proof, credits page. */
export const PRINT_OUTPUT_KINDS = ["print", "master", "proof", "credits"] as const;
export type PrintOutputKind = (typeof PRINT_OUTPUT_KINDS)[number];
export const PRINT_OUTPUT_STATES = ["queued", "running", "done", "failed"] as const;
export type PrintOutputState = (typeof PRINT_OUTPUT_STATES)[number];

/** The signed-in person as the app sees them (from the session). */
export type SessionUser = { id: string; name: string | null; email: string | null };
