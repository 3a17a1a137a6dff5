import type { Metadata } from "next";
import { Notice } from "@/components/ui/notice";
import { formatDate } from "@/lib/dates";
import { inspectCreditLink } from "@/server/credits";
import { CreditApprovalForm } from "./_components/credit-approval-form";

// The link carries its own key: keep it out of any Referer header sent onwards.
export const metadata: Metadata = { title: "Your credit line", referrer: "no-referrer" };
export const dynamic = "force-dynamic";

const HEADINGS = {
  invalid: "This link cannot be used",
  approved: "Already approved",
  changed: "This link no longer applies",
  expired: "This link has expired",
} as const;

/**
 * A contributor's credit line, opened from the request mail; signed out is fine, the token is the
 * key. A good link shows the line as it will print and approves it (edited or not); any other link
 * says plainly why not and offers nothing that changes anything.
 */
export default async function CreditLinkPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const view = await inspectCreditLink(token);
  if (view.state !== "good") {
    return (
      <section
        className="mx-auto flex max-w-xl flex-col gap-4 py-10"
        data-testid="credit-link-problem"
        data-state={view.state}
      >
        <h1 className="text-3xl font-extrabold">{HEADINGS[view.state]}</h1>
        {view.state !== "invalid" ? (
          <p className="text-ink-soft">
            {view.anthologyTitle} · “{view.pieceTitle}”
          </p>
        ) : null}
        <Notice tone={view.state === "approved" ? "info" : "caution"}>
          {view.message}
          {view.state === "approved" && view.approvedAt
            ? ` It was approved on ${formatDate(view.approvedAt)} and will print as “${view.creditLine}”.`
            : ""}
        </Notice>
      </section>
    );
  }
  return (
    <section className="mx-auto flex max-w-xl flex-col gap-6 py-10" data-testid="credit-link">
      <header className="flex flex-col gap-1">
        <p className="text-sm text-ink-soft">{view.anthologyTitle}</p>
        <h1 className="text-3xl font-extrabold">Your credit for “{view.pieceTitle}”</h1>
      </header>
      <CreditApprovalForm
        token={token}
        anthologyTitle={view.anthologyTitle}
        pieceTitle={view.pieceTitle}
        creditLine={view.creditLine}
      />
    </section>
  );
}
