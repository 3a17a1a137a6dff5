import { readerSpreads } from "@/lib/map/layout";
import { slotsByPage } from "@/lib/map/state";
import type { MapState, RuleMessage } from "@/lib/map/types";
import { SlotCard, type SlotMark } from "./slot-card";
import type { PieceView } from "./view-model";

const SPREAD_LABEL = {
  "front-cover": "Front cover",
  "back-cover": "Back cover",
  spread: "",
  unpaired: "No facing page",
} as const;

/** The booklet as it is read: the front cover, the open spreads 2–3, 4–5, …, the back cover. */
export function ReaderView({
  state,
  pieces,
  byPage,
  selectedPage,
  flaggedPages,
  markFor,
  canEdit,
  onSelect,
}: {
  state: MapState;
  pieces: Map<number, PieceView>;
  byPage: Map<number, RuleMessage[]>;
  selectedPage: number | null;
  flaggedPages: ReadonlySet<number>;
  markFor: (page: number) => SlotMark;
  canEdit: boolean;
  onSelect: (page: number) => void;
}) {
  const slots = slotsByPage(state);
  return (
    <ol
      className="flex flex-wrap gap-x-6 gap-y-4"
      data-testid="reader-view"
      aria-label="Reader spreads"
    >
      {readerSpreads(state.pageCount).map((spread) => {
        const label =
          spread.kind === "spread" ? `Pages ${spread.pages.join("–")}` : SPREAD_LABEL[spread.kind];
        return (
          <li
            key={spread.pages.join("-")}
            className="flex flex-col gap-1"
            data-testid={`spread-${spread.pages.join("-")}`}
          >
            <span className="text-xs text-ink-faint">{label}</span>
            <div className={`flex ${spread.kind === "front-cover" ? "ml-28" : ""}`}>
              {spread.pages.map((page) => {
                const slot = slots[page];
                if (!slot) return null;
                return (
                  <SlotCard
                    key={page}
                    slot={slot}
                    piece={slot.pieceId !== null ? pieces.get(slot.pieceId) : undefined}
                    messages={byPage.get(page) ?? []}
                    selected={selectedPage === page}
                    flagged={flaggedPages.has(page)}
                    mark={markFor(page)}
                    canEdit={canEdit}
                    onSelect={onSelect}
                  />
                );
              })}
            </div>
          </li>
        );
      })}
    </ol>
  );
}
