// Fresh people, anthologies and open calls for the submission tests: every call makes new rows
// with unique names, so test files can run side by side against one database.
import { eq } from "drizzle-orm";
import sharp from "sharp";
import { db, schema } from "@/db";
import type { Role } from "@/lib/domain";
import { uniqueEmail } from "./demo";
import { halfLetterDuplicatorSpec } from "./anthology-spec";

export type TestPerson = { id: string; name: string; email: string };

export async function makePerson(label: string): Promise<TestPerson> {
  const person = {
    id: crypto.randomUUID(),
    name: `${label[0]!.toUpperCase()}${label.slice(1)} Tester`,
    email: uniqueEmail(label),
  };
  await db.insert(schema.users).values({ ...person, emailVerified: new Date() });
  return person;
}

const DAY = 86_400_000;

/**
 * A half-letter duplicator anthology (5.5 x 8.5 in, 1/8 in bleed, 1/4 in safe margin, 300 ppi,
 * black and teal) at "call open", with a published call that opened yesterday and closes in a week,
 * unless `closed` puts both dates in the past.
 */
export async function makeAnthologyWithCall(
  members: { person: TestPerson; role: Role }[],
  options: {
    closed?: boolean;
    piecesPerPerson?: number;
    allowedKinds?: ("single" | "spread" | "run")[];
  } = {},
) {
  const lead = members.find((m) => m.role === "lead")?.person ?? members[0]!.person;
  const slug = `subm-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 7)}`;
  const [inserted] = await db
    .insert(schema.anthologies)
    .values({
      slug,
      title: `Test Tideline ${slug}`,
      pressName: "Marrowbend Print Collective",
      stage: "call-open",
      ...halfLetterDuplicatorSpec,
      createdBy: lead.id,
    })
    .$returningId();
  const anthologyId = inserted!.id;
  for (const m of members)
    await db.insert(schema.memberships).values({ anthologyId, userId: m.person.id, role: m.role });
  const now = Date.now();
  const opensAt = new Date(options.closed ? now - 30 * DAY : now - DAY);
  const closesAt = new Date(options.closed ? now - DAY : now + 7 * DAY);
  await db.insert(schema.calls).values({
    anthologyId,
    theme: "What the river carries",
    brief: "Anything the river brings down to the sea, drawn in black and teal.",
    opensAt,
    closesAt,
    timeZone: "UTC",
    allowedKinds: options.allowedKinds ?? ["single", "spread", "run"],
    maxRunPages: 4,
    piecesPerPerson: options.piecesPerPerson ?? 2,
    allowedInks: ["black", "teal"],
    rightsAsked: "First printing rights for this edition.",
    publishedAt: opensAt,
  });
  const [anthology] = await db
    .select()
    .from(schema.anthologies)
    .where(eq(schema.anthologies.id, anthologyId));
  return anthology!;
}

/** Inserts a piece with its pages straight into the database (for tests that are not about creating one). */
export async function makePiece(
  anthologyId: number,
  contributorId: string,
  fields: {
    title?: string;
    kind?: "single" | "spread" | "run";
    pageCount?: number;
    inks?: string[];
    status?: "awaiting-review" | "fix-requested" | "withdrawn" | "declined" | "accepted";
  } = {},
) {
  const pageCount = fields.pageCount ?? (fields.kind === "spread" ? 2 : 1);
  const [inserted] = await db
    .insert(schema.pieces)
    .values({
      anthologyId,
      contributorId,
      title: fields.title ?? "Driftwood",
      kind: fields.kind ?? "single",
      pageCount,
      inks: fields.inks ?? ["black"],
      creditLine: "Tester",
      status: fields.status ?? "awaiting-review",
    })
    .$returningId();
  const pieceId = inserted!.id;
  await db
    .insert(schema.piecePages)
    .values(Array.from({ length: pageCount }, (_, i) => ({ pieceId, pageIndex: i + 1 })));
  return pieceId;
}

/**
 * A greyscale PNG at 300 ppi, mid-grey to every edge. Half letter at 300 ppi is 1650 x 2550 px,
 * 1725 x 2625 px with 1/8 in bleed (pixels = inches x ppi, as in the
 * Haematologica "Image resolution" advisor, submit.haematologica.org/image_analysis/advisor/image_resolution.html).
 */
export async function greyPage(
  widthPx: number,
  heightPx: number,
  options: { colour?: boolean } = {},
): Promise<Buffer> {
  const base = sharp({
    create: {
      width: widthPx,
      height: heightPx,
      channels: 3,
      background: { r: 120, g: 140, b: options.colour ? 200 : 140 },
    },
  });
  const image = options.colour ? base.toColourspace("srgb") : base.toColourspace("b-w");
  return image.withDensity(300).png().toBuffer();
}
