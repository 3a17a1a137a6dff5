"use client";

import { useState } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import type { AltTextSavedAnswer } from "@/lib/wire/submissions";

/** The page's description for readers who cannot see it; saved on its own. */
export function AltTextEditor({
  pieceId,
  pageIndex,
  initial,
}: {
  pieceId: number;
  pageIndex: number;
  initial: string;
}) {
  const [value, setValue] = useState(initial);
  const [saved, setSaved] = useState(initial);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const id = `alt-${pieceId}-${pageIndex}`;
  async function save() {
    setBusy(true);
    setMessage(null);
    try {
      await fetchJson<AltTextSavedAnswer>(`/api/pieces/${pieceId}`, {
        method: "PATCH",
        json: { action: "alt-text", pageIndex, altText: value },
        failure: (status) => `Not saved (error ${status}).`,
      });
      setSaved(value.trim());
      setMessage("Saved.");
    } catch (e) {
      if (e instanceof ApiError) setMessage(e.fieldMessage("altText") ?? e.message);
      else setMessage(e instanceof Error ? e.message : "Not saved.");
    } finally {
      setBusy(false);
    }
  }
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold">
        Description for readers who cannot see the page
      </label>
      <textarea
        id={id}
        rows={2}
        maxLength={1000}
        value={value}
        onChange={(e) => setValue(e.target.value)}
        className={inputClass}
      />
      <div className="flex items-center gap-2">
        <Button variant="quiet" busy={busy} disabled={value.trim() === saved} onClick={save}>
          Save description
        </Button>
        {message ? (
          <span className="text-xs" aria-live="polite">
            {message}
          </span>
        ) : null}
      </div>
    </div>
  );
}
