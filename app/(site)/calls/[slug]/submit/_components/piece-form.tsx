"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useEffect, useMemo, useState } from "react";
import { Controller, useForm, useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass, TextField } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { PIECE_KIND_LABELS } from "@/lib/domain";
import {
  pageCountRange,
  pieceSchemaFor,
  type CallRules,
  type PieceInput,
  type PieceParsed,
} from "@/lib/validations/piece";
import { showServerFieldErrors } from "@/components/ui/server-field-errors";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import type { PieceCreatedAnswer } from "@/lib/wire/submissions";

/** The new-piece form: what the piece is, its inks and credit; files are uploaded on the next screen. */
export function PieceForm({
  slug,
  rules,
  defaultCreditLine,
  remaining,
}: {
  slug: string;
  rules: CallRules;
  defaultCreditLine: string;
  remaining: number;
}) {
  const router = useRouter();
  const schema = useMemo(() => pieceSchemaFor(rules), [rules]);
  const firstKind = rules.allowedKinds[0] ?? "single";
  const { register, handleSubmit, setError, setValue, control, formState } = useForm<
    PieceInput,
    unknown,
    PieceParsed
  >({
    resolver: zodResolver(schema),
    defaultValues: {
      title: "",
      kind: firstKind,
      pageCount: pageCountRange(firstKind, rules.maxRunPages).min,
      inks: rules.allowedInks.length === 1 ? [...rules.allowedInks] : [],
      creditLine: defaultCreditLine,
      statement: "",
      altTexts: [],
    },
  });
  const [problem, setProblem] = useState<string | null>(null);
  const kind = useWatch({ control, name: "kind" });
  const pageCountValue = useWatch({ control, name: "pageCount" });
  const range = pageCountRange(kind, rules.maxRunPages);
  const pages = Math.min(range.max, Math.max(range.min, Number(pageCountValue) || range.min));

  useEffect(() => {
    // A single page and a spread have a fixed page count; a run starts at its minimum.
    setValue("pageCount", range.min, { shouldValidate: false });
  }, [kind, range.min, setValue]);

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      const created = await fetchJson<PieceCreatedAnswer>(
        `/api/anthologies/${encodeURIComponent(slug)}/pieces`,
        {
          method: "POST",
          json: { ...values, altTexts: values.altTexts.slice(0, values.pageCount) },
          failure: (status) => `The piece could not be saved (error ${status}).`,
          unreachable:
            "Quireline could not be reached. Check your connection and send the form again; nothing was lost.",
        },
      );
      router.push(created.url);
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      showServerFieldErrors(setError, error.fields);
      setProblem(error.message);
    }
  });

  const e = formState.errors;
  return (
    <form
      onSubmit={onSubmit}
      noValidate
      className="flex flex-col gap-5 rounded-lg border border-ink/10 bg-white/50 p-5"
      data-testid="piece-form"
    >
      <p className="text-sm text-ink-soft">
        You can send {remaining} more piece{remaining === 1 ? "" : "s"} to this call.
      </p>
      <TextField id="title" label="Title" error={e.title?.message} {...register("title")} />

      <fieldset
        className="flex flex-col gap-2"
        aria-describedby={e.kind ? "kind-error" : undefined}
      >
        <legend className="text-sm font-semibold">What is it?</legend>
        <div className="flex flex-wrap gap-3">
          {rules.allowedKinds.map((k) => (
            <label
              key={k}
              className="inline-flex items-center gap-2 rounded-md border border-ink/20 px-3 py-2 text-sm has-[:checked]:border-teal has-[:checked]:bg-teal-light/50"
            >
              <input type="radio" value={k} {...register("kind")} data-testid={`kind-${k}`} />
              {PIECE_KIND_LABELS[k]}
            </label>
          ))}
        </div>
        {e.kind ? (
          <p id="kind-error" className="text-xs font-semibold text-persimmon-dark">
            {e.kind.message}
          </p>
        ) : null}
      </fieldset>

      {kind === "run" ? (
        <Field
          id="pageCount"
          label="How many pages?"
          hint={`A run has ${range.min} to ${range.max} pages in this call.`}
          error={e.pageCount?.message}
        >
          <input
            {...register("pageCount")}
            {...describedBy("pageCount", e.pageCount?.message)}
            type="number"
            inputMode="numeric"
            min={range.min}
            max={range.max}
            className={`${inputClass} w-28`}
          />
        </Field>
      ) : (
        <p className="text-sm text-ink-soft" data-testid="page-count-fixed">
          {range.min === 1
            ? "One page: you will upload one file."
            : "Two facing pages: you will upload one file for each page (left, then right)."}
        </p>
      )}

      <Controller
        control={control}
        name="inks"
        render={({ field }) => {
          const chosen = field.value ?? [];
          return (
            <fieldset
              className="flex flex-col gap-2"
              aria-describedby={e.inks ? "inks-error" : "inks-hint"}
            >
              <legend className="text-sm font-semibold">Inks your piece uses</legend>
              <div className="flex flex-wrap gap-3">
                {rules.allowedInks.map((ink) => (
                  <label key={ink} className="inline-flex items-center gap-2 text-sm">
                    <input
                      type="checkbox"
                      checked={chosen.includes(ink)}
                      data-testid={`ink-${ink}`}
                      onChange={(event) =>
                        field.onChange(
                          event.target.checked ? [...chosen, ink] : chosen.filter((i) => i !== ink),
                        )
                      }
                      onBlur={field.onBlur}
                    />
                    {ink}
                  </label>
                ))}
              </div>
              {e.inks ? (
                <p id="inks-error" className="text-xs font-semibold text-persimmon-dark">
                  {e.inks.message}
                </p>
              ) : (
                <p id="inks-hint" className="text-xs text-ink-faint">
                  Each ink is printed separately; fewer inks can mean fewer passes through the
                  press.
                </p>
              )}
            </fieldset>
          );
        }}
      />

      <TextField
        id="creditLine"
        label="Credit line"
        hint="Your name as it should appear in the credits, e.g. “Words and pictures by …”."
        error={e.creditLine?.message}
        {...register("creditLine")}
      />

      <Field
        id="statement"
        label="A few words about the piece (optional)"
        hint="Up to 1200 characters, for the editors."
        error={e.statement?.message}
      >
        <textarea
          {...register("statement")}
          {...describedBy("statement", e.statement?.message)}
          rows={4}
          className={inputClass}
        />
      </Field>

      <fieldset className="flex flex-col gap-3">
        <legend className="text-sm font-semibold">
          Describe each page for readers who cannot see it (optional)
        </legend>
        {Array.from({ length: pages }, (_, i) => (
          <Field
            key={i}
            id={`altTexts-${i}`}
            label={
              pages === 1
                ? "The page"
                : `Page ${i + 1}${kind === "spread" ? (i === 0 ? " (left)" : " (right)") : ""}`
            }
          >
            <textarea
              {...register(`altTexts.${i}` as const)}
              id={`altTexts-${i}`}
              rows={2}
              className={inputClass}
            />
          </Field>
        ))}
        {e.altTexts ? (
          <p className="text-xs font-semibold text-persimmon-dark">{e.altTexts.message}</p>
        ) : null}
      </fieldset>

      {problem ? (
        <Notice tone="error" testId="piece-form-error">
          {problem}
        </Notice>
      ) : null}
      <Button type="submit" variant="accent" busy={formState.isSubmitting} data-testid="save-piece">
        {formState.isSubmitting ? "Saving…" : "Save and upload files"}
      </Button>
    </form>
  );
}
