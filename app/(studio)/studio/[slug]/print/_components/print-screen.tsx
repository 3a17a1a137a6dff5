"use client";

import Link from "next/link";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useId, useState } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { inputClass } from "@/components/ui/field";
import { formatDateTime } from "@/lib/dates";
import { formatBytes } from "@/lib/format";
import type { PrintOutputKind } from "@/lib/domain";
import type {
  PreflightEntry,
  PrintFilesAnswer,
  PrintOutputView,
  ProduceAnswer,
  ProduceRefusedAnswer,
} from "@/lib/wire/print-files";

const KIND_LABELS: Record<PrintOutputKind, string> = {
  print: "Print file (imposed on the press sheet)",
  master: "Masters for one ink",
  proof: "Reader proof (spread by spread)",
  credits: "Credits page",
};

function kindLabel(o: PrintOutputView) {
  return o.kind === "master" && o.ink ? `Masters for ${o.ink}` : KIND_LABELS[o.kind];
}

const filesKey = (slug: string) => ["print-files", slug] as const;

export function PrintScreen({ slug, initial }: { slug: string; initial: PrintFilesAnswer }) {
  const queryClient = useQueryClient();
  const query = useQuery({
    queryKey: filesKey(slug),
    queryFn: ({ signal }) =>
      fetchJson<PrintFilesAnswer>(`/api/anthologies/${slug}/print-files`, { signal }),
    initialData: initial,
    // While anything is queued or running, ask again about every second for its progress.
    refetchInterval: (q) =>
      q.state.data?.outputs.some((o) => o.state === "queued" || o.state === "running")
        ? 1000
        : false,
  });
  const data = query.data;
  const active = data.outputs.filter((o) => o.state === "queued" || o.state === "running");
  const done = data.outputs.filter((o) => o.state === "done");
  const failed = data.outputs.filter(
    (o) =>
      o.state === "failed" &&
      !done.some((d) => d.kind === o.kind && d.ink === o.ink && d.createdAt > o.createdAt),
  );

  return (
    <div className="flex flex-col gap-6">
      {query.isError ? (
        <Notice tone="error" testId="print-refresh-error">
          The list could not be refreshed: {query.error.message}. It shows what was last known.
        </Notice>
      ) : null}
      <PreflightList entries={data.preflight.entries} />
      {data.canProduce ? (
        <ProduceForm
          slug={slug}
          data={data}
          running={active.length > 0}
          onQueued={(outputs) => {
            // Show the queued outputs at once; the polling then follows their progress.
            if (outputs.length)
              queryClient.setQueryData<PrintFilesAnswer>(filesKey(slug), (old) =>
                old
                  ? {
                      ...old,
                      outputs: [
                        ...outputs,
                        ...old.outputs.filter((o) => !outputs.some((n) => n.id === o.id)),
                      ],
                    }
                  : old,
              );
            else void queryClient.invalidateQueries({ queryKey: filesKey(slug) });
          }}
        />
      ) : (
        <p className="text-sm text-ink-soft">
          Only editors produce print files; you can download them.
        </p>
      )}
      <section aria-labelledby="print-progress" className="flex flex-col gap-2">
        <h2 id="print-progress" className="text-xl font-bold">
          Being made
        </h2>
        {active.length === 0 ? (
          <p className="text-sm text-ink-soft">Nothing is being made right now.</p>
        ) : (
          <ul className="flex flex-col gap-3" data-testid="print-progress-list">
            {active.map((o) => (
              <li key={o.id}>
                <Progress output={o} />
              </li>
            ))}
          </ul>
        )}
      </section>
      {failed.length ? (
        <section aria-labelledby="print-failed" className="flex flex-col gap-2">
          <h2 id="print-failed" className="text-xl font-bold">
            Runs that failed
          </h2>
          <ul className="flex flex-col gap-2">
            {failed.map((o) => (
              <li key={o.id}>
                <Notice tone="error" testId="print-failed" title={kindLabel(o)}>
                  <p className="break-words">{o.error ?? "It stopped without saying why."}</p>
                  <p className="mt-1 text-ink-soft">
                    Asked for {formatDateTime(new Date(o.createdAt))}, map version {o.mapVersion}.
                    The last good file of this kind, if any, is still listed below.
                  </p>
                </Notice>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <section aria-labelledby="print-finished" className="flex flex-col gap-2">
        <h2 id="print-finished" className="text-xl font-bold">
          Finished files
        </h2>
        {done.length === 0 ? (
          <p className="text-sm text-ink-soft" data-testid="print-none">
            No print files yet. Once the list above has nothing to fix, produce them here.
          </p>
        ) : (
          <ul className="flex flex-col gap-2" data-testid="print-finished-list">
            {done.map((o) => (
              <li key={o.id} className="rounded-md border border-ink/15 px-4 py-3 text-sm">
                <p className="font-semibold">{kindLabel(o)}</p>
                <p className="break-all font-mono text-xs">{o.fileName}</p>
                <p className="text-ink-soft">
                  {o.sizeBytes !== null ? formatBytes(o.sizeBytes) : "size unknown"},{" "}
                  {o.pageCount ?? "?"} {o.pageCount === 1 ? "page" : "pages"}
                  {o.sheetName ? `, on ${o.sheetName}` : ""}; made{" "}
                  {o.finishedAt ? formatDateTime(new Date(o.finishedAt)) : "—"} from map version{" "}
                  {o.mapVersion}
                </p>
                {o.staleAt ? (
                  <p className="font-semibold text-persimmon-dark" data-testid="print-stale">
                    Stale: the map or a file changed since ({formatDateTime(new Date(o.staleAt))}).
                    Produce again for files that match.
                  </p>
                ) : null}
                {o.downloadUrl ? (
                  <a href={o.downloadUrl} className="font-semibold" download>
                    Download {o.kind === "proof" ? "the proof" : "the print file"}
                    <span className="sr-only"> ({o.fileName})</span>
                  </a>
                ) : null}
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}

function PreflightList({ entries }: { entries: PreflightEntry[] }) {
  const blockers = entries.filter((e) => e.severity === "blocker").length;
  return (
    <section aria-labelledby="preflight" className="flex flex-col gap-2">
      <h2 id="preflight" className="text-xl font-bold">
        Before printing
      </h2>
      {entries.length === 0 ? (
        <Notice tone="info" testId="preflight-clear">
          Nothing to fix: every piece is placed and every file passes.
        </Notice>
      ) : (
        <>
          <p className="text-sm text-ink-soft">
            {blockers
              ? `${blockers} must be fixed before the files can be made; warnings may be left as they are.`
              : "Only warnings: the files can be made as they are."}
          </p>
          <ul className="flex flex-col gap-2" data-testid="preflight-list">
            {entries.map((e, i) => (
              <li
                key={`${e.code}-${i}`}
                className={`rounded-md border px-4 py-2 text-sm ${e.severity === "blocker" ? "border-persimmon/50 bg-persimmon-light/60" : "border-mustard bg-mustard-light/70"}`}
              >
                <span className="font-semibold">
                  {e.severity === "blocker" ? "Must fix: " : "Warning: "}
                </span>
                {e.message}{" "}
                <Link href={e.fixHref} className="font-semibold">
                  Fix this
                  <span className="sr-only"> ({e.message})</span>
                </Link>
              </li>
            ))}
          </ul>
        </>
      )}
    </section>
  );
}

function Progress({ output }: { output: PrintOutputView }) {
  const total = Math.max(output.pagesTotal, 1);
  const pct = Math.round((100 * output.pagesDone) / total);
  const label = `${kindLabel(output)}: ${output.state === "queued" ? "waiting to start" : `${output.pagesDone} of ${output.pagesTotal} pages placed`}`;
  return (
    <div className="flex flex-col gap-1 text-sm" data-testid="print-progress">
      <p>{label}</p>
      <div
        role="progressbar"
        aria-label={kindLabel(output)}
        aria-valuemin={0}
        aria-valuemax={output.pagesTotal}
        aria-valuenow={output.pagesDone}
        aria-valuetext={label}
        className="h-3 w-full overflow-hidden rounded-full bg-paper-deep ring-1 ring-ink/20"
      >
        <div className="h-full bg-teal-dark transition-[width]" style={{ width: `${pct}%` }} />
      </div>
    </div>
  );
}

function ProduceForm({
  slug,
  data,
  running,
  onQueued,
}: {
  slug: string;
  data: PrintFilesAnswer;
  running: boolean;
  onQueued: (outputs: PrintOutputView[]) => void;
}) {
  const id = useId();
  const [choice, setChoice] = useState<string>(data.defaultSheetId ?? "custom");
  const [width, setWidth] = useState("");
  const [height, setHeight] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string>();
  const blocked = !data.preflight.ok;
  const reason = blocked
    ? `Fix the ${data.preflight.blockers === 1 ? "item" : `${data.preflight.blockers} items`} marked “must fix” first.`
    : running
      ? "The files asked for last are still being made."
      : null;
  const needed = data.neededSheetMm;

  const produce = async () => {
    setError(undefined);
    let sheet: string | { widthMm: number; heightMm: number } = choice;
    if (choice === "custom") {
      const w = Number(width);
      const h = Number(height);
      if (!(w > 0) || !(h > 0))
        return setError("Give the custom sheet's width and height in millimetres.");
      sheet = { widthMm: w, heightMm: h };
    }
    setBusy(true);
    try {
      const answer = await fetchJson<ProduceAnswer>(`/api/anthologies/${slug}/print-files`, {
        method: "POST",
        json: { sheet },
      });
      onQueued(answer.outputs);
    } catch (e) {
      if (e instanceof ApiError) {
        const refused = e.body as Partial<ProduceRefusedAnswer> | undefined;
        setError(e.fields?.sheet?.[0] ?? e.message);
        if (refused?.preflight) onQueued([]);
      } else setError("The print files could not be asked for. Try again.");
    } finally {
      setBusy(false);
    }
  };

  return (
    <section aria-labelledby={`${id}-h`} className="flex flex-col gap-3">
      <h2 id={`${id}-h`} className="text-xl font-bold">
        Produce
      </h2>
      <fieldset className="flex flex-col gap-1 text-sm">
        <legend className="mb-1 font-semibold">Press sheet</legend>
        {data.sheets.map((s) => (
          <label key={s.id} className="flex items-start gap-2">
            <input
              type="radio"
              name={`${id}-sheet`}
              value={s.id}
              checked={choice === s.id}
              onChange={() => setChoice(s.id)}
            />
            <span>
              {s.name}
              {s.id === data.defaultSheetId ? " (usual for this trim)" : ""}
              {s.layoutNote ? (
                <span className="block text-xs text-ink-soft" data-testid={`sheet-note-${s.id}`}>
                  {s.layoutNote}
                </span>
              ) : null}
            </span>
          </label>
        ))}
        <label className="flex items-start gap-2">
          <input
            type="radio"
            name={`${id}-sheet`}
            value="custom"
            checked={choice === "custom"}
            onChange={() => setChoice("custom")}
          />
          Custom size
        </label>
        {choice === "custom" ? (
          <div className="mt-1 flex flex-wrap items-end gap-3">
            <label className="flex flex-col gap-1">
              Width (mm)
              <input
                className={`${inputClass} w-28`}
                inputMode="decimal"
                value={width}
                onChange={(e) => setWidth(e.target.value)}
              />
            </label>
            <label className="flex flex-col gap-1">
              Height (mm)
              <input
                className={`${inputClass} w-28`}
                inputMode="decimal"
                value={height}
                onChange={(e) => setHeight(e.target.value)}
              />
            </label>
            <p className="text-ink-soft">
              At least {Math.ceil(needed.widthMm)} x {Math.ceil(needed.heightMm)} mm either way
              round (the pages, the bleed and room for crop marks).
            </p>
          </div>
        ) : null}
      </fieldset>
      <div className="flex flex-wrap items-center gap-3">
        <Button
          type="button"
          onClick={produce}
          busy={busy}
          disabled={reason !== null}
          aria-describedby={reason ? `${id}-reason` : undefined}
          data-testid="produce"
        >
          Produce print files
        </Button>
        {reason ? (
          <p id={`${id}-reason`} className="text-sm text-ink-soft">
            {reason}
          </p>
        ) : null}
      </div>
      {error ? (
        <Notice tone="error" testId="produce-error">
          {error}
        </Notice>
      ) : null}
    </section>
  );
}
