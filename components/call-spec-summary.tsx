import type { CallSpecSummary } from "@/lib/call-spec";

/** The print spec a contributor works to, with download links for the page templates. */
export function CallSpecSummaryPanel({
  slug,
  spec,
  headingId = "spec-heading",
}: {
  slug: string;
  spec: CallSpecSummary;
  headingId?: string;
}) {
  const template = (format: "png" | "pdf") =>
    `/api/anthologies/${encodeURIComponent(slug)}/call/template?format=${format}`;
  return (
    <section
      aria-labelledby={headingId}
      className="rounded-lg border border-ink/15 bg-white/60 p-5"
    >
      <h2 id={headingId} className="text-xl font-semibold">
        Print spec for your files
      </h2>
      <dl
        className="mt-3 grid grid-cols-[9rem_1fr] gap-x-4 gap-y-2 text-sm"
        data-testid="call-spec"
      >
        {spec.rows.map((row) => (
          <div key={row.key} className="contents">
            <dt className="text-ink-soft">{row.label}</dt>
            <dd
              className={row.key === "colour" || row.key === "files" ? "" : "font-mono"}
              data-testid={`spec-${row.key}`}
            >
              {row.value}
            </dd>
          </div>
        ))}
      </dl>
      <h3 className="mt-5 text-base font-semibold">Page templates</h3>
      <p className="mt-1 text-sm text-ink-soft">
        One page at trim plus bleed, with the bleed edge, the trim line and the safe area drawn.
        Hide or delete the guides before you export.
      </p>
      <ul className="mt-2 flex flex-col gap-1 text-sm">
        <li>
          <a
            href={template("png")}
            download
            data-testid="template-png"
            className="font-semibold text-teal-dark"
          >
            PNG template
          </a>{" "}
          <span className="text-ink-soft">
            {spec.pixels.widthPx} x {spec.pixels.heightPx} px at {spec.pixels.ppi} ppi
          </span>
        </li>
        <li>
          <a
            href={template("pdf")}
            download
            data-testid="template-pdf"
            className="font-semibold text-teal-dark"
          >
            PDF template
          </a>{" "}
          <span className="text-ink-soft">with the trim box and bleed box set</span>
        </li>
      </ul>
    </section>
  );
}
