import { changeMap, loadMap } from "@/db/queries/page-map";
import { apiRoute, HttpError, readJson, requireApiAccess } from "@/lib/api";
import { can } from "@/lib/auth/policy";
import type { MapChangeAnswer, MapRefusalAnswer } from "@/lib/map-edits/payload";
import { COPIES_DEFAULT, copiesSchema, mapChangeRequestSchema } from "@/lib/validations/page-map";

type Context = { params: Promise<{ slug: string }> };

function copiesFrom(request: Request): number {
  const raw = new URL(request.url).searchParams.get("copies");
  if (raw === null || raw === "") return COPIES_DEFAULT;
  const parsed = copiesSchema.safeParse(raw);
  if (!parsed.success)
    throw new HttpError(400, "Copies must be a whole number from 1 to 100 000.", {
      fields: { copies: ["Whole number from 1 to 100 000"] },
    });
  return parsed.data;
}

/** The page map: slots, accepted pieces, rule messages, passes, creep and history. */
export const GET = apiRoute(async (request, { params }: Context) => {
  const { slug } = await params;
  const { anthology, role } = await requireApiAccess(slug, "map:view");
  return Response.json(
    await loadMap(anthology, { canEdit: can(role, "map:edit"), copies: copiesFrom(request) }),
  );
});

/**
 * One change to the map, made against the version the editor saw. 200 with the saved map; 409
 * with the fresh map when someone else changed it first; 422 when the rules refuse it.
 */
export const POST = apiRoute(async (request, { params }: Context) => {
  const { slug } = await params;
  const { anthology, user } = await requireApiAccess(slug, "map:edit");
  const input = await readJson(request, mapChangeRequestSchema);
  const outcome = await changeMap(anthology, user, input, copiesFrom(request));
  if (outcome.kind === "stale") {
    const body: MapRefusalAnswer = {
      error: `Someone else changed the map while you were working (it is now at version ${outcome.map.version}, you had ${input.version}). Your change was not saved; here is the map as it is now.`,
      map: outcome.map,
    };
    return Response.json(body, { status: 409 });
  }
  if (outcome.kind === "refused") {
    const body: MapRefusalAnswer = {
      error: outcome.reason,
      pages: outcome.pages,
      pieceIds: outcome.pieceIds,
    };
    return Response.json(body, { status: 422 });
  }
  const body: MapChangeAnswer = { ...outcome.map, summary: outcome.summary };
  return Response.json(body);
});
