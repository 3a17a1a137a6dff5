/**
 * The preflight before producing print files: what would stop the files being made (blockers)
 * and what would print but deserves a look (warnings), each in plain words with the numbers and
 * a link to where it is fixed. Built from the page-map check, the pieces in this issue, their
 * current files' verdicts and whether their credit lines are approved. Pure.
 */
import { checkMap } from "@/lib/map/check";
import { pagesInWords, plural } from "@/lib/map/state";
import type { MapState, RuleCode, RuleMessage } from "@/lib/map/types";

export type PreflightSeverity = "blocker" | "warning";

export type PreflightCode =
  | "map-rule"
  | "pieces-not-placed"
  | "pages-empty"
  | "file-missing"
  | "file-blocker"
  | "file-warning"
  | "credit-not-approved"
  | "spread-across-sheets"
  | "ink-overload"
  | "ink-not-on-press";

export interface PreflightEntry {
  severity: PreflightSeverity;
  code: PreflightCode;
  message: string;
  /** Where the editor fixes it (a studio path). */
  fixHref: string;
  pages: number[];
  pieceIds: number[];
}

/** A page of a piece and the verdict of its current file; null verdict = no current file. */
export interface PreflightPiecePage {
  pageIndex: number;
  verdict: string | null;
  fileName: string | null;
}

export interface PreflightPiece {
  id: number;
  title: string;
  creditApprovedAt: Date | string | null;
  pages: PreflightPiecePage[];
}

export interface PreflightInput {
  slug: string;
  state: MapState;
  /** The pieces on the map, with their pages' current files. */
  pieces: PreflightPiece[];
}

export interface Preflight {
  entries: PreflightEntry[];
  blockers: number;
  warnings: number;
  /** True when producing may go ahead (warnings allowed, no blockers). */
  ok: boolean;
}

const quote = (title: string) => `“${title}”`;

function listTitles(titles: string[], max = 3): string {
  const q = titles.map(quote);
  if (q.length <= max) {
    if (q.length <= 1) return q.join("");
    return `${q.slice(0, -1).join(", ")} and ${q[q.length - 1]}`;
  }
  return `${q.slice(0, max).join(", ")} and ${q.length - max} more`;
}

/** Map rules already said by an entry of their own below (or counted from the files). */
const MAP_CODES_HANDLED: ReadonlySet<RuleCode> = new Set<RuleCode>([
  "piece-not-placed",
  "page-empty",
  "spread-across-sheets",
  "side-over-press-inks",
  "ink-not-on-press",
  // Several passes per side is how a duplicator prints more than one ink; the map shows the count.
  "side-needs-several-passes",
]);

export function preflight(input: PreflightInput): Preflight {
  const { slug, state } = input;
  const mapHref = `/studio/${slug}/map`;
  const pieceHref = (id: number) => `/studio/${slug}/submissions/${id}`;
  const entries: PreflightEntry[] = [];
  const check = checkMap(state);
  const byCode = (code: RuleCode): RuleMessage[] => check.messages.filter((m) => m.code === code);

  // The map: its rules as they say them (errors block, warnings warn).
  for (const m of check.messages) {
    if (MAP_CODES_HANDLED.has(m.code)) continue;
    entries.push({
      severity: m.severity === "error" ? "blocker" : "warning",
      code: "map-rule",
      message: m.message,
      fixHref: mapHref,
      pages: m.pages,
      pieceIds: m.pieceIds,
    });
  }
  const notPlaced = byCode("piece-not-placed");
  if (notPlaced.length) {
    const ids = notPlaced.flatMap((m) => m.pieceIds);
    const titles = ids.map((id) => state.pieces.find((p) => p.id === id)?.title ?? `piece ${id}`);
    entries.push({
      severity: "blocker",
      code: "pieces-not-placed",
      message: `${plural(ids.length, "accepted piece")} ${ids.length === 1 ? "is" : "are"} not on the map yet: ${listTitles(titles)}. Place ${ids.length === 1 ? "it" : "them"}, or leave ${ids.length === 1 ? "it" : "them"} out of this issue.`,
      fixHref: mapHref,
      pages: [],
      pieceIds: ids,
    });
  }
  const empty = byCode("page-empty").flatMap((m) => m.pages);
  if (empty.length)
    entries.push({
      severity: "warning",
      code: "pages-empty",
      message: `${plural(empty.length, "page")} ${empty.length === 1 ? "is" : "are"} left empty and will print blank (${pagesInWords(empty)}). Place a piece there, or keep ${empty.length === 1 ? "it" : "them"} blank on purpose.`,
      fixHref: mapHref,
      pages: empty,
      pieceIds: [],
    });

  // The files of the pieces on the map.
  const where = new Map<number, number[]>();
  for (const slot of state.slots)
    if (slot.pieceId !== null)
      where.set(slot.pieceId, [...(where.get(slot.pieceId) ?? []), slot.page]);
  const onMap = input.pieces.filter((p) => where.has(p.id));
  for (const piece of onMap) {
    const pages = where.get(piece.id) ?? [];
    const missing = piece.pages.filter((pg) => pg.verdict === null || pg.verdict === "missing");
    const failing = piece.pages.filter((pg) => pg.verdict === "blocker");
    const warned = piece.pages.filter((pg) => pg.verdict === "warning");
    const pageWords = (list: PreflightPiecePage[]) =>
      `${list.length === 1 ? "page" : "pages"} ${list.map((pg) => pg.pageIndex).join(", ")} of ${piece.pages.length}`;
    if (missing.length)
      entries.push({
        severity: "blocker",
        code: "file-missing",
        message: `${quote(piece.title)} has no file for ${pageWords(missing)}.`,
        fixHref: pieceHref(piece.id),
        pages,
        pieceIds: [piece.id],
      });
    if (failing.length)
      entries.push({
        severity: "blocker",
        code: "file-blocker",
        message: `The current file of ${quote(piece.title)} for ${pageWords(failing)} will not print as it is (${failing.map((pg) => pg.fileName ?? "no name").join(", ")}). Ask for a fix.`,
        fixHref: pieceHref(piece.id),
        pages,
        pieceIds: [piece.id],
      });
    if (warned.length)
      entries.push({
        severity: "warning",
        code: "file-warning",
        message: `The current file of ${quote(piece.title)} for ${pageWords(warned)} has warnings; it prints, but look at its report first.`,
        fixHref: pieceHref(piece.id),
        pages,
        pieceIds: [piece.id],
      });
  }

  const unapproved = onMap.filter((p) => !p.creditApprovedAt);
  if (unapproved.length)
    entries.push({
      severity: "warning",
      code: "credit-not-approved",
      message: `${plural(unapproved.length, "credit line")} ${unapproved.length === 1 ? "is" : "are"} not approved by ${unapproved.length === 1 ? "its contributor" : "their contributors"} yet: ${listTitles(unapproved.map((p) => p.title))}.`,
      fixHref:
        unapproved.length === 1 ? pieceHref(unapproved[0]!.id) : `/studio/${slug}/submissions`,
      pages: [],
      pieceIds: unapproved.map((p) => p.id),
    });

  for (const m of byCode("spread-across-sheets"))
    entries.push({
      severity: "warning",
      code: "spread-across-sheets",
      message: m.message,
      fixHref: mapHref,
      pages: m.pages,
      pieceIds: m.pieceIds,
    });
  for (const m of byCode("side-over-press-inks"))
    entries.push({
      severity: "warning",
      code: "ink-overload",
      message: m.message,
      fixHref: mapHref,
      pages: m.pages,
      pieceIds: m.pieceIds,
    });
  for (const m of byCode("ink-not-on-press"))
    entries.push({
      severity: "warning",
      code: "ink-not-on-press",
      message: m.message,
      fixHref: mapHref,
      pages: m.pages,
      pieceIds: m.pieceIds,
    });

  // Blockers first, then warnings; the order within each is the order above.
  entries.sort((a, b) => Number(a.severity === "warning") - Number(b.severity === "warning"));
  const blockers = entries.filter((e) => e.severity === "blocker").length;
  return { entries, blockers, warnings: entries.length - blockers, ok: blockers === 0 };
}
