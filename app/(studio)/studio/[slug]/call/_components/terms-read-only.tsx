import { copiesText, feeText, salesShareText } from "@/lib/call-terms";
import { amountToCents, percentToBasisPoints, type CallParsed } from "@/lib/validations/call";

/** The saved payment terms, for editors who may not change them. */
export function TermsReadOnly({ initial, currency }: { initial: CallParsed; currency: string }) {
  return (
    <div className="sm:col-span-2" data-testid="terms-read-only">
      <dl className="grid grid-cols-[10rem_1fr] gap-x-4 gap-y-1 text-sm">
        <dt className="text-ink-soft">Fee</dt>
        <dd>
          {feeText(
            { feeKind: initial.feeKind, feeCents: amountToCents(initial.fee) ?? 0 },
            currency,
          )}
        </dd>
        <dt className="text-ink-soft">Share of sales</dt>
        <dd>
          {salesShareText(percentToBasisPoints(initial.salesSharePercent) ?? 0, initial.shareSplit)}
        </dd>
        <dt className="text-ink-soft">Contributor copies</dt>
        <dd>{copiesText(Number(initial.contributorCopies))}</dd>
      </dl>
      <p className="mt-2 text-xs text-ink-faint">
        Only the lead editor can change the payment terms.
      </p>
    </div>
  );
}
