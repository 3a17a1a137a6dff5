import { countPiecesForStage, findCall, moveStage } from "@/db/queries/open-call";
import { stageLayoutFacts } from "@/db/queries/page-map";
import { apiRoute, HttpError, readJson, requireApiAccess } from "@/server/api";
import { reviewStageMove } from "@/lib/stages";
import { formatDateTime } from "@/lib/dates";
import { stageMoveSchema } from "@/lib/validations/call";
import type { StageMovedAnswer } from "@/lib/wire/open-call";

/**
 * Moves the anthology one stage forward ({ "to": "call-open" }). 409 with every problem when what
 * the move needs is missing, or when someone else moved it first.
 */
export const POST = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const { slug } = await params;
  const { anthology } = await requireApiAccess(slug, "stage:advance");
  const { to } = await readJson(request, stageMoveSchema);
  const now = new Date();
  const call = await findCall(anthology.id);
  const review = reviewStageMove(
    {
      stage: anthology.stage,
      anthology,
      call: call ?? null,
      pieces: await countPiecesForStage(anthology.id),
      layout: to === "printing" ? await stageLayoutFacts(anthology) : undefined,
      now,
    },
    to,
    (date) => formatDateTime(date, call?.timeZone ?? "UTC"),
  );
  if (review.problems.length > 0) {
    throw new HttpError(
      409,
      review.problems.length === 1 ? review.problems[0]! : "The stage cannot move yet.",
      { problems: review.problems },
    );
  }
  if (!(await moveStage(anthology.id, anthology.stage, to, now))) {
    throw new HttpError(
      409,
      "Someone else moved the stage just now. Reload the page to see where it is.",
    );
  }
  return Response.json({
    stage: to,
    from: anthology.stage,
    cautions: review.cautions,
  } satisfies StageMovedAnswer);
});
