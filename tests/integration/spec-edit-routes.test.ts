// PATCH /api/anthologies/[slug]/spec against the real MariaDB and the upload fake: who may change
// the print spec, what a change may not break, and the re-check of every current file.
import { and, eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { assertTestDatabase } from "../helpers/env";
import {
  greyPage,
  makeAnthologyWithCall,
  makePerson,
  makePiece,
  type TestPerson,
} from "../helpers/submissions";

// The route handlers read the session through `auth()`; each test says who is signed in.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/auth", () => ({
  auth: vi.fn(async () =>
    session.userId ? { user: { id: session.userId, name: "Test person", email: null } } : null,
  ),
}));

const { db, pool, schema } = await import("@/db");
const specRoute = await import("@/app/api/anthologies/[slug]/spec/route");
const { ingestUpload } = await import("@/server/submissions/ingest");
const { storeFile } = await import("@/server/uploads");

assertTestDatabase(process.env.DATABASE_URL);

let lead: TestPerson;
let editor: TestPerson;
let finisher: TestPerson;
let contributor: TestPerson;
const anthologyIds: number[] = [];

const as = (who: TestPerson | null) => {
  session.userId = who?.id ?? null;
};

function patchSpec(slug: string, body: unknown) {
  return specRoute.PATCH(
    new Request(`http://localhost/api/anthologies/${slug}/spec`, {
      method: "PATCH",
      headers: { "content-type": "application/json" },
      body: JSON.stringify(body),
    }),
    { params: Promise.resolve({ slug }) },
  );
}

/** The spec form's values for the anthology makeAnthologyWithCall makes (half letter, duplicator). */
const halfLetter = {
  trimChoice: "half-letter",
  orientation: "portrait",
  unit: "in",
  bleed: 0.125,
  safeMargin: 0.25,
  binding: "saddle-stitch",
  pageCountTarget: 16,
  maxPages: 32,
  coverStock: "self",
  paperGsm: 90,
  paperCaliperMm: 0.11,
  printMethod: "duplicator",
  inks: ["black", "teal"],
  inksPerPass: 1,
  minPpi: 300,
};
// ISO 216: A5 = 148 x 210 mm; 3 mm bleed and 5 mm safe margin (common practice, no source).
const a5 = { ...halfLetter, trimChoice: "a5", unit: "mm", bleed: 3, safeMargin: 5 };

async function anthologyRow(id: number) {
  const [row] = await db.select().from(schema.anthologies).where(eq(schema.anthologies.id, id));
  return row!;
}

async function newAnthology() {
  const anthology = await makeAnthologyWithCall([
    { person: lead, role: "lead" },
    { person: editor, role: "editor" },
    { person: finisher, role: "finisher" },
    { person: contributor, role: "contributor" },
  ]);
  anthologyIds.push(anthology.id);
  return anthology;
}

/** A 16-page map: covers kept on pages 1 and 16, and `pieceId` on `page`. */
async function mapWithPieceOn(anthologyId: number, pieceId: number, page: number) {
  await db.insert(schema.pageSlots).values(
    Array.from({ length: 16 }, (_, i) => ({
      anthologyId,
      pageNumber: i + 1,
      reservation: i === 0 || i === 15 ? ("cover" as const) : null,
      pieceId: i + 1 === page ? pieceId : null,
      piecePageIndex: i + 1 === page ? 1 : null,
      locked: false,
    })),
  );
}

beforeAll(async () => {
  [lead, editor, finisher, contributor] = await Promise.all([
    makePerson("spec-lead"),
    makePerson("spec-editor"),
    makePerson("spec-finisher"),
    makePerson("spec-contributor"),
  ]);
});

afterAll(async () => {
  if (anthologyIds.length)
    await db.delete(schema.anthologies).where(inArray(schema.anthologies.id, anthologyIds));
  await pool.end();
});

describe("who may change the spec", () => {
  it("answers 401 signed out and 403 to a contributor and a finisher; an editor may", async () => {
    const anthology = await newAnthology();
    as(null);
    expect((await patchSpec(anthology.slug, halfLetter)).status).toBe(401);
    for (const who of [contributor, finisher]) {
      as(who);
      const answer = await patchSpec(anthology.slug, { ...halfLetter, paperGsm: 100 });
      expect(answer.status).toBe(403);
    }
    expect((await anthologyRow(anthology.id)).paperGsm).toBe(90);
    as(editor);
    const saved = await patchSpec(anthology.slug, { ...halfLetter, paperGsm: 100 });
    expect(saved.status).toBe(200);
    // Paper weight is not something the file check reads: nothing to check again.
    expect(await saved.json()).toMatchObject({ saved: true, recheck: { checked: 0 } });
    expect((await anthologyRow(anthology.id)).paperGsm).toBe(100);
  });

  it("answers 400 with field messages for a spec the create form would refuse too", async () => {
    const anthology = await newAnthology();
    as(lead);
    const answer = await patchSpec(anthology.slug, { ...halfLetter, pageCountTarget: 18 });
    expect(answer.status).toBe(400);
    const body = (await answer.json()) as { fields: Record<string, string[]> };
    // common practice, no source: a saddle-stitched booklet has a multiple of 4 pages.
    expect(body.fields.pageCountTarget?.[0]).toContain("multiple of 4");
  });
});

describe("what a change may not break", () => {
  it("refuses most pages below the pages already on the map, even when confirmed", async () => {
    const anthology = await newAnthology();
    const pieceId = await makePiece(anthology.id, contributor.id, {
      title: "Marsh Lights",
      status: "accepted",
    });
    await mapWithPieceOn(anthology.id, pieceId, 12);
    as(lead);
    for (const confirm of [false, true]) {
      const answer = await patchSpec(anthology.slug, {
        ...halfLetter,
        pageCountTarget: 8,
        maxPages: 8,
        confirm,
      });
      expect(answer.status).toBe(409);
      const body = (await answer.json()) as {
        saved: boolean;
        needs: string;
        impacts: { code: string; severity: string; message: string; pieceIds: number[] }[];
      };
      expect(body).toMatchObject({ saved: false, needs: "changes" });
      const maxPages = body.impacts.find((i) => i.code === "max-pages-below-map");
      expect(maxPages).toMatchObject({ severity: "refusal", pieceIds: [pieceId] });
      expect(maxPages?.message).toContain("16 pages");
      expect(maxPages?.message).toContain("Marsh Lights");
    }
    const row = await anthologyRow(anthology.id);
    expect([row.maxPages, row.pageCountTarget]).toEqual([32, 16]);
  });

  it("refuses taking away an ink a placed piece prints in", async () => {
    const anthology = await newAnthology();
    const pieceId = await makePiece(anthology.id, contributor.id, {
      title: "Teal Tide",
      status: "accepted",
      inks: ["teal"],
    });
    await mapWithPieceOn(anthology.id, pieceId, 6);
    as(editor);
    const answer = await patchSpec(anthology.slug, {
      ...halfLetter,
      inks: ["black"],
      confirm: true,
    });
    expect(answer.status).toBe(409);
    const body = (await answer.json()) as { impacts: { code: string; pieceIds: number[] }[] };
    expect(body.impacts).toContainEqual(
      expect.objectContaining({ code: "ink-in-use-removed", pieceIds: [pieceId] }),
    );
    expect((await anthologyRow(anthology.id)).inks).toEqual(["black", "teal"]);
  });
});

describe("a change that makes passing files fail", () => {
  it("warns first; confirmed, it saves, checks the file again and reports it failing", async () => {
    const anthology = await newAnthology();
    const pieceId = await makePiece(anthology.id, contributor.id, { title: "Heron Bend" });
    // Half letter + 1/8 in bleed at 300 ppi = 5.75 x 8.75 in = 1725 x 2625 px: a passing page.
    const file = await storeFile(await greyPage(1725, 2625), "heron-bend.png", "image/png");
    const first = await ingestUpload(
      { pieceId, pageIndex: 1, expectedRevision: 0, uploadedBy: contributor.id, file },
      { notify: false },
    );
    expect(first).toMatchObject({ verdict: "pass", pieceVerdict: "pass" });

    as(lead);
    const warned = await patchSpec(anthology.slug, a5);
    expect(warned.status).toBe(409);
    const warning = (await warned.json()) as {
      saved: boolean;
      needs: string;
      impacts: { code: string; severity: string; message: string; pieceIds: number[] }[];
    };
    expect(warning).toMatchObject({ saved: false, needs: "confirmation" });
    const failing = warning.impacts.find((i) => i.code === "files-will-fail");
    expect(failing).toMatchObject({ severity: "warning", pieceIds: [pieceId] });
    expect(failing?.message).toContain("Heron Bend");
    // Nothing changed yet.
    expect((await anthologyRow(anthology.id)).trimPreset).toBe("half-letter");

    const confirmed = await patchSpec(anthology.slug, { ...a5, confirm: true });
    expect(confirmed.status).toBe(200);
    const summary = (await confirmed.json()) as {
      saved: boolean;
      recheck: {
        checked: number;
        nowFailing: number;
        notChecked: number;
        changed: { pieceId: number; pageIndex: number; before: string; after: string }[];
      };
    };
    expect(summary).toMatchObject({
      saved: true,
      recheck: { checked: 1, nowFailing: 1, notChecked: 0 },
    });
    expect(summary.recheck.changed).toEqual([
      expect.objectContaining({ pieceId, pageIndex: 1, before: "pass", after: "blocker" }),
    ]);

    const row = await anthologyRow(anthology.id);
    expect(row.trimPreset).toBe("a5");
    // ISO 216: A5 = 148 x 210 mm.
    expect([row.trimWidthMm, row.trimHeightMm, row.bleedMm]).toEqual([148, 210, 3]);
    const [version] = await db
      .select()
      .from(schema.fileVersions)
      .where(eq(schema.fileVersions.id, first.versionId));
    expect(version!.verdict).toBe("blocker");
    const codes = (version!.report as { findings: { code: string }[] }).findings.map((f) => f.code);
    expect(codes).toContain("wrong-aspect");
    const [piece] = await db
      .select({ verdict: schema.pieces.verdict })
      .from(schema.pieces)
      .where(and(eq(schema.pieces.id, pieceId)));
    expect(piece!.verdict).toBe("blocker");
  });
});
