import { can } from "@/lib/auth/policy";
import { statementPdf } from "@/lib/statements";
import { statementQuery } from "@/lib/validations/payouts";
import { apiRoute, HttpError, readQuery, requireApiAccess } from "@/server/api";
import { statementData } from "@/server/statements";

/**
 * A statement as a PDF. The lead may fetch anyone's; a contributor only their own (asking for
 * someone else's answers 404, so it does not even say whether they have one).
 */
export const GET = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const slug = (await params).slug;
  const access = await requireApiAccess(slug, "anthology:view");
  const manager = can(access.role, "payouts:manage");
  if (!manager && !can(access.role, "payouts:view-own"))
    throw new HttpError(403, "Your role in this anthology does not allow that.");
  const query = readQuery(request, statementQuery);
  const contributorId = query.contributor ?? access.user.id;
  if (!manager && contributorId !== access.user.id)
    throw new HttpError(404, "There is no such statement.");
  const data = await statementData(access.anthology, query.period, contributorId);
  const bytes = await statementPdf(data);
  const name = `${slug}-statement-${data.periodLabel.replace(/[^\w-]+/g, "-")}.pdf`;
  return new Response(Buffer.from(bytes), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `attachment; filename="${name}"`,
      "cache-control": "private, no-store",
    },
  });
});
