/**
 * What the credits page and the colophon say, from the page map and the credit lines the
 * contributors approved. Pure: the print job turns the text pages into type (lib/print/pdf), the
 * editors' credits screen previews them. A credit line is printed only once its contributor has
 * approved it; until then it is listed as outstanding and left off the page.
 */
import type { Binding, CoverStock, PrintMethod } from "@/lib/domain";
import { formatTrim } from "@/lib/format";
import { piecePages } from "@/lib/map/state";
import type { MapState } from "@/lib/map/types";
import { ptToMm } from "@/lib/print/units";

/** A page set in type, as lib/print/pdf/types.ts `PageContent` takes it. */
export interface TextPage {
  kind: "text";
  heading: string;
  lines: string[];
}

/** A piece's credit as the editors keep it. */
export interface CreditSource {
  pieceId: number;
  title: string;
  creditLine: string;
  /** The contributor approved this exact line (piece.credit_approved_at is set). */
  approved: boolean;
}

/** One line of the credits page. */
export interface PrintedCredit {
  pieceId: number;
  pages: number[];
  text: string;
}

/** A placed piece whose credit cannot print yet. */
export interface OutstandingCredit {
  pieceId: number;
  title: string;
  pages: number[];
}

export interface CreditsContent {
  page: TextPage;
  printed: PrintedCredit[];
  /** Placed, but the line is not approved: not printed. */
  outstanding: OutstandingCredit[];
}

const EN_DASH = "\u2013";
const EM_DASH = "\u2014";

/**
 * Reader pages as a reference: "p. 7", "pp. 4–5", "pp. 3–5, 9". Runs of two or more
 * consecutive pages are joined with an en dash, the dash for inclusive numbers (Chicago Manual of
 * Style, "En dash" section, 6.78 in the 17th edition: section number from memory); "p." for one
 * page and "pp." for more is common practice, no source.
 */
export function pageReference(pages: readonly number[]): string {
  const sorted = [...new Set(pages)].sort((x, y) => x - y);
  if (sorted.length === 0) return "";
  const runs: string[] = [];
  for (let i = 0; i < sorted.length;) {
    let j = i;
    while (j + 1 < sorted.length && sorted[j + 1] === sorted[j]! + 1) j++;
    runs.push(j > i ? `${sorted[i]}${EN_DASH}${sorted[j]}` : `${sorted[i]}`);
    i = j + 1;
  }
  return `${sorted.length === 1 ? "p." : "pp."} ${runs.join(", ")}`;
}

/** "pp. 4–5  Heron at the Sluice Gate — Wren Halloway". */
export function creditText(pages: readonly number[], title: string, creditLine: string): string {
  return `${pageReference(pages)}  ${title.trim()} ${EM_DASH} ${creditLine.trim()}`;
}

/**
 * The credits page: one line per placed piece in page order (by its first page), approved lines
 * only; placed pieces whose line is not approved come back as outstanding. Pieces not on the map
 * are not in this issue's credits.
 */
export function creditsContent(
  state: MapState,
  sources: readonly CreditSource[],
  heading = "Credits",
): CreditsContent {
  const where = piecePages(state);
  const placed = sources
    .map((source) => ({ source, pages: (where.get(source.pieceId) ?? []).map((w) => w.page) }))
    .filter((x) => x.pages.length > 0)
    .sort((x, y) => x.pages[0]! - y.pages[0]! || x.source.pieceId - y.source.pieceId);
  const printed: PrintedCredit[] = [];
  const outstanding: OutstandingCredit[] = [];
  for (const { source, pages } of placed) {
    if (source.approved && source.creditLine.trim() !== "")
      printed.push({
        pieceId: source.pieceId,
        pages,
        text: creditText(pages, source.title, source.creditLine),
      });
    else outstanding.push({ pieceId: source.pieceId, title: source.title, pages });
  }
  return {
    page: { kind: "text", heading, lines: printed.map((p) => p.text) },
    printed,
    outstanding,
  };
}

/** What the colophon reads from: the anthology's spec, the run and the year. */
export interface ColophonInput {
  title: string;
  pressName: string | null;
  trimPreset: string;
  trimWidthMm: number;
  trimHeightMm: number;
  binding: Binding;
  paperGsm: number;
  coverStock: CoverStock;
  coverPaperGsm: number | null;
  printMethod: PrintMethod;
  inks: string[];
  copies: number;
  year: number;
}

const PRINTED_ON: Record<PrintMethod, string> = {
  duplicator: "Printed on a stencil duplicator",
  "laser-colour": "Printed on a colour laser printer",
  "laser-black": "Printed on a black laser printer",
  inkjet: "Printed on an inkjet printer",
};

const BOUND: Record<Binding, string> = {
  "saddle-stitch": "Folded and saddle-stitched",
  "fold-only": "Folded from a single sheet",
};

/** "black", "black and teal", "black, teal and fluorescent pink". */
function listInWords(items: readonly string[]): string {
  if (items.length <= 1) return items[0] ?? "";
  return `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`;
}

/** The colophon: title, press, trim, paper, how it was printed and bound, inks, the edition and year. */
export function colophonContent(input: ColophonInput, heading = "Colophon"): TextPage {
  const paper =
    input.coverStock === "separate" && input.coverPaperGsm
      ? `Paper: ${input.paperGsm} gsm inside, ${input.coverPaperGsm} gsm cover`
      : `Paper: ${input.paperGsm} gsm throughout, cover included`;
  const inks = input.inks.filter((ink) => ink.trim() !== "");
  const lines = [
    input.title.trim(),
    ...(input.pressName?.trim() ? [`Published by ${input.pressName.trim()}`] : []),
    `Trim: ${formatTrim(input)}`,
    paper,
    `${PRINTED_ON[input.printMethod]}${inks.length ? ` in ${listInWords(inks)}` : ""}`,
    BOUND[input.binding],
    `An edition of ${input.copies.toLocaleString("en-US")} ${input.copies === 1 ? "copy" : "copies"}, ${input.year}`,
  ];
  return { kind: "text", heading, lines };
}

/**
 * Lines of type that fit a page: the trim height less the safe margin top and bottom, less two
 * lines for the heading, at `leadingPt` (12 pt leading for 10 pt type: common practice, no source).
 * A point is 1/72 in (ISO 32000-1 §8.3.2.3, default user space unit).
 */
export function linesPerPage(trimHeightMm: number, safeMarginMm: number, leadingPt = 12): number {
  const usable = trimHeightMm - 2 * safeMarginMm;
  return Math.max(1, Math.floor(usable / ptToMm(leadingPt)) - 2);
}

/** The text pages for the map's reserved "credits" and "colophon" slots. */
export interface ReservedTextPages {
  /** Each reserved page that gets type, in page order. */
  pages: { page: number; content: TextPage }[];
  /** Reserved pages for which there is no text (more credits pages than lines need, a second colophon). */
  unusedPages: number[];
  /** What has nowhere to go because no page is reserved for it. */
  unplaced: ("credits" | "colophon")[];
  /** Credit lines that did not fit on the credits pages reserved. */
  overflowLines: string[];
}

/**
 * Puts the credits on the map's "credits" pages (split in page order, `maxLines` a page, the later
 * pages headed "… (continued)") and the colophon on the first "colophon" page. The print job calls
 * this and gives each page's `content` to the builder.
 */
export function reservedTextPages(
  state: MapState,
  text: { credits: TextPage; colophon: TextPage },
  { maxLines }: { maxLines: number },
): ReservedTextPages {
  const perPage = Math.max(1, Math.floor(maxLines));
  const reserved = (kind: "credits" | "colophon") =>
    state.slots
      .filter((s) => s.reservation === kind && s.pieceId === null)
      .map((s) => s.page)
      .sort((x, y) => x - y);
  const out: ReservedTextPages = { pages: [], unusedPages: [], unplaced: [], overflowLines: [] };

  const creditPages = reserved("credits");
  if (creditPages.length === 0) out.unplaced.push("credits");
  const lines = [...text.credits.lines];
  creditPages.forEach((page, i) => {
    const chunk = lines.splice(0, perPage);
    if (i > 0 && chunk.length === 0) {
      out.unusedPages.push(page);
      return;
    }
    out.pages.push({
      page,
      content: {
        kind: "text",
        heading: i === 0 ? text.credits.heading : `${text.credits.heading} (continued)`,
        lines: chunk,
      },
    });
  });
  if (creditPages.length > 0) out.overflowLines = lines;

  const colophonPages = reserved("colophon");
  if (colophonPages.length === 0) out.unplaced.push("colophon");
  else {
    out.pages.push({ page: colophonPages[0]!, content: text.colophon });
    out.unusedPages.push(...colophonPages.slice(1));
  }
  out.pages.sort((x, y) => x.page - y.page);
  out.unusedPages.sort((x, y) => x - y);
  return out;
}
