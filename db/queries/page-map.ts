import "server-only";
import { and, asc, desc, eq, gt, inArray, or, sql } from "drizzle-orm";
import { db, schema } from "@/db";
import { bookletCreepMm } from "@/lib/print/creep";
import { checkMap } from "@/lib/map/check";
import { sheetSides, startingPageCount } from "@/lib/map/layout";
import { countPasses } from "@/lib/map/passes";
import { piecePages, unplacedPieces } from "@/lib/map/state";
import type { MapPiece, MapSlot, MapState, Proposal } from "@/lib/map/types";
import { checkedChange } from "@/lib/map-edits/apply";
import type { MapEventView, MapPageArt, MapPayload, MapPieceCard } from "@/lib/map-edits/payload";
import type { SessionUser } from "@/lib/domain";
import type { LayoutFacts } from "@/lib/stages";
import { personLabel } from "@/lib/people";
import type { MapChangeRequest } from "@/lib/validations/page-map";
import type { Anthology } from "./anthologies";
import { markOutputsStale } from "./print-files";

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

const a = schema.anthologies;
const s = schema.pageSlots;
const p = schema.pieces;
const u = schema.users;

/* ---------- Reading ---------- */

type PieceRow = MapPiece &
  Omit<MapPieceCard, "contributorName"> & {
    contributorId: string;
    contributorName: string | null;
    contributorEmail: string | null;
  };

/** Who is looking at the map: whether they may change it, and see an address in place of a missing name. */
export interface MapViewer {
  canEdit: boolean;
  mayShowEmail: boolean;
  /** May see the pieces' artwork previews (lib/auth/policy.ts maySeePiece as an editor). */
  mayShowArt?: boolean;
}

/** Each page's current file preview and description, for the pieces given. */
async function readArt(tx: Tx, pieceIds: number[]): Promise<Map<number, MapPageArt[]>> {
  const out = new Map<number, MapPageArt[]>();
  if (pieceIds.length === 0) return out;
  const pp = schema.piecePages;
  const fv = schema.fileVersions;
  const rows = await tx
    .select({
      pieceId: pp.pieceId,
      pageIndex: pp.pageIndex,
      altText: pp.altText,
      versionId: fv.id,
      hasThumbnail: sql<number>`${fv.thumbnailWebp} IS NOT NULL`,
    })
    .from(pp)
    .leftJoin(fv, eq(fv.id, pp.currentVersionId))
    .where(inArray(pp.pieceId, pieceIds))
    .orderBy(asc(pp.pieceId), asc(pp.pageIndex));
  for (const r of rows) {
    const list = out.get(r.pieceId) ?? [];
    list.push({
      pageIndex: r.pageIndex,
      thumbnailUrl:
        r.versionId !== null && Number(r.hasThumbnail)
          ? `/api/file-versions/${r.versionId}/thumbnail`
          : null,
      altText: r.altText?.trim() || null,
    });
    out.set(r.pieceId, list);
  }
  return out;
}

/** Accepted pieces, plus any piece still on the map after leaving "accepted" (shown as left out so it can be taken off). */
async function readPieces(tx: Tx, anthologyId: number): Promise<PieceRow[]> {
  const onMap = tx
    .select({ id: s.pieceId })
    .from(s)
    .where(and(eq(s.anthologyId, anthologyId), sql`${s.pieceId} IS NOT NULL`));
  const rows = await tx
    .select({
      id: p.id,
      title: p.title,
      kind: p.kind,
      pageCount: p.pageCount,
      inks: p.inks,
      leftOut: p.leftOut,
      status: p.status,
      contributorId: p.contributorId,
      contributorName: u.name,
      contributorEmail: u.email,
    })
    .from(p)
    .innerJoin(u, eq(u.id, p.contributorId))
    .where(and(eq(p.anthologyId, anthologyId), or(eq(p.status, "accepted"), inArray(p.id, onMap))))
    .orderBy(asc(p.id));
  return rows.map((r) => ({
    ...r,
    inks: Array.isArray(r.inks) ? r.inks : [],
    leftOut: r.leftOut || r.status !== "accepted",
  }));
}

async function readSlots(tx: Tx, anthologyId: number, forUpdate: boolean): Promise<MapSlot[]> {
  const query = tx
    .select({
      page: s.pageNumber,
      reservation: s.reservation,
      pieceId: s.pieceId,
      piecePageIndex: s.piecePageIndex,
      locked: s.locked,
    })
    .from(s)
    .where(eq(s.anthologyId, anthologyId))
    .orderBy(asc(s.pageNumber));
  const rows = forUpdate ? await query.for("update") : await query;
  return rows.map((r) => ({ ...r, reservation: r.reservation ?? null, locked: Boolean(r.locked) }));
}

function toState(anthology: Anthology, slots: MapSlot[], pieces: PieceRow[]): MapState {
  return {
    binding: anthology.binding,
    pageCount: slots.length,
    maxPages: anthology.maxPages,
    inksPerPass: anthology.inksPerPass,
    pressInks: anthology.inks,
    slots,
    pieces: pieces.map(({ id, title, kind, pageCount, inks, leftOut }) => ({
      id,
      title,
      kind,
      pageCount,
      inks,
      leftOut,
    })),
  };
}

/** Creates the slots the first time the map is opened: one per page, the front and back covers kept for the cover. */
async function ensureSlots(anthology: Anthology): Promise<void> {
  const [existing] = await db
    .select({ n: sql<number>`count(*)` })
    .from(s)
    .where(eq(s.anthologyId, anthology.id));
  if (Number(existing?.n ?? 0) > 0) return;
  await db.transaction(async (tx) => {
    const [row] = await tx.select().from(a).where(eq(a.id, anthology.id)).for("update");
    if (!row) return;
    const [again] = await tx
      .select({ n: sql<number>`count(*)` })
      .from(s)
      .where(eq(s.anthologyId, anthology.id));
    if (Number(again?.n ?? 0) > 0) return;
    const pages = startingPageCount(row);
    await tx.insert(s).values(
      Array.from({ length: pages }, (_, i) => ({
        anthologyId: row.id,
        pageNumber: i + 1,
        reservation: i === 0 || i === pages - 1 ? ("cover" as const) : null,
        locked: false,
      })),
    );
  });
}

async function listEvents(
  tx: Tx,
  anthologyId: number,
  mayShowEmail: boolean,
  limit = 40,
): Promise<MapEventView[]> {
  const rows = await tx
    .select({
      id: schema.mapEvents.id,
      mapVersion: schema.mapEvents.mapVersion,
      action: schema.mapEvents.action,
      detail: schema.mapEvents.detail,
      actorName: u.name,
      actorEmail: u.email,
      at: schema.mapEvents.createdAt,
    })
    .from(schema.mapEvents)
    .leftJoin(u, eq(u.id, schema.mapEvents.actorId))
    .where(eq(schema.mapEvents.anthologyId, anthologyId))
    .orderBy(desc(schema.mapEvents.id))
    .limit(limit);
  return rows.map((r) => {
    const detail = (r.detail ?? {}) as { summary?: unknown };
    return {
      id: r.id,
      mapVersion: r.mapVersion,
      action: r.action,
      summary: typeof detail.summary === "string" ? detail.summary : r.action,
      actorName: personLabel(
        { name: r.actorName, email: r.actorEmail },
        { mayShowEmail, unnamed: "Someone" },
      ),
      at: r.at.toISOString(),
    };
  });
}

async function payloadIn(
  tx: Tx,
  anthologyId: number,
  { canEdit, mayShowEmail, mayShowArt = false }: MapViewer,
  asked: number | undefined,
): Promise<MapPayload> {
  const [anthology] = await tx.select().from(a).where(eq(a.id, anthologyId));
  if (!anthology) throw new Error(`anthology ${anthologyId} vanished`);
  const copies = asked ?? anthology.plannedCopies;
  const pieces = await readPieces(tx, anthologyId);
  const state = toState(anthology, await readSlots(tx, anthologyId, false), pieces);
  const art = mayShowArt
    ? await readArt(
        tx,
        pieces.map((x) => x.id),
      )
    : null;
  return {
    anthology: {
      id: anthology.id,
      slug: anthology.slug,
      title: anthology.title,
      binding: anthology.binding,
      printMethod: anthology.printMethod,
      paperCaliperMm: anthology.paperCaliperMm,
      coverStock: anthology.coverStock,
      plannedCopies: anthology.plannedCopies,
    },
    version: anthology.mapVersion,
    state,
    cards: pieces.map((x) => ({
      id: x.id,
      contributorName: personLabel(
        { name: x.contributorName, email: x.contributorEmail },
        { mayShowEmail },
      ),
      status: x.status,
      ...(art ? { art: art.get(x.id) ?? [] } : {}),
    })),
    check: checkMap(state),
    passes: countPasses(state, copies),
    creepMm: bookletCreepMm(sheetSides(state.pageCount, state.binding).sheets.length, anthology),
    events: await listEvents(tx, anthologyId, mayShowEmail),
    canEdit,
  };
}

/**
 * The map as the screen needs it, created from the page count target the first time. The pass
 * figures are for `copies`, or for the anthology's planned copies when none are asked for.
 */
export async function loadMap(
  anthology: Anthology,
  opts: MapViewer & { copies?: number },
): Promise<MapPayload> {
  await ensureSlots(anthology);
  return db.transaction((tx) => payloadIn(tx, anthology.id, opts, opts.copies));
}

/* ---------- Changing ---------- */

export type ChangeOutcome =
  | { kind: "saved"; map: MapPayload; summary: string; changed: boolean }
  | { kind: "stale"; map: MapPayload }
  | { kind: "refused"; reason: string; pages: number[]; pieceIds: number[] };

/** Writes the slots of `next` over `before`: updates changed pages, adds new ones, deletes pages past the end. */
async function writeSlots(
  tx: Tx,
  anthologyId: number,
  before: MapSlot[],
  next: MapSlot[],
): Promise<void> {
  const old = new Map(before.map((x) => [x.page, x]));
  const same = (x: MapSlot, y: MapSlot | undefined) =>
    y !== undefined &&
    x.reservation === y.reservation &&
    x.pieceId === y.pieceId &&
    x.piecePageIndex === y.piecePageIndex &&
    x.locked === y.locked;
  const inserts: (typeof s.$inferInsert)[] = [];
  for (const slot of next) {
    const prior = old.get(slot.page);
    const fields = {
      reservation: slot.reservation,
      pieceId: slot.pieceId,
      piecePageIndex: slot.piecePageIndex,
      locked: slot.locked,
    };
    if (!prior) inserts.push({ anthologyId, pageNumber: slot.page, ...fields });
    else if (!same(slot, prior))
      await tx
        .update(s)
        .set(fields)
        .where(and(eq(s.anthologyId, anthologyId), eq(s.pageNumber, slot.page)));
  }
  if (next.length < before.length)
    await tx.delete(s).where(and(eq(s.anthologyId, anthologyId), gt(s.pageNumber, next.length)));
  if (inserts.length) await tx.insert(s).values(inserts);
}

/** Writes `left_out` for the pieces whose mark the change turned over. */
async function writeLeftOut(
  tx: Tx,
  anthologyId: number,
  before: MapState,
  next: MapState,
): Promise<void> {
  const was = new Map(before.pieces.map((x) => [x.id, Boolean(x.leftOut)]));
  for (const piece of next.pieces) {
    const leftOut = Boolean(piece.leftOut);
    if (was.get(piece.id) === leftOut) continue;
    await tx
      .update(p)
      .set({ leftOut })
      .where(and(eq(p.anthologyId, anthologyId), eq(p.id, piece.id)));
  }
}

/**
 * Applies one change in one transaction: the anthology row is locked (so changes to one map go
 * one at a time), the version compared, the change run through the map engine and the save rule,
 * the slots written, the version bumped and the change recorded in the history.
 */
export async function changeMap(
  anthology: Anthology,
  user: SessionUser,
  request: MapChangeRequest,
  { copies, mayShowEmail }: { copies?: number; mayShowEmail: boolean },
): Promise<ChangeOutcome> {
  // Only editors change the map, and editors may see every piece's artwork.
  const viewer: MapViewer = { canEdit: true, mayShowEmail, mayShowArt: true };
  await ensureSlots(anthology);
  return db.transaction(async (tx) => {
    const [row] = await tx.select().from(a).where(eq(a.id, anthology.id)).for("update");
    if (!row) throw new Error(`anthology ${anthology.id} vanished`);
    if (row.mapVersion !== request.version)
      return { kind: "stale", map: await payloadIn(tx, row.id, viewer, copies) };
    const slots = await readSlots(tx, row.id, true);
    const pieces = await readPieces(tx, row.id);
    const state = toState(row, slots, pieces);
    const { change } = request;
    // A piece no longer accepted stays left out: it can only come off the map.
    const notAccepted =
      change.op === "leave-out" && !change.leftOut
        ? pieces.find((x) => x.id === change.pieceId && x.status !== "accepted")
        : undefined;
    if (notAccepted)
      return {
        kind: "refused",
        reason: `“${notAccepted.title}” is no longer accepted, so it cannot come back to the tray.`,
        pages: [],
        pieceIds: [notAccepted.id],
      };
    const result = checkedChange(state, change);
    if (!result.ok)
      return {
        kind: "refused",
        reason: result.reason,
        pages: result.pages,
        pieceIds: result.pieceIds,
      };
    // A change that leaves every page as it was saves nothing: no new version, no history entry.
    if (!result.changed)
      return {
        kind: "saved",
        map: await payloadIn(tx, row.id, viewer, copies),
        summary: result.summary,
        changed: false,
      };
    await writeSlots(tx, row.id, slots, result.state.slots);
    await writeLeftOut(tx, row.id, state, result.state);
    const version = row.mapVersion + 1;
    await tx
      .update(a)
      .set({
        mapVersion: version,
        ...(result.state.pageCount !== state.pageCount
          ? { pageCountTarget: result.state.pageCount }
          : {}),
      })
      .where(eq(a.id, row.id));
    // Print files made from the earlier version no longer match the map.
    await markOutputsStale(row.id, tx);
    await tx.insert(schema.mapEvents).values({
      anthologyId: row.id,
      actorId: user.id,
      mapVersion: version,
      action: request.change.op,
      detail: {
        summary: result.summary,
        change: request.change,
        changedPages: result.changedPages,
      },
    });
    return {
      kind: "saved",
      map: await payloadIn(tx, row.id, viewer, copies),
      summary: result.summary,
      changed: true,
    };
  });
}

/** Keeps the number of copies the editor plans to print, for the map's pass figures. */
export async function savePlannedCopies(anthology: Anthology, copies: number): Promise<number> {
  await db.update(a).set({ plannedCopies: copies }).where(eq(a.id, anthology.id));
  return copies;
}

/** The current map and pieces, for the proposal (read only). */
export async function readMapState(
  anthology: Anthology,
): Promise<{ version: number; state: MapState }> {
  await ensureSlots(anthology);
  return db.transaction(async (tx) => {
    const [row] = await tx.select().from(a).where(eq(a.id, anthology.id));
    if (!row) throw new Error(`anthology ${anthology.id} vanished`);
    return {
      version: row.mapVersion,
      state: toState(row, await readSlots(tx, row.id, false), await readPieces(tx, row.id)),
    };
  });
}

export type { Proposal };

/* ---------- Before printing ---------- */

/** Verdicts of a piece whose current files do not meet the spec (lib/pieces/verdict.ts). */
const NOT_PASSING = ["blocker", "missing", "warning"];

/**
 * What is still open on the page map for the move to printing: empty pages, accepted pieces not
 * placed (left-out ones aside), and pieces in this issue whose current files do not pass. Read
 * only: a map never opened has no pages yet, so its pieces all count as not placed.
 */
export async function stageLayoutFacts(anthology: Anthology): Promise<LayoutFacts> {
  return db.transaction(async (tx) => {
    const pieces = (await readPieces(tx, anthology.id)).filter((x) => x.status === "accepted");
    const state = toState(anthology, await readSlots(tx, anthology.id, false), pieces);
    const verdicts = await tx
      .select({ id: p.id, verdict: p.verdict })
      .from(p)
      .where(and(eq(p.anthologyId, anthology.id), eq(p.status, "accepted"), eq(p.leftOut, false)));
    return {
      emptyPages: state.slots
        .filter((x) => x.pieceId === null && x.reservation === null)
        .map((x) => x.page),
      unplacedPieces: unplacedPieces(state).length,
      piecesNotPassing: verdicts.filter((x) => NOT_PASSING.includes(x.verdict)).length,
    };
  });
}

/* ---------- Page notices ---------- */

/**
 * The pages an accepted piece sits on, as the page notice tells its contributor (the map's own
 * piece-pages reading); none when it is not placed or no longer accepted.
 */
export async function placedPagesOf(anthology: Anthology, pieceId: number): Promise<number[]> {
  return db.transaction(async (tx) => {
    const [piece] = await tx
      .select({ status: p.status })
      .from(p)
      .where(and(eq(p.id, pieceId), eq(p.anthologyId, anthology.id)));
    if (piece?.status !== "accepted") return [];
    const state = toState(anthology, await readSlots(tx, anthology.id, false), []);
    return (piecePages(state).get(pieceId) ?? []).map((w) => w.page);
  });
}

export type PageNoticeRecipient = {
  contributorId: string;
  email: string | null;
  name: string | null;
  pieces: { title: string; pages: number[] }[];
};

/** Each contributor with accepted pieces placed on the map, and the pages those pieces sit on. */
export async function pageNoticeRecipients(anthology: Anthology): Promise<PageNoticeRecipient[]> {
  const { state, pieces } = await db.transaction(async (tx) => {
    const pieces = await readPieces(tx, anthology.id);
    return { pieces, state: toState(anthology, await readSlots(tx, anthology.id, false), pieces) };
  });
  const where = piecePages(state);
  const byPerson = new Map<string, PageNoticeRecipient>();
  for (const piece of pieces) {
    if (piece.status !== "accepted") continue;
    const pages = (where.get(piece.id) ?? []).map((w) => w.page);
    if (pages.length === 0) continue;
    const entry = byPerson.get(piece.contributorId) ?? {
      contributorId: piece.contributorId,
      email: piece.contributorEmail,
      name: piece.contributorName,
      pieces: [],
    };
    entry.pieces.push({ title: piece.title, pages });
    byPerson.set(piece.contributorId, entry);
  }
  return [...byPerson.values()];
}
