"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useFieldArray, useForm, useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass, TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { CURRENCIES, currencyLabel, DEFAULT_CURRENCY } from "@/lib/money";
import { BINDING_LABELS, BINDINGS, PRINT_METHOD_LABELS, PRINT_METHODS } from "@/lib/domain";
import { defaultCaliperMm, shouldScore } from "@/lib/print/paper";
import { mmText } from "@/lib/format";
import { inksPerPassNote } from "@/lib/print/method-notes";
import { findPreset } from "@/lib/print/sizes";
import { z } from "zod";
import {
  anthologyInputSchema,
  TRIM_CHOICES,
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

const selectClass = `${inputClass} bg-white`;

/** The new-anthology form: title, trim (preset or custom), bleed, pages, paper, print method and inks. */
export function AnthologyForm() {
  const router = useRouter();
  const [serverError, setServerError] = useState<string>();
  const [saving, setSaving] = useState(false);
  const form = useForm<FormValues, unknown, AnthologyParsed>({
    defaultValues: DEFAULTS,
    // The form edits inks as rows; the shared schema sees them as a list of names.
    resolver: zodResolver(
      z.preprocess((v) => {
        const { inkRows, ...rest } = v as FormValues;
        return { ...rest, inks: inkRows.map((row) => row.name) };
      }, anthologyInputSchema),
    ),
  });
  const { register, handleSubmit, control, setError, formState } = form;
  const inks = useFieldArray({ control, name: "inkRows" });
  const [trimChoice, unit, paperGsm, coverStock, coverGsm, printMethod] = useWatch({
    control,
    name: ["trimChoice", "unit", "paperGsm", "coverStock", "coverPaperGsm", "printMethod"],
  });
  const e = formState.errors;
  const unitLabel = unit === "in" ? "in" : "mm";
  const preset = trimChoice === "custom" ? undefined : findPreset(trimChoice);
  const gsmNumber = Number(paperGsm);
  const coverNumber = Number(coverGsm);

  const inkError = (e as { inks?: { message?: string } }).inks?.message;

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
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-8" aria-label="New anthology">
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

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-xl font-semibold">Trim, bleed and safe area</legend>
        <Field
          id="trimChoice"
          label="Trim size"
          hint={
            preset
              ? `${mmText(preset.widthMm)} x ${mmText(preset.heightMm)} mm`
              : "Enter the size below."
          }
          error={e.trimChoice?.message}
        >
          <select
            {...register("trimChoice")}
            {...describedBy("trimChoice", e.trimChoice?.message)}
            className={selectClass}
          >
            {TRIM_CHOICES.map((id) => (
              <option key={id} value={id}>
                {id === "custom" ? "Custom size" : (findPreset(id)?.label ?? id)}
              </option>
            ))}
          </select>
        </Field>
        <Field id="orientation" label="Orientation">
          <select {...register("orientation")} id="orientation" className={selectClass}>
            <option value="portrait">Portrait (taller than wide)</option>
            <option value="landscape">Landscape (wider than tall)</option>
          </select>
        </Field>
        <Field
          id="unit"
          label="Unit for lengths"
          hint="Used for custom size, bleed and safe margin."
        >
          <select {...register("unit")} {...describedBy("unit")} className={selectClass}>
            <option value="in">inches</option>
            <option value="mm">millimetres</option>
          </select>
        </Field>
        {trimChoice === "custom" ? (
          <>
            <TextField
              id="customWidth"
              label={`Width (${unitLabel})`}
              error={e.customWidth?.message}
              {...register("customWidth")}
              inputMode="decimal"
            />
            <TextField
              id="customHeight"
              label={`Height (${unitLabel})`}
              error={e.customHeight?.message}
              {...register("customHeight")}
              inputMode="decimal"
            />
          </>
        ) : null}
        <TextField
          id="bleed"
          label={`Bleed (${unitLabel})`}
          hint={unit === "in" ? "Usually 0.125 in." : "Usually 3 mm."}
          error={e.bleed?.message}
          {...register("bleed")}
          inputMode="decimal"
        />
        <TextField
          id="safeMargin"
          label={`Safe margin (${unitLabel})`}
          hint="Keep text this far inside the trim."
          error={e.safeMargin?.message}
          {...register("safeMargin")}
          inputMode="decimal"
        />
        <TextField
          id="minPpi"
          label="Minimum resolution (ppi)"
          hint="300 ppi for photos and tones."
          error={e.minPpi?.message}
          {...register("minPpi")}
          inputMode="numeric"
        />
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-xl font-semibold">Binding and paper</legend>
        <Field id="binding" label="Binding">
          <select {...register("binding")} {...describedBy("binding")} className={selectClass}>
            {BINDINGS.map((b) => (
              <option key={b} value={b}>
                {BINDING_LABELS[b]}
              </option>
            ))}
          </select>
        </Field>
        <TextField
          id="pageCountTarget"
          label="Pages (with covers)"
          hint="A multiple of 4 for saddle stitch."
          error={e.pageCountTarget?.message}
          {...register("pageCountTarget")}
          inputMode="numeric"
        />
        <TextField
          id="maxPages"
          label="Most pages the stapler allows"
          error={e.maxPages?.message}
          {...register("maxPages")}
          inputMode="numeric"
        />
        <TextField
          id="paperGsm"
          label="Inside paper (gsm)"
          error={e.paperGsm?.message}
          {...register("paperGsm")}
          inputMode="numeric"
        />
        <Field
          id="paperCaliperMm"
          label="Paper caliper (mm)"
          hint={
            gsmNumber > 0
              ? `Leave empty to estimate ${defaultCaliperMm(gsmNumber).toFixed(3)} mm from the weight.`
              : "Leave empty to estimate from the weight."
          }
          error={e.paperCaliperMm?.message}
        >
          <input
            {...register("paperCaliperMm")}
            {...describedBy("paperCaliperMm", e.paperCaliperMm?.message)}
            inputMode="decimal"
            className={inputClass}
          />
        </Field>
        <Field id="coverStock" label="Cover">
          <select
            {...register("coverStock")}
            {...describedBy("coverStock")}
            className={selectClass}
          >
            <option value="self">Same paper as the inside (self-cover)</option>
            <option value="separate">Separate, heavier cover stock</option>
          </select>
        </Field>
        {coverStock === "separate" ? (
          <TextField
            id="coverPaperGsm"
            label="Cover stock (gsm)"
            error={e.coverPaperGsm?.message}
            {...register("coverPaperGsm")}
            inputMode="numeric"
          />
        ) : null}
        {(coverStock === "separate" && shouldScore(coverNumber)) || shouldScore(gsmNumber) ? (
          <p className="text-sm text-ink-soft sm:col-span-3" data-testid="score-hint">
            Stock this heavy should be scored before folding so the fold does not crack.
          </p>
        ) : null}
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-xl font-semibold">Printing</legend>
        <Field id="printMethod" label="Print method">
          <select
            {...register("printMethod")}
            {...describedBy("printMethod")}
            className={selectClass}
          >
            {PRINT_METHODS.map((m) => (
              <option key={m} value={m}>
                {PRINT_METHOD_LABELS[m]}
              </option>
            ))}
          </select>
        </Field>
        <TextField
          id="inksPerPass"
          label="Inks per pass"
          hint={inksPerPassNote(printMethod)}
          error={e.inksPerPass?.message}
          {...register("inksPerPass")}
          inputMode="numeric"
        />
        <div className="flex flex-col gap-2 sm:col-span-3">
          <p className="text-sm font-semibold" id="inks-label">
            Inks
          </p>
          <ul className="flex flex-wrap gap-2" aria-labelledby="inks-label">
            {inks.fields.map((field, index) => (
              <li key={field.id} className="flex items-center gap-1">
                <input
                  {...register(`inkRows.${index}.name` as const)}
                  aria-label={`Ink ${index + 1}`}
                  className={`${inputClass} w-40`}
                />
                {inks.fields.length > 1 ? (
                  <button
                    type="button"
                    onClick={() => inks.remove(index)}
                    className="rounded px-2 text-sm text-ink-soft hover:bg-paper-deep"
                    aria-label={`Remove ink ${index + 1}`}
                  >
                    ✕
                  </button>
                ) : null}
              </li>
            ))}
            <li>
              <Button
                type="button"
                variant="quiet"
                onClick={() => inks.append({ name: "" })}
                disabled={inks.fields.length >= 8}
              >
                Add an ink
              </Button>
            </li>
          </ul>
          {inkError ? (
            <p className="text-xs font-semibold text-persimmon-dark" data-testid="error-inks">
              {inkError}
            </p>
          ) : null}
        </div>
      </fieldset>

      <div>
        <Button type="submit" variant="accent" busy={saving}>
          {saving ? "Saving…" : "Create anthology"}
        </Button>
      </div>
    </form>
  );
}
