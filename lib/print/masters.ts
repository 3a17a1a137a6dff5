/**
 * The masters (stencils) a duplicator run needs: one per ink per sheet side that carries that
 * ink, each a sheet side of greyscale art where only that ink's pages are drawn ("each copy
 * sheet is run thru the mimeo as many times as there are colors", Fancyclopedia, "Mimeography").
 * The print worker makes one PDF per ink from this; its number of masters is the number of
 * passes lib/map/passes.ts counts for a press laying one ink per pass. Pure.
 */
import { allSides, sheetSides } from "@/lib/map/layout";
import type { MapSheetSideName, MapState, SheetPlan } from "@/lib/map/types";
import type { PrintMethod } from "./spec";
import { needsSeparations, type RequiredFile } from "@/lib/pieces/separations";

/** One reader page on a master: a page of a piece that prints in the ink, or blank in it. */
export type MasterPage =
  | { page: number; kind: "piece"; pieceId: number; piecePageIndex: number }
  | { page: number; kind: "blank" };

/** One sheet side's master for one ink, its pages left to right as seen from that side. */
export interface MasterSide {
  sheet: number;
  side: MapSheetSideName;
  /** "2-front", as the sheet view keys sides. */
  key: string;
  pages: MasterPage[];
}

/** Every master for one ink, in print order (sheet 1 front, sheet 1 back, sheet 2 front, …). */
export interface InkMasters {
  ink: string;
  /** False for an ink a placed piece uses that the press does not have (listed after the press's). */
  onPress: boolean;
  sides: MasterSide[];
}

/**
 * For each ink, in press order (inks the press lacks last, alphabetically, as the sheet view
 * lists them), the sheet sides that need a master for it; a side where the ink is not used is
 * not listed, and an ink no placed piece uses has no entry. A page holds its piece's page only
 * on the masters of that piece's inks; everywhere else it is blank, as are padding pages,
 * reserved pages and pages with no piece.
 */
export function mastersFor(
  state: MapState,
  plan: SheetPlan = sheetSides(state.pageCount, state.binding),
): InkMasters[] {
  const inksById = new Map(state.pieces.map((p) => [p.id, [...new Set(p.inks)]]));
  const onPage = new Map<number, { pieceId: number; piecePageIndex: number; inks: string[] }>();
  for (const slot of state.slots) {
    if (slot.pieceId === null || slot.piecePageIndex === null) continue;
    if (slot.page < 1 || slot.page > state.pageCount) continue;
    const inks = inksById.get(slot.pieceId);
    if (!inks) continue;
    onPage.set(slot.page, { pieceId: slot.pieceId, piecePageIndex: slot.piecePageIndex, inks });
  }

  const used = new Set<string>();
  for (const { inks } of onPage.values()) for (const ink of inks) used.add(ink);
  const press = state.pressInks.filter((ink, i) => state.pressInks.indexOf(ink) === i);
  const order = [
    ...press.filter((ink) => used.has(ink)),
    ...[...used].filter((ink) => !press.includes(ink)).sort((a, b) => a.localeCompare(b)),
  ];

  const sides = allSides(plan);
  return order.map((ink) => ({
    ink,
    onPress: press.includes(ink),
    sides: sides
      .map((side): MasterSide => ({
        sheet: side.sheet,
        side: side.side,
        key: side.key,
        pages: side.pages.map((page): MasterPage => {
          const placed = onPage.get(page);
          return placed && placed.inks.includes(ink)
            ? {
                page,
                kind: "piece",
                pieceId: placed.pieceId,
                piecePageIndex: placed.piecePageIndex,
              }
            : { page, kind: "blank" };
        }),
      }))
      .filter((side) => side.pages.some((p) => p.kind === "piece")),
  }));
}

/** How many masters (stencils) the run needs: one per listed side of every ink. */
export function masterCount(masters: readonly InkMasters[]): number {
  return masters.reduce((n, m) => n + m.sides.length, 0);
}

/**
 * Which file supplies a piece's page on the master for an ink: the page's own (composite) file
 * for a one-ink piece, that ink's separation for a piece in two or more inks, and nothing (null:
 * the page is blank in this ink) when the piece does not print in it.
 */
export function fileForInk(
  anthology: { printMethod: PrintMethod },
  piece: { inks: readonly string[] },
  ink: string,
): RequiredFile | null {
  if (!piece.inks.includes(ink)) return null;
  return needsSeparations(anthology, piece) ? { kind: "separation", ink } : { kind: "composite" };
}
