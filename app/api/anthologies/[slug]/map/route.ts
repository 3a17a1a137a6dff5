import { changeMap, loadMap } from "@/db/queries/page-map";
import { apiRoute, readJson, readQuery, requireApiAccess } from "@/server/api";
import { can, maySeePiece } from "@/lib/auth/policy";
import type { MapChangeAnswer, MapPayload, MapRefusalAnswer } from "@/lib/map-edits/payload";
import { mapChangeRequestSchema, mapQuerySchema } from "@/lib/validations/page-map";

type Context = { params: Promise<{ slug: string }> };

/** The page map: slots, accepted pieces, rule messages, passes, creep and history. */
export const GET = apiRoute(async (request, { params }: Context) => {
  const { slug } = await params;
  const { anthology, role } = await requireApiAccess(slug, "map:view");
  return Response.json(
    (await loadMap(anthology, {
      canEdit: can(role, "map:edit"),
      mayShowEmail: can(role, "contributors:private-data"),
      // The artwork previews follow the piece rule: editors see every piece.
      mayShowArt: maySeePiece(role, false),
      copies: readQuery(request, mapQuerySchema).copies,
    })) satisfies MapPayload,
  );
});

/**
 * One change to the map, made against the version the editor saw. 200 with the saved map; 409
 * with the fresh map when someone else changed it first; 422 when the rules refuse it.
 */
export const POST = apiRoute(async (request, { params }: Context) => {
  const { slug } = await params;
  const { anthology, user, role } = await requireApiAccess(slug, "map:edit");
  const { copies } = readQuery(request, mapQuerySchema);
  const input = await readJson(request, mapChangeRequestSchema);
  const outcome = await changeMap(anthology, user, input, {
    copies,
    mayShowEmail: can(role, "contributors:private-data"),
  });
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
  const body: MapChangeAnswer = {
    ...outcome.map,
    summary: outcome.summary,
    changed: outcome.changed,
  };
  return Response.json(body);
});
