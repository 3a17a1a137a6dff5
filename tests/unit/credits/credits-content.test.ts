import { describe, expect, it } from "vitest";
import {
  colophonContent,
  creditsContent,
  creditText,
  linesPerPage,
  pageReference,
  reservedTextPages,
  type CreditSource,
} from "@/lib/print/credits";
import { setReservation } from "@/lib/map/edit";
import type { MapState } from "@/lib/map/types";
import { map, single, spread, run, withPlaced } from "../map/fixtures";

// A 12-page booklet: the spread "Heron at the Sluice Gate" on 4–5, a single on 7, a run on 8–10.
function booklet(): MapState {
  const base = map(12, [
    spread(1, ["black"], { title: "Heron at the Sluice Gate" }),
    single(2, ["black"], { title: "Moth Census" }),
    run(3, 3, ["teal"], { title: "Lantern Walk" }),
    single(4, ["black"], { title: "Not Placed Yet" }),
  ]);
  return withPlaced(base, [
    [1, [4, 5]],
    [2, [7]],
    [3, [8, 9, 10]],
  ]);
}

const sources: CreditSource[] = [
  { pieceId: 3, title: "Lantern Walk", creditLine: "Pell Ashdown", approved: true },
  { pieceId: 1, title: "Heron at the Sluice Gate", creditLine: "Wren Halloway", approved: true },
  { pieceId: 2, title: "Moth Census", creditLine: "Juno Marsh", approved: false },
  { pieceId: 4, title: "Not Placed Yet", creditLine: "Ida Fenn", approved: true },
];

describe("page references", () => {
  it("reads one page as p., several as pp., runs joined by an en dash", () => {
    expect(pageReference([7])).toBe("p. 7");
    expect(pageReference([5, 4])).toBe("pp. 4\u20135");
    expect(pageReference([3, 4, 5, 9])).toBe("pp. 3\u20135, 9");
    expect(pageReference([2, 9])).toBe("pp. 2, 9");
    expect(pageReference([])).toBe("");
  });

  it("writes a line as pages, two spaces, the title, an em dash and the credit", () => {
    expect(creditText([4, 5], " Heron at the Sluice Gate", "Wren Halloway ")).toBe(
      "pp. 4\u20135  Heron at the Sluice Gate \u2014 Wren Halloway",
    );
  });
});

describe("the credits page", () => {
  it("prints approved lines in page order and lists the unapproved as outstanding", () => {
    const content = creditsContent(booklet(), sources);
    expect(content.page).toEqual({
      kind: "text",
      heading: "Credits",
      lines: [
        "pp. 4\u20135  Heron at the Sluice Gate \u2014 Wren Halloway",
        "pp. 8\u201310  Lantern Walk \u2014 Pell Ashdown",
      ],
    });
    expect(content.outstanding).toEqual([{ pieceId: 2, title: "Moth Census", pages: [7] }]);
  });

  it("never prints an unapproved line, whatever it says", () => {
    const lines = creditsContent(booklet(), sources).page.lines.join("\n");
    expect(lines).not.toContain("Juno Marsh");
    // A piece off the map is not in this credits at all.
    expect(lines).not.toContain("Ida Fenn");
  });

  it("is empty when nothing placed is approved", () => {
    const none = sources.map((s) => ({ ...s, approved: false }));
    const content = creditsContent(booklet(), none);
    expect(content.page.lines).toEqual([]);
    expect(content.outstanding.map((o) => o.pieceId)).toEqual([1, 2, 3]);
  });
});

describe("the colophon", () => {
  const almanac = {
    title: "The Low Tide Almanac",
    pressName: "Marrowbend Print Collective",
    trimPreset: "a5",
    trimWidthMm: 148,
    trimHeightMm: 210,
    binding: "saddle-stitch" as const,
    paperGsm: 90,
    coverStock: "separate" as const,
    coverPaperGsm: 250,
    printMethod: "duplicator" as const,
    inks: ["black", "teal", "fluorescent pink"],
    copies: 120,
    year: 2026,
  };

  it("names the title, press, trim, paper, printing, binding, edition and year", () => {
    expect(colophonContent(almanac)).toEqual({
      kind: "text",
      heading: "Colophon",
      lines: [
        "The Low Tide Almanac",
        "Published by Marrowbend Print Collective",
        // ISO 216: A5 = 148 x 210 mm
        "Trim: A5 (148 x 210 mm)",
        "Paper: 90 gsm inside, 250 gsm cover",
        "Printed on a stencil duplicator in black, teal and fluorescent pink",
        "Folded and saddle-stitched",
        "An edition of 120 copies, 2026",
      ],
    });
  });

  it("says a self cover is the same paper, leaves out a missing press, and counts one copy", () => {
    const lines = colophonContent({
      ...almanac,
      pressName: null,
      coverStock: "self",
      coverPaperGsm: null,
      printMethod: "laser-black",
      inks: ["black"],
      copies: 1,
      binding: "fold-only",
    }).lines;
    expect(lines).not.toContain("Published by Marrowbend Print Collective");
    expect(lines).toContain("Paper: 90 gsm throughout, cover included");
    expect(lines).toContain("Printed on a black laser printer in black");
    expect(lines).toContain("Folded from a single sheet");
    expect(lines).toContain("An edition of 1 copy, 2026");
  });
});

describe("lines a page holds", () => {
  it("fits 42 lines of 12 pt leading on an A5 page with 10 mm margins, less two for the heading", () => {
    // 1 pt = 25.4/72 mm (ISO 32000-1 §8.3.2.3); (210 − 20) mm ÷ 4.2333 mm = 44.88 → 44, less 2 = 42
    expect(linesPerPage(210, 10)).toBe(42);
  });
});

describe("the reserved pages", () => {
  const credits = { kind: "text" as const, heading: "Credits", lines: ["a", "b", "c", "d", "e"] };
  const colophon = { kind: "text" as const, heading: "Colophon", lines: ["x"] };
  const reserve = (state: MapState, page: number, what: "credits" | "colophon") => {
    const r = setReservation(state, page, what);
    if (!r.ok) throw new Error(r.reason);
    return r.state;
  };

  it("splits the credits over the credits pages and puts the colophon on its page", () => {
    let state = reserve(booklet(), 11, "credits");
    state = reserve(state, 2, "credits");
    state = reserve(state, 3, "colophon");
    const out = reservedTextPages(state, { credits, colophon }, { maxLines: 3 });
    expect(out.pages).toEqual([
      { page: 2, content: { kind: "text", heading: "Credits", lines: ["a", "b", "c"] } },
      { page: 3, content: colophon },
      { page: 11, content: { kind: "text", heading: "Credits (continued)", lines: ["d", "e"] } },
    ]);
    expect(out).toMatchObject({ unusedPages: [], unplaced: [], overflowLines: [] });
  });

  it("reports lines that do not fit and pages left over", () => {
    let state = reserve(booklet(), 11, "credits");
    state = reserve(state, 2, "colophon");
    state = reserve(state, 3, "colophon");
    const out = reservedTextPages(state, { credits, colophon }, { maxLines: 2 });
    expect(out.pages.map((p) => p.page)).toEqual([2, 11]);
    expect(out.overflowLines).toEqual(["c", "d", "e"]);
    expect(out.unusedPages).toEqual([3]);
  });

  it("says when no page is reserved for either", () => {
    const out = reservedTextPages(booklet(), { credits, colophon }, { maxLines: 40 });
    expect(out.pages).toEqual([]);
    expect(out.unplaced).toEqual(["credits", "colophon"]);
    expect(out.overflowLines).toEqual([]);
  });

  it("keeps a first credits page with its heading even with no approved lines", () => {
    const state = reserve(booklet(), 11, "credits");
    const out = reservedTextPages(
      state,
      { credits: { ...credits, lines: [] }, colophon },
      { maxLines: 5 },
    );
    expect(out.pages).toEqual([
      { page: 11, content: { kind: "text", heading: "Credits", lines: [] } },
    ]);
  });
});
