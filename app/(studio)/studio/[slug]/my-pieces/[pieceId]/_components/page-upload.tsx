"use client";

import { useRouter } from "next/navigation";
import { useEffect, useId, useRef, useState, type DragEvent } from "react";
import type { ArtworkServerData } from "@/app/api/uploadthing/core";
import { Notice } from "@/components/ui/notice";
import { VerdictBadge } from "@/components/verdict-badge";
import { UNREADABLE_KEPT_EARLIER } from "@/lib/pieces/versions";
import { useArtworkUploader } from "./use-artwork-uploader";

const ACCEPT =
  ".png,.jpg,.jpeg,.tif,.tiff,.webp,.pdf,image/png,image/jpeg,image/tiff,image/webp,application/pdf";

const NOT_FINISHED = "The upload did not finish. Nothing was kept; please try again.";

type Outcome = { tone: "info" | "warn" | "error"; text: string; verdict?: string } | null;

/**
 * Uploads one file for one page (its composite, or with `ink` one ink's master), with a progress
 * bar; the page refreshes to show the new report.
 * Until the uploader is ready the control is off and says so; a file chosen or dropped meanwhile
 * is held and sent as soon as it is, so a choice is never silently lost.
 */
export function PageUpload({
  pieceId,
  pageIndex,
  ink = null,
  testKey = String(pageIndex),
  revision,
  maxMb,
  replacing,
  label,
}: {
  pieceId: number;
  pageIndex: number;
  /** The ink this control sends a master for; null for the page's composite file. */
  ink?: string | null;
  /** What the test ids end with ("1", or "1-teal" for a master). */
  testKey?: string;
  /** The revision of what this control replaces: the page's, or that ink's separation's. */
  revision: number;
  maxMb: number;
  replacing: boolean;
  label?: string;
}) {
  const what = ink ? `${ink} master` : "page";
  const router = useRouter();
  const inputId = useId();
  const input = useRef<HTMLInputElement>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const [phase, setPhase] = useState<"idle" | "sending" | "checking">("idle");
  const [outcome, setOutcome] = useState<Outcome>(null);
  const [dragging, setDragging] = useState(false);
  const [waiting, setWaiting] = useState<File | null>(null);
  // The SDK reports a failed upload here and then resolves with nothing.
  const failure = useRef<string | null>(null);
  const { state, startUpload } = useArtworkUploader({
    onUploadProgress: (p) => {
      setProgress(p);
      if (p >= 100) setPhase("checking");
    },
    onUploadError: (error) => {
      // The SDK's own words for a failure in the browser name the SDK; ours say what to do.
      failure.current = error.code === "INTERNAL_CLIENT_ERROR" ? NOT_FINISHED : error.message;
    },
  });

  async function send(file: File) {
    setOutcome(null);
    if (file.size > maxMb * 1024 * 1024) {
      setOutcome({
        tone: "error",
        text: `“${file.name}” is ${(file.size / 1048576).toFixed(1)} MB; a page file may be at most ${maxMb} MB. Export it at the print size and try again.`,
      });
      if (input.current) input.current.value = "";
      return;
    }
    setPhase("sending");
    setProgress(0);
    failure.current = null;
    try {
      const result = await startUpload([file], {
        pieceId,
        pageIndex,
        expectedRevision: revision,
        ...(ink ? { ink } : {}),
      });
      const data = result?.[0]?.serverData as ArtworkServerData | undefined;
      if (!data) throw new Error(failure.current ?? NOT_FINISHED);
      if (!data.ok) {
        setOutcome({ tone: "error", text: data.error });
      } else if (data.heldBack === "unreadable") {
        setOutcome({
          tone: "warn",
          text: `${UNREADABLE_KEPT_EARLIER} It is kept as version ${data.versionNumber} with its report below.`,
          verdict: data.verdict,
        });
      } else if (!data.current) {
        setOutcome({
          tone: "warn",
          text: ink
            ? `Another upload replaced this ${what} while yours was on its way. Yours is kept as version ${data.versionNumber}, listed below.`
            : `Another upload replaced this page while yours was on its way. Yours is kept as version ${data.versionNumber}; you can choose it below.`,
          verdict: data.verdict,
        });
      } else {
        setOutcome({
          tone: "info",
          text: ink
            ? `Version ${data.versionNumber} of the ${what} checked.`
            : `Version ${data.versionNumber} checked.`,
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

  /** Sends the file now when the uploader is ready, or holds it until it is. */
  function choose(file: File) {
    if (state === "ready") void send(file);
    else if (state === "preparing") {
      setOutcome(null);
      setWaiting(file);
    } else {
      setOutcome({
        tone: "error",
        text: `“${file.name}” was not sent: the uploader could not start. Reload the page and choose the file again.`,
      });
      if (input.current) input.current.value = "";
    }
  }

  // A file may already sit in the input before the page came alive (it was drawn on the server).
  useEffect(() => {
    const early = input.current?.files?.[0];
    if (early) setWaiting((held) => held ?? early);
  }, []);

  // Once ready, send what was chosen while waiting; if the uploader cannot start, say so.
  useEffect(() => {
    if (!waiting || state === "preparing") return;
    setWaiting(null);
    choose(waiting);
  }, [state, waiting]); // choose() is this render's, so it sees the current state

  function onDrop(event: DragEvent<HTMLDivElement>) {
    event.preventDefault();
    setDragging(false);
    const file = event.dataTransfer.files[0];
    if (file && phase === "idle" && !waiting) choose(file);
  }

  const busy = phase !== "idle";
  return (
    <div className="flex flex-col gap-2" data-testid={`upload-${testKey}`}>
      <div
        onDragOver={(e) => {
          e.preventDefault();
          setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={onDrop}
        aria-busy={state === "preparing" || undefined}
        className={`flex flex-col gap-2 rounded-md border-2 border-dashed p-3 text-sm ${dragging ? "border-teal bg-teal-light/50" : "border-ink/25"}`}
      >
        <label htmlFor={inputId} className="font-semibold">
          {label ?? (replacing ? "Replace with a new file" : "Upload the file for this page")}
        </label>
        <input
          ref={input}
          id={inputId}
          type="file"
          accept={ACCEPT}
          disabled={busy || state !== "ready"}
          aria-describedby={`${inputId}-limits`}
          data-testid={`upload-input-${testKey}`}
          onChange={(e) => {
            const file = e.target.files?.[0];
            if (file) choose(file);
          }}
          className="text-sm file:mr-3 file:rounded-md file:border-0 file:bg-ink file:px-3 file:py-1.5 file:text-paper disabled:opacity-60"
        />
        <p id={`${inputId}-limits`} className="text-xs text-ink-faint">
          PNG, JPEG, TIFF, WebP or one-page PDF · up to {maxMb} MB · or drop the file here
        </p>
      </div>
      {state === "preparing" ? (
        <p
          className="text-xs text-ink-soft"
          data-testid={`upload-waiting-${testKey}`}
          aria-live="polite"
        >
          Getting the uploader ready…
          {waiting ? ` “${waiting.name}” will be sent as soon as it is.` : ""}
        </p>
      ) : null}
      {state === "unavailable" && !outcome ? (
        <Notice tone="error" testId={`upload-unavailable-${testKey}`}>
          The uploader could not start, so files cannot be sent from this page just now. Reload the
          page to try again.
        </Notice>
      ) : null}
      {busy ? (
        <div
          className="flex items-center gap-2 text-xs"
          data-testid={`upload-progress-${testKey}`}
          aria-live="polite"
        >
          <progress
            value={progress ?? 0}
            max={100}
            className="h-2 flex-1 accent-teal"
            aria-label={ink ? `Upload progress, ${what}` : "Upload progress"}
          />
          <span className="w-40 text-right">
            {phase === "checking"
              ? "Checking against the spec…"
              : `Sending… ${Math.round(progress ?? 0)}%`}
          </span>
        </div>
      ) : null}
      {outcome ? (
        <Notice tone={outcome.tone} testId={`upload-outcome-${testKey}`}>
          <span className="inline-flex flex-wrap items-center gap-2">
            {outcome.text}
            {outcome.verdict ? <VerdictBadge verdict={outcome.verdict} /> : null}
          </span>
        </Notice>
      ) : null}
    </div>
  );
}
