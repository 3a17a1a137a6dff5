import type { KeyboardCoordinateGetter } from "@dnd-kit/core";

/** What a dragged piece carries: where it came from and, from the map, which of its pages was grabbed. */
export type DragData = { pieceId: number; from: "tray" | "map"; index: number };

export const pageDropId = (page: number) => `page-${page}`;
export const TRAY_DROP_ID = "tray";

/** The page number of a slot's drop id, or null. */
export function pageOfDropId(id: string | number | undefined | null): number | null {
  const match = /^page-(\d+)$/.exec(String(id ?? ""));
  return match ? Number(match[1]) : null;
}

const ARROWS = ["ArrowRight", "ArrowLeft", "ArrowDown", "ArrowUp"] as const;

/**
 * Arrow keys move a piece picked up with the keyboard to the nearest page (or the tray) in that
 * direction, centred on it, instead of nudging it a few pixels at a time.
 */
export const pageKeyboardCoordinates: KeyboardCoordinateGetter = (
  event,
  { context, currentCoordinates },
) => {
  const direction = ARROWS.find((key) => key === event.code);
  if (!direction) return undefined;
  event.preventDefault();
  const { collisionRect, droppableRects, droppableContainers } = context;
  if (!collisionRect) return currentCoordinates;
  const cx = collisionRect.left + collisionRect.width / 2;
  const cy = collisionRect.top + collisionRect.height / 2;
  const across = direction === "ArrowRight" || direction === "ArrowLeft";
  let best: { x: number; y: number } | null = null;
  let bestScore = Number.POSITIVE_INFINITY;
  for (const container of droppableContainers.getEnabled()) {
    const rect = droppableRects.get(container.id);
    if (!rect) continue;
    const dx = rect.left + rect.width / 2 - cx;
    const dy = rect.top + rect.height / 2 - cy;
    const ahead =
      direction === "ArrowRight"
        ? dx > 2
        : direction === "ArrowLeft"
          ? dx < -2
          : direction === "ArrowDown"
            ? dy > 2
            : dy < -2;
    if (!ahead) continue;
    // Prefer what lies straight ahead: distance off the line counts three times.
    const score = across ? Math.abs(dx) + 3 * Math.abs(dy) : Math.abs(dy) + 3 * Math.abs(dx);
    if (score < bestScore) {
      bestScore = score;
      best = {
        x: rect.left + (rect.width - collisionRect.width) / 2,
        y: rect.top + (rect.height - collisionRect.height) / 2,
      };
    }
  }
  return best ?? currentCoordinates;
};
