"use client";

import { useState } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import type { OnboardingAnswer } from "@/lib/wire/payouts";

/** Sends the contributor to the payments service's set-up page, which brings them back here. */
export function ConnectAccount({ slug, resume }: { slug: string; resume: boolean }) {
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string>();
  async function go() {
    setBusy(true);
    setProblem(undefined);
    try {
      const { url } = await fetchJson<OnboardingAnswer>(
        `/api/anthologies/${slug}/my-payouts/account`,
        {
          method: "POST",
          json: {},
          failure: "The payout set-up could not be started.",
        },
      );
      window.location.assign(url);
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      setProblem(error.message);
      setBusy(false);
    }
  }
  return (
    <div className="flex flex-col items-start gap-2">
      <Button type="button" onClick={go} busy={busy}>
        {busy
          ? "Opening the set-up page…"
          : resume
            ? "Finish setting up payouts"
            : "Connect a payout account"}
      </Button>
      {problem ? (
        <p role="alert" className="text-sm font-semibold text-persimmon-dark">
          {problem}
        </p>
      ) : null}
    </div>
  );
}
