import { useEffect, useId, useMemo, useRef, useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import type { MapState } from "@/lib/map/types";
import { checkedChange } from "@/lib/map-edits/apply";
import type { MapChange } from "@/lib/validations/page-map";
import { slotButtonId } from "./slot-card";
import { spanLabel, validStarts, type PieceView } from "./view-model";

/**
 * The keyboard way to place or move a piece: choose a start page from the pages where it fits,
 * or type one; the same rules as dragging say why a page will not do.
 */
export function PlaceDialog({
  mode,
  piece,
  state,
  onConfirm,
  onClose,
}: {
  mode: "place" | "move";
  piece: PieceView;
  state: MapState;
  onConfirm: (change: MapChange) => Promise<boolean>;
  onClose: () => void;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const id = useId();
  const starts = useMemo(() => validStarts(state, piece.id, mode), [state, piece.id, mode]);
  const [chosen, setChosen] = useState<string>(starts[0] !== undefined ? String(starts[0]) : "");
  const [typed, setTyped] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  // Where the piece went, once saved: closing hands focus to that page rather than to the tray
  // entry that has just gone, which would drop it on the page body (WCAG 2.2 SC 2.4.3).
  const placedAt = useRef<number | null>(null);

  useEffect(() => {
    const dialog = ref.current;
    const placed = placedAt;
    if (dialog && !dialog.open) dialog.showModal();
    return () => {
      dialog?.close();
      if (placed.current !== null) document.getElementById(slotButtonId(placed.current))?.focus();
    };
  }, []);

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const raw = typed.trim() !== "" ? typed.trim() : chosen;
    const startPage = Number(raw);
    if (raw === "" || !Number.isInteger(startPage) || startPage < 1) {
      setError(`Choose a start page, or type a page number from 1 to ${state.pageCount}.`);
      return;
    }
    const change: MapChange = { op: mode, pieceId: piece.id, startPage };
    const local = checkedChange(state, change);
    if (!local.ok) {
      setError(local.reason);
      return;
    }
    setBusy(true);
    const saved = await onConfirm(change);
    setBusy(false);
    if (saved) {
      placedAt.current = startPage;
      onClose();
    } else setError("The change was not saved; the message above the map says why.");
  };

  const shape =
    piece.kind === "spread"
      ? "a spread: it starts on a left (even) page"
      : piece.length > 1
        ? `a run of ${piece.length} pages in order`
        : "one page";
  return (
    <dialog
      ref={ref}
      aria-labelledby={`${id}-title`}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      data-testid="place-dialog"
      className="m-auto w-[min(32rem,92vw)] rounded-lg border border-ink/20 bg-paper p-5 text-ink shadow-xl backdrop:bg-ink/40"
    >
      <form onSubmit={submit} className="flex flex-col gap-3">
        <h2 id={`${id}-title`} className="text-xl font-semibold">
          {mode === "place" ? "Place" : "Move"} “{piece.title}”
        </h2>
        <p className="text-sm text-ink-soft">
          By {piece.contributorName}; {shape}.
        </p>
        {starts.length ? (
          <div className="flex flex-col gap-1">
            <label htmlFor={`${id}-start`} className="text-sm font-semibold">
              Where it fits
            </label>
            <select
              id={`${id}-start`}
              data-testid="place-start"
              className={`${inputClass} bg-white`}
              value={chosen}
              onChange={(e) => {
                setChosen(e.target.value);
                setError(null);
              }}
            >
              {starts.map((p) => (
                <option key={p} value={p}>
                  {spanLabel(p, piece.length)[0]!.toUpperCase() +
                    spanLabel(p, piece.length).slice(1)}
                </option>
              ))}
            </select>
          </div>
        ) : (
          <p className="text-sm text-persimmon-dark">
            There is no free place for it now: free some pages, or add 4 pages.
          </p>
        )}
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-typed`} className="text-sm font-semibold">
            Or type its first page
          </label>
          <input
            id={`${id}-typed`}
            data-testid="place-typed"
            inputMode="numeric"
            className={`${inputClass} w-32`}
            value={typed}
            aria-describedby={error ? `${id}-error` : undefined}
            aria-invalid={error ? true : undefined}
            onChange={(e) => {
              setTyped(e.target.value);
              setError(null);
            }}
          />
        </div>
        {error ? (
          <p
            id={`${id}-error`}
            data-testid="place-error"
            role="status"
            className="text-sm font-semibold text-persimmon-dark"
          >
            {error}
          </p>
        ) : null}
        <div className="flex gap-2">
          <Button type="submit" busy={busy} data-testid="place-confirm">
            {mode === "place" ? "Place it" : "Move it"}
          </Button>
          <Button type="button" variant="quiet" onClick={onClose}>
            Cancel
          </Button>
        </div>
      </form>
    </dialog>
  );
}
