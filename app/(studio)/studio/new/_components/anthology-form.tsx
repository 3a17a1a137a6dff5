"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormProvider, useForm } from "react-hook-form";
import { PrintSpecFields, withInkList } from "@/components/print-spec-fields";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass, TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { CURRENCIES, currencyLabel, DEFAULT_CURRENCY } from "@/lib/money";
import { z } from "zod";
import {
  anthologyInputSchema,
  type AnthologyInput,
  type AnthologyParsed,
} from "@/lib/validations/anthology";
import { showServerFieldErrors } from "@/components/ui/server-field-errors";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import type { AnthologyCreatedAnswer } from "@/lib/wire/anthologies";

type FormValues = Omit<AnthologyInput, "inks"> & { inkRows: { name: string }[] };

const DEFAULTS: FormValues = {
  title: "",
  pressName: "",
  summary: "",
  currency: DEFAULT_CURRENCY,
  trimChoice: "half-letter",
  orientation: "portrait",
  unit: "in",
  bleed: 0.125,
  safeMargin: 0.25,
  binding: "saddle-stitch",
  pageCountTarget: 24,
  maxPages: 48,
  coverStock: "self",
  paperGsm: 90,
  printMethod: "laser-black",
  inkRows: [{ name: "black" }],
  inksPerPass: 1,
  minPpi: 300,
};

/** The new-anthology form: title, press and summary, then the print spec's fields (shared with the spec screen). */
export function AnthologyForm() {
  const router = useRouter();
  const [serverError, setServerError] = useState<string>();
  const [saving, setSaving] = useState(false);
  const form = useForm<FormValues, unknown, AnthologyParsed>({
    defaultValues: DEFAULTS,
    // The form edits inks as rows; the shared schema sees them as a list of names.
    resolver: zodResolver(z.preprocess((v) => withInkList(v as FormValues), anthologyInputSchema)),
  });
  const { register, handleSubmit, setError, formState } = form;
  const e = formState.errors;

  const onSubmit = handleSubmit(async (values) => {
    setSaving(true);
    setServerError(undefined);
    try {
      const created = await fetchJson<AnthologyCreatedAnswer>("/api/anthologies", {
        method: "POST",
        json: values,
        failure: "The anthology was not saved.",
        unreachable: "Could not reach Quireline. Check your connection; nothing was saved.",
      });
      router.push(`/studio/${created.anthology.slug}`);
      router.refresh();
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      showServerFieldErrors(setError, error.fields);
      setServerError(error.message);
    } finally {
      setSaving(false);
    }
  });

  return (
    <FormProvider {...form}>
      <form
        onSubmit={onSubmit}
        noValidate
        className="flex flex-col gap-8"
        aria-label="New anthology"
      >
        {serverError ? (
          <Notice tone="error" testId="form-error">
            {serverError}
          </Notice>
        ) : null}
        <fieldset className="grid gap-4 sm:grid-cols-2">
          <legend className="mb-2 text-xl font-semibold">The anthology</legend>
          <TextField id="title" label="Title" error={e.title?.message} {...register("title")} />
          <TextField
            id="pressName"
            label="Press or collective"
            hint="Optional."
            error={e.pressName?.message}
            {...register("pressName")}
          />
          <Field
            id="currency"
            label="Currency"
            hint="For fees and payouts; it cannot change once money is recorded."
            error={e.currency?.message}
          >
            <select
              {...register("currency")}
              {...describedBy("currency", e.currency?.message)}
              className={`${inputClass} bg-white`}
            >
              {CURRENCIES.map((code) => (
                <option key={code} value={code}>
                  {currencyLabel(code)}
                </option>
              ))}
            </select>
          </Field>
          <TextField
            id="summary"
            label="One-line summary"
            hint="Optional; shown on the open call."
            fieldClassName="sm:col-span-2"
            error={e.summary?.message}
            {...register("summary")}
          />
        </fieldset>

        <PrintSpecFields />

        <div>
          <Button type="submit" variant="accent" busy={saving}>
            {saving ? "Saving…" : "Create anthology"}
          </Button>
        </div>
      </form>
    </FormProvider>
  );
}
