import { eq } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import { db, pool, schema } from "@/db";
import { createAnthology, findRole, listMyAnthologies } from "@/db/queries/anthologies";
import { inToMm } from "@/lib/print/units";
import { uniqueEmail } from "../helpers/demo";

const run = Date.now().toString(36);

async function makeUser(label: string) {
  const id = crypto.randomUUID();
  await db.insert(schema.users).values({ id, name: `Tester ${label}`, email: uniqueEmail(label) });
  return id;
}

const spec = {
  title: "Round Trip Quarterly",
  trimPreset: "half-letter",
  trimWidthMm: inToMm(5.5),
  trimHeightMm: inToMm(8.5),
  bleedMm: inToMm(0.125),
  safeMarginMm: inToMm(0.25),
  binding: "saddle-stitch" as const,
  pageCountTarget: 24,
  maxPages: 40,
  coverStock: "separate" as const,
  coverPaperGsm: 216,
  paperGsm: 90,
  paperCaliperMm: 0.104,
  printMethod: "duplicator" as const,
  inks: ["black", "fluorescent orange", "teal"],
  inksPerPass: 1,
  minPpi: 300,
};

afterAll(async () => {
  await pool.end();
});

describe("schema round-trips on MariaDB", () => {
  it("keeps an anthology's spec exactly: doubles, JSON ink lists, defaults", async () => {
    const lead = await makeUser("lead");
    const created = await createAnthology(lead, spec, `round-trip-${run}`);
    const [row] = await db
      .select()
      .from(schema.anthologies)
      .where(eq(schema.anthologies.id, created.id));
    expect(row).toBeDefined();
    // NBS Circular 572: 1 in = 25.4 mm exactly → half letter is 139.7 x 215.9 mm, 1/8 in = 3.175 mm
    // A double survives the round trip bit for bit (8.5 x 25.4 is 215.89999999999998 in binary floating point).
    expect(row!.trimWidthMm).toBe(spec.trimWidthMm);
    expect(row!.trimHeightMm).toBe(spec.trimHeightMm);
    expect(row!.trimWidthMm).toBeCloseTo(139.7, 9);
    expect(row!.trimHeightMm).toBeCloseTo(215.9, 9);
    expect(row!.bleedMm).toBeCloseTo(3.175, 12);
    expect(row!.inks).toEqual(["black", "fluorescent orange", "teal"]);
    expect(row!.stage).toBe("planning");
    expect(row!.mapVersion).toBe(0);
    expect(row!.currency).toBe("USD");
    expect(row!.createdAt).toBeInstanceOf(Date);
    expect(await findRole(row!.id, lead)).toBe("lead");
    expect((await listMyAnthologies(lead)).map((a) => a.slug)).toEqual([`round-trip-${run}`]);
  });

  it("gives a second anthology with the same title a free slug", async () => {
    const lead = await makeUser("slugs");
    const first = await createAnthology(lead, spec, `same-title-${run}`);
    const second = await createAnthology(lead, spec, `same-title-${run}`);
    expect(first.slug).toBe(`same-title-${run}`);
    expect(second.slug).toBe(`same-title-${run}-2`);
  });

  it("refuses a second membership for the same person and anthology", async () => {
    const lead = await makeUser("dup");
    const anthology = await createAnthology(lead, spec, `dup-member-${run}`);
    await expect(
      db
        .insert(schema.memberships)
        .values({ anthologyId: anthology.id, userId: lead, role: "editor" }),
    ).rejects.toThrow();
    expect(await findRole(anthology.id, lead)).toBe("lead");
  });

  it("stores file versions with their JSON report and WebP thumbnail bytes", async () => {
    const lead = await makeUser("files");
    const anthology = await createAnthology(lead, spec, `files-${run}`);
    const [piece] = await db
      .insert(schema.pieces)
      .values({
        anthologyId: anthology.id,
        contributorId: lead,
        title: "Kelp Study",
        kind: "single",
        pageCount: 1,
        inks: ["teal"],
        creditLine: "K. Tester",
      })
      .$returningId();
    const [page] = await db
      .insert(schema.piecePages)
      .values({ pieceId: piece!.id, pageIndex: 1 })
      .$returningId();
    const thumbnail = Buffer.from([0x52, 0x49, 0x46, 0x46, 0, 1, 2, 3, 255, 254]);
    const report = {
      verdict: "warning",
      findings: [{ code: "no-bleed", severity: "warning", message: "ünïcode ✓" }],
    };
    const [version] = await db
      .insert(schema.fileVersions)
      .values({
        piecePageId: page!.id,
        versionNumber: 1,
        storageKey: "abc123",
        fileName: "kelp.png",
        mimeType: "image/png",
        sizeBytes: 5_000_000_000,
        report,
        verdict: "warning",
        thumbnailWebp: thumbnail,
        uploadedBy: lead,
      })
      .$returningId();
    const [stored] = await db
      .select()
      .from(schema.fileVersions)
      .where(eq(schema.fileVersions.id, version!.id));
    expect(stored!.report).toEqual(report);
    expect(Buffer.compare(stored!.thumbnailWebp!, thumbnail)).toBe(0);
    expect(stored!.sizeBytes).toBe(5_000_000_000);
    await expect(
      db.insert(schema.fileVersions).values({ ...stored!, id: undefined, thumbnailWebp: null }),
    ).rejects.toThrow();
  });

  it("keeps money as whole cents beyond 32 bits and times in UTC", async () => {
    const lead = await makeUser("money");
    const anthology = await createAnthology(lead, spec, `money-${run}`);
    const soldOn = new Date("2026-11-14T18:30:00.000Z");
    await db.insert(schema.sales).values({
      anthologyId: anthology.id,
      channel: "event",
      label: "Harbour fair",
      copies: 40,
      unitPriceCents: 4_294_967_301,
      recoverableCostsCents: 1999,
      currency: "USD",
      recordedBy: lead,
      soldOn,
    });
    const [sale] = await db
      .select()
      .from(schema.sales)
      .where(eq(schema.sales.anthologyId, anthology.id));
    expect(sale!.unitPriceCents).toBe(4_294_967_301);
    expect(Number.isInteger(sale!.recoverableCostsCents)).toBe(true);
    expect(sale!.soldOn.toISOString()).toBe("2026-11-14T18:30:00.000Z");
  });
});
