import "server-only";
/**
 * One print output, made by the worker: the map as it is (the version the output was asked for),
 * the pages' current files fetched one at a time as the builder places them, the PDF stored
 * through the upload service and the row marked done. Any failure marks the row failed with a
 * message naming the page and the file; earlier finished outputs are never touched.
 */
import { eq } from "drizzle-orm";
import { db, schema } from "@/db";
import { readMapState } from "@/db/queries/page-map";
import {
  claimOutput,
  findOutput,
  markDone,
  markFailed,
  piecesOnMap,
  saveProgress,
  type PieceForPrint,
  type PlacedFile,
} from "@/db/queries/print-files";
import { env } from "@/lib/env";
import { allSides, readerSpreads, sheetSides } from "@/lib/map/layout";
import { bookletCreepMm } from "@/lib/print/creep";
import { fileForInk, mastersFor } from "@/lib/print/masters";
import { imposeBooklet } from "@/lib/print/pdf/impose";
import { sheetMarksFor } from "@/lib/print/press-sheet";
import { readerProof } from "@/lib/print/pdf/proof";
import type { ArtBytes, PageContent, PlacedPage, ProducedPdf } from "@/lib/print/pdf/types";
import type { MapState } from "@/lib/map/types";
import { deleteStoredFiles, readStoredFile, storedFileUrl, storeFile } from "@/server/uploads";
import { reservedTextPagesFor } from "@/server/credits";
import { log } from "@/server/log";
import { artBytesOf } from "./art";

/** A failure the editor reads as it is. */
export class ProduceError extends Error {}

export const MAP_CHANGED = "the map changed while producing; produce again";

export interface ProduceHooks {
  /** After each page is placed (the worker reports it to BullMQ). */
  onProgress?: (done: number, total: number) => void | Promise<void>;
  /** The queue handed this job again after its worker stalled: take over the running row. */
  retake?: boolean;
}

export type ProduceResult = "done" | "failed" | "skipped";

type Anthology = typeof schema.anthologies.$inferSelect;

/** The page whose file was loaded last: the one a builder is placing when it fails. */
interface Placing {
  current: { page: number; title: string; fileName: string } | null;
}

function maxPixels(): number {
  return Math.round(env().MAX_IMAGE_MEGAPIXELS * 1e6);
}

const message = (error: unknown) => (error instanceof Error ? error.message : String(error));

/**
 * What goes on each reader page, and which file versions the output uses. With `ink`, the page
 * of a duplicator master for that ink: the piece's page only when the piece prints in it (its
 * one file for a one-ink piece, that ink's master otherwise), blank elsewhere; pages set in type
 * (contents, credits, colophon) go on the first press ink's masters.
 */
function pageContents(
  anthology: Anthology,
  state: MapState,
  pieces: PieceForPrint[],
  laidOutPages: number,
  loaded: Placing,
  typeset: Map<number, PageContent>,
  ink: string | null,
) {
  const byId = new Map(pieces.map((p) => [p.id, p]));
  const used: number[] = [];
  const contents = new Map<number, PageContent>();
  const contentsLines = contentsPage(state, byId);
  const typeInk = state.pressInks[0] ?? null;
  for (let page = 1; page <= laidOutPages; page++) {
    const slot = state.slots[page - 1];
    if (!slot || slot.pieceId === null) {
      // Padding and pages kept blank print blank; the contents page is set from the map, the
      // credits and colophon from the approved credit lines.
      const text =
        slot?.reservation === "contents" && contentsLines.length
          ? ({ kind: "text", heading: "Contents", lines: contentsLines } as const)
          : typeset.get(page);
      contents.set(page, text && (ink === null || ink === typeInk) ? text : { kind: "blank" });
      continue;
    }
    const piece = byId.get(slot.pieceId);
    const index = slot.piecePageIndex ?? 1;
    const title = piece?.title ?? `piece ${slot.pieceId}`;
    const pg = piece?.pages.find((x) => x.pageIndex === index);
    let file: PlacedFile | null;
    let what = "file";
    if (ink === null) {
      // A composite or a proof: the page's one file, else its first master in press order.
      const firstInk = (piece?.inks ?? []).find((i) => pg?.separations[i]);
      file = pg?.file ?? (firstInk ? pg!.separations[firstInk]! : null);
    } else {
      const need = piece ? fileForInk(anthology, piece, ink) : null;
      if (!need) {
        contents.set(page, { kind: "blank" });
        continue;
      }
      file = need.kind === "composite" ? (pg?.file ?? null) : (pg?.separations[ink] ?? null);
      if (need.kind === "separation") what = `${ink} master`;
    }
    if (!file)
      throw new ProduceError(
        `page ${page}: “${title}” has no ${what} for its page ${index}; ask for one, or take it off the map`,
      );
    used.push(file.versionId);
    const chosen = file;
    contents.set(page, {
      kind: "art",
      title,
      credit: piece?.creditLine ?? null,
      load: () => loadArt(page, title, chosen, loaded),
    });
  }
  return { contents, used };
}

/** The contents page: each piece on the map with its first page, in page order. */
function contentsPage(state: MapState, byId: Map<number, PieceForPrint>): string[] {
  const first = new Map<number, number>();
  for (const slot of state.slots)
    if (slot.pieceId !== null && !first.has(slot.pieceId)) first.set(slot.pieceId, slot.page);
  return [...first.entries()]
    .sort((x, y) => x[1] - y[1])
    .map(([id, page]) => {
      const piece = byId.get(id);
      return `${page}  ${piece?.title ?? `piece ${id}`}${piece?.creditLine ? ` — ${piece.creditLine}` : ""}`;
    });
}

/** Fetches one page's file and readies it for the builder; failures name the page and the file. */
async function loadArt(
  page: number,
  title: string,
  file: PlacedFile,
  loaded: Placing,
): Promise<ArtBytes> {
  loaded.current = { page, title, fileName: file.fileName };
  let bytes: Buffer;
  try {
    bytes = await readStoredFile(await storedFileUrl(file.storageKey));
  } catch (error) {
    throw new ProduceError(
      `page ${page}: the file of “${title}” is missing from storage (${file.fileName}: ${message(error)})`,
    );
  }
  try {
    const art = await artBytesOf(bytes, { maxPixels: maxPixels() });
    return { bytes: art.bytes, format: art.format };
  } catch (error) {
    throw new ProduceError(
      `page ${page}: the file of “${title}” (${file.fileName}) could not be read: ${message(error)}`,
    );
  }
}

function fileNameFor(anthology: Anthology, kind: string, ink: string | null, mapVersion: number) {
  const inkPart = ink ? `-${ink.toLowerCase().replace(/[^a-z0-9]+/g, "-")}` : "";
  return `${anthology.slug}-${kind}${inkPart}-map-v${mapVersion}.pdf`;
}

async function currentMapVersion(anthologyId: number): Promise<number | null> {
  const [row] = await db
    .select({ v: schema.anthologies.mapVersion })
    .from(schema.anthologies)
    .where(eq(schema.anthologies.id, anthologyId));
  return row?.v ?? null;
}

/** Makes the output; see the module comment. Never throws: the row says how it went. */
export async function produceOutput(
  outputId: number,
  hooks: ProduceHooks = {},
): Promise<ProduceResult> {
  if (!(await claimOutput(outputId, { retake: hooks.retake }))) return "skipped";
  // The page being placed when a builder fails, so its message can name it.
  const loaded: Placing = { current: null };
  try {
    const output = await findOutput(outputId);
    if (!output) return "skipped";
    const [anthology] = await db
      .select()
      .from(schema.anthologies)
      .where(eq(schema.anthologies.id, output.anthologyId));
    if (!anthology) throw new ProduceError("the anthology is gone");
    const { version, state } = await readMapState(anthology);
    if (version !== output.mapVersion) throw new ProduceError(MAP_CHANGED);
    const plan = sheetSides(state.pageCount, state.binding);
    const pieces = await piecesOnMap(anthology);
    const typeset = new Map(
      (await reservedTextPagesFor(anthology)).pages.map((t) => [t.page, t.content] as const),
    );
    const { contents, used } = pageContents(
      anthology,
      state,
      pieces,
      plan.laidOutPages,
      loaded,
      typeset,
      output.kind === "master" ? output.ink : null,
    );
    const placed = (page: number): PlacedPage => ({
      page,
      content: contents.get(page) ?? { kind: "blank" },
    });
    const onProgress = async (done: number, total: number) => {
      await saveProgress(outputId, done, total);
      await hooks.onProgress?.(done, total);
    };
    const common = {
      title: anthology.title,
      trimWidthMm: anthology.trimWidthMm,
      trimHeightMm: anthology.trimHeightMm,
      bleedMm: anthology.bleedMm,
      onProgress,
    };

    let pdf: ProducedPdf;
    try {
      if (output.kind === "print" || output.kind === "master") {
        const ink = output.kind === "master" ? output.ink : null;
        let sides = allSides(plan);
        if (ink !== null) {
          // One master per side that carries this ink (as the sheet view counts the passes),
          // and the sides of pages set in type on the first ink's masters.
          const keys = new Set(
            mastersFor(state, plan)
              .find((m) => m.ink === ink)
              ?.sides.map((x) => x.key) ?? [],
          );
          sides = sides.filter(
            (side) =>
              keys.has(side.key) || side.pages.some((pg) => contents.get(pg)?.kind === "text"),
          );
          if (sides.length === 0) throw new ProduceError(`no page of the map prints in ${ink}`);
        }
        const coverNote =
          anthology.coverStock === "separate"
            ? `cover stock${anthology.coverPaperGsm ? ` ${anthology.coverPaperGsm} gsm` : ""}`
            : null;
        const sheet = {
          name: output.sheetName ?? "sheet",
          widthMm: output.sheetWidthMm ?? 0,
          heightMm: output.sheetHeightMm ?? 0,
        };
        // A sheet that is the spread itself (half letter on letter) holds no bleed or marks.
        const fit = sheetMarksFor(anthology, sheet);
        pdf = await imposeBooklet({
          ...common,
          bleedMm: fit?.bleedMm ?? anthology.bleedMm,
          marks: fit?.marks ?? true,
          sheet,
          // Sheet 1 (the outermost, which carries the covers) prints first; on a separate
          // cover stock its sides say so in the slug line.
          sides: sides.map((side) => ({
            sheet: side.sheet,
            side: side.side,
            pages: side.pages.map(placed),
            stockNote: side.sheet === 1 ? coverNote : null,
          })),
          creepMm:
            state.binding === "saddle-stitch"
              ? bookletCreepMm(plan.sheets.length, anthology)
              : plan.sheets.map(() => 0),
          ink,
        });
      } else if (output.kind === "proof") {
        pdf = await readerProof({
          ...common,
          spreads: readerSpreads(plan.laidOutPages).map((spread) => ({
            pages: spread.pages.map(placed),
          })),
        });
      } else {
        throw new ProduceError(`this worker does not make “${output.kind}” outputs yet`);
      }
    } catch (error) {
      if (error instanceof ProduceError) throw error;
      const at = loaded.current;
      throw new ProduceError(
        at
          ? `page ${at.page}: the file of “${at.title}” (${at.fileName}) could not be placed: ${message(error)}`
          : `the PDF could not be made: ${message(error)}`,
      );
    }

    if ((await currentMapVersion(anthology.id)) !== output.mapVersion)
      throw new ProduceError(MAP_CHANGED);
    const fileName = fileNameFor(anthology, output.kind, output.ink, output.mapVersion);
    const stored = await storeFile(pdf.bytes, fileName, "application/pdf");
    const done = await markDone(
      outputId,
      anthology.id,
      output.mapVersion,
      {
        storageKey: stored.key,
        fileName,
        sizeBytes: pdf.bytes.byteLength,
        pageCount: pdf.pageCount,
      },
      used,
    );
    if (!done) {
      await deleteStoredFiles([stored.key]);
      throw new ProduceError(MAP_CHANGED);
    }
    return "done";
  } catch (error) {
    if (!(error instanceof ProduceError))
      log.error(
        {
          kind: "job-failed",
          output: outputId,
          error: error instanceof Error ? error.name : "unknown",
        },
        "print output failed",
      );
    await markFailed(
      outputId,
      error instanceof ProduceError ? error.message : `producing stopped: ${message(error)}`,
    );
    return "failed";
  }
}
