"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { LENGTH } from "@/lib/validations/limits";
import type { CreditLineSavedAnswer } from "@/lib/wire/credits";

/** The contributor's credit line, with where its approval stands; a change is asked about again by e-mail. */
export function CreditLineEditor({
  pieceId,
  initial,
  status,
  editable,
}: {
  pieceId: number;
  initial: string;
  /** "Approved on 3 Dec 2026", "Waiting for your approval (e-mailed …)", … */
  status: string;
  editable: boolean;
}) {
  const router = useRouter();
  const [value, setValue] = useState(initial);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const id = `credit-line-${pieceId}`;
  async function save() {
    setBusy(true);
    setMessage(null);
    try {
      const answer = await fetchJson<CreditLineSavedAnswer>(`/api/pieces/${pieceId}`, {
        method: "PATCH",
        json: { action: "credit-line", creditLine: value },
        failure: (status) => `Not saved (error ${status}).`,
      });
      setMessage(
        answer.asked ? "Saved. We sent you an e-mail to approve the new wording." : "Saved.",
      );
      router.refresh();
    } catch (e) {
      setMessage(
        e instanceof ApiError ? (e.fieldMessage("creditLine") ?? e.message) : "Not saved.",
      );
    } finally {
      setBusy(false);
    }
  }
  return (
    <section
      aria-labelledby={`${id}-heading`}
      className="flex flex-col gap-2"
      data-testid="credit-line-section"
    >
      <h2 id={`${id}-heading`} className="text-xl font-semibold">
        Your credit line
      </h2>
      <p className="text-sm" data-testid="credit-line-status">
        {status}
      </p>
      {editable ? (
        <div className="flex max-w-xl flex-col gap-1">
          <label htmlFor={id} className="text-sm font-semibold">
            How you are credited for this piece
          </label>
          <input
            id={id}
            className={inputClass}
            value={value}
            maxLength={LENGTH.creditLine}
            onChange={(e) => setValue(e.target.value)}
          />
          <p className="text-xs text-ink-soft">
            Changing an approved line asks you to approve the new wording by e-mail; only approved
            lines print.
          </p>
          <div className="flex items-center gap-2">
            <Button
              variant="quiet"
              busy={busy}
              disabled={value.trim() === initial.trim()}
              onClick={save}
            >
              Save credit line
            </Button>
            {message ? (
              <span className="text-xs" aria-live="polite" data-testid="credit-line-message">
                {message}
              </span>
            ) : null}
          </div>
        </div>
      ) : (
        <p className="text-sm">“{initial}”</p>
      )}
    </section>
  );
}
