import { Notice } from "@/components/ui/notice";
import { isPieceVerdict, PIECE_VERDICT_LABELS } from "@/lib/pieces/verdict";
import type { SpecSavedAnswer } from "@/lib/wire/spec-change";

const verdictWords = (v: string) => (isPieceVerdict(v) ? PIECE_VERDICT_LABELS[v] : v);
const files = (n: number) => `${n} file${n === 1 ? "" : "s"}`;

/** The outcome of a saved spec change: what was checked again and which verdicts moved. */
export function SpecSaved({ answer }: { answer: SpecSavedAnswer }) {
  const { recheck } = answer;
  return (
    <div className="flex flex-col gap-3" data-testid="spec-saved">
      <Notice tone="info" title="The spec is saved" testId="spec-saved-summary">
        {recheck.checked === 0 && recheck.notChecked === 0 ? (
          <p>Nothing the file check reads changed, so no file needed checking again.</p>
        ) : (
          <p>
            {files(recheck.checked)} checked again against the new spec;{" "}
            {recheck.nowFailing === 0
              ? "none fails that did not before."
              : `${files(recheck.nowFailing)} now ${recheck.nowFailing === 1 ? "fails" : "fail"}; ${recheck.nowFailing === 1 ? "its contributor sees" : "their contributors see"} the new report on the piece's page.`}
          </p>
        )}
        {recheck.notChecked > 0 ? (
          <p className="mt-2" data-testid="spec-not-checked">
            {files(recheck.notChecked)} could not be fetched from the file store and{" "}
            {recheck.notChecked === 1 ? "keeps its" : "keep their"} earlier report.
          </p>
        ) : null}
      </Notice>
      {recheck.changed.length > 0 ? (
        <section aria-labelledby="rechecked-heading" className="flex flex-col gap-2">
          <h2 id="rechecked-heading" className="text-lg font-semibold">
            Verdicts that changed
          </h2>
          <ul className="flex flex-col gap-1 text-sm" data-testid="spec-rechecked">
            {recheck.changed.map((c) => (
              <li key={c.versionId} data-verdict={c.after}>
                “{c.pieceTitle}”, page {c.pageIndex}
                {c.ink ? `, ${c.ink} master` : ""} ({c.fileName}): {verdictWords(c.before)} →{" "}
                <span className="font-semibold">{verdictWords(c.after)}</span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
