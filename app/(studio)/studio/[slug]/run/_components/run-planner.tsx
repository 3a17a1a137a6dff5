"use client";

import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { timedSteps } from "@/lib/run/checklist";
import { planRun } from "@/lib/run/plan";
import { PRINT_MODE_LABELS, PRINT_MODES, type PrintMode } from "@/lib/run/batches";
import type { StepTimings } from "@/lib/run/prices";
import { parseQuantities, runPlanSchema } from "@/lib/validations/run";
import type { RunPayload, RunPlanSettings } from "@/lib/wire/run";
import { CostChart } from "./cost-chart";
import { CostTable } from "./cost-table";
import {
  draftToPrices,
  draftToQuote,
  EMPTY_PRICES,
  PACK_KEYS,
  PACK_LABELS,
  pricesToDraft,
  tiersToDraft,
  type PricesDraft,
  type TierDraft,
} from "./drafts";
import { EventsPanel } from "./events-panel";
import { fieldErrorsOf } from "./field-errors";

type TimingDraft = Record<string, { setup: string; perCopy: string }>;

function timingsToDraft(t: StepTimings, steps: RunPayload["checklist"]): TimingDraft {
  return Object.fromEntries(
    steps.map((s) => [
      s.id,
      { setup: String(t[s.id]?.setupMinutes ?? 0), perCopy: String(t[s.id]?.minutesPerCopy ?? 0) },
    ]),
  );
}

const num = (text: string) => (text.trim() === "" ? Number.NaN : Number(text));

/**
 * The run planner. Every figure is computed here by the pure engine from the form as it stands,
 * so a changed price moves the chart, the sentence and the table together; a field that does not
 * parse shows its message and the figures stay at the last sound input.
 */
export function RunPlanner({ slug, initial }: { slug: string; initial: RunPayload }) {
  const router = useRouter();
  const { counts, checklist, currency, canPlan } = initial;

  const [quantitiesText, setQuantitiesText] = useState(initial.plan.quantities.join(", "));
  const [listId, setListId] = useState<number | null>(
    initial.plan.priceListId ?? initial.priceLists[0]?.id ?? null,
  );
  const listOf = (id: number | null) => initial.priceLists.find((l) => l.id === id);
  const [listName, setListName] = useState(listOf(listId)?.name ?? "Our prices");
  const [prices, setPrices] = useState<PricesDraft>(
    pricesToDraft(listOf(listId)?.prices ?? EMPTY_PRICES),
  );
  const [quoteId, setQuoteId] = useState<number | null>(
    initial.plan.shopQuoteId ?? initial.quotes[0]?.id ?? null,
  );
  const quoteOf = (id: number | null) => initial.quotes.find((q) => q.id === id);
  const [shopName, setShopName] = useState(quoteOf(quoteId)?.shopName ?? "");
  const [tiers, setTiers] = useState<TierDraft[]>(tiersToDraft(quoteOf(quoteId)?.tiers ?? []));
  const [turnaround, setTurnaround] = useState(String(quoteOf(quoteId)?.turnaroundDays ?? 7));
  const [timings, setTimings] = useState<TimingDraft>(
    timingsToDraft(initial.plan.timings, checklist),
  );
  const [hoursText, setHoursText] = useState(String(initial.plan.minutesPerWeek / 60));
  const [printMode, setPrintMode] = useState<PrintMode>(initial.plan.printMode);
  const [status, setStatus] = useState<{ tone: "info" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState<string | null>(null);
  const [serverErrors, setServerErrors] = useState<Record<string, string>>({});

  // Parse every input; each part keeps its own field messages.
  const quantities = parseQuantities(quantitiesText);
  const priceParse = draftToPrices(prices);
  const quoteParse =
    quoteId === null && shopName.trim() === "" && tiers.length === 0
      ? null
      : draftToQuote(shopName, tiers, turnaround);
  const timingValues: StepTimings = {};
  const timingErrors: Record<string, string> = {};
  for (const s of checklist) {
    const t = timings[s.id] ?? { setup: "0", perCopy: "0" };
    const setupMinutes = num(t.setup);
    const minutesPerCopy = num(t.perCopy);
    if (!(setupMinutes >= 0)) timingErrors[`${s.id}.setup`] = "Minutes cannot be negative or empty";
    if (!(minutesPerCopy >= 0))
      timingErrors[`${s.id}.perCopy`] = "Minutes cannot be negative or empty";
    timingValues[s.id] = { setupMinutes, minutesPerCopy };
  }
  const hoursValue = num(hoursText);
  const settings = {
    quantities: quantities ?? [],
    priceListId: listId,
    shopQuoteId: quoteId,
    timings: timingValues,
    minutesPerWeek: Math.round(hoursValue * 60),
    printMode,
  } satisfies RunPlanSettings;
  const settingsParse = runPlanSchema.safeParse(settings);
  const planErrors = settingsParse.success ? {} : fieldErrorsOf(settingsParse.error);
  const quantityError =
    quantities === undefined
      ? "Type whole numbers of copies, separated by commas"
      : (planErrors.quantities ??
        Object.entries(planErrors).find(([k]) => k.startsWith("quantities."))?.[1]);
  const hoursError = !(hoursValue >= 0)
    ? "Give the hours as a number, 0 or more"
    : planErrors.minutesPerWeek;

  const steps = useMemo(
    () => timedSteps(checklist, timingValues),
    [checklist, JSON.stringify(timingValues)],
  );
  const sound =
    priceParse.ok &&
    (quoteParse === null || quoteParse.ok) &&
    quantityError === undefined &&
    Object.keys(timingErrors).length === 0;
  const inputs = sound
    ? {
        counts,
        prices: priceParse.prices,
        steps,
        quote: quoteParse && quoteParse.ok ? quoteParse.quote : null,
        printRuns: printMode === "per-batch" ? Math.max(1, initial.events.length) : 1,
      }
    : null;
  const inputsKey = JSON.stringify(inputs && { ...inputs, q: quantities });
  const [lastPlan, setLastPlan] = useState<{
    key: string;
    plan: ReturnType<typeof planRun>;
  } | null>(null);
  const plan = useMemo(() => {
    if (!inputs || !quantities || quantities.length === 0) return null;
    return planRun(inputs, quantities);
  }, [inputsKey]);
  if (plan && lastPlan?.key !== inputsKey) setLastPlan({ key: inputsKey, plan });
  const shown = plan ?? lastPlan?.plan ?? null;

  const priceErrors = priceParse.ok ? {} : priceParse.errors;
  const quoteErrors = quoteParse && !quoteParse.ok ? quoteParse.errors : {};
  const err = (key: string) => serverErrors[key] ?? priceErrors[key] ?? quoteErrors[key];

  async function run(label: string, action: () => Promise<string>) {
    setBusy(label);
    setStatus(null);
    setServerErrors({});
    try {
      const message = await action();
      setStatus({ tone: "info", text: message });
      router.refresh();
    } catch (error) {
      if (error instanceof ApiError) {
        setServerErrors(
          Object.fromEntries(Object.entries(error.fields).map(([k, v]) => [k, v[0] ?? ""])),
        );
        setStatus({ tone: "error", text: error.message });
      } else throw error;
    } finally {
      setBusy(null);
    }
  }

  const base = `/api/anthologies/${slug}/run`;
  const savePrices = (asNew: boolean) =>
    run("prices", async () => {
      if (!priceParse.ok) throw new ApiError("Some prices need attention.", 400);
      const body = { name: listName, prices: priceParse.prices };
      const answer = await fetchJson<{ id: number }>(
        asNew || listId === null ? `${base}/price-lists` : `${base}/price-lists/${listId}`,
        { method: asNew || listId === null ? "POST" : "PUT", json: body },
      );
      setListId(answer.id);
      await fetchJson(base, { method: "PUT", json: { ...settings, priceListId: answer.id } });
      return `Price list “${listName}” saved for ${initial.pressName ?? "your press"}.`;
    });
  const saveQuote = (asNew: boolean) =>
    run("quote", async () => {
      if (!quoteParse || !quoteParse.ok) throw new ApiError("The quote needs attention.", 400);
      const answer = await fetchJson<{ id: number }>(
        asNew || quoteId === null ? `${base}/quotes` : `${base}/quotes/${quoteId}`,
        { method: asNew || quoteId === null ? "POST" : "PUT", json: quoteParse.quote },
      );
      setQuoteId(answer.id);
      await fetchJson(base, { method: "PUT", json: { ...settings, shopQuoteId: answer.id } });
      return `Quote from ${quoteParse.quote.shopName} saved.`;
    });
  const savePlan = () =>
    run("plan", async () => {
      if (!settingsParse.success) throw new ApiError("Some fields need attention.", 400);
      await fetchJson(base, { method: "PUT", json: settingsParse.data });
      return "Plan saved.";
    });

  const pickList = (id: number | null) => {
    setListId(id);
    const l = listOf(id);
    setListName(l?.name ?? "New price list");
    setPrices(pricesToDraft(l?.prices ?? EMPTY_PRICES));
  };
  const pickQuote = (id: number | null) => {
    setQuoteId(id);
    const q = quoteOf(id);
    setShopName(q?.shopName ?? "");
    setTiers(tiersToDraft(q?.tiers ?? []));
    setTurnaround(String(q?.turnaroundDays ?? 7));
  };

  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="copy-heading" className="flex flex-col gap-2">
        <h2 id="copy-heading" className="text-xl font-bold">
          What one copy takes
        </h2>
        <p className="text-sm text-ink-soft">
          Counted from the page map ({counts.laidOutPages} pages laid out) and the print method.
        </p>
        <dl
          className="grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-4"
          data-testid="copy-counts"
        >
          <dt className="text-ink-soft">Text sheets</dt>
          <dd>{counts.insideSheets}</dd>
          <dt className="text-ink-soft">Cover sheets</dt>
          <dd>{counts.coverSheets}</dd>
          <dt className="text-ink-soft">Printed sides</dt>
          <dd>{counts.printedSides}</dd>
          <dt className="text-ink-soft">{counts.duplicator ? "Drum passes" : "Passes"}</dt>
          <dd>{counts.passes}</dd>
          {counts.duplicator ? (
            <>
              <dt className="text-ink-soft">Masters a run</dt>
              <dd>{counts.mastersPerRun}</dd>
            </>
          ) : null}
          <dt className="text-ink-soft">Staples</dt>
          <dd>{counts.staples}</dd>
        </dl>
      </section>

      <section aria-labelledby="compare-heading" className="flex flex-col gap-4" aria-live="polite">
        <h2 id="compare-heading" className="text-xl font-bold">
          Ourselves, copy shop or print shop
        </h2>
        {!shown ? (
          <Notice tone="info" testId="run-empty">
            Enter at least one quantity and sound prices to see the comparison.
          </Notice>
        ) : (
          <>
            {!sound ? (
              <Notice tone="warn" testId="run-stale">
                Some fields need attention; the figures below are from the last sound entries.
              </Notice>
            ) : null}
            <p className="text-base font-semibold" data-testid="run-summary">
              {shown.comparison.summary}
            </p>
            {shown.comparison.breakEvens.length > 0 ? (
              <p className="text-sm text-ink-soft" data-testid="run-break-evens">
                Break-even:{" "}
                {shown.comparison.breakEvens.map((b) => `${b.copies} copies`).join(" and ")}.
              </p>
            ) : null}
            <CostChart plan={shown} currency={currency} />
            <CostTable plan={shown} currency={currency} duplicator={counts.duplicator} />
          </>
        )}
      </section>

      <section aria-labelledby="weigh-heading" className="flex flex-col gap-4">
        <h2 id="weigh-heading" className="text-xl font-bold">
          Quantities and finishing time
        </h2>
        <Field
          id="quantities"
          label="Quantities to weigh"
          hint="Copies, separated by commas: 10, 25, 50, 100, 250"
          error={quantityError}
        >
          <input
            {...describedBy("quantities", quantityError)}
            className={inputClass}
            value={quantitiesText}
            onChange={(e) => setQuantitiesText(e.target.value)}
            disabled={!canPlan}
            inputMode="numeric"
          />
        </Field>
        <fieldset className="flex flex-col gap-2">
          <legend className="text-sm font-semibold">Minutes for each finishing step</legend>
          <p className="text-xs text-ink-faint">
            Your own timings: set-up once a batch, then per copy.
          </p>
          {checklist.map((s) => (
            <div
              key={s.id}
              className="grid grid-cols-1 gap-2 sm:grid-cols-[12rem_1fr_1fr] sm:items-end"
            >
              <span className="text-sm">{s.label}</span>
              {(["setup", "perCopy"] as const).map((part) => {
                const id = `timing-${s.id}-${part}`;
                const e = timingErrors[`${s.id}.${part}`];
                return (
                  <Field
                    key={part}
                    id={id}
                    label={
                      part === "setup" ? `${s.label}: set-up minutes` : `${s.label}: minutes a copy`
                    }
                    error={e}
                  >
                    <input
                      {...describedBy(id, e)}
                      className={inputClass}
                      inputMode="decimal"
                      value={timings[s.id]?.[part] ?? "0"}
                      disabled={!canPlan}
                      onChange={(ev) =>
                        setTimings((t) => ({
                          ...t,
                          [s.id]: {
                            ...(t[s.id] ?? { setup: "0", perCopy: "0" }),
                            [part]: ev.target.value,
                          },
                        }))
                      }
                    />
                  </Field>
                );
              })}
            </div>
          ))}
        </fieldset>
        <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
          <Field id="hours" label="Finishers' hours a week, all together" error={hoursError}>
            <input
              {...describedBy("hours", hoursError)}
              className={inputClass}
              inputMode="decimal"
              value={hoursText}
              disabled={!canPlan}
              onChange={(e) => setHoursText(e.target.value)}
            />
          </Field>
          <Field id="print-mode" label="Printing">
            <select
              {...describedBy("print-mode")}
              className={inputClass}
              value={printMode}
              disabled={!canPlan}
              onChange={(e) => setPrintMode(e.target.value as PrintMode)}
            >
              {PRINT_MODES.map((m) => (
                <option key={m} value={m}>
                  {PRINT_MODE_LABELS[m]}
                </option>
              ))}
            </select>
          </Field>
        </div>
        {canPlan ? (
          <div>
            <Button type="button" onClick={savePlan} busy={busy === "plan"}>
              Save the plan
            </Button>
          </div>
        ) : null}
      </section>

      <section aria-labelledby="prices-heading" className="flex flex-col gap-4">
        <h2 id="prices-heading" className="text-xl font-bold">
          Price list
        </h2>
        <p className="text-sm text-ink-soft">
          Kept for {initial.pressName ?? "your own anthologies"} and reused by its next anthology.
          Amounts in {currency}.
        </p>
        <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
          <Field id="price-list" label="Price list">
            <select
              {...describedBy("price-list")}
              className={inputClass}
              value={listId ?? ""}
              onChange={(e) => pickList(e.target.value === "" ? null : Number(e.target.value))}
            >
              {initial.priceLists.map((l) => (
                <option key={l.id} value={l.id}>
                  {l.name}
                </option>
              ))}
              <option value="">A new price list</option>
            </select>
          </Field>
          <Field id="price-list-name" label="Name of the list" error={serverErrors.name}>
            <input
              {...describedBy("price-list-name", serverErrors.name)}
              className={inputClass}
              value={listName}
              disabled={!canPlan}
              onChange={(e) => setListName(e.target.value)}
            />
          </Field>
        </div>
        <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
          {PACK_KEYS.map((k) => {
            const priceError = err(`prices.${k}.priceCents`) ?? err(`${k}.priceCents`);
            const perError = err(`prices.${k}.perQuantity`) ?? err(`${k}.perQuantity`);
            return (
              <fieldset key={k} className="grid grid-cols-2 gap-2">
                <legend className="col-span-2 text-sm font-semibold">{PACK_LABELS[k].label}</legend>
                <Field id={`price-${k}`} label="Price" error={priceError}>
                  <input
                    {...describedBy(`price-${k}`, priceError)}
                    className={inputClass}
                    inputMode="decimal"
                    value={prices[k].price}
                    disabled={!canPlan}
                    onChange={(e) =>
                      setPrices((p) => ({ ...p, [k]: { ...p[k], price: e.target.value } }))
                    }
                  />
                </Field>
                <Field id={`per-${k}`} label={`For (${PACK_LABELS[k].per})`} error={perError}>
                  <input
                    {...describedBy(`per-${k}`, perError)}
                    className={inputClass}
                    inputMode="numeric"
                    value={prices[k].per}
                    disabled={!canPlan}
                    onChange={(e) =>
                      setPrices((p) => ({ ...p, [k]: { ...p[k], per: e.target.value } }))
                    }
                  />
                </Field>
              </fieldset>
            );
          })}
          <Field
            id="price-rate"
            label="Finishing time, per hour"
            hint="0 counts your time as free"
            error={err("finishingCentsPerHour")}
          >
            <input
              {...describedBy("price-rate", err("finishingCentsPerHour"))}
              className={inputClass}
              inputMode="decimal"
              value={prices.rate}
              disabled={!canPlan}
              onChange={(e) => setPrices((p) => ({ ...p, rate: e.target.value }))}
            />
          </Field>
          <Field
            id="price-spoilage"
            label="Spoilage, percent of sheets"
            hint="Extra sheets for misfeeds and bad copies"
            error={err("spoilageBasisPoints")}
          >
            <input
              {...describedBy("price-spoilage", err("spoilageBasisPoints"))}
              className={inputClass}
              inputMode="decimal"
              value={prices.spoilage}
              disabled={!canPlan}
              onChange={(e) => setPrices((p) => ({ ...p, spoilage: e.target.value }))}
            />
          </Field>
        </div>
        {canPlan ? (
          <div className="flex flex-wrap gap-2">
            <Button
              type="button"
              onClick={() => savePrices(false)}
              busy={busy === "prices"}
              disabled={!priceParse.ok}
            >
              {listId === null ? "Save this price list" : "Save changes to this list"}
            </Button>
            {listId !== null ? (
              <Button
                type="button"
                variant="quiet"
                onClick={() => savePrices(true)}
                disabled={!priceParse.ok || busy !== null}
              >
                Save as a new list
              </Button>
            ) : null}
          </div>
        ) : null}
      </section>

      <section aria-labelledby="quote-heading" className="flex flex-col gap-4">
        <h2 id="quote-heading" className="text-xl font-bold">
          Print shop quote
        </h2>
        <div className="grid grid-cols-1 gap-4 sm:grid-cols-3">
          <Field id="quote" label="Quote">
            <select
              {...describedBy("quote")}
              className={inputClass}
              value={quoteId ?? ""}
              onChange={(e) => pickQuote(e.target.value === "" ? null : Number(e.target.value))}
            >
              {initial.quotes.map((q) => (
                <option key={q.id} value={q.id}>
                  {q.shopName}
                </option>
              ))}
              <option value="">A new quote</option>
            </select>
          </Field>
          <Field id="shop-name" label="Shop" error={err("shopName")}>
            <input
              {...describedBy("shop-name", err("shopName"))}
              className={inputClass}
              value={shopName}
              disabled={!canPlan}
              onChange={(e) => setShopName(e.target.value)}
            />
          </Field>
          <Field id="turnaround" label="Turnaround, days" error={err("turnaroundDays")}>
            <input
              {...describedBy("turnaround", err("turnaroundDays"))}
              className={inputClass}
              inputMode="numeric"
              value={turnaround}
              disabled={!canPlan}
              onChange={(e) => setTurnaround(e.target.value)}
            />
          </Field>
        </div>
        <fieldset className="flex flex-col gap-2">
          <legend className="text-sm font-semibold">
            Price tiers: finished copies and the total
          </legend>
          {err("tiers") ? (
            <p className="text-xs font-semibold text-persimmon-dark" data-testid="error-tiers">
              {err("tiers")}
            </p>
          ) : null}
          {tiers.map((t, i) => (
            <div key={i} className="grid grid-cols-2 items-end gap-2 sm:grid-cols-[1fr_1fr_auto]">
              <Field
                id={`tier-${i}-copies`}
                label={`Tier ${i + 1}: copies`}
                error={err(`tiers.${i}.copies`)}
              >
                <input
                  {...describedBy(`tier-${i}-copies`, err(`tiers.${i}.copies`))}
                  className={inputClass}
                  inputMode="numeric"
                  value={t.copies}
                  disabled={!canPlan}
                  onChange={(e) =>
                    setTiers((all) =>
                      all.map((x, j) => (j === i ? { ...x, copies: e.target.value } : x)),
                    )
                  }
                />
              </Field>
              <Field
                id={`tier-${i}-total`}
                label={`Tier ${i + 1}: total`}
                error={err(`tiers.${i}.totalCents`)}
              >
                <input
                  {...describedBy(`tier-${i}-total`, err(`tiers.${i}.totalCents`))}
                  className={inputClass}
                  inputMode="decimal"
                  value={t.total}
                  disabled={!canPlan}
                  onChange={(e) =>
                    setTiers((all) =>
                      all.map((x, j) => (j === i ? { ...x, total: e.target.value } : x)),
                    )
                  }
                />
              </Field>
              {canPlan ? (
                <Button
                  type="button"
                  variant="quiet"
                  className="col-span-2 sm:col-span-1"
                  onClick={() => setTiers((all) => all.filter((_, j) => j !== i))}
                >
                  Remove tier {i + 1}
                </Button>
              ) : null}
            </div>
          ))}
          {canPlan ? (
            <div className="flex flex-wrap gap-2">
              <Button
                type="button"
                variant="quiet"
                onClick={() => setTiers((all) => [...all, { copies: "", total: "" }])}
              >
                Add a tier
              </Button>
              <Button
                type="button"
                onClick={() => saveQuote(false)}
                busy={busy === "quote"}
                disabled={!quoteParse?.ok}
              >
                {quoteId === null ? "Save this quote" : "Save changes to this quote"}
              </Button>
            </div>
          ) : null}
        </fieldset>
      </section>

      {status ? (
        <div role="status">
          <Notice tone={status.tone} testId="run-status">
            {status.text}
          </Notice>
        </div>
      ) : null}

      <EventsPanel
        slug={slug}
        initial={initial}
        steps={steps}
        minutesPerWeek={
          Number.isFinite(hoursValue) && hoursValue >= 0 ? Math.round(hoursValue * 60) : 0
        }
        turnaroundDays={quoteParse && quoteParse.ok ? quoteParse.quote.turnaroundDays : null}
      />
    </div>
  );
}
