"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useEffect, useMemo, useState } from "react";
import { Controller, useForm, useWatch, type Control } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { FEE_KIND_LABELS, copiesText, feeText, salesShareText } from "@/lib/call-terms";
import { FEE_KINDS, PIECE_KIND_LABELS, PIECE_KINDS } from "@/lib/domain";
import { formatInZone, isValidTimeZone, timeZonesByRegion, zonedToUtc } from "@/lib/time-zones";
import {
  amountToCents,
  callSchemaFor,
  percentToBasisPoints,
  type CallInput,
  type CallParsed,
} from "@/lib/validations/call";
import { showServerFieldErrors } from "@/components/ui/server-field-errors";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import type { CallSavedAnswer } from "@/lib/wire/open-call";

type Props = {
  slug: string;
  initial: CallParsed;
  isNew: boolean;
  anthologyInks: string[];
  maxPages: number;
  currency: string;
  canEditTerms: boolean;
  /** Zone names from the server, so the list is the same on both sides of hydration. */
  timeZones: string[];
};

const selectClass = `${inputClass} bg-white`;

/** The open call form: theme and brief, dates in a time zone, what a piece may be, inks, terms and rights. */
export function CallForm({
  slug,
  initial,
  isNew,
  anthologyInks,
  maxPages,
  currency,
  canEditTerms,
  timeZones,
}: Props) {
  const router = useRouter();
  const [notice, setNotice] = useState<{ tone: "info" | "error"; text: string }>();
  const [mounted, setMounted] = useState(false);
  const schema = useMemo(
    () => callSchemaFor({ inks: anthologyInks, maxPages }),
    [anthologyInks, maxPages],
  );
  const { register, handleSubmit, control, setError, reset, setValue, formState } = useForm<
    CallInput,
    unknown,
    CallParsed
  >({
    defaultValues: initial,
    resolver: zodResolver(schema),
  });
  const [kinds, feeKind, timeZone, opensAt, closesAt] = useWatch({
    control,
    name: ["allowedKinds", "feeKind", "timeZone", "opensAt", "closesAt"],
  });
  const e = formState.errors;

  useEffect(() => {
    setMounted(true);
    // A new call starts in the editor's own zone rather than UTC.
    if (isNew) {
      const own = Intl.DateTimeFormat().resolvedOptions().timeZone;
      if (own && own !== initial.timeZone && timeZones.includes(own)) setValue("timeZone", own);
    }
  }, [isNew, initial.timeZone, setValue, timeZones]);

  useEffect(() => {
    if (!formState.isDirty) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [formState.isDirty]);

  const zones = useMemo(() => {
    const list = timeZones.includes(initial.timeZone)
      ? timeZones
      : [initial.timeZone, ...timeZones];
    return timeZonesByRegion(list);
  }, [timeZones, initial.timeZone]);

  const when = (local: unknown) => {
    if (
      !mounted ||
      typeof local !== "string" ||
      typeof timeZone !== "string" ||
      !isValidTimeZone(timeZone)
    )
      return undefined;
    const result = zonedToUtc(local, timeZone);
    return result.ok ? formatInZone(result.instant, timeZone) : undefined;
  };

  const onSubmit = handleSubmit(async (values) => {
    setNotice(undefined);
    try {
      const saved = await fetchJson<CallSavedAnswer>(
        `/api/anthologies/${encodeURIComponent(slug)}/call`,
        {
          method: "PUT",
          json: values,
          failure: "The call was not saved.",
          unreachable:
            "Could not reach Quireline. Check your connection; your changes are still in the form.",
        },
      );
      reset(saved.form);
      setNotice({
        tone: "info",
        text: "Saved. The public page shows these details as soon as the call is open.",
      });
      router.refresh();
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      showServerFieldErrors(setError, error.fields);
      setNotice({ tone: "error", text: error.message });
    }
  });

  return (
    // Inputs carry defaultValue too, so the server-drawn form already shows the saved call;
    // data-ready says the form is live (typing before that would be overwritten on hydration).
    <form
      onSubmit={onSubmit}
      noValidate
      className="flex flex-col gap-8"
      aria-label="Open call"
      data-testid="call-form"
      data-ready={mounted ? "true" : "false"}
    >
      <fieldset className="grid gap-4">
        <legend className="mb-2 text-xl font-semibold">The call</legend>
        <Field
          id="theme"
          label="Theme"
          hint="A few words, e.g. What the tide leaves."
          error={e.theme?.message}
        >
          <input
            {...register("theme")}
            defaultValue={String(initial.theme)}
            {...describedBy("theme", e.theme?.message)}
            className={inputClass}
          />
        </Field>
        <Field
          id="brief"
          label="Brief"
          hint="What you hope to receive, who may send it, anything contributors should know. Blank lines start new paragraphs."
          error={e.brief?.message}
        >
          <textarea
            {...register("brief")}
            defaultValue={String(initial.brief)}
            {...describedBy("brief", e.brief?.message)}
            rows={8}
            className={inputClass}
          />
        </Field>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-xl font-semibold">Dates</legend>
        <Field
          id="opensAt"
          label="Opens"
          hint={when(opensAt) ?? "Date and time in the zone below."}
          error={e.opensAt?.message}
        >
          <input
            {...register("opensAt")}
            defaultValue={String(initial.opensAt)}
            {...describedBy("opensAt", e.opensAt?.message)}
            type="datetime-local"
            className={inputClass}
          />
        </Field>
        <Field
          id="closesAt"
          label="Closes"
          hint={when(closesAt) ?? "Work is taken until this moment."}
          error={e.closesAt?.message}
        >
          <input
            {...register("closesAt")}
            defaultValue={String(initial.closesAt)}
            {...describedBy("closesAt", e.closesAt?.message)}
            type="datetime-local"
            className={inputClass}
          />
        </Field>
        <Field
          id="timeZone"
          label="Time zone"
          hint="The dates are in this zone, and the public page shows them in it."
          className="sm:col-span-2"
          error={e.timeZone?.message}
        >
          <select
            {...register("timeZone")}
            defaultValue={String(initial.timeZone)}
            {...describedBy("timeZone", e.timeZone?.message)}
            className={selectClass}
          >
            {zones.map((group) => (
              <optgroup key={group.region} label={group.region}>
                {group.zones.map((zone) => (
                  <option key={zone} value={zone}>
                    {zone.replace(/_/g, " ")}
                  </option>
                ))}
              </optgroup>
            ))}
          </select>
        </Field>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-xl font-semibold">What a piece may be</legend>
        <CheckboxGroup
          control={control}
          name="allowedKinds"
          label="Kinds of piece"
          options={PIECE_KINDS.map((kind) => ({ value: kind, label: PIECE_KIND_LABELS[kind] }))}
          error={e.allowedKinds?.message ?? e.allowedKinds?.root?.message}
        />
        <CheckboxGroup
          control={control}
          name="allowedInks"
          label="Inks a piece may use"
          hint="From the anthology's inks."
          options={anthologyInks.map((ink) => ({ value: ink, label: ink }))}
          error={e.allowedInks?.message ?? e.allowedInks?.root?.message}
        />
        {Array.isArray(kinds) && kinds.includes("run") ? (
          <Field
            id="maxRunPages"
            label="Longest run (pages)"
            hint={`A run is 2 or more pages in a row; the booklet has at most ${maxPages}.`}
            error={e.maxRunPages?.message}
          >
            <input
              {...register("maxRunPages")}
              defaultValue={String(initial.maxRunPages)}
              {...describedBy("maxRunPages", e.maxRunPages?.message)}
              inputMode="numeric"
              className={inputClass}
            />
          </Field>
        ) : null}
        <Field id="piecesPerPerson" label="Pieces per person" error={e.piecesPerPerson?.message}>
          <input
            {...register("piecesPerPerson")}
            defaultValue={String(initial.piecesPerPerson)}
            {...describedBy("piecesPerPerson", e.piecesPerPerson?.message)}
            inputMode="numeric"
            className={inputClass}
          />
        </Field>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-xl font-semibold">Terms for contributors</legend>
        {canEditTerms ? (
          <>
            <Field id="feeKind" label="Fee">
              <select
                {...register("feeKind")}
                defaultValue={String(initial.feeKind)}
                {...describedBy("feeKind")}
                className={selectClass}
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
          <div className="sm:col-span-2" data-testid="terms-read-only">
            <dl className="grid grid-cols-[10rem_1fr] gap-x-4 gap-y-1 text-sm">
              <dt className="text-ink-soft">Fee</dt>
              <dd>
                {feeText(
                  { feeKind: initial.feeKind, feeCents: amountToCents(initial.fee) ?? 0 },
                  currency,
                )}
              </dd>
              <dt className="text-ink-soft">Share of sales</dt>
              <dd>{salesShareText(percentToBasisPoints(initial.salesSharePercent) ?? 0)}</dd>
              <dt className="text-ink-soft">Contributor copies</dt>
              <dd>{copiesText(Number(initial.contributorCopies))}</dd>
            </dl>
            <p className="mt-2 text-xs text-ink-faint">
              Only the lead editor can change the payment terms.
            </p>
          </div>
        )}
        <p className="text-xs text-ink-faint sm:col-span-2">
          Terms are an agreement between the press and each contributor; Quireline keeps the
          records, not tax or legal advice.
        </p>
      </fieldset>

      <fieldset className="grid gap-4">
        <legend className="mb-2 text-xl font-semibold">Rights</legend>
        <Field
          id="rightsAsked"
          label="Rights you ask for"
          hint="Which rights, for how long, and when they return to the contributor."
          error={e.rightsAsked?.message}
        >
          <textarea
            {...register("rightsAsked")}
            defaultValue={String(initial.rightsAsked)}
            {...describedBy("rightsAsked", e.rightsAsked?.message)}
            rows={3}
            className={inputClass}
          />
        </Field>
      </fieldset>

      {notice ? (
        <Notice tone={notice.tone} testId={notice.tone === "error" ? "call-error" : "call-saved"}>
          {notice.text}
        </Notice>
      ) : null}
      <div className="flex items-center gap-3">
        <Button type="submit" variant="accent" busy={formState.isSubmitting}>
          {formState.isSubmitting ? "Saving…" : isNew ? "Save the call" : "Save changes"}
        </Button>
        {formState.isDirty ? <span className="text-xs text-ink-faint">Unsaved changes</span> : null}
      </div>
    </form>
  );
}

/** A group of checkboxes editing one list of strings; keyboard and screen-reader friendly. */
function CheckboxGroup({
  control,
  name,
  label,
  hint,
  options,
  error,
}: {
  control: Control<CallInput, unknown, CallParsed>;
  name: "allowedKinds" | "allowedInks";
  label: string;
  hint?: string;
  options: { value: string; label: string }[];
  error?: string;
}) {
  const groupId = `${name}-group`;
  return (
    <Controller
      control={control}
      name={name}
      render={({ field }) => {
        const selected = (Array.isArray(field.value) ? field.value : []) as string[];
        const toggle = (value: string, on: boolean) => {
          const next = on ? [...selected, value] : selected.filter((v) => v !== value);
          // Keep the options' order so saved lists read the same way every time.
          field.onChange(options.map((o) => o.value).filter((v) => next.includes(v)));
        };
        return (
          <div
            role="group"
            aria-labelledby={`${groupId}-label`}
            aria-describedby={error ? `${name}-error` : undefined}
            className="flex flex-col gap-1"
          >
            <p id={`${groupId}-label`} className="text-sm font-semibold">
              {label}
            </p>
            <div className="flex flex-wrap gap-x-4 gap-y-1">
              {options.map((option) => (
                <label key={option.value} className="flex items-center gap-2 text-sm">
                  <input
                    type="checkbox"
                    name={name}
                    value={option.value}
                    checked={selected.includes(option.value)}
                    onChange={(event) => toggle(option.value, event.target.checked)}
                    onBlur={field.onBlur}
                    className="h-4 w-4 accent-teal"
                  />
                  {option.label}
                </label>
              ))}
            </div>
            {hint && !error ? <p className="text-xs text-ink-faint">{hint}</p> : null}
            {error ? (
              <p
                id={`${name}-error`}
                data-testid={`error-${name}`}
                className="text-xs font-semibold text-persimmon-dark"
              >
                {error}
              </p>
            ) : null}
          </div>
        );
      }}
    />
  );
}
