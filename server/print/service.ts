import "server-only";
import { log } from "@/server/log";
import { mastersFor } from "@/lib/print/masters";
/**
 * What the print-file routes call: the screen's view (preflight, sheets, outputs) and a request
 * to produce, which refuses while the preflight has blockers, checks the sheet, writes the rows
 * and queues one job per output.
 */
import { readMapState } from "@/db/queries/page-map";
import type { Anthology } from "@/db/queries/anthologies";
import {
  createOutputs,
  listOutputs,
  markFailed,
  piecesOnMap,
  preflightPieces,
  setJobId,
  type NewOutput,
  type PrintOutput,
} from "@/db/queries/print-files";
import { can } from "@/lib/auth/policy";
import type { Role, SessionUser } from "@/lib/domain";
import { sheetSides } from "@/lib/map/layout";
import { preflight, type Preflight } from "@/lib/print/preflight";
import {
  defaultSheetFor,
  neededSheetMm,
  presetSheetsFor,
  resolveSheet,
  type SheetLayoutInput,
  type SheetRequest,
} from "@/lib/print/press-sheet";
import type { PrintFilesAnswer, PrintOutputView } from "@/lib/wire/print-files";
import { HttpError } from "@/server/api";
import { enqueueOutput } from "./queue";

export function outputView(row: PrintOutput): PrintOutputView {
  return {
    id: row.id,
    kind: row.kind,
    ink: row.ink,
    state: row.state,
    mapVersion: row.mapVersion,
    sheetName: row.sheetName,
    pagesDone: row.pagesDone,
    pagesTotal: row.pagesTotal,
    fileName: row.fileName,
    sizeBytes: row.sizeBytes,
    pageCount: row.pageCount,
    staleAt: row.staleAt?.toISOString() ?? null,
    error: row.error,
    createdAt: row.createdAt.toISOString(),
    finishedAt: row.finishedAt?.toISOString() ?? null,
    downloadUrl:
      row.state === "done" && row.storageKey ? `/api/print-files/${row.id}/download` : null,
  };
}

async function preflightOf(anthology: Anthology) {
  const { version, state } = await readMapState(anthology);
  const pieces = await piecesOnMap(anthology);
  return {
    version,
    state,
    result: preflight({ slug: anthology.slug, state, pieces: preflightPieces(pieces) }),
  };
}

function layoutOf(anthology: Anthology, pageCount: number): SheetLayoutInput {
  return {
    trimPreset: anthology.trimPreset,
    trimWidthMm: anthology.trimWidthMm,
    trimHeightMm: anthology.trimHeightMm,
    bleedMm: anthology.bleedMm,
    binding: anthology.binding,
    pageCount,
  };
}

export async function printFilesView(
  anthology: Anthology,
  role: Role | null,
): Promise<PrintFilesAnswer> {
  const { version, state, result } = await preflightOf(anthology);
  const layout = layoutOf(anthology, state.pageCount);
  return {
    mapVersion: version,
    preflight: result,
    sheets: presetSheetsFor(layout),
    defaultSheetId: defaultSheetFor(layout)?.id ?? null,
    neededSheetMm: neededSheetMm(layout),
    canProduce: can(role, "print:produce"),
    outputs: (await listOutputs(anthology.id)).map(outputView),
  };
}

export class PreflightBlocked extends Error {
  constructor(readonly preflight: Preflight) {
    super(
      `Print files cannot be produced yet: ${preflight.blockers} ${preflight.blockers === 1 ? "thing needs" : "things need"} fixing first.`,
    );
  }
}

/** Queues the print files (a composite, or a duplicator's masters per ink) and the reader proof. */
export async function requestPrintFiles(
  anthology: Anthology,
  user: SessionUser,
  sheetRequest: SheetRequest,
): Promise<PrintOutputView[]> {
  const { version, state, result } = await preflightOf(anthology);
  if (!result.ok) throw new PreflightBlocked(result);
  const resolved = resolveSheet(layoutOf(anthology, state.pageCount), sheetRequest);
  if (!resolved.ok)
    throw new HttpError(400, resolved.message, { fields: { sheet: [resolved.message] } });
  const plan = sheetSides(state.pageCount, state.binding);
  const pages = plan.laidOutPages;
  const sheet = {
    name: resolved.sheet.name.slice(0, 40),
    widthMm: resolved.sheet.widthMm,
    heightMm: resolved.sheet.heightMm,
  };
  // A stencil duplicator prints one ink per drum pass: one PDF of masters per ink, each side
  // that carries the ink a master (lib/print/masters.ts). Other presses take one composite.
  const printFiles: NewOutput[] =
    anthology.printMethod === "duplicator"
      ? mastersFor(state, plan).map((m) => ({
          kind: "master" as const,
          ink: m.ink.slice(0, 40),
          mapVersion: version,
          sheet,
          pagesTotal: 2 * m.sides.length,
        }))
      : [{ kind: "print", ink: null, mapVersion: version, sheet, pagesTotal: pages }];
  const wanted: NewOutput[] = [
    ...printFiles,
    { kind: "proof", ink: null, mapVersion: version, sheet: null, pagesTotal: pages },
  ];
  const ids = await createOutputs(anthology.id, user.id, wanted);
  for (const [i, id] of ids.entries()) {
    try {
      await setJobId(id, await enqueueOutput({ id, kind: wanted[i]!.kind, ink: wanted[i]!.ink }));
    } catch (error) {
      log.error(
        { kind: "queue", output: id, error: error instanceof Error ? error.message : "unknown" },
        "could not queue a print output",
      );
      for (const left of ids.slice(i))
        await markFailed(left, "the print queue did not answer; produce again in a moment");
      throw new HttpError(
        503,
        "The print queue did not answer; nothing was produced. Try again in a moment.",
      );
    }
  }
  const rows = await listOutputs(anthology.id);
  return rows.filter((r) => ids.includes(r.id)).map(outputView);
}
