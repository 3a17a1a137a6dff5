"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import type { VersionChosenAnswer } from "@/lib/wire/submissions";

/** Makes an earlier (or parked) version the page's current file. */
export function UseVersionButton({
  pieceId,
  pageIndex,
  versionId,
  revision,
  versionNumber,
}: {
  pieceId: number;
  pageIndex: number;
  versionId: number;
  revision: number;
  versionNumber: number;
}) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function choose() {
    setBusy(true);
    setError(null);
    try {
      await fetchJson<VersionChosenAnswer>(`/api/pieces/${pieceId}`, {
        method: "PATCH",
        json: { action: "use-version", pageIndex, versionId, expectedRevision: revision },
        failure: (status) => `That did not work (error ${status}).`,
      });
      router.refresh();
    } catch (e) {
      setError(e instanceof Error ? e.message : "That did not work.");
    } finally {
      setBusy(false);
    }
  }
  return (
    <div className="flex flex-col gap-1">
      <div>
        <Button
          variant="quiet"
          busy={busy}
          onClick={choose}
          data-testid={`use-version-${versionNumber}`}
        >
          Use version {versionNumber} for this page
        </Button>
      </div>
      {error ? <p className="text-xs font-semibold text-persimmon-dark">{error}</p> : null}
    </div>
  );
}
