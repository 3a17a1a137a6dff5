"use client";

import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import type { IdAnswer } from "@/lib/wire/payouts";

/** Opens a period: a name and its first and last day. */
export function PeriodForm({ slug }: { slug: string }) {
  const router = useRouter();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string>();
  const [busy, setBusy] = useState(false);
  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setBusy(true);
    setProblem(undefined);
    try {
      await fetchJson<IdAnswer>(`/api/anthologies/${slug}/payouts/periods`, {
        method: "POST",
        json: Object.fromEntries(
          ["label", "startsOn", "endsOn"].map((k) => [k, String(form.get(k) ?? "")]),
        ),
        failure: "The period was not opened.",
      });
      setErrors({});
      router.refresh();
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      setErrors(Object.fromEntries(Object.entries(error.fields).map(([k, v]) => [k, v[0] ?? ""])));
      setProblem(error.message);
    } finally {
      setBusy(false);
    }
  }
  return (
    <form
      onSubmit={submit}
      noValidate
      className="flex flex-wrap items-end gap-3"
      aria-label="Open a period"
    >
      <Field id="period-label" label="Name" error={errors.label} hint="e.g. Winter 2026">
        <input
          name="label"
          maxLength={80}
          {...describedBy("period-label", errors.label)}
          className={inputClass}
        />
      </Field>
      <Field id="period-start" label="First day" error={errors.startsOn}>
        <input
          name="startsOn"
          type="date"
          {...describedBy("period-start", errors.startsOn)}
          className={inputClass}
        />
      </Field>
      <Field id="period-end" label="Last day" error={errors.endsOn}>
        <input
          name="endsOn"
          type="date"
          {...describedBy("period-end", errors.endsOn)}
          className={inputClass}
        />
      </Field>
      <Button type="submit" variant="quiet" busy={busy}>
        {busy ? "Opening…" : "Open period"}
      </Button>
      {problem ? (
        <div role="alert" className="w-full">
          <Notice tone="error">{problem}</Notice>
        </div>
      ) : null}
    </form>
  );
}
