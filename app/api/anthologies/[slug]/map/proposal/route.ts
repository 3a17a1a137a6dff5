import { loadMap, readMapState } from "@/db/queries/page-map";
import { apiRoute, readJson, requireApiAccess } from "@/server/api";
import { can, maySeePiece } from "@/lib/auth/policy";
import { checkMap } from "@/lib/map/check";
import { countPasses } from "@/lib/map/passes";
import { proposePlacement } from "@/lib/map/propose";
import type { MapRefusalAnswer, ProposalAnswer } from "@/lib/map-edits/payload";
import { proposalRequestSchema } from "@/lib/validations/page-map";

/**
 * Proposes where the pieces waiting in the tray go, around what is placed, reserved and locked.
 * Nothing is saved: the editor accepts the proposal as one change (with this version) or drops it.
 */
export const POST = apiRoute(async (request, { params }: { params: Promise<{ slug: string }> }) => {
  const { slug } = await params;
  const { anthology, role } = await requireApiAccess(slug, "map:edit");
  const input = await readJson(request, proposalRequestSchema);
  const copies = input.copies ?? anthology.plannedCopies;
  const { version, state } = await readMapState(anthology);
  if (version !== input.version) {
    const body: MapRefusalAnswer = {
      error: `Someone else changed the map (it is now at version ${version}, you had ${input.version}); here is the map as it is now. Ask for a proposal again.`,
      map: await loadMap(anthology, {
        canEdit: true,
        mayShowEmail: can(role, "contributors:private-data"),
        // The artwork previews follow the piece rule: editors see every piece.
        mayShowArt: maySeePiece(role, false),
        copies,
      }),
    };
    return Response.json(body, { status: 409 });
  }
  const proposal = proposePlacement(state, { copies });
  const body: ProposalAnswer = {
    version,
    copies,
    proposal,
    check: checkMap(proposal.state),
    passes: countPasses(proposal.state, copies),
  };
  return Response.json(body);
});
