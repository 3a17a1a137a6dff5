"use client";

import { generateReactHelpers } from "@uploadthing/react";
import { useRouter } from "next/navigation";
import { useId, useRef, useState, type DragEvent } from "react";
import type { ArtworkServerData, UploadRouter } from "@/app/api/uploadthing/core";
import { Notice } from "@/components/ui/notice";
import { VerdictBadge } from "@/components/verdict-badge";

const { useUploadThing } = generateReactHelpers<UploadRouter>({ url: "/api/uploadthing" });

const ACCEPT =
  ".png,.jpg,.jpeg,.tif,.tiff,.webp,.pdf,image/png,image/jpeg,image/tiff,image/webp,application/pdf";

type Outcome = { tone: "info" | "warn" | "error"; text: string; verdict?: string } | null;

/** Uploads one file for one page, with a progress bar; the page refreshes to show the new report. */
export function PageUpload({
  pieceId,
  pageIndex,
  revision,
  maxMb,
  replacing,
}: {
  pieceId: number;
  pageIndex: number;
  revision: number;
  maxMb: number;
  replacing: boolean;
}) {
  const router = useRouter();
  const inputId = useId();
  const input = useRef<HTMLInputElement>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const [phase, setPhase] = useState<"idle" | "sending" | "checking">("idle");
  const [outcome, setOutcome] = useState<Outcome>(null);
  const [dragging, setDragging] = useState(false);
  const { startUpload } = useUploadThing("artworkPage", {
    uploadProgressGranularity: "fine",
    onUploadProgress: (p) => {
      setProgress(p);
      if (p >= 100) setPhase("checking");
    },
  });

  async function send(file: File) {
    setOutcome(null);
    if (file.size > maxMb * 1024 * 1024) {
      setOutcome({
        tone: "error",
        text: `“${file.name}” is ${(file.size / 1048576).toFixed(1)} MB; a page file may be at most ${maxMb} MB. Export it at the print size and try again.`,
      });
      return;
    }
    setPhase("sending");
    setProgress(0);
    try {
      const result = await startUpload([file], { pieceId, pageIndex, expectedRevision: revision });
      const data = result?.[0]?.serverData as ArtworkServerData | undefined;
      if (!data) throw new Error("The upload did not finish. Nothing was kept; please try again.");
      if (!data.ok) {
        setOutcome({ tone: "error", text: data.error });
      } else if (!data.current) {
        setOutcome({
          tone: "warn",
          text: `Another upload replaced this page while yours was on its way. Yours is kept as version ${data.versionNumber}; you can choose it below.`,
          verdict: data.verdict,
        });
      } else {
        setOutcome({
          tone: "info",
          text: `Version ${data.versionNumber} checked.`,
          verdict: data.verdict,
        });
      }
      router.refresh();
    } catch (error) {
      setOutcome({
        tone: "error",
        text:
          error instanceof Error
            ? error.message
            : "The upload failed. Nothing was kept; please try again.",
      });
    } finally {
      setPhase("idle");
      setProgress(null);
      if (input.current) input.current.value = "";
    }
  }

  function onDrop(event: DragEvent<HTMLDivElement>) {
    event.preventDefault();
    setDragging(false);
    const file = event.dataTransfer.files[0];
    if (file && phase === "idle") void send(file);
  }

  const busy = phase !== "idle";
  return (
    <div className="flex flex-col gap-2" data-testid={`upload-${pageIndex}`}>
      <div
        onDragOver={(e) => {
          e.preventDefault();
          setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={onDrop}
        className={`flex flex-col gap-2 rounded-md border-2 border-dashed p-3 text-sm ${dragging ? "border-teal bg-teal-light/50" : "border-ink/25"}`}
      >
        <label htmlFor={inputId} className="font-semibold">
          {replacing ? "Replace with a new file" : "Upload the file for this page"}
        </label>
        <input
          ref={input}
          id={inputId}
          type="file"
          accept={ACCEPT}
          disabled={busy}
          aria-describedby={`${inputId}-limits`}
          data-testid={`upload-input-${pageIndex}`}
          onChange={(e) => {
            const file = e.target.files?.[0];
            if (file) void send(file);
          }}
          className="text-sm file:mr-3 file:rounded-md file:border-0 file:bg-ink file:px-3 file:py-1.5 file:text-paper disabled:opacity-60"
        />
        <p id={`${inputId}-limits`} className="text-xs text-ink-faint">
          PNG, JPEG, TIFF, WebP or one-page PDF · up to {maxMb} MB · or drop the file here
        </p>
      </div>
      {busy ? (
        <div
          className="flex items-center gap-2 text-xs"
          data-testid={`upload-progress-${pageIndex}`}
          aria-live="polite"
        >
          <progress
            value={progress ?? 0}
            max={100}
            className="h-2 flex-1 accent-teal"
            aria-label="Upload progress"
          />
          <span className="w-40 text-right">
            {phase === "checking"
              ? "Checking against the spec…"
              : `Sending… ${Math.round(progress ?? 0)}%`}
          </span>
        </div>
      ) : null}
      {outcome ? (
        <Notice tone={outcome.tone} testId={`upload-outcome-${pageIndex}`}>
          <span className="inline-flex flex-wrap items-center gap-2">
            {outcome.text}
            {outcome.verdict ? <VerdictBadge verdict={outcome.verdict} /> : null}
          </span>
        </Notice>
      ) : null}
    </div>
  );
}
