/**
 * The page-map check: how a booklet is built (page count for the binding, within the page
 * limit), where pieces may sit (spreads on an even-left/odd-right pair, runs in order, no page
 * used twice) and that every accepted piece is placed or deliberately left out. Warnings point
 * at things that print but cost effort: spreads split across sheets and sides that need more
 * than one pass.
 */
import { padToMultipleOf4 } from "@/lib/print/imposition";
import { foldFormatFor, sheetByPage, sheetSides } from "./layout";
import { countPasses } from "./passes";
import { pagesInWords, pieceLength, pieceName, plural } from "./state";
import type { MapCheck, MapPiece, MapState, RuleCode, RuleMessage, RuleSeverity } from "./types";

const ERROR_CODES: ReadonlySet<RuleCode> = new Set<RuleCode>([
  "page-count-not-multiple-of-4",
  "fold-only-page-count",
  "over-max-pages",
  "slots-do-not-match-pages",
  "unknown-piece",
  "piece-page-index-invalid",
  "spread-not-on-facing-pages",
  "run-out-of-order",
  "piece-page-placed-twice",
  "reserved-slot-holds-piece",
  "piece-not-placed",
  "piece-placed-partially",
]);

/** The severity a rule code always has. */
export function severityOf(code: RuleCode): RuleSeverity {
  return ERROR_CODES.has(code) ? "error" : "warning";
}

function msg(
  code: RuleCode,
  message: string,
  pages: number[] = [],
  pieceIds: number[] = [],
): RuleMessage {
  return {
    code,
    severity: severityOf(code),
    message,
    pages: [...pages].sort((a, b) => a - b),
    pieceIds: [...pieceIds].sort((a, b) => a - b),
  };
}

function inkList(inks: readonly string[]): string {
  if (inks.length <= 1) return inks.join("");
  return `${inks.slice(0, -1).join(", ")} and ${inks[inks.length - 1]}`;
}

/** Checks a page map against every rule; errors block printing, warnings explain extra work. */
export function checkMap(state: MapState): MapCheck {
  const out: RuleMessage[] = [];
  const n = state.pageCount;

  // How the booklet is built.
  if (state.binding === "saddle-stitch" && n % 4 !== 0) {
    const { pages, blanks } = padToMultipleOf4(n);
    const add: number[] = [];
    for (let p = n + 1; p <= pages; p++) add.push(p);
    const fewer = n - (pages - 4);
    out.push(
      msg(
        "page-count-not-multiple-of-4",
        `The booklet has ${plural(n, "page")}; a saddle stitch needs a multiple of 4, because each folded sheet carries 4 pages. ` +
          `Add ${plural(blanks, "blank page")} (${pagesInWords(add)}) to make ${pages}` +
          (pages - 4 >= 4 ? `, or take out ${plural(fewer, "page")} to make ${pages - 4}.` : "."),
        add,
      ),
    );
  }
  if (state.binding === "fold-only" && foldFormatFor(n) === null)
    out.push(
      msg(
        "fold-only-page-count",
        `A fold-only sheet has 4, 6 or 8 pages (folded once, folded in thirds, or slit and folded); this map has ${plural(n, "page")}.`,
      ),
    );
  if (n > state.maxPages)
    out.push(
      msg(
        "over-max-pages",
        `The booklet has ${plural(n, "page")}, more than the ${state.maxPages} this binding allows; take out ${plural(n - state.maxPages, "page")}.`,
        Array.from({ length: n - state.maxPages }, (_, i) => state.maxPages + i + 1),
      ),
    );

  // One slot per page.
  const seen = new Map<number, number>();
  for (const s of state.slots) seen.set(s.page, (seen.get(s.page) ?? 0) + 1);
  const missing: number[] = [];
  for (let p = 1; p <= n; p++) if (!seen.has(p)) missing.push(p);
  const doubled = [...seen.entries()].filter(([p, c]) => c > 1 && p >= 1 && p <= n).map(([p]) => p);
  const outside = [...seen.keys()].filter((p) => !(Number.isInteger(p) && p >= 1 && p <= n));
  if (missing.length || doubled.length || outside.length) {
    const parts: string[] = [];
    if (missing.length)
      parts.push(`${pagesInWords(missing)} ${missing.length === 1 ? "has" : "have"} no slot`);
    if (doubled.length)
      parts.push(
        `${pagesInWords(doubled)} ${doubled.length === 1 ? "has" : "have"} more than one slot`,
      );
    if (outside.length)
      parts.push(`${pagesInWords(outside)} ${outside.length === 1 ? "is" : "are"} outside 1–${n}`);
    out.push(
      msg(
        "slots-do-not-match-pages",
        `The map should have one slot per page 1–${n}: ${parts.join("; ")}.`,
        [...missing, ...doubled, ...outside],
      ),
    );
  }

  const pieceById = new Map<number, MapPiece>(state.pieces.map((p) => [p.id, p]));
  const placements = new Map<number, Array<{ page: number; index: number }>>();
  const unknown = new Map<number, number[]>();
  for (const s of state.slots) {
    if (s.pieceId === null) continue;
    const piece = pieceById.get(s.pieceId);
    if (s.reservation !== null)
      out.push(
        msg(
          "reserved-slot-holds-piece",
          `Page ${s.page} is kept for the ${s.reservation} and also holds ${pieceName(piece, s.pieceId)}; clear one of them.`,
          [s.page],
          [s.pieceId],
        ),
      );
    if (!piece) {
      unknown.set(s.pieceId, [...(unknown.get(s.pieceId) ?? []), s.page]);
      continue;
    }
    const len = pieceLength(piece);
    const idx = s.piecePageIndex;
    if (idx === null || !Number.isInteger(idx) || idx < 1 || idx > len) {
      out.push(
        msg(
          "piece-page-index-invalid",
          `Page ${s.page} holds ${pieceName(piece, piece.id)} but names its page ${idx ?? "(none)"}; the piece has ${plural(len, "page")}.`,
          [s.page],
          [piece.id],
        ),
      );
      continue;
    }
    const list = placements.get(piece.id) ?? [];
    list.push({ page: s.page, index: idx });
    placements.set(piece.id, list);
  }
  for (const [id, pages] of unknown)
    out.push(
      msg(
        "unknown-piece",
        `${pagesInWords(pages)} ${pages.length === 1 ? "holds" : "hold"} piece ${id}, which is not an accepted piece.`,
        pages,
        [id],
      ),
    );

  const plan = sheetSides(n, state.binding);
  const sheetOf = sheetByPage(plan);

  for (const piece of [...state.pieces].sort((a, b) => a.id - b.id)) {
    const list = (placements.get(piece.id) ?? []).sort((a, b) => a.page - b.page);
    const name = pieceName(piece, piece.id);
    const len = pieceLength(piece);
    if (list.length === 0) {
      if (!piece.leftOut && !unknown.has(piece.id))
        out.push(
          msg(
            "piece-not-placed",
            `${name} (${plural(len, "page")}) is not on the map; place it or mark it left out of this issue.`,
            [],
            [piece.id],
          ),
        );
      continue;
    }
    if (piece.leftOut)
      out.push(
        msg(
          "left-out-piece-placed",
          `${name} is marked left out but still sits on ${pagesInWords(list.map((l) => l.page))}.`,
          list.map((l) => l.page),
          [piece.id],
        ),
      );

    const byIndex = new Map<number, number[]>();
    for (const l of list) byIndex.set(l.index, [...(byIndex.get(l.index) ?? []), l.page]);
    let clean = true;
    for (const [index, pages] of [...byIndex.entries()].sort((a, b) => a[0] - b[0])) {
      if (pages.length > 1) {
        clean = false;
        out.push(
          msg(
            "piece-page-placed-twice",
            `Page ${index} of ${name} is placed ${pages.length} times, on ${pagesInWords(pages)}; keep one.`,
            pages,
            [piece.id],
          ),
        );
      }
    }
    const absent: number[] = [];
    for (let i = 1; i <= len; i++) if (!byIndex.has(i)) absent.push(i);
    if (absent.length) {
      clean = false;
      out.push(
        msg(
          "piece-placed-partially",
          `${name} has ${plural(len, "page")} but only ${plural(len - absent.length, "is", "are")} placed` +
            ` (on ${pagesInWords([...new Set(list.map((l) => l.page))])}); its ${absent.length === 1 ? "page" : "pages"} ${absent.join(", ")} ${absent.length === 1 ? "is" : "are"} missing.`,
          list.map((l) => l.page),
          [piece.id],
        ),
      );
    }
    if (!clean || len === 1) continue;
    const first = byIndex.get(1)?.[0] ?? 0;
    const inOrder = list.every((l) => l.page === first + l.index - 1);
    const pages = list.map((l) => l.page);
    if (piece.kind === "spread") {
      if (!inOrder || first % 2 !== 0)
        out.push(
          msg(
            "spread-not-on-facing-pages",
            `${name} is a spread on ${pagesInWords(pages)}; a spread needs a left (even) page and the right (odd) page after it, such as ${first % 2 === 0 ? first : Math.max(2, first - 1)} and ${first % 2 === 0 ? first + 1 : Math.max(3, first)}.`,
            pages,
            [piece.id],
          ),
        );
      else if (sheetOf[first] !== sheetOf[first + 1])
        out.push(
          msg(
            "spread-across-sheets",
            `${name} on pages ${first} and ${first + 1} prints on two sheets (page ${first} on sheet ${sheetOf[first]}, page ${first + 1} on sheet ${sheetOf[first + 1]}): ` +
              `the halves print apart and must line up across the fold when the booklet is folded.` +
              (plan.centreSpread && state.binding === "saddle-stitch"
                ? ` Only the centre spread, pages ${plan.centreSpread[0]} and ${plan.centreSpread[1]}, prints in one piece.`
                : ""),
            pages,
            [piece.id],
          ),
        );
    } else if (!inOrder) {
      const order = list.map((l) => `${l.index}→${l.page}`).join(", ");
      out.push(
        msg(
          "run-out-of-order",
          `${name} is a run of ${plural(len, "page")} and must sit on ${len} pages in a row in its own order; now its pages are at ${order} (piece page→reader page).`,
          pages,
          [piece.id],
        ),
      );
    }
  }

  // Inks per side.
  const passes = countPasses(state);
  const perPass = passes.inksPerPass;
  for (const side of passes.sides) {
    const where = `Sheet ${side.sheet} ${side.side} (${pagesInWords(side.pages)})`;
    if (side.missingInks.length)
      out.push(
        msg(
          "ink-not-on-press",
          `${where} needs ${inkList(side.missingInks)}, which the press does not have (it has ${state.pressInks.length ? inkList(state.pressInks) : "no inks listed"}).`,
          side.pages,
          side.pieceIds,
        ),
      );
    if (side.inks.length > state.pressInks.length)
      out.push(
        msg(
          "side-over-press-inks",
          `${where} carries ${plural(side.inks.length, "ink")} (${inkList(side.inks)}) but the press has only ${plural(state.pressInks.length, "ink")}.`,
          side.pages,
          side.pieceIds,
        ),
      );
    if (side.inks.length > perPass)
      out.push(
        msg(
          "side-needs-several-passes",
          `${where} carries ${inkList(side.inks)}; the press lays ${plural(perPass, "ink")} per pass, so this side goes through the press ${side.passes} times ` +
            `(${side.inks.length} inks ÷ ${perPass}, rounded up). Putting pieces with the same inks on the same side saves passes.`,
          side.pages,
          side.pieceIds,
        ),
      );
  }

  const empty = state.slots
    .filter((s) => s.page >= 1 && s.page <= n && s.pieceId === null && s.reservation === null)
    .map((s) => s.page)
    .sort((a, b) => a - b);
  if (empty.length)
    out.push(
      msg(
        "page-empty",
        `${pagesInWords(empty)} ${empty.length === 1 ? "is" : "are"} empty: place a piece or keep ${empty.length === 1 ? "it" : "them"} as blank.`,
        empty,
      ),
    );

  const first = (m: RuleMessage) => m.pages[0] ?? Number.MAX_SAFE_INTEGER;
  const sorted = (list: RuleMessage[]) =>
    list
      .map((m, i) => ({ m, i }))
      .sort((a, b) => first(a.m) - first(b.m) || a.i - b.i)
      .map((x) => x.m);
  const errors = sorted(out.filter((m) => m.severity === "error"));
  const warnings = sorted(out.filter((m) => m.severity === "warning"));
  return { ok: errors.length === 0, errors, warnings, messages: [...errors, ...warnings] };
}

/** Only the errors, for a quick "can this print?" */
export function mapErrors(state: MapState): RuleMessage[] {
  return checkMap(state).errors;
}
