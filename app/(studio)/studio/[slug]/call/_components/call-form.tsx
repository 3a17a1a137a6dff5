"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useEffect, useMemo, useState } from "react";
import { FormProvider, useForm } from "react-hook-form";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { showServerFieldErrors } from "@/components/ui/server-field-errors";
import { callSchemaFor, type CallInput, type CallParsed } from "@/lib/validations/call";
import type { CallSavedAnswer } from "@/lib/wire/open-call";
import { CallDatesSection } from "./call-dates-section";
import { CallRightsSection } from "./call-rights-section";
import { CallTermsSection } from "./call-terms-section";
import { CallThemeSection } from "./call-theme-section";
import { PieceRulesSection } from "./piece-rules-section";

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
  const form = useForm<CallInput, unknown, CallParsed>({
    defaultValues: initial,
    resolver: zodResolver(schema),
  });
  const { handleSubmit, setError, reset, setValue, formState } = form;

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
    <FormProvider {...form}>
      {/* Inputs carry defaultValue too, so the server-drawn form already shows the saved call;
          data-ready says the form is live (typing before that would be overwritten on hydration). */}
      <form
        onSubmit={onSubmit}
        noValidate
        className="flex flex-col gap-8"
        aria-label="Open call"
        data-testid="call-form"
        data-ready={mounted ? "true" : "false"}
      >
        <CallThemeSection initial={initial} />
        <CallDatesSection initial={initial} timeZones={timeZones} live={mounted} />
        <PieceRulesSection initial={initial} anthologyInks={anthologyInks} maxPages={maxPages} />
        <CallTermsSection initial={initial} currency={currency} canEditTerms={canEditTerms} />
        <CallRightsSection initial={initial} />

        {notice ? (
          <Notice tone={notice.tone} testId={notice.tone === "error" ? "call-error" : "call-saved"}>
            {notice.text}
          </Notice>
        ) : null}
        <div className="flex items-center gap-3">
          <Button type="submit" variant="accent" busy={formState.isSubmitting}>
            {formState.isSubmitting ? "Saving…" : isNew ? "Save the call" : "Save changes"}
          </Button>
          {formState.isDirty ? (
            <span className="text-xs text-ink-faint">Unsaved changes</span>
          ) : null}
        </div>
      </form>
    </FormProvider>
  );
}
