"use client";

import { useWatch } from "react-hook-form";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { FEE_KIND_LABELS } from "@/lib/call-terms";
import { FEE_KINDS, SHARE_SPLIT_LABELS, SHARE_SPLITS } from "@/lib/domain";
import type { CallParsed } from "@/lib/validations/call";
import { useCallForm } from "./call-form-context";
import { TermsReadOnly } from "./terms-read-only";

/** The payment terms: editable by the lead editor, shown read-only to the other editors. */
export function CallTermsSection({
  initial,
  currency,
  canEditTerms,
}: {
  initial: CallParsed;
  currency: string;
  canEditTerms: boolean;
}) {
  const { register, control, errors: e } = useCallForm();
  const feeKind = useWatch({ control, name: "feeKind" });
  return (
    <fieldset className="grid gap-4 sm:grid-cols-2">
      <legend className="mb-2 text-xl font-semibold">Terms for contributors</legend>
      {canEditTerms ? (
        <>
          <Field id="feeKind" label="Fee">
            <select
              {...register("feeKind")}
              defaultValue={String(initial.feeKind)}
              {...describedBy("feeKind")}
              className={`${inputClass} bg-white`}
            >
              {FEE_KINDS.map((kind) => (
                <option key={kind} value={kind}>
                  {FEE_KIND_LABELS[kind]}
                </option>
              ))}
            </select>
          </Field>
          {feeKind !== "none" ? (
            <Field
              id="fee"
              label={`Amount (${currency})`}
              hint={
                feeKind === "per-page"
                  ? "Paid for each page printed."
                  : "Paid for each piece printed."
              }
              error={e.fee?.message}
            >
              <input
                {...register("fee")}
                defaultValue={String(initial.fee)}
                {...describedBy("fee", e.fee?.message)}
                inputMode="decimal"
                className={inputClass}
              />
            </Field>
          ) : (
            <div aria-hidden="true" />
          )}
          <Field
            id="salesSharePercent"
            label="Share of net sales (%)"
            hint="Pooled among the contributors; 0 for none."
            error={e.salesSharePercent?.message}
          >
            <input
              {...register("salesSharePercent")}
              defaultValue={String(initial.salesSharePercent)}
              {...describedBy("salesSharePercent", e.salesSharePercent?.message)}
              inputMode="decimal"
              className={inputClass}
            />
          </Field>
          <Field
            id="shareSplit"
            label="Share divided"
            hint="Largest remainder: the parts add up to the share to the cent."
            error={e.shareSplit?.message}
          >
            <select
              {...register("shareSplit")}
              defaultValue={initial.shareSplit}
              {...describedBy("shareSplit", e.shareSplit?.message)}
              className={`${inputClass} bg-white`}
            >
              {SHARE_SPLITS.map((split) => (
                <option key={split} value={split}>
                  {SHARE_SPLIT_LABELS[split]}
                </option>
              ))}
            </select>
          </Field>
          <Field
            id="contributorCopies"
            label="Contributor copies (each)"
            error={e.contributorCopies?.message}
          >
            <input
              {...register("contributorCopies")}
              defaultValue={String(initial.contributorCopies)}
              {...describedBy("contributorCopies", e.contributorCopies?.message)}
              inputMode="numeric"
              className={inputClass}
            />
          </Field>
        </>
      ) : (
        <TermsReadOnly initial={initial} currency={currency} />
      )}
      <p className="text-xs text-ink-faint sm:col-span-2">
        Terms are an agreement between the press and each contributor; Quireline keeps the records,
        not tax or legal advice.
      </p>
    </fieldset>
  );
}
