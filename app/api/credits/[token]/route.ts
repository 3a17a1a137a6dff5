import { creditApprovalSchema } from "@/lib/validations/credits";
import type { CreditApprovedAnswer } from "@/lib/wire/credits";
import { approveByLink } from "@/server/credits";
import { apiRoute, readJson } from "@/server/api";

type Context = { params: Promise<{ token: string }> };

/**
 * The contributor approves their credit line from the e-mail link, as it is or as they edited it.
 * No session: the signed token is the key (lib/credits/token.ts), good for one piece and one wording.
 */
export const POST = apiRoute(async (request, { params }: Context) => {
  const { token } = await params;
  const { creditLine } = await readJson(request, creditApprovalSchema, { limit: 8 * 1024 });
  const approved = await approveByLink(token, creditLine);
  return Response.json({
    creditLine: approved.creditLine,
    approvedAt: approved.approvedAt.toISOString(),
  } satisfies CreditApprovedAnswer);
});
