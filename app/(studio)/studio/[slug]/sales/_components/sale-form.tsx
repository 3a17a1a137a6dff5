"use client";

import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SALE_CHANNEL_LABELS, SALE_CHANNELS } from "@/lib/domain";
import { parseCents } from "@/lib/money";
import type { IdAnswer } from "@/lib/wire/payouts";

const MONEY_FIELDS = [
  ["unitPriceCents", "Price per copy", "Before any discount"],
  ["discountCents", "Discounts given", "Total for these copies"],
  ["channelFeesCents", "Fees the channel kept", "A shop's commission, a card reader's cut"],
  [
    "recoverableCostsCents",
    "Costs recovered first",
    "Printing or a table fee the terms let the press take back",
  ],
] as const;

/** Records one sale line; amounts are typed as money and sent as whole cents. */
export function SaleForm({
  slug,
  currency,
  today,
}: {
  slug: string;
  currency: string;
  today: string;
}) {
  const router = useRouter();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [result, setResult] = useState<{ tone: "info" | "error"; text: string }>();
  const [busy, setBusy] = useState(false);

  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const problems: Record<string, string> = {};
    const money: Record<string, number> = {};
    for (const [name, label] of MONEY_FIELDS) {
      const text = String(form.get(name) ?? "").trim();
      try {
        money[name] = text === "" ? 0 : parseCents(text);
      } catch {
        problems[name] = `${label}: write an amount such as 12.50`;
      }
    }
    setErrors(problems);
    if (Object.keys(problems).length > 0) return;
    setBusy(true);
    setResult(undefined);
    try {
      await fetchJson<IdAnswer>(`/api/anthologies/${slug}/sales`, {
        method: "POST",
        json: {
          channel: form.get("channel"),
          label: String(form.get("label") ?? ""),
          soldOn: String(form.get("soldOn") ?? ""),
          copies: Number(form.get("copies")),
          note: String(form.get("note") ?? "") || undefined,
          ...money,
        },
        failure: "The sale was not recorded.",
      });
      setResult({ tone: "info", text: "Sale recorded." });
      (event.target as HTMLFormElement).reset();
      router.refresh();
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      setErrors(Object.fromEntries(Object.entries(error.fields).map(([k, v]) => [k, v[0] ?? ""])));
      setResult({ tone: "error", text: error.message });
    } finally {
      setBusy(false);
    }
  }

  return (
    <form
      onSubmit={submit}
      noValidate
      className="grid gap-3 sm:grid-cols-2"
      aria-label="Record a sale"
    >
      <Field id="sale-channel" label="Where" error={errors.channel}>
        <select
          name="channel"
          {...describedBy("sale-channel", errors.channel)}
          className={`${inputClass} bg-white`}
        >
          {SALE_CHANNELS.map((c) => (
            <option key={c} value={c}>
              {SALE_CHANNEL_LABELS[c]}
            </option>
          ))}
        </select>
      </Field>
      <Field
        id="sale-label"
        label="Event or shop"
        error={errors.label}
        hint="e.g. Harbour Zine Fair"
      >
        <input
          name="label"
          required
          maxLength={120}
          {...describedBy("sale-label", errors.label)}
          className={inputClass}
        />
      </Field>
      <Field id="sale-date" label="Date" error={errors.soldOn}>
        <input
          name="soldOn"
          type="date"
          required
          defaultValue={today}
          {...describedBy("sale-date", errors.soldOn)}
          className={inputClass}
        />
      </Field>
      <Field
        id="sale-copies"
        label="Copies"
        error={errors.copies}
        hint="Below zero for copies returned"
      >
        <input
          name="copies"
          type="number"
          step={1}
          required
          defaultValue={1}
          {...describedBy("sale-copies", errors.copies)}
          className={inputClass}
        />
      </Field>
      {MONEY_FIELDS.map(([name, label, hint]) => (
        <Field
          key={name}
          id={`sale-${name}`}
          label={`${label} (${currency})`}
          error={errors[name]}
          hint={hint}
        >
          <input
            name={name}
            inputMode="decimal"
            placeholder="0.00"
            {...describedBy(`sale-${name}`, errors[name])}
            className={inputClass}
          />
        </Field>
      ))}
      <Field id="sale-note" label="Note (optional)" error={errors.note} className="sm:col-span-2">
        <input
          name="note"
          maxLength={255}
          {...describedBy("sale-note", errors.note)}
          className={inputClass}
        />
      </Field>
      <div className="flex flex-wrap items-center gap-3 sm:col-span-2">
        <Button type="submit" busy={busy}>
          {busy ? "Recording…" : "Record sale"}
        </Button>
        {result ? (
          <div role="status" className="w-full">
            <Notice tone={result.tone} testId="sale-result">
              {result.text}
            </Notice>
          </div>
        ) : null}
      </div>
    </form>
  );
}
