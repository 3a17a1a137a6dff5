import type { OnboardingAnswer } from "@/lib/wire/payouts";
import { apiRoute, HttpError, requireApiAccess } from "@/server/api";
import { appUrl } from "@/server/mail";
import { PaymentProblem } from "@/server/payments";
import { startOnboarding } from "@/server/payouts";

/** Starts (or resumes) connecting a payout account: answers the service's onboarding page. */
export const POST = apiRoute(
  async (_request, { params }: { params: Promise<{ slug: string }> }) => {
    const slug = (await params).slug;
    const { user } = await requireApiAccess(slug, "payouts:view-own");
    const back = appUrl(`/studio/${slug}/my-payouts`);
    try {
      const { url } = await startOnboarding(user, {
        returnUrl: `${back}?account=returned`,
        refreshUrl: `${back}?account=expired`,
      });
      return Response.json({ url } satisfies OnboardingAnswer);
    } catch (error) {
      if (error instanceof PaymentProblem) throw new HttpError(error.status, error.message);
      throw error;
    }
  },
);
