import { useDraggable, useDroppable } from "@dnd-kit/core";
import type { MapSlot, RuleMessage } from "@/lib/map/types";
import { RESERVATION_LABELS } from "@/lib/map-edits/labels";
import { pageDropId, type DragData } from "./drag";
import { pageArt, type PieceView } from "./view-model";

export type SlotMark = "drop-ok" | "drop-no" | null;

/** The id of a page's select button, so focus can come back to a page after a dialog. */
export const slotButtonId = (page: number) => `map-page-${page}`;

/** One page of the map: what it holds or is kept for, its lock, and the rule messages about it. */
export function SlotCard({
  slot,
  piece,
  messages,
  selected,
  flagged,
  mark,
  canEdit,
  onSelect,
}: {
  slot: MapSlot;
  piece: PieceView | undefined;
  messages: RuleMessage[];
  selected: boolean;
  flagged: boolean;
  mark: SlotMark;
  canEdit: boolean;
  onSelect: (page: number) => void;
}) {
  const { setNodeRef, isOver } = useDroppable({ id: pageDropId(slot.page), disabled: !canEdit });
  const errors = messages.filter((m) => m.severity === "error");
  const tone = errors.length
    ? "border-persimmon"
    : messages.length
      ? "border-mustard"
      : "border-ink/20";
  const fill = slot.reservation ? "bg-paper-deep" : piece ? "bg-white" : "bg-white/40";
  const what = piece
    ? `${piece.title}${piece.length > 1 ? `, its page ${slot.piecePageIndex} of ${piece.length}` : ""}`
    : slot.reservation
      ? `kept for ${RESERVATION_LABELS[slot.reservation].toLowerCase()}`
      : "empty";
  return (
    <div
      ref={setNodeRef}
      data-testid={`slot-${slot.page}`}
      data-piece={slot.pieceId ?? ""}
      data-reservation={slot.reservation ?? ""}
      data-locked={slot.locked ? "true" : "false"}
      data-rules={messages.length}
      className={`relative flex h-40 w-28 flex-col gap-1 border-2 p-1.5 text-xs transition-colors ${tone} ${fill} ${
        selected ? "ring-2 ring-teal ring-offset-1" : ""
      } ${flagged ? "ring-2 ring-persimmon ring-offset-1" : ""} ${isOver && mark !== "drop-no" ? "bg-teal-light" : ""} ${
        mark === "drop-no" ? "opacity-40" : mark === "drop-ok" ? "border-dashed border-teal" : ""
      }`}
    >
      <button
        type="button"
        onClick={() => onSelect(slot.page)}
        aria-pressed={selected}
        id={slotButtonId(slot.page)}
        // Starts with the visible "p. N" so speech input can say what it sees (WCAG 2.2 SC 2.5.3).
        aria-label={`p. ${slot.page}: ${what}${slot.locked ? ", locked" : ""}${messages.length ? `, ${messages.length} rule ${messages.length === 1 ? "message" : "messages"}` : ""}`}
        // At least 24 px tall: the smallest target WCAG 2.2 SC 2.5.8 allows.
        className="flex min-h-6 items-center justify-between text-left font-mono text-[11px] text-ink-soft hover:text-ink"
        data-testid={`slot-select-${slot.page}`}
      >
        <span>p. {slot.page}</span>
        {slot.locked ? (
          <svg viewBox="0 0 12 14" className="h-3 w-3 fill-ink-soft" aria-hidden="true">
            <title>Locked</title>
            <path d="M3 6V4a3 3 0 0 1 6 0v2h1a1 1 0 0 1 1 1v6a1 1 0 0 1-1 1H2a1 1 0 0 1-1-1V7a1 1 0 0 1 1-1h1Zm1.5 0h3V4a1.5 1.5 0 0 0-3 0v2Z" />
          </svg>
        ) : null}
      </button>
      {slot.reservation ? (
        <p className="font-semibold text-ink-soft">{RESERVATION_LABELS[slot.reservation]}</p>
      ) : null}
      {piece ? (
        <PlacedChip
          piece={piece}
          slot={slot}
          canEdit={canEdit && !slot.locked}
          onSelect={onSelect}
        />
      ) : null}
      {!piece && !slot.reservation ? <p className="text-ink-faint">Empty</p> : null}
      {messages.length ? (
        <ul className="mt-auto flex flex-col gap-0.5" data-testid={`slot-rules-${slot.page}`}>
          {messages.slice(0, 2).map((m, i) => (
            <li
              key={i}
              className={`line-clamp-2 leading-tight ${m.severity === "error" ? "text-persimmon-dark" : "text-ink-soft"}`}
              title={m.message}
            >
              {m.severity === "error" ? "Problem: " : "Note: "}
              {m.message}
            </li>
          ))}
          {messages.length > 2 ? (
            <li className="text-ink-faint">and {messages.length - 2} more</li>
          ) : null}
        </ul>
      ) : null}
    </div>
  );
}

function PlacedChip({
  piece,
  slot,
  canEdit,
  onSelect,
}: {
  piece: PieceView;
  slot: MapSlot;
  canEdit: boolean;
  onSelect: (page: number) => void;
}) {
  const data: DragData = { pieceId: piece.id, from: "map", index: slot.piecePageIndex ?? 1 };
  const art = pageArt(piece, slot.piecePageIndex);
  const { attributes, listeners, setNodeRef, isDragging } = useDraggable({
    id: `map-piece-${piece.id}-${slot.page}`,
    data,
    disabled: !canEdit,
  });
  return (
    <div
      ref={setNodeRef}
      {...attributes}
      {...listeners}
      onKeyDown={(event) => {
        if (event.key === "Enter") {
          event.preventDefault();
          onSelect(slot.page);
          return;
        }
        listeners?.onKeyDown?.(event);
      }}
      aria-roledescription="placed piece"
      data-testid={`placed-${piece.id}-${slot.page}`}
      className={`flex min-h-0 flex-col gap-0.5 rounded bg-teal-light/70 px-1.5 py-1 ${canEdit ? "cursor-grab touch-none" : ""} ${isDragging ? "opacity-40" : ""}`}
    >
      {art ? (
        <img
          src={art.src}
          alt={art.alt}
          className="h-12 w-full rounded-sm bg-white object-contain"
          loading="lazy"
          draggable={false}
          data-testid={`slot-thumb-${slot.page}`}
        />
      ) : null}
      <p className="line-clamp-2 font-semibold leading-tight">{piece.title}</p>
      <p className="text-[11px] text-ink-soft">
        {piece.length > 1 ? `${slot.piecePageIndex}/${piece.length} · ` : ""}
        {piece.contributorName}
      </p>
      {/* The name comes from the visible text (WCAG 2.2 SC 2.5.3); the page and keys are added. */}
      <span className="sr-only">
        , on page {slot.page}. Press Enter for its page controls
        {canEdit ? ", or Space to drag it" : ""}.
      </span>
    </div>
  );
}
