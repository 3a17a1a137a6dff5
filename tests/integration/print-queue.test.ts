// The print queue end to end against the real MariaDB, the upload fake, the private Redis and the
// print worker the launcher runs: produce through the route, the worker makes the PDFs, the rows
// say done, the files come back from the upload fake and poppler's pdfinfo counts their pages.
// Then the failures: a file that went bad, the map changing while producing, a file missing from
// the host; each leaves the last good outputs listed and downloadable.
import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { and, eq, inArray } from "drizzle-orm";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { assertTestDatabase } from "../helpers/env";
import {
  makeAnthologyWithCall,
  makePerson,
  makePiece,
  type TestPerson,
} from "../helpers/submissions";

const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/auth", () => ({
  auth: vi.fn(async () =>
    session.userId ? { user: { id: session.userId, name: "Test person", email: null } } : null,
  ),
}));

const { db, pool, schema } = await import("@/db");
const filesRoute = await import("@/app/api/anthologies/[slug]/print-files/route");
const downloadRoute = await import("@/app/api/print-files/[id]/download/route");
const { ingestUpload } = await import("@/server/submissions/ingest");
const { storeFile, deleteStoredFiles } = await import("@/server/uploads");
const { changeMap } = await import("@/db/queries/page-map");
const { createOutputs, findOutput } = await import("@/db/queries/print-files");
const { produceOutput, MAP_CHANGED } = await import("@/server/print/produce");
const { printQueue } = await import("@/server/print/queue");

assertTestDatabase(process.env.DATABASE_URL);

let lead: TestPerson;
let editor: TestPerson;
let finisher: TestPerson;
let contributor: TestPerson;
let anthology: Awaited<ReturnType<typeof makeAnthologyWithCall>>;
const pieceIds: Record<string, number> = {};
const anthologyIds: number[] = [];
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "quireline-print-"));

const as = (who: TestPerson | null) => {
  session.userId = who?.id ?? null;
};

function post(slug: string, body: unknown) {
  return filesRoute.POST(
    new Request(`http://localhost/api/anthologies/${slug}/print-files`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify(body),
    }),
    { params: Promise.resolve({ slug }) },
  );
}
function list(slug: string) {
  return filesRoute.GET(new Request(`http://localhost/api/anthologies/${slug}/print-files`), {
    params: Promise.resolve({ slug }),
  });
}
function download(id: number) {
  return downloadRoute.GET(new Request(`http://localhost/api/print-files/${id}/download`), {
    params: Promise.resolve({ id: String(id) }),
  });
}

/** Waits for the worker to finish an output (done or failed). */
async function settled(id: number, timeoutMs = 60_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const row = await findOutput(id);
    if (row && (row.state === "done" || row.state === "failed")) return row;
    if (Date.now() > until)
      throw new Error(`output ${id} still ${row?.state} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** pdfinfo's page count of a PDF (poppler, an independent reader). */
function pdfPages(bytes: Uint8Array, name: string): number {
  const file = path.join(tmp, name);
  fs.writeFileSync(file, bytes);
  const info = execFileSync("pdfinfo", [file], { encoding: "utf8" });
  const pages = /^Pages:\s+(\d+)/m.exec(info)?.[1];
  if (!pages) throw new Error(`pdfinfo gave no page count:\n${info}`);
  return Number(pages);
}

// Half letter with 1/8 in bleed is 5.75 x 8.75 in; at 72 ppi that is 414 x 630 px (pixels =
// inches x ppi). The test anthology asks for 72 ppi so the files stay small.
const W = 414;
const H = 630;
const grey = (level: number) =>
  sharp({
    create: { width: W, height: H, channels: 3, background: { r: level, g: level, b: level } },
  })
    .toColourspace("b-w")
    .withDensity(72);

async function upload(
  pieceId: number,
  pageIndex: number,
  bytes: Buffer,
  name: string,
  type: string,
) {
  const file = await storeFile(bytes, name, type);
  const [page] = await db
    .select({ revision: schema.piecePages.revision })
    .from(schema.piecePages)
    .where(and(eq(schema.piecePages.pieceId, pieceId), eq(schema.piecePages.pageIndex, pageIndex)));
  const result = await ingestUpload(
    { pieceId, pageIndex, expectedRevision: page!.revision, uploadedBy: contributor.id, file },
    { notify: false, enforceWindow: false, bytes },
  );
  expect(result.current).toBe(true);
  return result;
}

async function currentFile(pieceId: number, pageIndex: number) {
  const [row] = await db
    .select({ id: schema.fileVersions.id, key: schema.fileVersions.storageKey })
    .from(schema.piecePages)
    .innerJoin(schema.fileVersions, eq(schema.fileVersions.id, schema.piecePages.currentVersionId))
    .where(and(eq(schema.piecePages.pieceId, pieceId), eq(schema.piecePages.pageIndex, pageIndex)));
  return row!;
}

async function mapVersion() {
  const [row] = await db
    .select({ v: schema.anthologies.mapVersion })
    .from(schema.anthologies)
    .where(eq(schema.anthologies.id, anthology.id));
  return row!.v;
}

beforeAll(async () => {
  [lead, editor, finisher, contributor] = await Promise.all([
    makePerson("print-lead"),
    makePerson("print-editor"),
    makePerson("print-finisher"),
    makePerson("print-contributor"),
  ]);
  anthology = await makeAnthologyWithCall([
    { person: lead, role: "lead" },
    { person: editor, role: "editor" },
    { person: finisher, role: "finisher" },
    { person: contributor, role: "contributor" },
  ]);
  anthologyIds.push(anthology.id);
  await db
    .update(schema.anthologies)
    // A laser press takes one composite print file; the duplicator's masters are tested below.
    .set({ minPpi: 72, coverStock: "separate", coverPaperGsm: 216, printMethod: "laser-black" })
    .where(eq(schema.anthologies.id, anthology.id));
  anthology = {
    ...anthology,
    minPpi: 72,
    coverStock: "separate",
    coverPaperGsm: 216,
    printMethod: "laser-black",
  };

  pieceIds.heron = await makePiece(anthology.id, contributor.id, { title: "What the Heron Kept" });
  pieceIds.gull = await makePiece(anthology.id, contributor.id, { title: "Gull Weather" });
  pieceIds.tide = await makePiece(anthology.id, contributor.id, {
    title: "Tide Table",
    kind: "spread",
  });
  // An 8-bit PNG, a JPEG, and for the spread a 16-bit PNG and a TIFF (both converted once to PNG).
  await upload(pieceIds.heron, 1, await grey(90).png().toBuffer(), "heron.png", "image/png");
  await upload(pieceIds.gull, 1, await grey(150).jpeg().toBuffer(), "gull.jpg", "image/jpeg");
  await upload(
    pieceIds.tide,
    1,
    await grey(60).toColourspace("grey16").png().toBuffer(),
    "tide-left.png",
    "image/png",
  );
  await upload(pieceIds.tide, 2, await grey(200).tiff().toBuffer(), "tide-right.tif", "image/tiff");
  await db
    .update(schema.pieces)
    .set({ status: "accepted", creditApprovedAt: new Date() })
    .where(inArray(schema.pieces.id, Object.values(pieceIds)));

  // Eight pages: covers kept blank on purpose, Heron on 2, Gull on 3, the spread on the centre
  // pages 4 and 5 (an 8-page saddle stitch's centre spread, REFERENCE.md §6.3), 6–8 blank.
  const onPage: Record<number, [number, number]> = {
    2: [pieceIds.heron, 1],
    3: [pieceIds.gull, 1],
    4: [pieceIds.tide, 1],
    5: [pieceIds.tide, 2],
  };
  await db.insert(schema.pageSlots).values(
    Array.from({ length: 8 }, (_, i) => {
      const placed = onPage[i + 1];
      return {
        anthologyId: anthology.id,
        pageNumber: i + 1,
        reservation: placed ? null : ("blank" as const),
        pieceId: placed?.[0] ?? null,
        piecePageIndex: placed?.[1] ?? null,
        locked: false,
      };
    }),
  );
}, 120_000);

afterAll(async () => {
  if (anthologyIds.length)
    await db.delete(schema.anthologies).where(inArray(schema.anthologies.id, anthologyIds));
  await printQueue().close();
  await pool.end();
  fs.rmSync(tmp, { recursive: true, force: true });
});

let good: { print: number; proof: number };

describe("producing print files", () => {
  it("queues a print file and a proof; the worker makes them; they download as PDFs pdfinfo reads", async () => {
    as(editor);
    const res = await post(anthology.slug, { sheet: "letter" });
    expect(res.status).toBe(202);
    const body = (await res.json()) as { outputs: { id: number; kind: string; state: string }[] };
    expect(body.outputs.map((o) => o.kind).sort()).toEqual(["print", "proof"]);
    const print = body.outputs.find((o) => o.kind === "print")!;
    const proof = body.outputs.find((o) => o.kind === "proof")!;

    const printRow = await settled(print.id);
    expect(printRow.error).toBeNull();
    expect(printRow).toMatchObject({
      state: "done",
      pagesDone: 8,
      pagesTotal: 8,
      sheetName: "Letter (8.5 x 11 in)",
    });
    expect(printRow.jobId).toBe(`output-${print.id}`);
    expect(printRow.finishedAt).toBeInstanceOf(Date);
    const proofRow = await settled(proof.id);
    expect(proofRow.state).toBe("done");

    // 8 pages saddle-stitched: 2 sheets, 4 sides (8 ÷ 4 sheets, REFERENCE.md §6.3).
    const printRes = await download(print.id);
    expect(printRes.status).toBe(200);
    expect(printRes.headers.get("content-disposition")).toContain(
      `filename="${printRow.fileName}"`,
    );
    const printBytes = new Uint8Array(await printRes.arrayBuffer());
    expect(printBytes.byteLength).toBe(printRow.sizeBytes);
    expect(pdfPages(printBytes, "print.pdf")).toBe(4);
    expect(printRow.pageCount).toBe(4);
    // Reader spreads of 8 pages: 1 | 2–3 | 4–5 | 6–7 | 8 (CSS Paged Media, facing pages).
    const proofBytes = new Uint8Array(await (await download(proof.id)).arrayBuffer());
    expect(pdfPages(proofBytes, "proof.pdf")).toBe(5);

    good = { print: print.id, proof: proof.id };
  }, 120_000);

  it("a finisher may list and download but not produce; a contributor may do neither", async () => {
    as(finisher);
    const listed = await list(anthology.slug);
    expect(listed.status).toBe(200);
    const view = (await listed.json()) as { canProduce: boolean; outputs: { id: number }[] };
    expect(view.canProduce).toBe(false);
    expect(view.outputs.map((o) => o.id)).toContain(good.print);
    expect((await download(good.print)).status).toBe(200);
    expect((await post(anthology.slug, { sheet: "letter" })).status).toBe(403);
    as(contributor);
    expect((await list(anthology.slug)).status).toBe(403);
    expect((await download(good.print)).status).toBe(403);
    as(null);
    expect((await download(good.print)).status).toBe(401);
  });

  it("refuses a sheet that does not suit the trim with 400, naming the ones that do", async () => {
    as(editor);
    // A4 is 210 mm across; two half-letter pages stand 215.9 mm tall (ISO 216, ANSI sizes).
    const res = await post(anthology.slug, { sheet: "a4" });
    expect(res.status).toBe(400);
    const body = (await res.json()) as { error: string; fields: Record<string, string[]> };
    expect(body.fields.sheet?.[0]).toContain("use Letter (8.5 x 11 in)");
  });

  it("refuses with 409 and the preflight while a piece is not placed", async () => {
    const waiting = await makePiece(anthology.id, contributor.id, {
      title: "Sandpiper Ledger",
      status: "accepted",
    });
    as(editor);
    const res = await post(anthology.slug, { sheet: "letter" });
    expect(res.status).toBe(409);
    const body = (await res.json()) as {
      preflight: { code: string; severity: string; message: string }[];
    };
    expect(body.preflight).toContainEqual(
      expect.objectContaining({ code: "pieces-not-placed", severity: "blocker" }),
    );
    expect(body.preflight.find((e) => e.code === "pieces-not-placed")!.message).toContain(
      "“Sandpiper Ledger”",
    );
    await db.update(schema.pieces).set({ leftOut: true }).where(eq(schema.pieces.id, waiting));
  });

  it("a page whose stored file went bad fails naming the page and the piece; the last good files stay", async () => {
    const gull = await currentFile(pieceIds.gull!, 1);
    const junk = await storeFile(
      Buffer.from("this is not an image at all"),
      "gull.jpg",
      "image/jpeg",
    );
    await db
      .update(schema.fileVersions)
      .set({ storageKey: junk.key })
      .where(eq(schema.fileVersions.id, gull.id));
    try {
      as(editor);
      const res = await post(anthology.slug, { sheet: "tabloid" });
      expect(res.status).toBe(202);
      const { outputs } = (await res.json()) as { outputs: { id: number; kind: string }[] };
      const failed = await settled(outputs.find((o) => o.kind === "print")!.id);
      expect(failed.state).toBe("failed");
      expect(failed.error).toMatch(
        /^page 3: the file of “Gull Weather” \(gull\.jpg\) could not be read/,
      );
      expect(failed.storageKey).toBeNull();
      await settled(outputs.find((o) => o.kind === "proof")!.id);
    } finally {
      await db
        .update(schema.fileVersions)
        .set({ storageKey: gull.key })
        .where(eq(schema.fileVersions.id, gull.id));
    }
    const kept = await findOutput(good.print);
    expect(kept).toMatchObject({ state: "done", staleAt: null });
    expect((await download(good.print)).status).toBe(200);
  }, 120_000);

  it("fails when the map changes while producing; the last good files stay listed, now stale", async () => {
    const version = await mapVersion();
    const [id] = await createOutputs(anthology.id, editor.id, [
      { kind: "proof", ink: null, mapVersion: version, sheet: null, pagesTotal: 8 },
    ]);
    let changed = false;
    const result = await produceOutput(id!, {
      onProgress: async () => {
        if (changed) return;
        changed = true;
        const outcome = await changeMap(
          anthology,
          { id: editor.id, name: editor.name, email: editor.email },
          { version, change: { op: "lock", page: 8, locked: true } },
          { mayShowEmail: true },
        );
        expect(outcome.kind).toBe("saved");
      },
    });
    expect(result).toBe("failed");
    expect((await findOutput(id!))!.error).toBe(MAP_CHANGED);
    const kept = await findOutput(good.print);
    expect(kept!.state).toBe("done");
    expect(kept!.staleAt).toBeInstanceOf(Date);
    as(editor);
    const view = (await (await list(anthology.slug)).json()) as {
      outputs: { id: number; staleAt: string | null; downloadUrl: string | null }[];
    };
    const listed = view.outputs.find((o) => o.id === good.print)!;
    expect(listed.staleAt).not.toBeNull();
    expect(listed.downloadUrl).toBe(`/api/print-files/${good.print}/download`);
  }, 120_000);

  it("a file missing from the host fails naming the page and the piece; a new file marks finished outputs stale", async () => {
    // Fresh outputs first, to see the new upload mark them stale at the end.
    as(editor);
    const first = (await (await post(anthology.slug, { sheet: "letter" })).json()) as {
      outputs: { id: number; kind: string }[];
    };
    const fresh = await settled(first.outputs.find((o) => o.kind === "print")!.id);
    expect(fresh.error).toBeNull();
    expect(fresh).toMatchObject({ state: "done", staleAt: null });
    await settled(first.outputs.find((o) => o.kind === "proof")!.id);

    const heron = await currentFile(pieceIds.heron!, 1);
    await deleteStoredFiles([heron.key]);
    const res = await post(anthology.slug, { sheet: "letter" });
    expect(res.status).toBe(202);
    const { outputs } = (await res.json()) as { outputs: { id: number; kind: string }[] };
    for (const o of outputs) {
      const row = await settled(o.id);
      expect(row.state).toBe("failed");
      expect(row.error).toMatch(
        /^page 2: the file of “What the Heron Kept” is missing from storage/,
      );
    }
    expect((await findOutput(fresh.id))!.state).toBe("done");
    expect((await download(fresh.id)).status).toBe(200);

    await upload(pieceIds.heron!, 1, await grey(100).png().toBuffer(), "heron-2.png", "image/png");
    expect((await findOutput(fresh.id))!.staleAt).toBeInstanceOf(Date);
  }, 120_000);
});

describe("masters for a two-ink duplicator booklet", () => {
  it("makes one PDF per ink with one master per side that carries the ink, as the passes count", async () => {
    const dup = await makeAnthologyWithCall([
      { person: lead, role: "lead" },
      { person: contributor, role: "contributor" },
    ]);
    anthologyIds.push(dup.id);
    await db
      .update(schema.anthologies)
      .set({ minPpi: 72, printMethod: "duplicator", inks: ["black", "teal"], inksPerPass: 1 })
      .where(eq(schema.anthologies.id, dup.id));
    const mono = await makePiece(dup.id, contributor.id, { title: "Mud Script" });
    const duo = await makePiece(dup.id, contributor.id, {
      title: "Teal Ledger",
      inks: ["black", "teal"],
    });
    await upload(mono, 1, await grey(80).png().toBuffer(), "mud.png", "image/png");
    for (const ink of ["black", "teal"]) {
      const bytes = await grey(ink === "black" ? 40 : 160)
        .png()
        .toBuffer();
      const file = await storeFile(bytes, `ledger-${ink}.png`, "image/png");
      const result = await ingestUpload(
        {
          pieceId: duo,
          pageIndex: 1,
          ink,
          expectedRevision: null,
          uploadedBy: contributor.id,
          file,
        },
        { notify: false, enforceWindow: false, bytes },
      );
      expect(result.current).toBe(true);
    }
    await db
      .update(schema.pieces)
      .set({ status: "accepted", creditApprovedAt: new Date() })
      .where(inArray(schema.pieces.id, [mono, duo]));
    // Eight pages: Mud Script (black) on 2, Teal Ledger (black + teal) on 6; the rest blank.
    // Saddle stitch of 8 (REFERENCE.md §6.3): sheet 1 back holds 2|7, sheet 2 front holds 6|3.
    await db.insert(schema.pageSlots).values(
      Array.from({ length: 8 }, (_, i) => {
        const piece = i + 1 === 2 ? mono : i + 1 === 6 ? duo : null;
        return {
          anthologyId: dup.id,
          pageNumber: i + 1,
          reservation: piece ? null : ("blank" as const),
          pieceId: piece,
          piecePageIndex: piece ? 1 : null,
          locked: false,
        };
      }),
    );

    as(lead);
    const res = await post(dup.slug, { sheet: "tabloid" });
    expect(res.status).toBe(202);
    const { outputs } = (await res.json()) as {
      outputs: { id: number; kind: string; ink: string | null }[];
    };
    expect(outputs.map((o) => `${o.kind}:${o.ink ?? ""}`).sort()).toEqual([
      "master:black",
      "master:teal",
      "proof:",
    ]);
    const pages: Record<string, number> = {};
    for (const o of outputs.filter((x) => x.kind === "master")) {
      const row = await settled(o.id);
      expect(row.error).toBeNull();
      expect(row.state).toBe("done");
      const bytes = new Uint8Array(await (await download(o.id)).arrayBuffer());
      pages[o.ink!] = pdfPages(bytes, `master-${o.ink}.pdf`);
      // The slug line names the ink of every master.
      const file = path.join(tmp, `master-${o.ink}.pdf`);
      const text = execFileSync("pdftotext", ["-layout", file, "-"], { encoding: "utf8" });
      expect(text).toContain(o.ink!);
    }
    // Black is on sheet 1 back (page 2) and sheet 2 front (page 6); teal only on sheet 2 front.
    expect(pages).toEqual({ black: 2, teal: 1 });
    const proof = await settled(outputs.find((o) => o.kind === "proof")!.id);
    expect(proof.state).toBe("done");

    // The passes the map counts for one copy are exactly the masters made.
    const { readMapState } = await import("@/db/queries/page-map");
    const { countPasses } = await import("@/lib/map/passes");
    const [row] = await db
      .select()
      .from(schema.anthologies)
      .where(eq(schema.anthologies.id, dup.id));
    const { state } = await readMapState(row!);
    expect(countPasses(state, 1).passesPerCopy).toBe(pages.black! + pages.teal!);
  }, 180_000);
});
