import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { emptyMap } from "@/lib/map/state";
import type { MapPiece, MapState } from "@/lib/map/types";
import { checkArtwork } from "@/lib/print/check";
import {
  analyseSpecChange,
  checkedSpecChanged,
  failsAfterChange,
  keepUnchangedLengths,
  type AnthologySpec,
  type CurrentFile,
  type SpecChangeInput,
} from "@/lib/print/spec-change";
import { specOf } from "@/lib/print/spec";
import { inToMm } from "@/lib/print/units";
import { makePdf } from "./fixtures";

/** A half-letter booklet (5.5 x 8.5 in, 1/8 in bleed, 1/4 in safe margin) on a two-drum duplicator. */
const halfLetter: AnthologySpec = {
  trimPreset: "half-letter",
  trimWidthMm: inToMm(5.5),
  trimHeightMm: inToMm(8.5),
  bleedMm: inToMm(0.125),
  safeMarginMm: inToMm(0.25),
  minPpi: 300,
  printMethod: "duplicator",
  inks: ["black", "teal"],
  inksPerPass: 1,
  binding: "saddle-stitch",
  pageCountTarget: 16,
  maxPages: 32,
  paperGsm: 90,
  paperCaliperMm: 0.11,
  coverStock: "self",
  coverPaperGsm: null,
};
// ISO 216: A5 = 148 x 210 mm; 3 mm bleed and 5 mm safe margin (common practice, no source).
const a5: AnthologySpec = {
  ...halfLetter,
  trimPreset: "a5",
  trimWidthMm: 148,
  trimHeightMm: 210,
  bleedMm: 3,
  safeMarginMm: 5,
};

/** A flat page of this many pixels at 300 ppi, checked the way an upload is (half letter unless `checkedAt`). */
async function greyFile(
  widthPx: number,
  heightPx: number,
  fields: Partial<CurrentFile> = {},
  { colour = false, checkedAt = halfLetter }: { colour?: boolean; checkedAt?: AnthologySpec } = {},
): Promise<CurrentFile> {
  const base = sharp({
    create: { width: widthPx, height: heightPx, channels: 3, background: colour ? "#3a7" : "#888" },
  });
  const bytes = await (colour ? base : base.toColourspace("b-w")).withDensity(300).png().toBuffer();
  const pieceInks = fields.pieceInks ?? ["black"];
  const report = await checkArtwork(
    bytes,
    specOf(checkedAt, { pagesExpected: 1, inks: pieceInks }),
    {
      filename: "page.png",
      edgeAnalysis: false,
    },
  );
  return {
    versionId: 1,
    pieceId: 7,
    pieceTitle: "Heron Bend",
    pageIndex: 1,
    fileName: "heron-bend.png",
    pieceInks,
    report,
    ...fields,
  };
}

const piece = (id: number, title: string, inks: string[]): MapPiece => ({
  id,
  title,
  kind: "single",
  pageCount: 1,
  inks,
});

/** A 16-page saddle-stitched map with covers kept on 1 and 16 and `placed` pieces on their pages. */
function mapWith(placed: [MapPiece, number][], spec: AnthologySpec = halfLetter): MapState {
  const map = emptyMap({
    binding: spec.binding,
    pageCount: 16,
    maxPages: spec.maxPages,
    inksPerPass: spec.inksPerPass,
    pressInks: spec.inks,
    pieces: placed.map(([p]) => p),
  });
  for (const slot of map.slots) if (slot.page === 1 || slot.page === 16) slot.reservation = "cover";
  for (const [p, page] of placed) {
    const slot = map.slots.find((s) => s.page === page)!;
    slot.pieceId = p.id;
    slot.piecePageIndex = 1;
  }
  return map;
}

const change = (input: Partial<SpecChangeInput> & Pick<SpecChangeInput, "after">) =>
  analyseSpecChange({ before: halfLetter, map: null, files: [], callInks: null, ...input });
const codes = (r: ReturnType<typeof analyseSpecChange>) => r.impacts.map((i) => i.code);

describe("what counts as a change", () => {
  it("an inch length read back in millimetres is the same length", () => {
    // 1/8 in = 3.175 mm exactly (25.4 mm per inch, NIST SP 811), whatever the float rounding.
    const retyped = { ...halfLetter, bleedMm: 0.125 * 25.4 + 1e-9, safeMarginMm: 6.35 - 1e-9 };
    expect(keepUnchangedLengths(halfLetter, retyped).bleedMm).toBe(halfLetter.bleedMm);
    expect(checkedSpecChanged(halfLetter, retyped)).toBe(false);
    expect(change({ after: retyped })).toMatchObject({ impacts: [], recheck: false });
  });

  it("paper and cover change nothing the file check reads; trim, bleed, ppi, method and inks do", () => {
    expect(checkedSpecChanged(halfLetter, { ...halfLetter, paperGsm: 120 })).toBe(false);
    expect(checkedSpecChanged(halfLetter, { ...halfLetter, coverStock: "separate" })).toBe(false);
    expect(checkedSpecChanged(halfLetter, a5)).toBe(true);
    expect(checkedSpecChanged(halfLetter, { ...halfLetter, minPpi: 600 })).toBe(true);
    expect(checkedSpecChanged(halfLetter, { ...halfLetter, printMethod: "inkjet" })).toBe(true);
    expect(checkedSpecChanged(halfLetter, { ...halfLetter, inks: ["teal", "black"] })).toBe(true);
    // Only the spelling's case: the same inks.
    expect(checkedSpecChanged(halfLetter, { ...halfLetter, inks: ["Black", "Teal"] })).toBe(false);
  });
});

describe("files that meet the spec now and would not after the change", () => {
  // Half letter + 1/8 in bleed = 5.75 x 8.75 in; at 300 ppi that is 1725 x 2625 px.
  it("a half-letter page at 300 ppi passes, and at A5 it would be cut", async () => {
    const file = await greyFile(1725, 2625);
    expect(file.report.verdict).toBe("pass");
    // A5 + 3 mm bleed = 154 x 216 mm. Scaled to cover its width the page prints
    // 2625 x 154 / 1725 = 234.3 mm tall: 18.3 mm cut off, 9.2 mm a side, past the 5 mm margin.
    const reason = failsAfterChange(a5, file);
    expect(reason).toContain("154 x 216 mm with bleed");
    expect(reason).toContain("18.3 mm off its height");
    const result = change({ after: a5, files: [file] });
    expect(result).toMatchObject({ refused: false, needsConfirmation: true, recheck: true });
    const warning = result.impacts.find((i) => i.code === "files-will-fail");
    expect(warning).toMatchObject({ severity: "warning", pieceIds: [7] });
    expect(warning?.message).toContain("“Heron Bend”, page 1 (heron-bend.png)");
    expect(codes(result)).toContain("files-checked-again");
  });

  it("3 mm bleed in place of 1/8 in (3.175 mm) leaves the same file passing", async () => {
    const file = await greyFile(1725, 2625);
    const result = change({ after: { ...halfLetter, bleedMm: 3 }, files: [file] });
    expect(codes(result)).toEqual(["files-checked-again"]);
    expect(result).toMatchObject({ needsConfirmation: false, recheck: true });
  });

  it("doubling the resolution asked for fails a 300 ppi page", async () => {
    // The check fails a file under 0.75 of the asked ppi: 1.5 x screen ruling is the accepted
    // minimum against the usual 2 x (300 ppi for a 150 lpi screen); common practice, no source.
    const file = await greyFile(1725, 2625);
    expect(failsAfterChange({ ...halfLetter, minPpi: 600 }, file)).toContain(
      "300 ppi, well under the 600 ppi asked",
    );
    // 400 ppi asked: 300 is exactly 0.75 of it, a warning in the check, not a failure.
    expect(failsAfterChange({ ...halfLetter, minPpi: 400 }, file)).toBeNull();
  });

  it("a colour file would fail once the press is a two-ink duplicator", async () => {
    const laser = { ...halfLetter, printMethod: "laser-colour" as const };
    // The piece takes the anthology's inks (black and teal).
    const file = await greyFile(1725, 2625, { pieceInks: [] }, { colour: true, checkedAt: laser });
    expect(file.report.verdict).not.toBe("blocker");
    expect(failsAfterChange(laser, file)).toBeNull();
    expect(failsAfterChange(halfLetter, file)).toContain("one greyscale file per ink");
  });

  it("a PDF whose trim is half letter would not fit A5", async () => {
    // Half letter with 1/8 in bleed is 414 x 630 pt (5.75 x 8.75 in at 72 pt per inch, ISO 32000).
    const bytes = await makePdf([{ media: [414, 630], trim: [9, 9, 396, 612] }]);
    const report = await checkArtwork(bytes, specOf(halfLetter, { pagesExpected: 1 }));
    expect(report.verdict).not.toBe("blocker");
    const file: CurrentFile = { ...(await greyFile(10, 10)), fileName: "page.pdf", report };
    // 396 x 612 pt = 139.7 x 215.9 mm.
    expect(failsAfterChange(a5, file)).toBe(
      "its trim is 139.7 x 215.9 mm and the new trim is 148 x 210 mm",
    );
    expect(failsAfterChange({ ...halfLetter, bleedMm: 3 }, file)).toBeNull();
  });

  it("files that fail already, or could not be read, are not predicted", async () => {
    const sideways = await greyFile(2625, 1725);
    expect(sideways.report.verdict).toBe("blocker");
    expect(failsAfterChange(a5, sideways)).toBeNull();
    const cut = await greyFile(1725, 2625);
    cut.report = {
      ...cut.report,
      findings: [{ code: "file-truncated", severity: "blocker", message: "cut" }],
      verdict: "warning",
    };
    expect(failsAfterChange(a5, cut)).toBeNull();
  });
});

describe("what the change may not break on the page map", () => {
  const marsh = piece(3, "Marsh Lights", ["black"]);
  const tide = piece(4, "Teal Tide", ["teal"]);

  it("the most pages may not go below the pages on the map", () => {
    const map = mapWith([[marsh, 12]]);
    const refused = change({ map, after: { ...halfLetter, maxPages: 8, pageCountTarget: 8 } });
    expect(refused.refused).toBe(true);
    const impact = refused.impacts.find((i) => i.code === "max-pages-below-map");
    expect(impact).toMatchObject({ severity: "refusal", pieceIds: [3], pages: [12] });
    expect(impact?.message).toBe(
      "The page map has 16 pages, with “Marsh Lights” on page 12, so the most pages cannot go below 16. Take pages out on the page map first; it moves the pieces with them.",
    );
    // The page count belongs to the map once it is laid out.
    expect(codes(refused)).toContain("page-count-set-by-map");
    expect(change({ map, after: { ...halfLetter, maxPages: 16 } }).impacts).toEqual([]);
  });

  it("an ink a placed piece prints in may not be taken away; one only unplaced pieces use asks first", async () => {
    const map = mapWith([[tide, 6]]);
    const refused = change({ map, after: { ...halfLetter, inks: ["black"] } });
    const impact = refused.impacts.find((i) => i.code === "ink-in-use-removed");
    expect(impact).toMatchObject({ severity: "refusal", pieceIds: [4], pages: [6] });
    expect(impact?.message).toContain("“Teal Tide” (page 6) prints in teal");

    const unplaced = await greyFile(1725, 2625, {
      pieceId: 9,
      pieceTitle: "Kelp",
      pieceInks: ["teal"],
    });
    const warned = change({
      map: mapWith([]),
      files: [unplaced],
      after: { ...halfLetter, inks: ["black"] },
    });
    expect(warned).toMatchObject({ refused: false, needsConfirmation: true });
    expect(warned.impacts.find((i) => i.code === "ink-removed-from-pieces")).toMatchObject({
      pieceIds: [9],
    });
  });

  it("an ink the open call still offers may not be taken away", () => {
    const result = change({
      callInks: ["black", "teal"],
      after: { ...halfLetter, inks: ["black"] },
    });
    expect(result.impacts).toContainEqual(
      expect.objectContaining({ code: "ink-offered-by-call", severity: "refusal" }),
    );
  });

  it("a binding the map's page count does not suit is refused with the map's own rule", () => {
    // A fold-only sheet has 4, 6 or 8 pages (common practice, no source); the map has 16.
    const result = change({
      map: mapWith([[marsh, 5]]),
      after: { ...halfLetter, binding: "fold-only" },
    });
    const impact = result.impacts.find((i) => i.code === "map-rule-broken");
    expect(impact?.severity).toBe("refusal");
    expect(impact?.message).toContain("A fold-only sheet has 4, 6 or 8 pages");
  });

  it("fewer inks per pass is a warning from the map's pass count", () => {
    // Pages 2 and 15 share sheet 1's inside; black and teal there take 2 passes at 1 ink a pass.
    const two = { ...halfLetter, inksPerPass: 2 };
    const map = mapWith(
      [
        [marsh, 2],
        [tide, 15],
      ],
      two,
    );
    const result = analyseSpecChange({
      before: two,
      after: halfLetter,
      map,
      files: [],
      callInks: null,
    });
    expect(result.impacts.find((i) => i.code === "map-rule-warning")?.message).toContain(
      "goes through the press 2 times",
    );
    expect(result.needsConfirmation).toBe(true);
  });
});

describe("leaving the duplicator", () => {
  it("warns that greyscale files drawn for a coloured ink would print grey", async () => {
    const kelp = await greyFile(1725, 2625, {
      pieceId: 9,
      pieceTitle: "Kelp",
      pieceInks: ["teal"],
    });
    const plain = await greyFile(1725, 2625, {
      pieceId: 10,
      pieceTitle: "Night",
      pieceInks: ["black"],
    });
    const result = change({
      files: [kelp, plain],
      after: { ...halfLetter, printMethod: "laser-colour" },
    });
    const impact = result.impacts.find((i) => i.code === "duplicator-files-to-colour-press");
    expect(impact).toMatchObject({ severity: "warning", pieceIds: [9] });
    expect(impact?.message).toContain("“Kelp” (teal)");
  });
});
