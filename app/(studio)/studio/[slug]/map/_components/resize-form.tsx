import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import type { MapChange } from "@/lib/validations/page-map";

/** Grows or shrinks the booklet one folded sheet (4 pages) at a chosen page. */
export function ResizeForm({
  pageCount,
  maxPages,
  onChange,
}: {
  pageCount: number;
  maxPages: number;
  onChange: (change: MapChange) => Promise<boolean>;
}) {
  const [delta, setDelta] = useState<"4" | "-4">("4");
  const [atPage, setAtPage] = useState(String(Math.max(2, pageCount - 1)));
  const [error, setError] = useState<string | null>(null);
  const [force, setForce] = useState(false);
  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const at = Number(atPage);
    if (!Number.isInteger(at) || at < 1) {
      setError("Type a page number.");
      return;
    }
    setError(null);
    await onChange(
      delta === "4"
        ? { op: "resize", delta: 4, atPage: at }
        : { op: "resize", delta: -4, atPage: at, force },
    );
  };
  return (
    <form
      onSubmit={submit}
      className="flex flex-col gap-2 text-sm"
      data-testid="resize-form"
      aria-labelledby="resize-title"
    >
      <h2 id="resize-title" className="text-lg font-semibold">
        Page count: {pageCount}
      </h2>
      <p className="text-xs text-ink-faint">
        One folded sheet at a time: 4 pages. This binding takes at most {maxPages}.
      </p>
      <div className="flex flex-wrap items-end gap-2">
        <label className="flex flex-col gap-1">
          <span className="text-xs font-semibold">Change</span>
          <select
            data-testid="resize-delta"
            className={`${inputClass} bg-white`}
            value={delta}
            onChange={(e) => setDelta(e.target.value as "4" | "-4")}
          >
            <option value="4">Add 4 pages</option>
            <option value="-4">Remove 4 pages</option>
          </select>
        </label>
        <label className="flex flex-col gap-1">
          <span className="text-xs font-semibold">
            {delta === "4" ? "New pages start at page" : "Remove from page"}
          </span>
          <input
            data-testid="resize-at"
            inputMode="numeric"
            className={`${inputClass} w-20`}
            value={atPage}
            onChange={(e) => setAtPage(e.target.value)}
          />
        </label>
        <Button type="submit" variant="quiet" data-testid="resize-submit">
          {delta === "4" ? "Add" : "Remove"}
        </Button>
      </div>
      {delta === "-4" ? (
        <label className="flex items-start gap-2 text-xs">
          <input
            type="checkbox"
            data-testid="resize-force"
            checked={force}
            onChange={(e) => setForce(e.target.checked)}
            className="mt-0.5"
          />
          <span>
            If pieces sit on those pages, send them back to the tray. Without this, the removal is
            refused and names them.
          </span>
        </label>
      ) : null}
      {error ? <p className="text-xs font-semibold text-persimmon-dark">{error}</p> : null}
    </form>
  );
}
