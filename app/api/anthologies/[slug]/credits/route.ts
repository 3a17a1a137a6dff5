import { can } from "@/lib/auth/policy";
import { creditRequestSchema } from "@/lib/validations/credits";
import type { CreditsAnswer, CreditsAskedAnswer } from "@/lib/wire/credits";
import { askForCredits, creditsOverview } from "@/server/credits";
import { apiRoute, readJson, requireApiAccess } from "@/server/api";

type Context = { params: Promise<{ slug: string }> };

/** The credits screen's data: each piece in the issue, its credit state, the preview and where it goes. */
export const GET = apiRoute(async (_request, { params }: Context) => {
  const { slug } = await params;
  const { anthology, role } = await requireApiAccess(slug, "credits:manage");
  const credits = await creditsOverview(anthology, {
    mayShowEmail: can(role, "contributors:private-data"),
  });
  return Response.json(credits satisfies CreditsAnswer);
});

/** Asks contributors by e-mail to approve their lines: every outstanding one, or the pieces named. */
export const POST = apiRoute(async (request, { params }: Context) => {
  const { slug } = await params;
  const { anthology, role } = await requireApiAccess(slug, "credits:manage");
  const input = await readJson(request, creditRequestSchema);
  const outcome = await askForCredits(
    anthology,
    input.scope === "outstanding" ? "outstanding" : input.pieceIds,
  );
  const credits = await creditsOverview(anthology, {
    mayShowEmail: can(role, "contributors:private-data"),
  });
  return Response.json({ ...outcome, credits } satisfies CreditsAskedAnswer);
});
