import "server-only";
import { createHash } from "node:crypto";
import type { Anthology } from "@/db/queries/anthologies";
import { pageNoticeRecipients } from "@/db/queries/page-map";
import { pageNoticeMail } from "@/lib/mail/templates/page-notice";
import type { NoticesAnswer } from "@/lib/map-edits/payload";
import { personLabel } from "@/lib/people";
import { appUrl, sendLoggedMail } from "@/server/mail";

/**
 * E-mails each contributor with placed pieces the pages they are on. One message per contributor
 * per set of pages: the dedupe key carries a hash of their pages, so sending again sends nothing
 * new until their pages change.
 */
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
    const hash = createHash("sha256")
      .update(JSON.stringify(person.pieces))
      .digest("hex")
      .slice(0, 16);
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
        dedupeKey: `page-notice:${anthology.id}:${person.contributorId}:${hash}`,
      },
      mail,
    );
    if (outcome.duplicate) answer.alreadySent++;
    else if (outcome.sent) answer.sent++;
    else answer.failed++;
  }
  return answer;
}
