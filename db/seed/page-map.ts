/**
 * The demo almanac's page map, half done: the covers and inside covers kept, a contents page
 * and a credits page, the centre spread and a few pieces placed, three pieces still waiting in
 * the tray. Accepted pieces seeded by the submissions demo are used first; when there are too
 * few, invented ones are added for the demo contributors (no files: the map does not need them).
 * Idempotent: once the almanac's map has any history it is left as it is.
 */
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db";
import { schema } from "@/db";
import type { PieceKind, SlotReservation } from "@/lib/domain";
import { checkMap } from "@/lib/map/check";
import { lockSlot, placePiece, setReservation } from "@/lib/map/edit";
import { emptyMap, pieceLength, pagesInWords, piecePages } from "@/lib/map/state";
import type { MapPiece, MapState } from "@/lib/map/types";
import { padToMultipleOf4 } from "@/lib/print/imposition";
import { RESERVATION_PHRASES } from "@/lib/map-edits/labels";

type ExtraPiece = {
  title: string;
  email: string;
  kind: PieceKind;
  pageCount: number;
  inks: string[];
  credit: string;
};

/** Invented pieces for the demo contributors, used only when the almanac has too few accepted pieces. */
const EXTRA_PIECES: ExtraPiece[] = [
  {
    title: "Bladderwrack Census",
    email: "tomasz@lanternfield.test",
    kind: "spread",
    pageCount: 2,
    inks: ["black", "teal"],
    credit: "Tomasz Vireo",
  },
  {
    title: "The Limpet Clock",
    email: "bea@lanternfield.test",
    kind: "single",
    pageCount: 1,
    inks: ["black"],
    credit: "Bea Okonkwo-Hale",
  },
  {
    title: "Mudflat at Six",
    email: "imke@lanternfield.test",
    kind: "single",
    pageCount: 1,
    inks: ["teal"],
    credit: "Imke Sallow",
  },
  {
    title: "Hermit Crab Moving Day",
    email: "bea@lanternfield.test",
    kind: "run",
    pageCount: 3,
    inks: ["black"],
    credit: "Bea Okonkwo-Hale",
  },
  {
    title: "Low Water Mark",
    email: "tomasz@lanternfield.test",
    kind: "single",
    pageCount: 1,
    inks: ["teal"],
    credit: "Tomasz Vireo",
  },
  {
    title: "Sea Glass Inventory",
    email: "imke@lanternfield.test",
    kind: "single",
    pageCount: 1,
    inks: ["black", "teal"],
    credit: "Imke Sallow",
  },
  {
    title: "What the Heron Kept",
    email: "tomasz@lanternfield.test",
    kind: "single",
    pageCount: 1,
    inks: ["black"],
    credit: "Tomasz Vireo",
  },
  {
    title: "Tide Table for Insomniacs",
    email: "bea@lanternfield.test",
    kind: "spread",
    pageCount: 2,
    inks: ["teal"],
    credit: "Bea Okonkwo-Hale",
  },
];

/** Pieces the demo map wants: enough to place some and leave a few waiting. */
const WANTED_PIECES = EXTRA_PIECES.length;
const LEFT_IN_TRAY = 3;

const RESERVED: [number | "last" | "second-last", SlotReservation][] = [
  [1, "cover"],
  [2, "inside-cover"],
  [3, "contents"],
  ["second-last", "inside-cover"],
  ["last", "cover"],
];

export async function seedPageMap(
  db: Db,
): Promise<{ slug: string; placed: number; waiting: number } | null> {
  const [almanac] = await db
    .select()
    .from(schema.anthologies)
    .where(eq(schema.anthologies.slug, "low-tide-almanac"))
    .limit(1);
  if (!almanac) throw new Error("seed the demo press before its page map");
  const [history] = await db
    .select({ id: schema.mapEvents.id })
    .from(schema.mapEvents)
    .where(eq(schema.mapEvents.anthologyId, almanac.id))
    .limit(1);
  if (history) return null;
  const [odile] = await db
    .select()
    .from(schema.users)
    .where(eq(schema.users.email, "odile@marrowbend.test"))
    .limit(1);
  if (!odile) throw new Error("demo lead editor missing");

  let accepted = await acceptedPieces(db, almanac.id);
  const titles = new Set(accepted.map((p) => p.title));
  for (const extra of EXTRA_PIECES) {
    if (accepted.length >= WANTED_PIECES) break;
    if (titles.has(extra.title)) continue;
    await createAcceptedPiece(db, almanac.id, extra);
    accepted = await acceptedPieces(db, almanac.id);
  }

  const pageCount = padToMultipleOf4(almanac.pageCountTarget).pages;
  let state: MapState = emptyMap({
    binding: almanac.binding,
    pageCount,
    maxPages: almanac.maxPages,
    inksPerPass: almanac.inksPerPass,
    pressInks: almanac.inks,
    pieces: accepted,
  });
  const steps: { action: string; summary: string }[] = [];
  const apply = (result: ReturnType<typeof placePiece>, action: string, summary: string) => {
    if (!result.ok) return false;
    state = result.state;
    steps.push({ action, summary });
    return true;
  };

  for (const [where, reservation] of RESERVED) {
    const page = where === "last" ? pageCount : where === "second-last" ? pageCount - 1 : where;
    apply(
      setReservation(state, page, reservation),
      "reserve",
      `Kept page ${page} for ${RESERVATION_PHRASES[reservation]}.`,
    );
  }
  apply(
    setReservation(state, pageCount - 2, "credits"),
    "reserve",
    `Kept page ${pageCount - 2} for the credits.`,
  );
  for (const page of [1, pageCount])
    apply(lockSlot(state, page, true), "lock", `Locked page ${page}.`);

  // The centre spread first (the one reader spread printed whole on one side), then the rest
  // from page 4 on, leaving a few pieces for the tray and the proposal.
  const order = [...accepted].sort(
    (x, y) => Number(y.kind === "spread") - Number(x.kind === "spread") || x.id - y.id,
  );
  const toPlace = order.slice(0, Math.max(0, order.length - LEFT_IN_TRAY));
  const centre = pageCount / 2;
  for (const piece of toPlace) {
    const starts =
      piece.kind === "spread" && !steps.some((s) => s.action === "place") ? [centre] : [];
    for (let p = 4; p <= pageCount; p++) starts.push(p);
    for (const start of starts) {
      const result = placePiece(state, piece.id, start);
      if (result.ok) {
        apply(result, "place", `Placed “${piece.title}” on ${pagesInWords(result.changedPages)}.`);
        break;
      }
    }
  }
  const problems = checkMap(state).errors.filter((m) => m.code !== "piece-not-placed");
  if (problems.length)
    throw new Error(
      `demo page map breaks its own rules: ${problems.map((m) => m.message).join(" ")}`,
    );

  await db.transaction(async (tx) => {
    await tx.delete(schema.pageSlots).where(eq(schema.pageSlots.anthologyId, almanac.id));
    await tx.insert(schema.pageSlots).values(
      state.slots.map((s) => ({
        anthologyId: almanac.id,
        pageNumber: s.page,
        reservation: s.reservation,
        pieceId: s.pieceId,
        piecePageIndex: s.piecePageIndex,
        locked: s.locked,
      })),
    );
    const base = almanac.mapVersion;
    const start = Date.now() - steps.length * 7 * 60_000;
    await tx.insert(schema.mapEvents).values(
      steps.map((step, i) => ({
        anthologyId: almanac.id,
        actorId: odile.id,
        mapVersion: base + i + 1,
        action: step.action,
        detail: { summary: step.summary, seeded: true },
        createdAt: new Date(start + i * 7 * 60_000),
      })),
    );
    await tx
      .update(schema.anthologies)
      .set({ mapVersion: base + steps.length, pageCountTarget: pageCount })
      .where(eq(schema.anthologies.id, almanac.id));
  });
  const placed = piecePages(state).size;
  return {
    slug: almanac.slug,
    placed,
    waiting: accepted.filter((p) => !p.leftOut).length - placed,
  };
}

async function acceptedPieces(db: Db, anthologyId: number): Promise<MapPiece[]> {
  const rows = await db
    .select({
      id: schema.pieces.id,
      title: schema.pieces.title,
      kind: schema.pieces.kind,
      pageCount: schema.pieces.pageCount,
      inks: schema.pieces.inks,
      leftOut: schema.pieces.leftOut,
    })
    .from(schema.pieces)
    .where(and(eq(schema.pieces.anthologyId, anthologyId), eq(schema.pieces.status, "accepted")))
    .orderBy(schema.pieces.id);
  return rows
    .map((r) => ({ ...r, inks: Array.isArray(r.inks) ? r.inks : [] }))
    .filter((p) => !p.leftOut);
}

async function createAcceptedPiece(db: Db, anthologyId: number, extra: ExtraPiece): Promise<void> {
  const [person] = await db
    .select({ id: schema.users.id })
    .from(schema.users)
    .where(eq(schema.users.email, extra.email))
    .limit(1);
  if (!person) throw new Error(`demo contributor ${extra.email} missing`);
  const [inserted] = await db
    .insert(schema.pieces)
    .values({
      anthologyId,
      contributorId: person.id,
      title: extra.title,
      kind: extra.kind,
      pageCount: pieceLength({ kind: extra.kind, pageCount: extra.pageCount }),
      inks: extra.inks,
      creditLine: extra.credit,
      status: "accepted",
    })
    .$returningId();
  if (!inserted) throw new Error("piece insert returned no id");
  const pages = pieceLength({ kind: extra.kind, pageCount: extra.pageCount });
  await db
    .insert(schema.piecePages)
    .values(Array.from({ length: pages }, (_, i) => ({ pieceId: inserted.id, pageIndex: i + 1 })));
  await db.insert(schema.pieceEvents).values({
    pieceId: inserted.id,
    actorId: null,
    fromStatus: null,
    toStatus: "accepted",
    message: "Accepted for the demo page map.",
  });
}
