import { useDraggable, useDroppable } from "@dnd-kit/core";
import type { KeyboardEvent } from "react";
import type { DragData } from "./drag";
import { TRAY_DROP_ID } from "./drag";
import { inkList, type PieceView } from "./view-model";

/**
 * Accepted pieces not yet on the map; dropping a placed piece here takes it off the map. A piece
 * can be left out of this issue from here (it then leaves the rules) and brought back.
 */
export function Tray({
  pieces,
  leftOut,
  canEdit,
  onPlace,
  onLeaveOut,
}: {
  pieces: PieceView[];
  leftOut: PieceView[];
  canEdit: boolean;
  onPlace: (pieceId: number) => void;
  onLeaveOut: (pieceId: number, leftOut: boolean) => void;
}) {
  const { setNodeRef, isOver } = useDroppable({ id: TRAY_DROP_ID, disabled: !canEdit });
  return (
    <section
      ref={setNodeRef}
      aria-labelledby="tray-title"
      data-testid="tray"
      className={`flex flex-col gap-2 rounded-md border p-3 ${isOver ? "border-teal bg-teal-light/50" : "border-ink/15 bg-white/40"}`}
    >
      <h2 id="tray-title" className="text-lg font-semibold">
        Waiting to be placed
      </h2>
      {pieces.length === 0 ? (
        <p className="text-sm text-ink-soft" data-testid="tray-empty">
          Every accepted piece is on the map.
        </p>
      ) : (
        <>
          {canEdit ? (
            <p className="text-xs text-ink-faint">
              Drag a piece onto a page, or focus it and press Enter to choose a page.
            </p>
          ) : null}
          <ul className="flex flex-col gap-2">
            {pieces.map((piece) => (
              <TrayPiece
                key={piece.id}
                piece={piece}
                canEdit={canEdit}
                onPlace={onPlace}
                onLeaveOut={() => onLeaveOut(piece.id, true)}
              />
            ))}
          </ul>
        </>
      )}
      {canEdit ? (
        <p className="text-xs text-ink-faint">Drop a placed piece here to take it off the map.</p>
      ) : null}
      {leftOut.length > 0 ? (
        <section
          aria-labelledby="left-out-title"
          className="flex flex-col gap-1 border-t border-ink/10 pt-2 text-sm"
          data-testid="left-out"
        >
          <h3 id="left-out-title" className="font-semibold text-ink-soft">
            Left out of this issue ({leftOut.length})
          </h3>
          <ul className="flex flex-col gap-1">
            {leftOut.map((piece) => (
              <li key={piece.id} data-testid={`left-out-piece-${piece.id}`}>
                {piece.title} <span className="text-ink-faint">by {piece.contributorName}</span>
                {canEdit && piece.status === "accepted" ? (
                  <>
                    {" "}
                    <button
                      type="button"
                      onClick={() => onLeaveOut(piece.id, false)}
                      className="text-xs font-semibold text-teal-dark underline"
                      data-testid={`bring-back-${piece.id}`}
                    >
                      Bring “{piece.title}” back
                    </button>
                  </>
                ) : null}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </section>
  );
}

function TrayPiece({
  piece,
  canEdit,
  onPlace,
  onLeaveOut,
}: {
  piece: PieceView;
  canEdit: boolean;
  onPlace: (pieceId: number) => void;
  onLeaveOut: () => void;
}) {
  const data: DragData = { pieceId: piece.id, from: "tray", index: 1 };
  const { attributes, listeners, setNodeRef, isDragging } = useDraggable({
    id: `tray-piece-${piece.id}`,
    data,
    disabled: !canEdit,
  });
  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    if (event.key === "Enter" && canEdit) {
      event.preventDefault();
      onPlace(piece.id);
      return;
    }
    listeners?.onKeyDown?.(event);
  };
  return (
    <li className="flex flex-col gap-1">
      <div
        ref={setNodeRef}
        {...attributes}
        {...listeners}
        onKeyDown={onKeyDown}
        aria-roledescription="piece"
        data-testid={`tray-piece-${piece.id}`}
        className={`rounded-md border border-ink/20 bg-paper px-3 py-2 text-sm shadow-sm ${canEdit ? "cursor-grab touch-none" : ""} ${isDragging ? "opacity-40" : ""}`}
      >
        <p className="font-semibold leading-tight">{piece.title}</p>
        <p className="text-xs text-ink-soft">
          {piece.contributorName} ·{" "}
          {piece.kind === "single"
            ? "1 page"
            : piece.kind === "spread"
              ? "spread, 2 pages"
              : `run of ${piece.length} pages`}
        </p>
        <p className="text-xs text-ink-faint">{inkList(piece.inks)}</p>
        {/* The name comes from the visible text (WCAG 2.2 SC 2.5.3); only the keys are added. */}
        <span className="sr-only">Press Enter to choose a page, or Space to drag.</span>
      </div>
      {canEdit ? (
        <button
          type="button"
          onClick={() => onPlace(piece.id)}
          className="self-start text-xs font-semibold text-teal-dark underline"
          data-testid={`tray-place-${piece.id}`}
        >
          Place “{piece.title}”…
        </button>
      ) : null}
      {canEdit ? (
        <button
          type="button"
          onClick={onLeaveOut}
          className="self-start text-xs text-ink-soft underline"
          data-testid={`tray-leave-out-${piece.id}`}
        >
          Leave “{piece.title}” out of this issue
        </button>
      ) : null}
    </li>
  );
}
