/** What the credit routes answer; shared by the handlers, the credits screen and the approval page. */
import type { TextPage } from "@/lib/print/credits";

/** Where a piece's credit stands. */
export type CreditStateName = "approved" | "asked" | "not-asked";

export interface CreditRowView {
  pieceId: number;
  title: string;
  contributorName: string;
  creditLine: string;
  state: CreditStateName;
  approvedAt: string | null;
  requestedAt: string | null;
  /** Reader pages on the map; empty when not placed yet. */
  pages: number[];
  /** False when the contributor's account has no address to write to. */
  hasAddress: boolean;
}

export interface CreditsAnswer {
  rows: CreditRowView[];
  counts: { approved: number; asked: number; notAsked: number; outstanding: number };
  /** The credits page as it would print now (approved lines only), and what it leaves out. */
  preview: { page: TextPage; outstanding: { pieceId: number; title: string; pages: number[] }[] };
  colophon: TextPage;
  /** Reserved pages of the map: where the credits and the colophon will go. */
  reserved: { credits: number[]; colophon: number[] };
}

export interface CreditsAskedAnswer {
  asked: number;
  failed: number;
  skipped: number;
  credits: CreditsAnswer;
}

export interface CreditLineSavedAnswer {
  creditLine: string;
  changed: boolean;
  /** A request mail went out for the changed line. */
  asked: boolean;
}

export interface CreditApprovedAnswer {
  creditLine: string;
  approvedAt: string;
}
