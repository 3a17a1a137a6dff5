import "server-only";
/** Gathers a contributor's statement for a period and sends it (e-mail with a link to the PDF). */
import { and, eq } from "drizzle-orm";
import { db, schema } from "@/db";
import type { Anthology } from "@/db/queries/anthologies";
import { contributorWork, copiesGiven, findPeriod, ledgerFor } from "@/db/queries/payouts";
import { payoutStatementMail } from "@/lib/mail/templates/payout-statement";
import { ledgerTotals } from "@/lib/payouts";
import { personLabel } from "@/lib/people";
import type { StatementData } from "@/lib/statements";
import { Refusal } from "@/lib/refusal";
import { appUrl, sendLoggedMail } from "@/server/mail";

export async function statementData(
  anthology: Anthology,
  periodId: number,
  contributorId: string,
): Promise<StatementData> {
  const period = await findPeriod(anthology.id, periodId);
  if (!period) throw new Refusal(404, "There is no such period.");
  if (!period.closedAt)
    throw new Refusal(409, `The period “${period.label}” is still open; close it first.`);
  const [person] = await db
    .select({ name: schema.users.name, email: schema.users.email })
    .from(schema.users)
    .where(eq(schema.users.id, contributorId));
  if (!person) throw new Refusal(404, "There is no such contributor.");
  const pieces = await db
    .select({
      title: schema.pieces.title,
      pages: schema.pieces.pageCount,
      credit: schema.pieces.creditLine,
    })
    .from(schema.pieces)
    .where(
      and(
        eq(schema.pieces.anthologyId, anthology.id),
        eq(schema.pieces.contributorId, contributorId),
        eq(schema.pieces.status, "accepted"),
      ),
    );
  const lines = await ledgerFor(anthology.id, contributorId);
  if (pieces.length === 0 && lines.length === 0)
    throw new Refusal(404, "That person has nothing in this anthology's ledger.");
  const copies = await copiesGiven(anthology.id, contributorId);
  const totals = ledgerTotals(lines);
  return {
    anthologyTitle: anthology.title,
    pressName: anthology.pressName,
    periodLabel: period.label,
    startsOn: period.startsOn.toISOString().slice(0, 10),
    endsOn: period.endsOn.toISOString().slice(0, 10),
    currency: anthology.currency,
    person: personLabel(person, { mayShowEmail: false, unnamed: "Contributor" }),
    creditLines: [...new Set(pieces.map((p) => p.credit))],
    pieces: pieces.map((p) => ({ title: p.title, pages: p.pages })),
    copiesGiven: copies?.handedOverAt ? copies.quantity : null,
    lines: lines
      .filter((l) => l.periodId === periodId)
      .map((l) => ({
        id: l.id,
        kind: l.kind,
        source: l.source,
        amountCents: l.amountCents,
        working: l.computation.working,
        reference: l.reference,
      })),
    ...totals,
  };
}

/** E-mails every contributor with work or lines their statement for a closed period, once each. */
export async function sendStatements(anthology: Anthology, periodId: number) {
  const period = await findPeriod(anthology.id, periodId);
  if (!period) throw new Refusal(404, "There is no such period.");
  if (!period.closedAt)
    throw new Refusal(409, `The period “${period.label}” is still open; close it first.`);
  const work = await contributorWork(anthology.id);
  const withLines = new Set((await ledgerFor(anthology.id)).map((l) => l.contributorId));
  const people = new Map(work.map((w) => [w.contributorId, w]));
  for (const id of withLines) if (!people.has(id)) people.set(id, undefined as never);
  let sent = 0;
  let alreadySent = 0;
  let failed = 0;
  for (const contributorId of people.keys()) {
    const [user] = await db
      .select({ name: schema.users.name, email: schema.users.email })
      .from(schema.users)
      .where(eq(schema.users.id, contributorId));
    if (!user?.email) continue;
    const statement = await statementData(anthology, periodId, contributorId);
    const mail = payoutStatementMail({
      statement,
      greeting: personLabel(user, { mayShowEmail: false, unnamed: "there" }),
      link: appUrl(`/studio/${anthology.slug}/my-payouts`),
    });
    const result = await sendLoggedMail(
      {
        anthologyId: anthology.id,
        kind: "payout-statement",
        to: user.email,
        dedupeKey: `statement:${periodId}:${contributorId}`,
      },
      mail,
    );
    if (result.sent) sent++;
    else if (result.duplicate) alreadySent++;
    else failed++;
  }
  return { sent, alreadySent, failed };
}
