"use client";

import { useFieldArray, useFormContext, useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass, TextField } from "@/components/ui/field";
import { BINDING_LABELS, BINDINGS, PRINT_METHOD_LABELS, PRINT_METHODS } from "@/lib/domain";
import { mmText } from "@/lib/format";
import { defaultCaliperMm, shouldScore } from "@/lib/print/paper";
import { inksPerPassNote } from "@/lib/print/method-notes";
import { findPreset } from "@/lib/print/sizes";
import { INKS_MAX } from "@/lib/validations/limits";
import { TRIM_CHOICES, type SpecFieldsInput } from "@/lib/validations/anthology";

/** The spec part of a form's values; inks are edited as rows, one input each. */
export type PrintSpecFormValues = Omit<SpecFieldsInput, "inks"> & { inkRows: { name: string }[] };

/** Turns the form's ink rows back into the list of names the shared schema reads. */
export function withInkList<T extends { inkRows: { name: string }[] }>(values: T) {
  const { inkRows, ...rest } = values;
  return { ...rest, inks: inkRows.map((row) => row.name) };
}

const selectClass = `${inputClass} bg-white`;

/**
 * The print spec's fieldsets (trim, bleed and safe area; binding and paper; printing and inks),
 * shared by the new-anthology form and the spec screen. Reads its form from FormProvider.
 */
export function PrintSpecFields() {
  const { register, control, formState } = useFormContext<PrintSpecFormValues>();
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

  return (
    <>
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
                disabled={inks.fields.length >= INKS_MAX}
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
    </>
  );
}
