import { sheetSides } from "@/lib/map/layout";
import { slotsByPage } from "@/lib/map/state";
import type { MapSheetSide, MapState, PassCount } from "@/lib/map/types";
import { RESERVATION_LABELS } from "@/lib/map-edits/labels";
import { inkList, pageArt, type PieceView } from "./view-model";

/** The same map as it prints: sheet by sheet, each side's two pages, inks and drum passes, and the creep. */
export function SheetView({
  state,
  pieces,
  passes,
  creepMm,
  coverStock,
}: {
  state: MapState;
  pieces: Map<number, PieceView>;
  passes: PassCount;
  creepMm: number[];
  coverStock: "self" | "separate";
}) {
  const plan = sheetSides(state.pageCount, state.binding);
  const slots = slotsByPage(state);
  const sideOf = new Map(passes.sides.map((s) => [s.key, s]));
  const pageLabel = (page: number) => {
    const slot = slots[page];
    if (!slot) return "padding (blank)";
    if (slot.pieceId !== null) return pieces.get(slot.pieceId)?.title ?? `piece ${slot.pieceId}`;
    if (slot.reservation) return RESERVATION_LABELS[slot.reservation];
    return "empty";
  };
  const Side = ({ side }: { side: MapSheetSide }) => {
    const count = sideOf.get(side.key);
    return (
      <div
        className="flex flex-col gap-1 rounded border border-ink/15 bg-white/60 p-2"
        data-testid={`sheet-side-${side.key}`}
      >
        <p className="text-xs font-semibold uppercase tracking-wide text-ink-soft">
          {side.side === "front" ? "Front (outside)" : "Back (inside)"}
        </p>
        <div className="flex gap-1">
          {side.pages.map((page) => {
            const slot = slots[page];
            const piece = slot?.pieceId != null ? pieces.get(slot.pieceId) : undefined;
            const art = piece ? pageArt(piece, slot?.piecePageIndex ?? null) : null;
            return (
              <div
                key={page}
                className="flex min-w-0 flex-1 flex-col gap-1 rounded bg-paper px-2 py-1 text-xs"
              >
                <span className="font-mono text-ink-faint">p. {page}</span>
                {art ? (
                  <img
                    src={art.src}
                    alt={art.alt}
                    className="h-16 w-full rounded-sm bg-white object-contain"
                    loading="lazy"
                    data-testid={`sheet-thumb-${page}`}
                  />
                ) : null}
                <p className="font-semibold leading-tight">{pageLabel(page)}</p>
              </div>
            );
          })}
        </div>
        <p className="text-xs">
          Inks: {count && count.inks.length ? inkList(count.inks) : "none"} ·{" "}
          <span data-testid={`side-passes-${side.key}`}>
            {count?.passes ?? 0} {count?.passes === 1 ? "pass" : "passes"}
          </span>
        </p>
        {count && count.missingInks.length ? (
          <p className="text-xs text-persimmon-dark">
            Not on the press: {inkList(count.missingInks)}
          </p>
        ) : null}
      </div>
    );
  };
  return (
    <div className="flex flex-col gap-4" data-testid="sheet-view">
      <dl className="grid grid-cols-2 gap-2 rounded-md border border-ink/15 bg-white/50 p-3 text-sm sm:grid-cols-4">
        <div>
          <dt className="text-ink-soft">Sheets per copy</dt>
          <dd className="text-lg font-semibold">{plan.sheets.length}</dd>
        </div>
        <div>
          <dt className="text-ink-soft">Passes per copy</dt>
          <dd className="text-lg font-semibold" data-testid="passes-per-copy">
            {passes.passesPerCopy}
          </dd>
        </div>
        <div>
          <dt className="text-ink-soft">Passes for {passes.copies} copies</dt>
          <dd className="text-lg font-semibold" data-testid="passes-per-run">
            {passes.passesPerRun.toLocaleString("en")}
          </dd>
        </div>
        <div>
          <dt className="text-ink-soft">Stencils to cut</dt>
          <dd className="text-lg font-semibold">{passes.mastersPerRun}</dd>
        </div>
      </dl>
      <p className="text-xs text-ink-soft">{passes.explanation}</p>
      {plan.paddingPages.length ? (
        <p className="text-xs text-persimmon-dark">
          Laid out as if padded to {plan.laidOutPages} pages: {plan.paddingPages.join(", ")} would
          print blank.
        </p>
      ) : null}
      <ol className="flex flex-col gap-3">
        {plan.sheets.map((sheet) => {
          const creep = creepMm[sheet.sheet - 1];
          return (
            <li
              key={sheet.sheet}
              className="rounded-md border border-ink/20 p-3"
              data-testid={`sheet-${sheet.sheet}`}
            >
              <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
                <h3 className="text-base font-semibold">
                  Sheet {sheet.sheet}
                  {sheet.sheet === 1
                    ? coverStock === "separate"
                      ? " · cover stock"
                      : " · outermost"
                    : ""}
                  {sheet.centre ? " · centre" : ""}
                </h3>
                <p className="text-xs text-ink-soft" data-testid={`creep-${sheet.sheet}`}>
                  {creep === undefined
                    ? "Creep shows once the map is saved."
                    : creep === 0
                      ? "Creep: none (outermost sheet)."
                      : `Creep: sticks out ${creep.toFixed(2)} mm at the fore-edge; its pages move ${creep.toFixed(2)} mm toward the spine.`}
                </p>
              </div>
              <div className="grid gap-2 sm:grid-cols-2">
                <Side side={sheet.front} />
                <Side side={sheet.back} />
              </div>
            </li>
          );
        })}
      </ol>
    </div>
  );
}
