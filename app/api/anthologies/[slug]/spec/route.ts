import { apiRoute, HttpError, readJson, requireApiAccess } from "@/server/api";
import { changeSpec } from "@/db/queries/spec-edit";
import { anthologySpecFromInput } from "@/lib/validations/anthology";
import { specEditSchema } from "@/lib/validations/spec-edit";
import type { RecheckSummary, SpecNotSavedAnswer, SpecSavedAnswer } from "@/lib/wire/spec-change";
import { recheckCurrentFiles } from "@/server/submissions/recheck";

const NOTHING_CHECKED: RecheckSummary = { checked: 0, nowFailing: 0, notChecked: 0, changed: [] };

/**
 * Changes the anthology's print spec. Refused (409, needs "changes") when the change would break
 * the page map; held (409, needs "confirmation") while it has warnings the editor has not
 * confirmed. Once saved, every current file is checked again against the new spec.
 */
export const PATCH = apiRoute(
  async (request, { params }: { params: Promise<{ slug: string }> }) => {
    const { slug } = await params;
    const { anthology } = await requireApiAccess(slug, "anthology:edit-spec");
    const input = await readJson(request, specEditSchema);
    const outcome = await changeSpec(anthology.id, anthologySpecFromInput(input), input.confirm);
    const { impacts, recheck } = outcome.change;
    if (outcome.kind !== "saved") {
      const refused = outcome.kind === "refused";
      throw new HttpError(
        409,
        refused
          ? "The spec was not changed: the change would break what is already laid out."
          : "The spec was not changed yet: confirm the warnings to change it.",
        {
          saved: false,
          needs: refused ? "changes" : "confirmation",
          impacts,
        } satisfies Omit<SpecNotSavedAnswer, "error">,
      );
    }
    return Response.json({
      saved: true,
      impacts,
      recheck: recheck ? await recheckCurrentFiles(anthology.id) : NOTHING_CHECKED,
    } satisfies SpecSavedAnswer);
  },
);
