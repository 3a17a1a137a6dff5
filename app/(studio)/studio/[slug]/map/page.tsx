import { loadMap } from "@/db/queries/page-map";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { can, maySeePiece } from "@/lib/auth/policy";
import { MapScreen } from "./_components/map-screen";

export const metadata = { title: "Page map" };

export default async function PageMapPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { anthology, role } = await requireAnthologyAccess(slug, "map:view", `/studio/${slug}/map`);
  const initial = await loadMap(anthology, {
    canEdit: can(role, "map:edit"),
    mayShowEmail: can(role, "contributors:private-data"),
    // The artwork previews follow the piece rule: editors see every piece.
    mayShowArt: maySeePiece(role, false),
  });
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-3xl font-extrabold">Page map</h1>
        <p className="max-w-3xl text-sm text-ink-soft">
          Where every accepted piece sits in {anthology.title}: the booklet as it is read, spread by
          spread, and as it prints, sheet by sheet.{" "}
          {initial.canEdit
            ? "Drag pieces from the tray onto pages, or pick a piece and press Enter to choose its page."
            : "You can look; only editors change the map."}
        </p>
      </div>
      <MapScreen slug={slug} initial={initial} />
    </div>
  );
}
