"use client";

import { useRouter } from "next/navigation";
import { useId, useState, type FormEvent } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import type { IdAnswer } from "@/lib/wire/payouts";

/** Marks an owed line paid outside the payments service, with how it was paid. */
export function PaidByHandForm({ slug, entryId }: { slug: string; entryId: number }) {
  const router = useRouter();
  const id = `by-hand-${useId().replace(/:/g, "")}`;
  const [error, setError] = useState<string>();
  const [busy, setBusy] = useState(false);
  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const reference = String(new FormData(event.currentTarget).get("reference") ?? "");
    setBusy(true);
    setError(undefined);
    try {
      await fetchJson<IdAnswer>(
        `/api/anthologies/${slug}/payouts/entries/${entryId}/paid-by-hand`,
        {
          method: "POST",
          json: { reference },
          failure: "It was not marked paid.",
        },
      );
      router.refresh();
    } catch (e) {
      if (!(e instanceof ApiError)) throw e;
      setError(e.fields.reference?.[0] ?? e.message);
    } finally {
      setBusy(false);
    }
  }
  return (
    <form onSubmit={submit} noValidate className="flex flex-wrap items-end gap-2">
      <Field
        id={id}
        label="Paid by hand: how"
        error={error}
        hint="e.g. cash at the fair, receipt 14"
      >
        <input
          name="reference"
          maxLength={120}
          {...describedBy(id, error)}
          className={`${inputClass} w-56`}
        />
      </Field>
      <Button type="submit" variant="quiet" busy={busy}>
        {busy ? "Saving…" : "Mark paid"}
      </Button>
    </form>
  );
}
