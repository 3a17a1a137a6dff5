import { PIECE_VERDICT_LABELS } from "@/lib/pieces/verdict";
import type { SpecReport } from "@/lib/print/check";
import { composeMail, type Mail } from "../compose";

const SEVERITY_WORDS = { blocker: "Must fix", warning: "Should fix", note: "Note" } as const;

/** Why a checked upload is kept as a version but not used for its page. */
export type NotUsedReason = "replaced" | "unreadable";

const NOT_USED: Record<NotUsedReason, string> = {
  replaced:
    "Another upload replaced this page while yours was on its way, so yours is kept as a version but not used. You can choose it on the piece's page.",
  unreadable:
    "This file could not be read, so your earlier file stays in use. It is kept as a version with this report; upload a new file when it is fixed.",
};

/** The spec report by e-mail: the verdict, each finding with its fix, and a link to the piece. */
export function specReportMail(input: {
  personName: string | null;
  fileName: string;
  pieceTitle: string;
  pageIndex: number;
  /** The ink of a separation (one ink's master); null or absent for a page's composite file. */
  ink?: string | null;
  versionNumber: number;
  anthologyTitle: string;
  report: Pick<SpecReport, "verdict" | "findings">;
  notUsed: NotUsedReason | null;
  link: string;
}): Mail {
  const verdict = PIECE_VERDICT_LABELS[input.report.verdict];
  const master = input.ink ? `, ${input.ink} master` : "";
  const whichFile = input.ink ? `the ${input.ink} master of page` : "page";
  return composeMail(
    `Spec check: "${input.pieceTitle}", page ${input.pageIndex}${master}: ${verdict}`,
    [
      `${input.personName ? `Hello ${input.personName}, w` : "W"}e checked ${input.fileName} (version ${input.versionNumber} of ${whichFile} ${input.pageIndex} of "${input.pieceTitle}") against the print spec of ${input.anthologyTitle}.`,
      input.report.findings.length === 0
        ? "It meets the spec: nothing to fix."
        : `Verdict: ${verdict}. What we found:`,
      ...input.report.findings.map(
        (f) => `${SEVERITY_WORDS[f.severity]}: ${f.message}${f.fix ? ` Fix: ${f.fix}` : ""}`,
      ),
      ...(input.notUsed ? [NOT_USED[input.notUsed]] : []),
    ],
    { href: input.link, label: "See the report with the trim, bleed and safe-area lines" },
  );
}
