"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import type { PieceWithdrawnAnswer } from "@/lib/wire/submissions";

/** Withdraw the piece, after a confirmation step that says what it means. */
export function WithdrawPiece({ pieceId, title }: { pieceId: number; title: string }) {
  const router = useRouter();
  const [asking, setAsking] = useState(false);
  const [reason, setReason] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function withdraw() {
    setBusy(true);
    setError(null);
    try {
      await fetchJson<PieceWithdrawnAnswer>(`/api/pieces/${pieceId}`, {
        method: "PATCH",
        json: { action: "withdraw", reason: reason.trim() || undefined },
        failure: (status) => `The piece could not be withdrawn (error ${status}).`,
      });
      setAsking(false);
      router.refresh();
    } catch (e) {
      setError(e instanceof Error ? e.message : "The piece could not be withdrawn.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <section
      aria-labelledby="withdraw-heading"
      className="flex max-w-xl flex-col gap-2 border-t border-ink/10 pt-4"
    >
      <h2 id="withdraw-heading" className="text-lg font-semibold">
        Withdraw this piece
      </h2>
      {!asking ? (
        <div>
          <Button variant="quiet" onClick={() => setAsking(true)} data-testid="withdraw-start">
            Withdraw…
          </Button>
        </div>
      ) : (
        <div
          className="flex flex-col gap-2 rounded-md border border-persimmon/40 bg-persimmon-light/30 p-3"
          role="group"
          aria-label="Confirm withdrawal"
        >
          <p className="text-sm">
            Withdrawing “{title}” takes it out of this call for good: the editors will no longer
            consider it, and it no longer counts towards your pieces. Your files stay visible to
            you.
          </p>
          <label className="text-sm font-semibold" htmlFor="withdraw-reason">
            A word to the editors (optional)
          </label>
          <textarea
            id="withdraw-reason"
            rows={2}
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            maxLength={500}
            className={inputClass}
          />
          <div className="flex gap-2">
            <Button variant="accent" busy={busy} onClick={withdraw} data-testid="withdraw-confirm">
              {busy ? "Withdrawing…" : "Yes, withdraw it"}
            </Button>
            <Button variant="quiet" onClick={() => setAsking(false)} disabled={busy}>
              Keep it in
            </Button>
          </div>
        </div>
      )}
      {error ? (
        <Notice tone="error" testId="withdraw-error">
          {error}
        </Notice>
      ) : null}
    </section>
  );
}
