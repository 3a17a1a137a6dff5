/** Verdicts and small helpers shared by the raster and PDF checks. */
import type { ArtworkFormat, Finding, Measured, SpecReport, Verdict } from "./types";

const RANK: Record<Verdict, number> = { pass: 0, note: 1, warning: 2, blocker: 3 };

/** The worst severity among the findings, or "pass" when there are none. */
export function verdictOf(findings: readonly Finding[]): Verdict {
  let worst: Verdict = "pass";
  for (const f of findings) if (RANK[f.severity] > RANK[worst]) worst = f.severity;
  return worst;
}

/** A finished report, findings ordered worst first (stable within a severity). */
export function makeReport(
  format: ArtworkFormat,
  measured: Measured,
  findings: Finding[],
): SpecReport {
  const ordered = findings
    .map((f, i) => ({ f, i }))
    .sort((a, b) => RANK[b.f.severity] - RANK[a.f.severity] || a.i - b.i)
    .map(({ f }) => f);
  return { format, measured, findings: ordered, verdict: verdictOf(ordered) };
}

/** "top", "top and left", "top, right and left". */
export function listText(items: readonly string[]): string {
  if (items.length <= 1) return items[0] ?? "";
  return `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`;
}

/** "page 3", "pages 1–4 and 7". */
export function pagesText(pages: readonly number[]): string {
  const sorted = [...new Set(pages)].sort((a, b) => a - b);
  const runs: string[] = [];
  for (let i = 0; i < sorted.length;) {
    let j = i;
    while (j + 1 < sorted.length && sorted[j + 1] === (sorted[j] ?? 0) + 1) j++;
    runs.push(i === j ? String(sorted[i]) : `${sorted[i]}–${sorted[j]}`);
    i = j + 1;
  }
  return `${sorted.length === 1 ? "page" : "pages"} ${listText(runs)}`;
}
