"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";

/** What each kind of button says once its route answers 2xx. */
const DONE = {
  statements: (a: Record<string, unknown>) =>
    `${a.sent} sent, ${a.alreadySent} sent before${a.failed ? `, ${a.failed} failed` : ""}.`,
  close: (a: Record<string, unknown>) => `${a.linesWritten} lines written.`,
  pay: (a: Record<string, unknown>) =>
    a.state === "paid" ? "Paid and confirmed." : "Transfer sent; waiting for confirmation.",
} as const;

/** A button that POSTs to one route, says what happened and refreshes the screen. */
export function PostButton({
  url,
  body,
  label,
  busyLabel,
  done,
  confirm,
  variant = "quiet",
}: {
  url: string;
  body?: unknown;
  label: string;
  busyLabel: string;
  /** Which message to show after a 2xx answer. */
  done: keyof typeof DONE;
  confirm?: string;
  variant?: "primary" | "quiet" | "accent";
}) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ error: boolean; text: string }>();
  async function run() {
    if (confirm && !window.confirm(confirm)) return;
    setBusy(true);
    setMessage(undefined);
    try {
      const answer = await fetchJson<Record<string, unknown>>(url, {
        method: "POST",
        json: body ?? {},
        failure: "That did not go through.",
      });
      setMessage({ error: false, text: DONE[done](answer) });
      router.refresh();
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      setMessage({ error: true, text: error.message });
    } finally {
      setBusy(false);
    }
  }
  return (
    <span className="inline-flex flex-wrap items-center gap-2">
      <Button type="button" variant={variant} busy={busy} onClick={run}>
        {busy ? busyLabel : label}
      </Button>
      {message ? (
        <span
          role={message.error ? "alert" : "status"}
          className={`text-xs ${message.error ? "font-semibold text-persimmon-dark" : "text-ink-soft"}`}
        >
          {message.text}
        </span>
      ) : null}
    </span>
  );
}
