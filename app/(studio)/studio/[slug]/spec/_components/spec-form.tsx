"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormProvider, useForm } from "react-hook-form";
import { z } from "zod";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import {
  PrintSpecFields,
  withInkList,
  type PrintSpecFormValues,
} from "@/components/print-spec-fields";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { showServerFieldErrors } from "@/components/ui/server-field-errors";
import {
  specEditSchema,
  type SpecEditInput,
  type SpecEditParsed,
} from "@/lib/validations/spec-edit";
import type { SpecImpact, SpecNotSavedAnswer, SpecSavedAnswer } from "@/lib/wire/spec-change";
import { SpecImpacts } from "./spec-impacts";
import { SpecSaved } from "./spec-saved";

type Step =
  | { kind: "editing" }
  | { kind: "saving" }
  | { kind: "confirm"; impacts: SpecImpact[]; values: SpecEditParsed }
  | { kind: "refused"; impacts: SpecImpact[]; message: string }
  | { kind: "saved"; answer: SpecSavedAnswer }
  | { kind: "failed"; message: string };

function formValues(initial: SpecEditInput): PrintSpecFormValues {
  const { inks, confirm: _confirm, ...rest } = initial;
  return { ...rest, inkRows: inks.map((name) => ({ name })) };
}

/**
 * The spec screen's form: the new-anthology form's spec fields and rules. Sending weighs the
 * change on the server; warnings come back to be confirmed, refusals to be changed, and a saved
 * change comes back with what checking the files again found.
 */
export function SpecForm({ slug, initial }: { slug: string; initial: SpecEditInput }) {
  const router = useRouter();
  const [step, setStep] = useState<Step>({ kind: "editing" });
  const form = useForm<PrintSpecFormValues, unknown, SpecEditParsed>({
    defaultValues: formValues(initial),
    // The form edits inks as rows; the shared schema sees them as a list of names.
    resolver: zodResolver(
      z.preprocess((v) => withInkList(v as PrintSpecFormValues), specEditSchema),
    ),
  });

  async function send(values: SpecEditParsed, confirm: boolean) {
    setStep({ kind: "saving" });
    try {
      const answer = await fetchJson<SpecSavedAnswer>(`/api/anthologies/${slug}/spec`, {
        method: "PATCH",
        json: { ...values, confirm },
        failure: "The spec was not changed.",
        unreachable: "Could not reach Quireline. Check your connection; the spec was not changed.",
      });
      setStep({ kind: "saved", answer });
      router.refresh();
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      const body = error.body as Partial<SpecNotSavedAnswer>;
      if (error.status === 409 && body.needs === "confirmation")
        setStep({ kind: "confirm", impacts: body.impacts ?? [], values });
      else if (error.status === 409 && body.needs === "changes")
        setStep({ kind: "refused", impacts: body.impacts ?? [], message: error.message });
      else {
        showServerFieldErrors(form.setError, error.fields);
        setStep({ kind: "failed", message: error.message });
      }
    }
  }

  const onSubmit = form.handleSubmit((values) => send(values, false));
  const busy = step.kind === "saving";

  return (
    <FormProvider {...form}>
      <form
        onSubmit={onSubmit}
        onChange={() => {
          // A warning or a refusal was about the values sent; an edit makes it out of date.
          if (step.kind === "confirm" || step.kind === "refused" || step.kind === "saved")
            setStep({ kind: "editing" });
        }}
        noValidate
        className="flex flex-col gap-8"
        aria-label="Print spec"
      >
        <PrintSpecFields />
        <div className="flex flex-col gap-4" aria-live="polite">
          {step.kind === "failed" ? (
            <Notice tone="error" testId="spec-error">
              {step.message}
            </Notice>
          ) : null}
          {step.kind === "refused" ? <SpecImpacts impacts={step.impacts} /> : null}
          {step.kind === "confirm" ? (
            <>
              <SpecImpacts impacts={step.impacts} />
              <div className="flex flex-wrap gap-3">
                <Button
                  type="button"
                  variant="accent"
                  onClick={() => void send(step.values, true)}
                  data-testid="spec-confirm"
                >
                  Confirm: change the spec and check every file again
                </Button>
                <Button type="button" variant="quiet" onClick={() => setStep({ kind: "editing" })}>
                  Keep editing
                </Button>
              </div>
            </>
          ) : null}
          {step.kind === "saved" ? <SpecSaved answer={step.answer} /> : null}
          {step.kind !== "confirm" ? (
            <div>
              <Button type="submit" variant="accent" busy={busy} data-testid="spec-save">
                {busy ? "Weighing the change…" : "Save the spec"}
              </Button>
            </div>
          ) : null}
        </div>
      </form>
    </FormProvider>
  );
}
