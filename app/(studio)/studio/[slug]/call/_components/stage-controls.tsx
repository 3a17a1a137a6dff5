"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { ANTHOLOGY_STAGES, STAGE_LABELS, type AnthologyStage } from "@/lib/domain";
import type { StageMovedAnswer, StageRefusalAnswer } from "@/lib/wire/open-call";

const MOVE_LABELS: Record<AnthologyStage, string> = {
  planning: "Back to planning",
  "call-open": "Open the call",
  "call-closed": "Close the call",
  "laying-out": "Start laying out",
  printing: "Start printing",
  "wrapped-up": "Mark as wrapped up",
};

type Props = {
  slug: string;
  stage: AnthologyStage;
  next: AnthologyStage | null;
  /** What stops the next move; the button stays off until they are fixed. */
  problems: string[];
  /** What the editor should know before confirming. */
  cautions: string[];
  canAdvance: boolean;
};

/** Where the anthology is in its stages, and the button that moves it one step forward. */
export function StageControls({ slug, stage, next, problems, cautions, canAdvance }: Props) {
  const router = useRouter();
  const [confirming, setConfirming] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<{ text: string; problems: string[] }>();
  const current = ANTHOLOGY_STAGES.indexOf(stage);

  async function move() {
    if (!next) return;
    setBusy(true);
    setError(undefined);
    try {
      await fetchJson<StageMovedAnswer>(`/api/anthologies/${encodeURIComponent(slug)}/stage`, {
        method: "POST",
        json: { to: next },
        failure: "The stage did not move.",
        unreachable: "Could not reach Quireline. Check your connection and try again.",
      });
      setConfirming(false);
      router.refresh();
    } catch (caught) {
      if (!(caught instanceof ApiError)) throw caught;
      const { problems } = caught.body as Partial<StageRefusalAnswer>;
      setError({
        text: caught.message,
        problems: Array.isArray(problems) && problems.length > 1 ? problems : [],
      });
    } finally {
      setBusy(false);
    }
  }

  return (
    <section
      aria-labelledby="stage-heading"
      className="rounded-lg border border-ink/15 bg-white/60 p-5"
      data-testid="stage-controls"
    >
      <h2 id="stage-heading" className="text-xl font-semibold">
        Stage
      </h2>
      <ol className="mt-3 flex flex-wrap gap-2 text-sm" data-testid="stage-steps">
        {ANTHOLOGY_STAGES.map((s, n) => (
          <li
            key={s}
            aria-current={s === stage ? "step" : undefined}
            className={`rounded-full border px-3 py-1 ${
              s === stage
                ? "border-teal bg-teal text-paper"
                : n < current
                  ? "border-teal/40 text-teal-dark"
                  : "border-ink/20 text-ink-faint"
            }`}
          >
            {n < current ? "✓ " : ""}
            {STAGE_LABELS[s]}
          </li>
        ))}
      </ol>
      <p className="mt-3 text-sm" data-testid="stage-current">
        Now: <strong>{STAGE_LABELS[stage]}</strong>
      </p>
      {next && canAdvance ? (
        <div className="mt-4 flex flex-col gap-3">
          {problems.length > 0 ? (
            <Notice
              tone="warn"
              title={`Before you can ${MOVE_LABELS[next].toLowerCase()}:`}
              testId="stage-problems"
            >
              <ul className="list-disc pl-5">
                {problems.map((p) => (
                  <li key={p}>{p}</li>
                ))}
              </ul>
            </Notice>
          ) : null}
          {confirming ? (
            <div
              className="flex flex-col gap-3 rounded-md border border-ink/20 p-4"
              data-testid="stage-confirm"
            >
              <p className="text-sm">
                Move from <strong>{STAGE_LABELS[stage]}</strong> to{" "}
                <strong>{STAGE_LABELS[next]}</strong>? Stages only move forward; this cannot be
                undone.
              </p>
              {cautions.length > 0 ? (
                <ul className="list-disc pl-5 text-sm text-ink-soft" data-testid="stage-cautions">
                  {cautions.map((c) => (
                    <li key={c}>{c}</li>
                  ))}
                </ul>
              ) : null}
              <div className="flex gap-2">
                <Button type="button" variant="accent" busy={busy} onClick={move}>
                  {busy ? "Moving…" : `Yes, ${MOVE_LABELS[next].toLowerCase()}`}
                </Button>
                <Button
                  type="button"
                  variant="quiet"
                  onClick={() => setConfirming(false)}
                  disabled={busy}
                >
                  Cancel
                </Button>
              </div>
            </div>
          ) : (
            <div>
              <Button
                type="button"
                variant={next === "call-open" ? "accent" : "primary"}
                disabled={problems.length > 0}
                onClick={() => setConfirming(true)}
              >
                {MOVE_LABELS[next]}
              </Button>
            </div>
          )}
          {error ? (
            <Notice tone="error" testId="stage-error">
              {error.text}
              {error.problems.length ? (
                <ul className="mt-1 list-disc pl-5">
                  {error.problems.map((p) => (
                    <li key={p}>{p}</li>
                  ))}
                </ul>
              ) : null}
            </Notice>
          ) : null}
        </div>
      ) : null}
    </section>
  );
}
