import { FORMAT_NAMES } from "@/lib/print";
import type {
  ArtworkFormat,
  Finding,
  Measured,
  Severity,
  SpecReport as Report,
} from "@/lib/print/check";
import { VerdictBadge } from "@/components/verdict-badge";

const SEVERITY = {
  blocker: { label: "Must fix", className: "border-persimmon bg-persimmon-light/70" },
  warning: { label: "Should fix", className: "border-mustard bg-mustard-light/70" },
  note: { label: "Note", className: "border-ink/20 bg-paper-deep" },
} as const satisfies Record<Severity, { label: string; className: string }>;

function bytesText(n: number): string {
  if (n < 1024) return `${n} bytes`;
  if (n < 1024 * 1024) return `${(n / 1024).toFixed(1)} KB`;
  return `${(n / 1048576).toFixed(1)} MB`;
}

/** The measured facts worth showing, as label/value pairs. */
function measuredRows(format: string, m: Measured): [string, string][] {
  const rows: [string, string][] = [
    ["File", `${FORMAT_NAMES[format as ArtworkFormat] ?? format}, ${bytesText(m.byteLength)}`],
  ];
  if (m.widthPx && m.heightPx) rows.push(["Pixels", `${m.widthPx} x ${m.heightPx} px`]);
  if (m.effectivePpi) rows.push(["Resolution at print size", `${Math.round(m.effectivePpi)} ppi`]);
  if (m.colourSpace)
    rows.push([
      "Colour",
      m.colourSpace === "rgb" ? "RGB" : m.colourSpace === "cmyk" ? "CMYK" : m.colourSpace,
    ]);
  const page = m.pdfPages?.[0];
  if (page)
    rows.push([
      "PDF page",
      `${page.trimBox.widthMm.toFixed(1)} x ${page.trimBox.heightMm.toFixed(1)} mm trim, ${page.bleedMm.toFixed(1)} mm bleed`,
    ]);
  if (m.pdfPageCount !== undefined) rows.push(["PDF pages", String(m.pdfPageCount)]);
  return rows;
}

function FindingItem({ finding }: { finding: Finding }) {
  const s = SEVERITY[finding.severity];
  return (
    <li
      className={`rounded-md border-l-4 px-3 py-2 ${s.className}`}
      data-testid="finding"
      data-code={finding.code}
      data-severity={finding.severity}
    >
      <p className="text-sm">
        <span className="mr-2 text-xs font-bold uppercase tracking-wide">{s.label}</span>
        {finding.message}
        {finding.where ? <span className="text-ink-soft"> ({finding.where})</span> : null}
      </p>
      {finding.fix ? (
        <p className="mt-1 text-sm" data-testid="finding-fix">
          <span className="font-semibold">Fix: </span>
          {finding.fix}
        </p>
      ) : null}
    </li>
  );
}

/** The spec check's report for one file: the verdict, what was measured, and every finding with its fix. */
export function SpecReport({ report, testId }: { report: Report; testId?: string }) {
  const rows = measuredRows(report.format, report.measured);
  return (
    <section className="flex flex-col gap-3" data-testid={testId} data-verdict={report.verdict}>
      <div className="flex items-center gap-2">
        <span
          data-testid={testId ? `${testId}-verdict` : undefined}
          data-verdict={report.verdict}
          className="text-sm font-semibold"
        >
          <VerdictBadge verdict={report.verdict} />
        </span>
        {report.findings.length === 0 ? (
          <span className="text-sm">Nothing to fix: this file meets the print spec.</span>
        ) : null}
      </div>
      {report.ink ? (
        <p className="text-sm" data-testid={testId ? `${testId}-ink` : undefined}>
          Checked as the {report.ink} master: one ink&rsquo;s greyscale file for its own drum pass.
        </p>
      ) : null}
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-xs">
        {rows.map(([label, value]) => (
          <div key={label} className="contents">
            <dt className="text-ink-soft">{label}</dt>
            <dd className="font-mono">{value}</dd>
          </div>
        ))}
      </dl>
      {report.findings.length > 0 ? (
        <ul className="flex flex-col gap-2">
          {report.findings.map((f, i) => (
            <FindingItem key={`${f.code}-${i}`} finding={f} />
          ))}
        </ul>
      ) : null}
    </section>
  );
}
