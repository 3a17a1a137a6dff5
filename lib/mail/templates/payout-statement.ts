import type { StatementData } from "@/lib/statements";
import { statementLines } from "@/lib/statements";
import { formatCents } from "@/lib/money";
import { composeMail, type Mail } from "../compose";

/** A contributor's statement for a period, the same lines as its PDF, with a link to the PDF. */
export function payoutStatementMail(input: {
  statement: StatementData;
  /** How to greet them: their name, or a neutral word, never their address. */
  greeting: string;
  link: string;
}): Mail {
  const s = input.statement;
  const sections = statementLines(s).flatMap((section) => [
    `${section.heading}:\n${section.rows.map((r) => (r.startsWith("    ") ? `    ${r.trim()}` : `- ${r}`)).join("\n")}`,
  ]);
  return composeMail(
    `${s.anthologyTitle}: your statement for ${s.periodLabel}`,
    [
      `Hello ${input.greeting}, here is your statement from ${s.anthologyTitle} for ${s.periodLabel}. Still to pay to you: ${formatCents(s.outstandingCents, s.currency)}.`,
      ...sections,
    ],
    { href: input.link, label: "See your payouts and the PDF" },
  );
}
