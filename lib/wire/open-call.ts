/** What the open-call and stage routes answer; shared by the handlers and the call screen. */
import type { CallSpecSummary } from "@/lib/call-spec";
import type { AnthologyStage } from "@/lib/domain";
import type { CallPhase } from "@/lib/stages";
import type { CallParsed, CallRecord } from "@/lib/validations/call";

/** A stored call with its instants as ISO 8601 strings (UTC). */
export type CallView = Omit<CallRecord, "opensAt" | "closesAt"> & {
  opensAt: string;
  closesAt: string;
  publishedAt: string | null;
  updatedAt: string;
};

/** GET /api/anthologies/[slug]/call: the call (null before it is written), the form's values and the spec. */
export interface CallAnswer {
  call: CallView | null;
  form: CallParsed;
  stage: AnthologyStage;
  phase: CallPhase;
  canEditTerms: boolean;
  currency: string;
  publicPath: string;
  spec: CallSpecSummary;
}

/** PUT /api/anthologies/[slug]/call (201 the first time, then 200): the saved call and its form values. */
export interface CallSavedAnswer {
  call: CallView;
  form: CallParsed;
}

/** 403 from the PUT when an editor who is not the lead changed payment terms: which ones. */
export interface CallTermsRefusalAnswer {
  error: string;
  terms: string[];
}

/** POST /api/anthologies/[slug]/stage: the move made and what the editor should know. */
export interface StageMovedAnswer {
  stage: AnthologyStage;
  from: AnthologyStage;
  cautions: string[];
}

/** 409 from the stage move: every problem that stops it (absent when someone moved it first). */
export interface StageRefusalAnswer {
  error: string;
  problems?: string[];
}
