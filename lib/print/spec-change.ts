/**
 * What changing an anthology's print spec after the call has started would break. Given the spec
 * before and after, the page map as it stands and the current file of every page with its report,
 * it lists each consequence with a severity:
 *
 * - a refusal: the change would break what is already laid out (the map holds more pages than
 *   the new limit, a placed piece prints in an ink taken away, the map's own rules would fail);
 *   the editor must change something else first;
 * - a warning: the change is allowed but costs someone work (files that meet the spec now would
 *   not at the new trim, bleed or resolution; greyscale duplicator files going to a colour
 *   press); the editor confirms, and every current file is then checked again;
 * - a note: worth knowing, nothing to confirm.
 *
 * The file predictions read the measurements in each stored report, so they need no bytes; the
 * check run on every current file after a confirmed change is what counts.
 */
import { checkMap } from "@/lib/map/check";
import { pagesInWords, plural } from "@/lib/map/state";
import type { MapState, RuleMessage } from "@/lib/map/types";
import { readable } from "@/lib/pieces/versions";
import {
  classifySize,
  DEFAULT_TRIM_TOLERANCE_MM,
  LOW_PPI_BLOCKER_RATIO,
  type SpecReport,
} from "./check";
import type { Binding, CoverStock } from "@/lib/domain";
import { bleedBoxOf, specOf, type PrintMethod, type PrintSpec } from "./spec";
import { roundTo } from "./units";

/** The spec columns of an anthology the spec screen edits; lengths in millimetres. */
export interface AnthologySpec {
  trimPreset: string;
  trimWidthMm: number;
  trimHeightMm: number;
  bleedMm: number;
  safeMarginMm: number;
  minPpi: number;
  printMethod: PrintMethod;
  inks: string[];
  inksPerPass: number;
  binding: Binding;
  pageCountTarget: number;
  maxPages: number;
  paperGsm: number;
  paperCaliperMm: number;
  coverStock: CoverStock;
  coverPaperGsm: number | null;
}

/** The current file of one page of a piece, with the report it was last checked to. */
export interface CurrentFile {
  versionId: number;
  pieceId: number;
  pieceTitle: string;
  /** 1-based page of the piece. */
  pageIndex: number;
  fileName: string;
  /** The piece's own inks; empty when it takes the anthology's. */
  pieceInks: string[];
  report: SpecReport;
}

export type ImpactSeverity = "refusal" | "warning" | "note";

export type SpecImpactCode =
  | "max-pages-below-map"
  | "page-count-set-by-map"
  | "ink-in-use-removed"
  | "ink-offered-by-call"
  | "map-rule-broken"
  | "map-rule-warning"
  | "ink-removed-from-pieces"
  | "files-will-fail"
  | "duplicator-files-to-colour-press"
  | "files-checked-again";

export interface SpecImpact {
  code: SpecImpactCode;
  severity: ImpactSeverity;
  /** Plain words with the numbers and the pieces' titles. */
  message: string;
  /** Pieces concerned. */
  pieceIds: number[];
  /** Reader pages of the map concerned. */
  pages: number[];
}

export interface SpecChangeInput {
  before: AnthologySpec;
  after: AnthologySpec;
  /** The page map as it stands; null when it has not been laid out yet. */
  map: MapState | null;
  /** The current file of every page that has one. */
  files: readonly CurrentFile[];
  /** Inks the open call offers contributors; null when there is no call. */
  callInks: readonly string[] | null;
}

export interface SpecChange {
  impacts: SpecImpact[];
  /** Some impact is a refusal: the change cannot be saved as it is. */
  refused: boolean;
  /** Some impact is a warning: the change is saved only when the editor confirms. */
  needsConfirmation: boolean;
  /** Something the file check reads changed, so every current file is checked again. */
  recheck: boolean;
}

/** Lengths closer than this are the same length typed in another unit (inches read back as millimetres). */
export const SAME_LENGTH_MM = 0.001;

const sameLength = (a: number, b: number) => Math.abs(a - b) < SAME_LENGTH_MM;
const key = (ink: string) => ink.trim().toLowerCase();
const mm = (v: number) => `${roundTo(v, 1)} mm`;
const sizeMm = (w: number, h: number) => `${roundTo(w, 1)} x ${roundTo(h, 1)} mm`;
const quoted = (title: string) => `“${title}”`;

function listText(items: readonly string[]): string {
  if (items.length <= 1) return items[0] ?? "";
  return `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`;
}

/**
 * The spec with lengths that only differ by unit conversion put back to the values stored
 * before, so an untouched field is never a change.
 */
export function keepUnchangedLengths(before: AnthologySpec, after: AnthologySpec): AnthologySpec {
  const out = { ...after };
  for (const field of ["trimWidthMm", "trimHeightMm", "bleedMm", "safeMarginMm"] as const)
    if (sameLength(before[field], after[field])) out[field] = before[field];
  if (Math.abs(before.paperCaliperMm - after.paperCaliperMm) < 0.0005)
    out.paperCaliperMm = before.paperCaliperMm;
  return out;
}

/** True when something the file check reads differs: trim, bleed, safe margin, resolution, method or inks. */
export function checkedSpecChanged(before: AnthologySpec, after: AnthologySpec): boolean {
  return (
    !sameLength(before.trimWidthMm, after.trimWidthMm) ||
    !sameLength(before.trimHeightMm, after.trimHeightMm) ||
    !sameLength(before.bleedMm, after.bleedMm) ||
    !sameLength(before.safeMarginMm, after.safeMarginMm) ||
    before.minPpi !== after.minPpi ||
    before.printMethod !== after.printMethod ||
    before.inks.length !== after.inks.length ||
    before.inks.some((ink, i) => key(ink) !== key(after.inks[i] ?? ""))
  );
}

/** Lists what the change from `before` to `after` breaks; see the module comment. */
export function analyseSpecChange(input: SpecChangeInput): SpecChange {
  const { before, map } = input;
  const after = keepUnchangedLengths(before, input.after);
  const impacts: SpecImpact[] = [];
  if (map) impacts.push(...mapImpacts(before, after, map));
  impacts.push(...inkImpacts(before, after, map, input.files, input.callInks));
  const recheck = checkedSpecChanged(before, after);
  if (recheck) {
    impacts.push(...input.files.flatMap((file) => fileImpacts(after, file)));
    impacts.push(...colourPressImpacts(before, after, input.files));
    if (input.files.length > 0)
      impacts.push({
        code: "files-checked-again",
        severity: "note",
        message: `${plural(input.files.length, "current file")} will be checked again against the new spec when it is saved, and ${input.files.length === 1 ? "its contributor sees" : "their contributors see"} the new ${input.files.length === 1 ? "report" : "reports"}.`,
        pieceIds: [...new Set(input.files.map((f) => f.pieceId))],
        pages: [],
      });
  }
  return {
    impacts,
    refused: impacts.some((i) => i.severity === "refusal"),
    needsConfirmation: impacts.some((i) => i.severity === "warning"),
    recheck,
  };
}

/** Pieces on the map and the reader pages each sits on, in page order. */
function placedPieces(map: MapState): Map<number, number[]> {
  const placed = new Map<number, number[]>();
  for (const slot of [...map.slots].sort((a, b) => a.page - b.page))
    if (slot.pieceId !== null)
      placed.set(slot.pieceId, [...(placed.get(slot.pieceId) ?? []), slot.page]);
  return placed;
}

function titleOf(map: MapState, pieceId: number): string {
  const piece = map.pieces.find((p) => p.id === pieceId);
  return piece ? quoted(piece.title) : `piece ${pieceId}`;
}

function mapImpacts(before: AnthologySpec, after: AnthologySpec, map: MapState): SpecImpact[] {
  const out: SpecImpact[] = [];
  const placed = placedPieces(map);
  if (after.maxPages < map.pageCount) {
    const beyond = [...placed].filter(([, pages]) => pages.some((p) => p > after.maxPages));
    const where = beyond.map(([id, pages]) => `${titleOf(map, id)} on ${pagesInWords(pages)}`);
    out.push({
      code: "max-pages-below-map",
      severity: "refusal",
      message:
        `The page map has ${plural(map.pageCount, "page")}${where.length ? `, with ${listText(where)}` : ""}, ` +
        `so the most pages cannot go below ${map.pageCount}. Take pages out on the page map first; it moves the pieces with them.`,
      pieceIds: beyond.map(([id]) => id),
      pages: beyond.flatMap(([, pages]) => pages.filter((p) => p > after.maxPages)),
    });
  }
  if (after.pageCountTarget !== before.pageCountTarget && after.pageCountTarget !== map.pageCount)
    out.push({
      code: "page-count-set-by-map",
      severity: "refusal",
      message: `The page map already has ${plural(map.pageCount, "page")}; add or take out pages on the page map, which keeps the pieces in order, rather than here.`,
      pieceIds: [],
      pages: [],
    });

  // The map's own rules, with the new binding, page limit and inks: only what the change adds.
  const next: MapState = {
    ...map,
    binding: after.binding,
    maxPages: after.maxPages,
    inksPerPass: after.inksPerPass,
    pressInks: after.inks,
  };
  const ruleKey = (m: RuleMessage) => `${m.code}:${m.pages.join(",")}:${m.pieceIds.join(",")}`;
  const known = new Set(checkMap(map).messages.map(ruleKey));
  for (const message of checkMap(next).messages) {
    // Covered above in the editor's terms, or by the ink rule below.
    if (message.code === "over-max-pages" || message.code === "ink-not-on-press") continue;
    if (known.has(ruleKey(message))) continue;
    const error = message.severity === "error";
    out.push({
      code: error ? "map-rule-broken" : "map-rule-warning",
      severity: error ? "refusal" : "warning",
      message: `On the page map: ${message.message}`,
      pieceIds: message.pieceIds,
      pages: message.pages,
    });
  }
  return out;
}

function inkImpacts(
  before: AnthologySpec,
  after: AnthologySpec,
  map: MapState | null,
  files: readonly CurrentFile[],
  callInks: readonly string[] | null,
): SpecImpact[] {
  const kept = new Set(after.inks.map(key));
  const removed = before.inks.filter((ink) => !kept.has(key(ink)));
  if (removed.length === 0) return [];
  const out: SpecImpact[] = [];
  const placed = map ? placedPieces(map) : new Map<number, number[]>();
  const placedIds = new Set<number>();
  for (const ink of removed) {
    const users = map
      ? map.pieces.filter((p) => placed.has(p.id) && p.inks.some((i) => key(i) === key(ink)))
      : [];
    for (const piece of users) placedIds.add(piece.id);
    if (users.length > 0)
      out.push({
        code: "ink-in-use-removed",
        severity: "refusal",
        message: `${listText(users.map((p) => `${quoted(p.title)} (${pagesInWords(placed.get(p.id) ?? [])})`))} ${users.length === 1 ? "prints" : "print"} in ${ink}, so ${ink} cannot be taken off the press. Take ${users.length === 1 ? "the piece" : "them"} off the page map first, or keep the ink.`,
        pieceIds: users.map((p) => p.id),
        pages: users.flatMap((p) => placed.get(p.id) ?? []),
      });
    if (callInks?.some((i) => key(i) === key(ink)))
      out.push({
        code: "ink-offered-by-call",
        severity: "refusal",
        message: `The open call offers ${ink} to contributors; take it off the call's inks first, so nobody is asked for a file in an ink the press no longer has.`,
        pieceIds: [],
        pages: [],
      });
  }
  // Pieces with files in a removed ink that are not on the map: allowed, but they need a word.
  const affected = new Map<number, { title: string; inks: string[] }>();
  for (const file of files) {
    if (placedIds.has(file.pieceId)) continue;
    const inks = file.pieceInks.filter((i) => removed.some((r) => key(r) === key(i)));
    if (inks.length > 0) affected.set(file.pieceId, { title: file.pieceTitle, inks });
  }
  if (affected.size > 0)
    out.push({
      code: "ink-removed-from-pieces",
      severity: "warning",
      message: `${listText([...affected.values()].map((p) => `${quoted(p.title)} (${listText(p.inks)})`))} ${affected.size === 1 ? "was" : "were"} sent for an ink the press would no longer have; ${affected.size === 1 ? "its contributor needs" : "their contributors need"} to hear before the piece is placed.`,
      pieceIds: [...affected.keys()],
      pages: [],
    });
  return out;
}

/**
 * Why a file that does not fail the spec now would fail it after the change, or null. Reads the
 * measurements in its report: the pixel size of an image, the page boxes of a PDF, its colour.
 */
export function failsAfterChange(after: AnthologySpec, file: CurrentFile): string | null {
  const { report } = file;
  if (report.verdict === "blocker" || !readable(report)) return null;
  const spec: PrintSpec = specOf(after, { pagesExpected: 1, inks: file.pieceInks });
  const m = report.measured;
  const reasons: string[] = [];
  if (report.format === "pdf") {
    const reason = pdfTrimReason(spec, report);
    if (reason) reasons.push(reason);
  } else if (m.widthPx && m.heightPx) {
    reasons.push(...rasterReasons(spec, m.widthPx, m.heightPx));
  }
  const inColour = m.colourSpace === "rgb" || m.colourSpace === "cmyk";
  const looksGrey = report.findings.some((f) => f.code === "grey-in-colour-file");
  if (spec.printMethod === "duplicator" && spec.inks.length > 1 && inColour && !looksGrey)
    reasons.push(
      `it is in colour, and duplicator printing in ${spec.inks.length} inks needs one greyscale file per ink`,
    );
  return reasons.length ? listText(reasons) : null;
}

function rasterReasons(spec: PrintSpec, widthPx: number, heightPx: number): string[] {
  const v = classifySize(widthPx, heightPx, spec);
  const bleedBox = bleedBoxOf(spec);
  const page = `${sizeMm(bleedBox.widthMm, bleedBox.heightMm)} with bleed`;
  const out: string[] = [];
  if (v.match === "rotated")
    out.push(
      `at ${widthPx} x ${heightPx} px it is turned the wrong way for the new page (${page})`,
    );
  if (v.match === "mismatch") {
    const excess = Math.max(v.excessWidthMm, v.excessHeightMm);
    // The check fails a file whose cut-off part, per side, reaches past the safe margin.
    if (excess / 2 > spec.safeMarginMm)
      out.push(
        `covering the new page (${page}) at ${widthPx} x ${heightPx} px would cut ${mm(excess)} off its ${v.excessWidthMm > v.excessHeightMm ? "width" : "height"}, more than the ${mm(spec.safeMarginMm)} safe margin on each side`,
      );
  }
  // Below this share of the asked resolution the check fails a file (lib/print/check).
  if (v.effectivePpi < spec.minPpi * LOW_PPI_BLOCKER_RATIO)
    out.push(
      `printed at the new size it would be ${Math.round(v.effectivePpi)} ppi, well under the ${spec.minPpi} ppi asked`,
    );
  return out;
}

function pdfTrimReason(spec: PrintSpec, report: SpecReport): string | null {
  const pages = report.measured.pdfPages ?? [];
  const first = pages[0];
  if (!first) return null;
  const tol = DEFAULT_TRIM_TOLERANCE_MM;
  const near = (a: number, b: number) => Math.abs(a - b) <= tol;
  const bleedBox = bleedBoxOf(spec);
  // Without a TrimBox the check takes a page of trim-plus-bleed size as trim centred on it.
  const box = first.trimBox.explicit ? first.trimBox : first.cropBox;
  const trimOk = (w: number, h: number) => near(w, spec.trimWidthMm) && near(h, spec.trimHeightMm);
  const turned = first.rotateDeg % 180 !== 0;
  const [w, h] = turned ? [box.heightMm, box.widthMm] : [box.widthMm, box.heightMm];
  if (trimOk(w, h)) return null;
  if (!first.trimBox.explicit && near(w, bleedBox.widthMm) && near(h, bleedBox.heightMm))
    return null;
  if (trimOk(h, w)) return `its page, ${sizeMm(w, h)}, is turned the wrong way for the new trim`;
  return `its trim is ${sizeMm(w, h)} and the new trim is ${sizeMm(spec.trimWidthMm, spec.trimHeightMm)}`;
}

function fileImpacts(after: AnthologySpec, file: CurrentFile): SpecImpact[] {
  const reason = failsAfterChange(after, file);
  if (!reason) return [];
  return [
    {
      code: "files-will-fail",
      severity: "warning",
      message: `${quoted(file.pieceTitle)}, page ${file.pageIndex} (${file.fileName}), meets the spec now but would not after this change: ${reason}. Its contributor will be asked for a new file.`,
      pieceIds: [file.pieceId],
      pages: [],
    },
  ];
}

/**
 * Duplicator files are greyscale, one per ink (common practice, no source); any other press
 * prints them grey, so a piece drawn for a coloured ink loses its colour.
 */
function colourPressImpacts(
  before: AnthologySpec,
  after: AnthologySpec,
  files: readonly CurrentFile[],
): SpecImpact[] {
  if (before.printMethod !== "duplicator" || after.printMethod === "duplicator") return [];
  const pieces = new Map<number, { title: string; inks: string[] }>();
  for (const file of files) {
    const inks = file.pieceInks.length > 0 ? file.pieceInks : before.inks;
    const coloured = inks.filter((i) => key(i) !== "black");
    const grey =
      file.report.measured.colourSpace === "greyscale" ||
      file.report.findings.some((f) => f.code === "grey-in-colour-file");
    if (grey && coloured.length > 0)
      pieces.set(file.pieceId, { title: file.pieceTitle, inks: coloured });
  }
  if (pieces.size === 0) return [];
  return [
    {
      code: "duplicator-files-to-colour-press",
      severity: "warning",
      message: `${listText([...pieces.values()].map((p) => `${quoted(p.title)} (${listText(p.inks)})`))} ${pieces.size === 1 ? "was" : "were"} sent as greyscale files, one per duplicator ink. Printed any other way a greyscale file comes out grey, so ${pieces.size === 1 ? "it loses its" : "they lose their"} ink colours unless ${pieces.size === 1 ? "its contributor sends" : "their contributors send"} new files.`,
      pieceIds: [...pieces.keys()],
      pages: [],
    },
  ];
}
