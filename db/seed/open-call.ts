/**
 * The demo almanac's open call, opened a week ago and closing in three weeks (Lisbon time), and
 * the almanac moved to "call open". Idempotent: an existing call is left as it is, and the stage
 * only moves forward from planning.
 */
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db";
import { schema } from "@/db";
import { utcToZonedLocal, zonedToUtc } from "@/lib/time-zones";

const TIME_ZONE = "Europe/Lisbon";

/** The instant of `hh:mm` Lisbon time, `days` days from the Lisbon date of `now`. */
function lisbonTime(now: Date, days: number, hhmm: string): Date {
  const date = new Date(`${utcToZonedLocal(now, TIME_ZONE).slice(0, 10)}T12:00:00Z`);
  date.setUTCDate(date.getUTCDate() + days);
  const result = zonedToUtc(`${date.toISOString().slice(0, 10)}T${hhmm}`, TIME_ZONE);
  if (!result.ok) throw new Error(`no such Lisbon time: ${hhmm}`);
  return result.instant;
}

export async function seedOpenCall(db: Db, now = new Date()) {
  const [almanac] = await db
    .select()
    .from(schema.anthologies)
    .where(eq(schema.anthologies.slug, "low-tide-almanac"))
    .limit(1);
  if (!almanac) throw new Error("seed the demo press before its open call");
  let [call] = await db
    .select()
    .from(schema.calls)
    .where(eq(schema.calls.anthologyId, almanac.id))
    .limit(1);
  if (!call) {
    const opensAt = lisbonTime(now, -7, "09:00");
    await db.insert(schema.calls).values({
      anthologyId: almanac.id,
      theme: "What the tide leaves",
      brief: [
        "Twice a day the water goes out and leaves things behind: wrack lines, bottle glass, crab shells, a lost sandal, the patterns the current draws in the mud.",
        "Send us drawings, comics, prints or short illustrated text about what you find there, or what you wish you had found. Work in black and teal: the almanac is printed on the collective's two-drum stencil duplicator, one ink per drum.",
        "One page, a two-page spread or a short run of up to four pages. Beginners are welcome; we are happy to help with separating your inks.",
      ].join("\n\n"),
      opensAt,
      closesAt: lisbonTime(now, 21, "23:59"),
      timeZone: TIME_ZONE,
      allowedKinds: ["single", "spread", "run"],
      maxRunPages: 4,
      piecesPerPerson: 5,
      allowedInks: ["black", "teal"],
      feeKind: "per-piece",
      feeCents: 2500,
      salesShareBasisPoints: 1000,
      contributorCopies: 2,
      rightsAsked:
        "First printing rights for this edition; all rights return to you after printing.",
      publishedAt: opensAt,
    });
    [call] = await db
      .select()
      .from(schema.calls)
      .where(eq(schema.calls.anthologyId, almanac.id))
      .limit(1);
  }
  await db
    .update(schema.anthologies)
    .set({ stage: "call-open" })
    .where(and(eq(schema.anthologies.id, almanac.id), eq(schema.anthologies.stage, "planning")));
  return call;
}
