import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { SLOT_RESERVATIONS, type SlotReservation } from "@/lib/domain";
import type { MapSlot, RuleMessage } from "@/lib/map/types";
import { RESERVATION_LABELS } from "@/lib/map-edits/labels";
import type { MapChange } from "@/lib/validations/page-map";
import { inkList, type PieceView } from "./view-model";

/** Controls for the selected page: what it is kept for, its lock, and the piece on it. */
export function SlotPanel({
  slot,
  piece,
  messages,
  canEdit,
  onChange,
  onMove,
  onClose,
}: {
  slot: MapSlot;
  piece: PieceView | undefined;
  messages: RuleMessage[];
  canEdit: boolean;
  onChange: (change: MapChange) => void;
  onMove: (pieceId: number) => void;
  onClose: () => void;
}) {
  return (
    <section
      aria-labelledby="slot-panel-title"
      data-testid="slot-panel"
      className="flex flex-col gap-2 rounded-md border border-teal/40 bg-teal-light/30 p-3 text-sm"
    >
      <div className="flex items-baseline justify-between">
        <h2 id="slot-panel-title" className="text-lg font-semibold">
          Page {slot.page}
        </h2>
        <button type="button" onClick={onClose} className="text-xs underline">
          Close
        </button>
      </div>
      {piece ? (
        <div>
          <p className="font-semibold">{piece.title}</p>
          <p className="text-xs text-ink-soft">
            by {piece.contributorName}
            {piece.length > 1 ? ` · its page ${slot.piecePageIndex} of ${piece.length}` : ""} ·{" "}
            {inkList(piece.inks)}
          </p>
        </div>
      ) : (
        <p className="text-ink-soft">
          {slot.reservation
            ? `Kept for: ${RESERVATION_LABELS[slot.reservation]}`
            : "No piece on this page."}
        </p>
      )}
      {messages.length ? (
        <ul className="flex flex-col gap-1 text-xs">
          {messages.map((m, i) => (
            <li
              key={i}
              className={m.severity === "error" ? "text-persimmon-dark" : "text-ink-soft"}
            >
              {m.severity === "error" ? "Problem: " : "Note: "}
              {m.message}
            </li>
          ))}
        </ul>
      ) : null}
      {canEdit ? (
        <div className="flex flex-col gap-2 border-t border-ink/10 pt-2">
          <label htmlFor="slot-reservation" className="text-xs font-semibold">
            Keep this page for
          </label>
          <select
            id="slot-reservation"
            data-testid="slot-reservation"
            className={`${inputClass} bg-white`}
            value={slot.reservation ?? ""}
            disabled={slot.locked || slot.pieceId !== null}
            onChange={(e) =>
              onChange({
                op: "reserve",
                page: slot.page,
                reservation: e.target.value === "" ? null : (e.target.value as SlotReservation),
              })
            }
          >
            <option value="">Nothing: free for a piece</option>
            {SLOT_RESERVATIONS.map((r) => (
              <option key={r} value={r}>
                {RESERVATION_LABELS[r]}
              </option>
            ))}
          </select>
          {slot.pieceId !== null ? (
            <p className="text-xs text-ink-faint">
              Take the piece off to keep the page for something else.
            </p>
          ) : null}
          {slot.locked ? (
            <p className="text-xs text-ink-faint">Unlock the page to change it.</p>
          ) : null}
          <div className="flex flex-wrap gap-2">
            <Button
              type="button"
              variant="quiet"
              data-testid="slot-lock"
              onClick={() => onChange({ op: "lock", page: slot.page, locked: !slot.locked })}
            >
              {slot.locked ? "Unlock page" : "Lock page"}
            </Button>
            {piece ? (
              <>
                <Button
                  type="button"
                  variant="quiet"
                  data-testid="slot-move"
                  disabled={slot.locked}
                  onClick={() => onMove(piece.id)}
                >
                  Move…
                </Button>
                <Button
                  type="button"
                  variant="quiet"
                  data-testid="slot-remove"
                  disabled={slot.locked}
                  onClick={() => onChange({ op: "remove", pieceId: piece.id })}
                >
                  Back to the tray
                </Button>
              </>
            ) : null}
          </div>
        </div>
      ) : null}
    </section>
  );
}
