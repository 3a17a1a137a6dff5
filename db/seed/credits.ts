/**
 * The demo almanac's credits, part way: most placed pieces' credit lines approved, one asked
 * about and still outstanding (a neighbour of one of Bea's pieces, so her proof shows a title where
 * the artwork would be), and one not asked yet. Idempotent: once any almanac piece has a credit
 * approved or asked about, it is left as it is.
 */
import { and, eq, inArray, isNotNull, or } from "drizzle-orm";
import type { Db } from "@/db";
import { schema } from "@/db";
import { proofSpreads } from "@/lib/credits/proof";
import { readerSpreads } from "@/lib/map/layout";
import { emptySlot } from "@/lib/map/state";
import type { MapSlot, MapState } from "@/lib/map/types";

const DAY = 86_400_000;

export async function seedCredits(
  db: Db,
): Promise<{ approved: number; outstanding: number } | null> {
  const p = schema.pieces;
  const [almanac] = await db
    .select()
    .from(schema.anthologies)
    .where(eq(schema.anthologies.slug, "low-tide-almanac"))
    .limit(1);
  if (!almanac) throw new Error("seed the demo press before its credits");
  const [started] = await db
    .select({ id: p.id })
    .from(p)
    .where(
      and(
        eq(p.anthologyId, almanac.id),
        or(isNotNull(p.creditApprovedAt), isNotNull(p.creditRequestedAt)),
      ),
    )
    .limit(1);
  if (started) return null;

  const slots = await db
    .select()
    .from(schema.pageSlots)
    .where(eq(schema.pageSlots.anthologyId, almanac.id));
  const pieces = await db
    .select({ id: p.id, contributorId: p.contributorId, email: schema.users.email })
    .from(p)
    .innerJoin(schema.users, eq(schema.users.id, p.contributorId))
    .where(and(eq(p.anthologyId, almanac.id), eq(p.status, "accepted"), eq(p.leftOut, false)));
  const state: MapState = {
    binding: almanac.binding,
    pageCount: slots.length,
    maxPages: almanac.maxPages,
    inksPerPass: almanac.inksPerPass,
    pressInks: almanac.inks,
    pieces: [],
    slots: Array.from({ length: slots.length }, (_, i): MapSlot => {
      const row = slots.find((s) => s.pageNumber === i + 1);
      return row
        ? {
            page: row.pageNumber,
            reservation: row.reservation ?? null,
            pieceId: row.pieceId,
            piecePageIndex: row.piecePageIndex,
            locked: row.locked,
          }
        : emptySlot(i + 1);
    }),
  };
  const placed = pieces.filter((x) => state.slots.some((s) => s.pieceId === x.id));
  if (placed.length === 0) return null;

  // A neighbour of one of Bea's pieces stays outstanding (asked two days ago).
  const bea = placed.filter((x) => x.email === "bea@lanternfield.test");
  let asked: number | undefined;
  for (const own of bea) {
    for (const spread of proofSpreads(state, own.id))
      for (const page of spread.pages)
        if (
          page.kind === "neighbour" &&
          placed.find((x) => x.id === page.pieceId)?.contributorId !== own.contributorId
        )
          asked ??= page.pieceId;
  }
  asked ??= placed[0]!.id;
  // The last placed piece in reading order that is not that one is left not asked yet.
  const order = readerSpreads(state.pageCount).flatMap((s) => s.pages);
  const lastPlaced = [...order]
    .reverse()
    .map((page) => state.slots[page - 1]?.pieceId)
    .find((id): id is number => id != null && id !== asked);
  const approve = placed.map((x) => x.id).filter((id) => id !== asked && id !== lastPlaced);

  const now = Date.now();
  if (approve.length)
    await db
      .update(p)
      .set({ creditApprovedAt: new Date(Math.floor((now - 5 * DAY) / 1000) * 1000) })
      .where(inArray(p.id, approve));
  await db
    .update(p)
    .set({ creditRequestedAt: new Date(now - 2 * DAY) })
    .where(eq(p.id, asked));
  return { approved: approve.length, outstanding: placed.length - approve.length };
}
