/**
 * The demo press: the Marrowbend Print Collective of Lanternfield (invented), its people and its
 * anthologies. Idempotent: people are matched by e-mail, anthologies by slug.
 */
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db";
import { schema } from "@/db";
import { hashPassword, verifyPassword } from "@/server/auth/password";
import type { Role } from "@/lib/domain";
import { inToMm } from "@/lib/print/units";
import demoAccounts from "../demo-accounts.json";

export type DemoPerson = { id: string; role: Role; name: string; email: string };

export async function seedPeople(db: Db): Promise<DemoPerson[]> {
  const people: DemoPerson[] = [];
  for (const account of demoAccounts) {
    const [existing] = await db
      .select()
      .from(schema.users)
      .where(eq(schema.users.email, account.email))
      .limit(1);
    let id = existing?.id;
    if (!existing) {
      id = crypto.randomUUID();
      await db.insert(schema.users).values({
        id,
        name: account.name,
        email: account.email,
        emailVerified: new Date(),
        passwordHash: await hashPassword(account.password),
      });
    } else if (
      !existing.passwordHash ||
      !(await verifyPassword(existing.passwordHash, account.password))
    ) {
      await db
        .update(schema.users)
        .set({ passwordHash: await hashPassword(account.password) })
        .where(eq(schema.users.id, existing.id));
    }
    people.push({ id: id!, role: account.role as Role, name: account.name, email: account.email });
  }
  return people;
}

type AnthologyFields = Omit<typeof schema.anthologies.$inferInsert, "createdBy" | "slug">;

/** Inserts the anthology when its slug is free, then makes sure every listed member has their role. */
export async function seedAnthology(
  db: Db,
  slug: string,
  fields: AnthologyFields,
  createdBy: string,
  members: { userId: string; role: Role }[],
) {
  let [row] = await db
    .select()
    .from(schema.anthologies)
    .where(eq(schema.anthologies.slug, slug))
    .limit(1);
  if (!row) {
    await db.insert(schema.anthologies).values({ ...fields, slug, createdBy });
    [row] = await db
      .select()
      .from(schema.anthologies)
      .where(eq(schema.anthologies.slug, slug))
      .limit(1);
  }
  if (!row) throw new Error(`could not seed ${slug}`);
  for (const member of members) {
    const [existing] = await db
      .select({ id: schema.memberships.id })
      .from(schema.memberships)
      .where(
        and(
          eq(schema.memberships.anthologyId, row.id),
          eq(schema.memberships.userId, member.userId),
        ),
      )
      .limit(1);
    if (!existing) await db.insert(schema.memberships).values({ anthologyId: row.id, ...member });
  }
  return row;
}

export async function seedDemoPress(db: Db) {
  const people = await seedPeople(db);
  const byEmail = (email: string) => {
    const person = people.find((p) => p.email === email);
    if (!person) throw new Error(`demo person ${email} missing from demo-accounts.json`);
    return person;
  };
  const odile = byEmail("odile@marrowbend.test");
  const cass = byEmail("cass@marrowbend.test");
  const bea = byEmail("bea@lanternfield.test");
  const tomasz = byEmail("tomasz@lanternfield.test");
  const imke = byEmail("imke@lanternfield.test");

  const almanac = await seedAnthology(
    db,
    "low-tide-almanac",
    {
      title: "Low Tide Almanac",
      pressName: "Marrowbend Print Collective",
      summary:
        "Twenty-four pages of tide pools, mudflats and the things the sea leaves behind, in black and teal.",
      stage: "planning",
      trimPreset: "half-letter",
      trimWidthMm: inToMm(5.5),
      trimHeightMm: inToMm(8.5),
      bleedMm: inToMm(0.125),
      safeMarginMm: inToMm(0.25),
      binding: "saddle-stitch",
      pageCountTarget: 24,
      maxPages: 40,
      coverStock: "separate",
      coverPaperGsm: 216,
      paperGsm: 90,
      paperCaliperMm: 0.11,
      printMethod: "duplicator",
      inks: ["black", "teal"],
      inksPerPass: 1,
      minPpi: 300,
      currency: "USD",
    },
    odile.id,
    [
      { userId: odile.id, role: "lead" },
      { userId: cass.id, role: "finisher" },
      { userId: bea.id, role: "contributor" },
      { userId: tomasz.id, role: "contributor" },
      { userId: imke.id, role: "contributor" },
    ],
  );

  // Bea edits her own small comics jam: one person, two roles in two anthologies.
  const jam = await seedAnthology(
    db,
    "heron-street-comics-jam",
    {
      title: "Heron Street Comics Jam",
      pressName: "Heron Street Drawing Night",
      summary: "Four-panel comics drawn in one evening, printed on the library's black laser.",
      stage: "planning",
      trimPreset: "a6",
      trimWidthMm: 105,
      trimHeightMm: 148,
      bleedMm: 3,
      safeMarginMm: 5,
      binding: "saddle-stitch",
      pageCountTarget: 16,
      maxPages: 32,
      coverStock: "self",
      coverPaperGsm: null,
      paperGsm: 80,
      paperCaliperMm: 0.1,
      printMethod: "laser-black",
      inks: ["black"],
      inksPerPass: 1,
      minPpi: 300,
      currency: "EUR",
    },
    bea.id,
    [
      { userId: bea.id, role: "lead" },
      { userId: imke.id, role: "contributor" },
    ],
  );

  return { people, almanac, jam, odile, cass, bea, tomasz, imke };
}
