// The artwork pipeline against the real MariaDB and the upload fake: files are stored through the
// real UploadThing SDK (UTApi), read back from the fake's file host, checked, and recorded.
import { and, eq } from "drizzle-orm";
import { PDFDocument, rgb } from "pdf-lib";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db, pool, schema } from "@/db";
import { useVersion } from "@/db/queries/submissions";
import { Refusal } from "@/lib/refusal";
import {
  authoriseArtworkUpload,
  ingestUpload,
  type IngestResult,
} from "@/server/submissions/ingest";
import { storeFile } from "@/server/uploads";
import { assertTestDatabase } from "../helpers/env";
import { waitForMessage } from "../helpers/outbox";
import {
  greyPage,
  makeAnthologyWithCall,
  makePerson,
  makePiece,
  type TestPerson,
} from "../helpers/submissions";
import { encryptedPdf, makePdf, pngChunk } from "../unit/print/fixtures";

assertTestDatabase(process.env.DATABASE_URL);

let lead: TestPerson;
let bea: TestPerson;
let tomasz: TestPerson;
let anthologyId: number;
let closedAnthologyId: number;

beforeAll(async () => {
  [lead, bea, tomasz] = await Promise.all([
    makePerson("lead"),
    makePerson("bea"),
    makePerson("tomasz"),
  ]);
  const open = await makeAnthologyWithCall([
    { person: lead, role: "lead" },
    { person: bea, role: "contributor" },
    { person: tomasz, role: "contributor" },
  ]);
  anthologyId = open.id;
  const closed = await makeAnthologyWithCall(
    [
      { person: lead, role: "lead" },
      { person: bea, role: "contributor" },
    ],
    { closed: true },
  );
  closedAnthologyId = closed.id;
});

afterAll(async () => {
  await pool.end();
});

/** Stores bytes in the upload fake and runs the pipeline on them, as onUploadComplete does. */
async function upload(
  pieceId: number,
  pageIndex: number,
  bytes: Uint8Array,
  name: string,
  type: string,
  expectedRevision: number | null = null,
  by = bea,
) {
  const file = await storeFile(bytes, name, type);
  return ingestUpload({ pieceId, pageIndex, expectedRevision, uploadedBy: by.id, file });
}

async function version(id: number) {
  const [row] = await db.select().from(schema.fileVersions).where(eq(schema.fileVersions.id, id));
  return row!;
}

async function pageOf(pieceId: number, pageIndex = 1) {
  const [row] = await db
    .select()
    .from(schema.piecePages)
    .where(and(eq(schema.piecePages.pieceId, pieceId), eq(schema.piecePages.pageIndex, pageIndex)));
  return row!;
}

async function pieceRow(pieceId: number) {
  const [row] = await db.select().from(schema.pieces).where(eq(schema.pieces.id, pieceId));
  return row!;
}

const codes = (report: unknown) =>
  (report as { findings: { code: string }[] }).findings.map((f) => f.code);

describe("a good page", () => {
  it("passes, stores a 480 px WebP thumbnail and its md5, makes the page current and mails the report", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, { title: "Eel Grass" });
    // Half letter + 1/8 in bleed at 300 ppi = 5.75 x 8.75 in x 300 = 1725 x 2625 px (pixels = inches x ppi,
    // Haematologica "Image resolution" advisor, submit.haematologica.org/image_analysis/advisor/image_resolution.html).
    const result = await upload(
      pieceId,
      1,
      await greyPage(1725, 2625),
      "eel-grass.png",
      "image/png",
      0,
    );
    expect(result).toMatchObject({
      verdict: "pass",
      pieceVerdict: "pass",
      current: true,
      revision: 1,
      versionNumber: 1,
    });
    const v = await version(result.versionId);
    expect(v.verdict).toBe("pass");
    expect(v.md5).toMatch(/^[0-9a-f]{32}$/);
    expect(v.sizeBytes).toBeGreaterThan(0);
    expect(v.thumbnailWebp).not.toBeNull();
    const thumb = await sharp(v.thumbnailWebp!).metadata();
    expect(thumb.format).toBe("webp");
    expect(Math.max(thumb.width ?? 0, thumb.height ?? 0)).toBe(480);
    expect(v.thumbnailHeightPx).toBe(480);
    expect((await pageOf(pieceId)).currentVersionId).toBe(result.versionId);
    expect((await pieceRow(pieceId)).verdict).toBe("pass");

    const mail = await waitForMessage({
      to: bea.email,
      subject: /Spec check: "Eel Grass", page 1: Meets the spec/,
    });
    expect(mail.text).toContain("It meets the spec");
    const [logged] = await db
      .select()
      .from(schema.emailLog)
      .where(and(eq(schema.emailLog.pieceId, pieceId), eq(schema.emailLog.kind, "spec-report")));
    expect(logged?.sentAt).not.toBeNull();
  });

  it("a page without bleed is a stored report with the numbers and the fix", async () => {
    const pieceId = await makePiece(anthologyId, tomasz.id, { title: "Reed Bed" });
    const result = await upload(
      pieceId,
      1,
      await greyPage(1650, 2550),
      "reed-bed.png",
      "image/png",
      0,
      tomasz,
    );
    expect(result.verdict).toBe("blocker");
    const v = await version(result.versionId);
    const report = v.report as { findings: { code: string; message: string; fix?: string }[] };
    const noBleed = report.findings.find((f) => f.code === "no-bleed");
    expect(noBleed?.message).toContain("1650 x 2550 px");
    expect(noBleed?.fix).toContain("1725 x 2625 px");
    const mail = await waitForMessage({
      to: tomasz.email,
      subject: /Spec check: "Reed Bed", page 1: Won't print/,
    });
    expect(mail.text).toContain("1725 x 2625 px");
  });
});

describe("bad files are stored with a clear finding, never half-stored", () => {
  // A PNG header (IHDR) that claims 40000 x 40000 px with no real pixel data behind it.
  function pixelBomb(): Buffer {
    const ihdr = Buffer.alloc(13);
    ihdr.writeUInt32BE(40_000, 0);
    ihdr.writeUInt32BE(40_000, 4);
    ihdr[8] = 8; // bit depth
    ihdr[9] = 0; // greyscale
    return Buffer.concat([
      Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
      pngChunk("IHDR", ihdr),
      pngChunk("IDAT", Buffer.alloc(64)),
      pngChunk("IEND", Buffer.alloc(0)),
    ]);
  }

  const cases: [string, () => Promise<Uint8Array>, string, string, string][] = [
    ["an empty file", async () => new Uint8Array(0), "empty.png", "image/png", "file-empty"],
    [
      "a truncated PNG",
      async () => (await greyPage(1725, 2625)).subarray(0, 3000),
      "cut.png",
      "image/png",
      "file-truncated",
    ],
    [
      "text named .png",
      async () => new TextEncoder().encode("these are my notes, not a picture\n".repeat(20)),
      "notes.png",
      "image/png",
      "file-unrecognised",
    ],
    [
      "a GIF",
      async () =>
        sharp({ create: { width: 40, height: 40, channels: 3, background: "#777" } })
          .gif()
          .toBuffer(),
      "anim.gif",
      "image/gif",
      "file-unsupported",
    ],
    ["a pixel bomb", async () => pixelBomb(), "huge.png", "image/png", "too-many-pixels"],
    [
      "an encrypted PDF",
      async () => encryptedPdf(),
      "locked.pdf",
      "application/pdf",
      "pdf-encrypted",
    ],
    // Half letter with bleed is 414 x 630 pt (5.75 x 8.75 in at 72 pt per inch).
    [
      "a two-page PDF",
      async () => makePdf([{ media: [414, 630] }, { media: [414, 630] }]),
      "two.pdf",
      "application/pdf",
      "pdf-page-count",
    ],
    [
      "a landscape page",
      async () => greyPage(2625, 1725),
      "sideways.png",
      "image/png",
      "wrong-orientation",
    ],
    ["a square page", async () => greyPage(1000, 1000), "square.png", "image/png", "wrong-aspect"],
  ];

  for (const [label, make, name, type, code] of cases) {
    it(`${label}: ${code}`, async () => {
      const pieceId = await makePiece(anthologyId, bea.id, { title: label });
      const result = await upload(pieceId, 1, await make(), name, type, 0);
      const v = await version(result.versionId);
      expect(codes(v.report)).toContain(code);
      expect(["blocker", "warning"]).toContain(v.verdict);
      expect(v.fileName).toBe(name);
      expect((await pageOf(pieceId)).currentVersionId).toBe(result.versionId);
      expect((await pieceRow(pieceId)).verdict).toBe(v.verdict);
    });
  }

  it("the pixel bomb is not decoded: no thumbnail, and the next upload is checked normally", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, { title: "After the bomb" });
    const bomb = await upload(pieceId, 1, pixelBomb(), "huge.png", "image/png", 0);
    expect((await version(bomb.versionId)).thumbnailWebp).toBeNull();
    const next = await upload(pieceId, 1, await greyPage(1725, 2625), "fine.png", "image/png", 1);
    expect(next).toMatchObject({ verdict: "pass", versionNumber: 2, current: true });
  });

  it("a PDF's first page is drawn as its preview, in the page's proportions", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, { title: "PDF page" });
    // Half letter plus 1/8 in bleed is 414 x 630 pt (5.75 x 8.75 in x 72); the lower half is inked.
    const doc = await PDFDocument.create();
    const page = doc.addPage([414, 630]);
    page.drawRectangle({ x: 0, y: 0, width: 414, height: 315, color: rgb(0, 0, 0) });
    page.setTrimBox(9, 9, 396, 612);
    const result = await upload(pieceId, 1, await doc.save(), "page.pdf", "application/pdf", 0);
    const v = await version(result.versionId);
    const image = sharp(v.thumbnailWebp!);
    const meta = await image.metadata();
    // 414 x 630 pt keeps its proportions at 480 px high: 315 px wide.
    expect([meta.width, meta.height]).toEqual([315, 480]);
    const { data, info } = await image.greyscale().raw().toBuffer({ resolveWithObject: true });
    const at = (x: number, y: number) => data[y * info.width + x]!;
    expect(at(157, 100)).toBeGreaterThan(200); // upper half: paper
    expect(at(157, 380)).toBeLessThan(50); // lower half: ink
  });

  it("a PDF that cannot be drawn still gets a page-shaped card with its size", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, { title: "Locked PDF" });
    const result = await upload(pieceId, 1, encryptedPdf(), "locked.pdf", "application/pdf", 0);
    const v = await version(result.versionId);
    expect(v.thumbnailWebp).not.toBeNull();
    const meta = await sharp(v.thumbnailWebp!).metadata();
    // 396 x 612 pt at 480 px high is 311 px wide.
    expect([meta.width, meta.height]).toEqual([311, 480]);
    expect(v.verdict).toBe("blocker");
  });
});

describe("versions, revisions and the piece", () => {
  it("replacing keeps every version; a stale revision is stored but does not become current", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, { title: "Three tries" });
    const first = await upload(pieceId, 1, await greyPage(1650, 2550), "a.png", "image/png", 0);
    const second = await upload(pieceId, 1, await greyPage(1725, 2625), "b.png", "image/png", 1);
    expect(second).toMatchObject({
      versionNumber: 2,
      current: true,
      revision: 2,
      pieceVerdict: "pass",
    });
    const stale = await upload(pieceId, 1, await greyPage(1650, 2550), "c.png", "image/png", 1);
    expect(stale).toMatchObject({ versionNumber: 3, current: false, revision: 2 });
    const page = await pageOf(pieceId);
    expect(page.currentVersionId).toBe(second.versionId);
    expect(page.revision).toBe(2);
    const all = await db
      .select()
      .from(schema.fileVersions)
      .where(eq(schema.fileVersions.piecePageId, page.id));
    expect(all.map((v) => v.versionNumber).sort()).toEqual([1, 2, 3]);
    expect(all.find((v) => v.id === first.versionId)?.verdict).toBe("blocker");
    expect((await pieceRow(pieceId)).verdict).toBe("pass");
  });

  it("a damaged file after a passing one is kept with its report, but the passing file stays current", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, { title: "Heron at dusk" });
    const good = await upload(pieceId, 1, await greyPage(1725, 2625), "heron.png", "image/png", 0);
    expect(good).toMatchObject({ verdict: "pass", current: true, revision: 1 });
    // The same PNG cut short after 3000 bytes: the checker cannot read its pixels.
    const cut = (await greyPage(1725, 2625)).subarray(0, 3000);
    const damaged = await upload(pieceId, 1, cut, "heron-v2.png", "image/png", 1);
    expect(damaged).toMatchObject({
      versionNumber: 2,
      verdict: "blocker",
      current: false,
      heldBack: "unreadable",
      pieceVerdict: "pass",
      // The page's current file did not change, so neither did its revision.
      revision: 1,
    });

    const page = await pageOf(pieceId);
    expect(page.currentVersionId).toBe(good.versionId);
    expect(page.revision).toBe(1);
    const stored = await db
      .select()
      .from(schema.fileVersions)
      .where(eq(schema.fileVersions.piecePageId, page.id));
    expect(stored.map((v) => v.versionNumber).sort()).toEqual([1, 2]);
    expect(codes(stored.find((v) => v.versionNumber === 2)!.report)).toContain("file-truncated");
    expect((await pieceRow(pieceId)).verdict).toBe("pass");

    const mail = await waitForMessage({
      to: bea.email,
      subject: /Spec check: "Heron at dusk", page 1: Won't print/,
    });
    expect(mail.text).toContain("This file could not be read, so your earlier file stays in use.");

    // Nor can it be chosen by hand over the readable file.
    await expect(
      useVersion(
        pieceId,
        bea.id,
        { pageIndex: 1, versionId: damaged.versionId, expectedRevision: 1 },
        () => true,
      ),
    ).rejects.toMatchObject({ status: 409 });
    expect((await pageOf(pieceId)).currentVersionId).toBe(good.versionId);

    // A readable file after it takes the page as usual, on the revision the page still has.
    const fixed = await upload(
      pieceId,
      1,
      await greyPage(1650, 2550),
      "heron-v3.png",
      "image/png",
      1,
    );
    expect(fixed).toMatchObject({ versionNumber: 3, current: true, revision: 2 });
    expect((await pieceRow(pieceId)).verdict).toBe("blocker");
  });

  it("an unreadable file does not answer a fix request; on an empty page it is shown", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, { title: "Fix pending", kind: "spread" });
    const left = await upload(pieceId, 1, await greyPage(1725, 2625), "left.png", "image/png", 0);
    await db
      .update(schema.pieces)
      .set({ status: "fix-requested" })
      .where(eq(schema.pieces.id, pieceId));
    const locked = await upload(pieceId, 1, encryptedPdf(), "left.pdf", "application/pdf", 1);
    expect(locked).toMatchObject({ current: false, heldBack: "unreadable" });
    expect((await pieceRow(pieceId)).status).toBe("fix-requested");
    expect((await pageOf(pieceId, 1)).currentVersionId).toBe(left.versionId);
    // The right page has no file yet: the unreadable one is shown, so its report is in view.
    const empty = await upload(pieceId, 2, new Uint8Array(0), "right.png", "image/png", 0);
    expect(empty).toMatchObject({ current: true, heldBack: null });
    expect((await pieceRow(pieceId)).verdict).toBe("blocker");
  });

  it("two concurrent uploads for the same page leave one current version and store both", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, { title: "Two tabs" });
    const [a, b] = await Promise.all([
      storeFile(await greyPage(1725, 2625), "tab-a.png", "image/png"),
      storeFile(await greyPage(1650, 2550), "tab-b.png", "image/png"),
    ]);
    const results: IngestResult[] = await Promise.all(
      [a, b].map((file) =>
        ingestUpload(
          { pieceId, pageIndex: 1, expectedRevision: 0, uploadedBy: bea.id, file },
          { notify: false },
        ),
      ),
    );
    expect(results.filter((r) => r.current)).toHaveLength(1);
    expect(new Set(results.map((r) => r.versionNumber))).toEqual(new Set([1, 2]));
    const page = await pageOf(pieceId);
    expect(page.revision).toBe(1);
    const winner = results.find((r) => r.current)!;
    expect(page.currentVersionId).toBe(winner.versionId);
    expect((await pieceRow(pieceId)).verdict).toBe(winner.verdict);
    const stored = await db
      .select()
      .from(schema.fileVersions)
      .where(eq(schema.fileVersions.piecePageId, page.id));
    expect(stored).toHaveLength(2);
  });

  it("the same stored file reported twice makes one version", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, { title: "Echo" });
    const file = await storeFile(await greyPage(1725, 2625), "echo.png", "image/png");
    const request = { pieceId, pageIndex: 1, expectedRevision: 0, uploadedBy: bea.id, file };
    const first = await ingestUpload(request, { notify: false });
    const again = await ingestUpload(request, { notify: false });
    expect(again.versionId).toBe(first.versionId);
    expect(
      await db
        .select()
        .from(schema.fileVersions)
        .where(eq(schema.fileVersions.piecePageId, (await pageOf(pieceId)).id)),
    ).toHaveLength(1);
  });

  it("a spread is 'missing' until both pages have files, then takes the worst page", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, { title: "Spread", kind: "spread" });
    const left = await upload(pieceId, 1, await greyPage(1725, 2625), "left.png", "image/png", 0);
    expect(left.pieceVerdict).toBe("missing");
    const right = await upload(pieceId, 2, await greyPage(1650, 2550), "right.png", "image/png", 0);
    expect(right.pieceVerdict).toBe("blocker");
  });

  it("a new file answers a fix request: the piece goes back to be read, and the move is logged", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, {
      title: "Fixed",
      status: "fix-requested",
    });
    const result = await upload(
      pieceId,
      1,
      await greyPage(1725, 2625),
      "fixed.png",
      "image/png",
      0,
    );
    expect(result.status).toBe("awaiting-review");
    const events = await db
      .select()
      .from(schema.pieceEvents)
      .where(eq(schema.pieceEvents.pieceId, pieceId));
    expect(events.map((e) => [e.fromStatus, e.toStatus])).toContainEqual([
      "fix-requested",
      "awaiting-review",
    ]);
  });
});

describe("refusals", () => {
  const refusal = async (work: Promise<unknown>) => {
    try {
      await work;
    } catch (error) {
      if (error instanceof Refusal) return { status: error.status, message: error.message };
      throw error;
    }
    throw new Error("expected a refusal");
  };
  const one = [{ name: "page.png", size: 1000 }];

  it("the upload check refuses someone else's piece, a missing page, a stale revision and an oversized file", async () => {
    const pieceId = await makePiece(anthologyId, bea.id, { title: "Mine" });
    expect(
      await refusal(
        authoriseArtworkUpload(tomasz.id, { pieceId, pageIndex: 1, expectedRevision: 0 }, one),
      ),
    ).toMatchObject({ status: 403 });
    expect(
      await refusal(
        authoriseArtworkUpload(null, { pieceId, pageIndex: 1, expectedRevision: 0 }, one),
      ),
    ).toMatchObject({ status: 403 });
    expect(
      await refusal(
        authoriseArtworkUpload(bea.id, { pieceId, pageIndex: 2, expectedRevision: 0 }, one),
      ),
    ).toMatchObject({ status: 404 });
    expect(
      await refusal(
        authoriseArtworkUpload(bea.id, { pieceId, pageIndex: 1, expectedRevision: 3 }, one),
      ),
    ).toMatchObject({ status: 409 });
    const big = await refusal(
      authoriseArtworkUpload(bea.id, { pieceId, pageIndex: 1, expectedRevision: 0 }, [
        { name: "big.tif", size: 500 * 1024 * 1024 },
      ]),
    );
    expect(big.status).toBe(413);
    expect(big.message).toMatch(/"big\.tif" is 500\.0 MB; a page file may be at most \d+ MB/);
    await expect(
      authoriseArtworkUpload(bea.id, { pieceId, pageIndex: 1, expectedRevision: 0 }, one),
    ).resolves.toMatchObject({ pieceId, userId: bea.id });
  });

  it("after the call closes only a piece with a fix asked for takes files", async () => {
    const waiting = await makePiece(closedAnthologyId, bea.id, { title: "Late" });
    const fix = await makePiece(closedAnthologyId, bea.id, {
      title: "Fix me",
      status: "fix-requested",
    });
    const closed = await refusal(
      authoriseArtworkUpload(bea.id, { pieceId: waiting, pageIndex: 1, expectedRevision: 0 }, one),
    );
    expect(closed).toMatchObject({ status: 409 });
    expect(closed.message).toContain("The call has closed");
    await expect(
      authoriseArtworkUpload(bea.id, { pieceId: fix, pageIndex: 1, expectedRevision: 0 }, one),
    ).resolves.toBeTruthy();
    // The pipeline checks again when the file lands, and nothing is recorded on refusal.
    expect(
      await refusal(upload(waiting, 1, await greyPage(1725, 2625), "late.png", "image/png", 0)),
    ).toMatchObject({ status: 409 });
    expect((await pageOf(waiting)).currentVersionId).toBeNull();
    await expect(
      upload(fix, 1, await greyPage(1725, 2625), "fix.png", "image/png", 0),
    ).resolves.toMatchObject({ verdict: "pass" });
  });

  it("a withdrawn piece takes no files, and nobody may ingest into someone else's piece", async () => {
    const withdrawn = await makePiece(anthologyId, bea.id, { title: "Gone", status: "withdrawn" });
    expect(
      await refusal(
        authoriseArtworkUpload(
          bea.id,
          { pieceId: withdrawn, pageIndex: 1, expectedRevision: 0 },
          one,
        ),
      ),
    ).toMatchObject({ status: 409 });
    expect(
      await refusal(upload(withdrawn, 1, await greyPage(1725, 2625), "gone.png", "image/png", 0)),
    ).toMatchObject({ status: 409 });
    const beas = await makePiece(anthologyId, bea.id, { title: "Not Tomasz's" });
    expect(
      await refusal(upload(beas, 1, await greyPage(1725, 2625), "x.png", "image/png", 0, tomasz)),
    ).toMatchObject({ status: 403 });
  });
});
