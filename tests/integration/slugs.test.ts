// An anthology is found by its exact slug only. MariaDB's utf8mb4_unicode_ci compares without
// regard to case and ignores trailing spaces, so without care "/api/anthologies/LOW-TIDE" or
// "low-tide%20" would reach the same anthology. Route modules are called directly with a mocked
// session; the data is made fresh for this file.
import { eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { uniqueEmail } from "../helpers/demo";
import { halfLetterDuplicatorSpec } from "../helpers/anthology-spec";
import { assertTestDatabase } from "../helpers/env";

const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/auth", () => ({
  auth: vi.fn(async () =>
    session.userId ? { user: { id: session.userId, name: "Slug test lead", email: null } } : null,
  ),
}));

const { db, pool, schema } = await import("@/db");
const { createAnthology, findAnthologyAccess, findAnthologyBySlug } =
  await import("@/db/queries/anthologies");
const { findPublishedCall } = await import("@/db/queries/open-call");
const anthologyRoute = await import("@/app/api/anthologies/[slug]/route");

assertTestDatabase();

const DAY = 86_400_000;
let leadId = "";
let anthologyId = 0;
let slug = "";

/** What reaches the handler as `params.slug` for a path segment: Next decodes %20 and %00. */
const lookalikes = () => [
  slug.toUpperCase(),
  slug.charAt(0).toUpperCase() + slug.slice(1),
  decodeURIComponent(`${slug}%20`),
  decodeURIComponent(`${slug}%00`),
  `${slug}\t`,
  ` ${slug}`,
];

const getAnthology = (s: string) =>
  anthologyRoute.GET(new Request(`http://localhost/api/anthologies/${encodeURIComponent(s)}`), {
    params: Promise.resolve({ slug: s }),
  });

beforeAll(async () => {
  leadId = crypto.randomUUID();
  await db
    .insert(schema.users)
    .values({ id: leadId, name: "Slug test lead", email: uniqueEmail("slug-lead") });
  const anthology = await createAnthology(
    leadId,
    { title: "Brine Shrimp Gazette", stage: "call-open", ...halfLetterDuplicatorSpec },
    `brine-shrimp-${Date.now().toString(36)}`,
  );
  anthologyId = anthology.id;
  slug = anthology.slug;
  await db.insert(schema.calls).values({
    anthologyId,
    theme: "Small things in salt water",
    brief: "Drawings of the tiny animals of salt pans and rock pools.",
    opensAt: new Date(Date.now() - DAY),
    closesAt: new Date(Date.now() + 10 * DAY),
    timeZone: "UTC",
    allowedKinds: ["single"],
    allowedInks: ["black"],
    rightsAsked: "First printing rights for this edition.",
    publishedAt: new Date(Date.now() - DAY),
  });
});

afterAll(async () => {
  if (anthologyId)
    await db.delete(schema.anthologies).where(inArray(schema.anthologies.id, [anthologyId]));
  if (leadId) await db.delete(schema.users).where(eq(schema.users.id, leadId));
  await pool.end();
});

describe("finding an anthology by its slug", () => {
  it("answers 200 for the exact slug and 404 for one in capitals, with a trailing space or NUL", async () => {
    session.userId = leadId;
    const exact = await getAnthology(slug);
    expect(exact.status).toBe(200);
    expect(((await exact.json()) as { anthology: { id: number } }).anthology.id).toBe(anthologyId);
    for (const variant of lookalikes()) {
      const response = await getAnthology(variant);
      expect(response.status, JSON.stringify(variant)).toBe(404);
    }
  });

  it("finds nothing for a lookalike slug in the query the studio pages and routes share", async () => {
    expect((await findAnthologyBySlug(slug))?.id).toBe(anthologyId);
    for (const variant of lookalikes())
      expect(await findAnthologyBySlug(variant), JSON.stringify(variant)).toBeUndefined();
  });

  it("finds the anthology and the role only at the exact slug, for the guards of every route and page", async () => {
    const found = await findAnthologyAccess(slug, leadId);
    expect(found?.anthology.id).toBe(anthologyId);
    expect(found?.role).toBe("lead");
    expect((await findAnthologyAccess(slug, "no-such-person"))?.role).toBeNull();
    for (const variant of lookalikes())
      expect(await findAnthologyAccess(variant, leadId), JSON.stringify(variant)).toBeUndefined();
  });

  it("shows the public call page only at the exact slug", async () => {
    expect((await findPublishedCall(slug))?.anthology.id).toBe(anthologyId);
    for (const variant of lookalikes())
      expect(await findPublishedCall(variant), JSON.stringify(variant)).toBeUndefined();
  });
});
