import "server-only";
import { createHash } from "node:crypto";
import type { Anthology } from "@/db/queries/anthologies";
import { claimedDedupeKeys } from "@/db/queries/mail-log";
import { pageNoticeRecipients, type PageNoticeRecipient } from "@/db/queries/page-map";
import { pageNoticeMail } from "@/lib/mail/templates/page-notice";
import type { NoticesAnswer, NoticesPreviewAnswer } from "@/lib/map-edits/payload";
import { personLabel } from "@/lib/people";
import { appUrl, sendLoggedMail } from "@/server/mail";

/**
 * One message per contributor per set of pages: the dedupe key carries a hash of their pages, so
 * sending again sends nothing new until their pages change.
 */
function noticeKey(anthology: Anthology, person: PageNoticeRecipient): string {
  const hash = createHash("sha256")
    .update(JSON.stringify(person.pieces))
    .digest("hex")
    .slice(0, 16);
  return `page-notice:${anthology.id}:${person.contributorId}:${hash}`;
}

/**
 * Who would be told what, sending nothing: each contributor with placed pieces, named for the
 * viewer's role (an address only for roles that may see it), their pieces and pages, and whether
 * this notice already went out or cannot go for want of an address.
 */
export async function previewPageNotices(
  anthology: Anthology,
  { mayShowEmail }: { mayShowEmail: boolean },
): Promise<NoticesPreviewAnswer> {
  const recipients = await pageNoticeRecipients(anthology);
  const sent = await claimedDedupeKeys(recipients.map((person) => noticeKey(anthology, person)));
  const contributors = recipients.map((person) => ({
    contributorName: personLabel(person, { mayShowEmail }),
    pieces: person.pieces,
    alreadySent: sent.has(noticeKey(anthology, person)),
    hasAddress: Boolean(person.email),
  }));
  return {
    contributors,
    toSend: contributors.filter((c) => c.hasAddress && !c.alreadySent).length,
    alreadySent: contributors.filter((c) => c.alreadySent).length,
  };
}

/** E-mails each contributor with placed pieces the pages they are on (once per set of pages). */
export async function sendPageNotices(anthology: Anthology): Promise<NoticesAnswer> {
  const recipients = await pageNoticeRecipients(anthology);
  const answer: NoticesAnswer = {
    sent: 0,
    alreadySent: 0,
    failed: 0,
    contributors: recipients.length,
  };
  const link = appUrl(`/studio/${anthology.slug}`);
  for (const person of recipients) {
    if (!person.email) {
      answer.failed++;
      continue;
    }
    const mail = pageNoticeMail({
      anthologyTitle: anthology.title,
      greeting: personLabel(person, { mayShowEmail: false, unnamed: "there" }),
      pieces: person.pieces,
      link,
    });
    const outcome = await sendLoggedMail(
      {
        anthologyId: anthology.id,
        kind: "page-notice",
        to: person.email,
        dedupeKey: noticeKey(anthology, person),
      },
      mail,
    );
    if (outcome.duplicate) answer.alreadySent++;
    else if (outcome.sent) answer.sent++;
    else answer.failed++;
  }
  return answer;
}
