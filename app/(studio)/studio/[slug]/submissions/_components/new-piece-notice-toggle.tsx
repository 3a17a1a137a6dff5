"use client";

import { useMutation } from "@tanstack/react-query";
import { useState } from "react";
import { fetchJson } from "@/components/api/fetch-json";
import type { NotificationSettingsAnswer } from "@/lib/wire/review";

/** The signed-in editor's own choice: an e-mail each time a piece is submitted. */
export function NewPieceNoticeToggle({ slug, initial }: { slug: string; initial: boolean }) {
  const [on, setOn] = useState(initial);
  const mutation = useMutation({
    mutationFn: (newPieces: boolean) =>
      fetchJson<NotificationSettingsAnswer>(`/api/anthologies/${slug}/notifications`, {
        method: "PUT",
        json: { newPieces },
      }),
    onSuccess: (answer) => setOn(answer.newPieces),
  });
  return (
    <div className="flex flex-col gap-1 text-sm" data-testid="new-piece-notice">
      <label className="flex cursor-pointer items-center gap-2">
        <input
          type="checkbox"
          checked={on}
          disabled={mutation.isPending}
          onChange={(event) => mutation.mutate(event.target.checked)}
          className="h-4 w-4 accent-teal"
        />
        E-mail me about each new piece
      </label>
      <p className="text-ink-soft" aria-live="polite" data-testid="new-piece-notice-status">
        {mutation.isError
          ? `The setting did not change: ${mutation.error.message}`
          : mutation.isSuccess
            ? on
              ? "Saved: you will be e-mailed when a piece is submitted."
              : "Saved: no e-mail about new pieces."
            : "Only your own setting; other editors choose for themselves."}
      </p>
    </div>
  );
}
