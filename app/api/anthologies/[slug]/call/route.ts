import { findCall, saveCall, toCallRecord, type CallRow } from "@/db/queries/open-call";
import { apiRoute, HttpError, readJson, requireApiAccess } from "@/server/api";
import { can } from "@/lib/auth/policy";
import { callSpecSummary } from "@/lib/call-spec";
import { specOf } from "@/lib/print/spec";
import { callPhase } from "@/lib/stages";
import {
  callInputFromRecord,
  callRecordFromInput,
  callSchemaFor,
  changedTerms,
  DEFAULT_TERMS,
  newCallDefaults,
  termsOf,
} from "@/lib/validations/call";
import type { CallAnswer, CallSavedAnswer } from "@/lib/wire/open-call";

type Context = { params: Promise<{ slug: string }> };

function callJson(row: CallRow) {
  return {
    ...toCallRecord(row),
    opensAt: row.opensAt.toISOString(),
    closesAt: row.closesAt.toISOString(),
    publishedAt: row.publishedAt?.toISOString() ?? null,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** The anthology's open call (null before it is written), the form's values and the spec summary. */
export const GET = apiRoute(async (_request, { params }: Context) => {
  const { slug } = await params;
  const { anthology, role } = await requireApiAccess(slug, "call:edit");
  const row = await findCall(anthology.id);
  const now = new Date();
  return Response.json({
    call: row ? callJson(row) : null,
    form: row ? callInputFromRecord(toCallRecord(row)) : newCallDefaults(anthology, now),
    stage: anthology.stage,
    phase: callPhase(row, anthology.stage, now),
    canEditTerms: can(role, "call:edit-terms"),
    currency: anthology.currency,
    publicPath: `/calls/${anthology.slug}`,
    spec: callSpecSummary(specOf(anthology, { inks: row?.allowedInks })),
  } satisfies CallAnswer);
});

/** Writes the call. Editors may change everything but the payment terms, which are the lead's. */
export const PUT = apiRoute(async (request, { params }: Context) => {
  const { slug } = await params;
  const { anthology, role } = await requireApiAccess(slug, "call:edit");
  const input = await readJson(request, callSchemaFor(anthology));
  const record = callRecordFromInput(input, anthology.inks);
  const existing = await findCall(anthology.id);
  const changed = changedTerms(existing ? termsOf(existing) : DEFAULT_TERMS, termsOf(record));
  if (changed.length > 0 && !can(role, "call:edit-terms")) {
    throw new HttpError(
      403,
      `Only the lead editor can change the payment terms (${changed.join(", ")}).`,
      { terms: changed },
    );
  }
  const row = await saveCall(anthology.id, record);
  return Response.json(
    { call: callJson(row), form: callInputFromRecord(toCallRecord(row)) } satisfies CallSavedAnswer,
    { status: existing ? 200 : 201 },
  );
});
