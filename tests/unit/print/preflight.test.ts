import { describe, expect, it } from "vitest";
import { preflight, type PreflightPiece } from "@/lib/print/preflight";
import type { MapState } from "@/lib/map";
import { map, single, spread, withPlaced } from "../map/fixtures";

/** Every page of an 8-page map filled: 1–8 kept blank except those given pieces. */
function fullMap(state: MapState): MapState {
  return {
    ...state,
    slots: state.slots.map((s) => (s.pieceId === null ? { ...s, reservation: "blank" } : s)),
  };
}

const passing = (id: number, title: string, pages = 1): PreflightPiece => ({
  id,
  title,
  creditApprovedAt: new Date("2026-11-20T10:00:00Z"),
  pages: Array.from({ length: pages }, (_, i) => ({
    pageIndex: i + 1,
    verdict: "pass",
    fileName: `${title}-${i + 1}.png`,
  })),
});

describe("preflight", () => {
  it("a full map with passing, approved files has nothing to say and may produce", () => {
    const state = fullMap(withPlaced(map(8, [single(1, ["black"])]), [[1, [4]]]));
    const result = preflight({ slug: "tide", state, pieces: [passing(1, "Heron")] });
    expect(result.entries).toEqual([]);
    expect(result.ok).toBe(true);
  });

  it("an accepted piece not placed blocks, naming it and linking to the map", () => {
    const state = fullMap(
      withPlaced(map(8, [single(1, ["black"]), single(2, ["black"])]), [[1, [4]]]),
    );
    const result = preflight({ slug: "tide", state, pieces: [passing(1, "Heron")] });
    expect(result.ok).toBe(false);
    expect(result.blockers).toBe(1);
    const entry = result.entries[0]!;
    expect(entry).toMatchObject({
      severity: "blocker",
      code: "pieces-not-placed",
      fixHref: "/studio/tide/map",
      pieceIds: [2],
    });
    expect(entry.message).toBe(
      "1 accepted piece is not on the map yet: “Piece 2”. Place it, or leave it out of this issue.",
    );
  });

  it("empty pages warn with their numbers (they print blank)", () => {
    const state = withPlaced(map(8, [single(1, ["black"])]), [[1, [4]]]);
    const result = preflight({ slug: "tide", state, pieces: [passing(1, "Heron")] });
    expect(result.ok).toBe(true);
    const entry = result.entries.find((e) => e.code === "pages-empty")!;
    expect(entry.severity).toBe("warning");
    expect(entry.pages).toEqual([1, 2, 3, 5, 6, 7, 8]);
    expect(entry.message).toContain("7 pages are left empty");
    expect(entry.message).toContain("pages 1, 2, 3, 5, 6, 7 and 8");
  });

  it("a missing file and a blocking file block; a warning file warns; each links to its piece", () => {
    const state = fullMap(
      withPlaced(map(8, [single(1, ["black"]), spread(2, ["black"]), single(3, ["black"])]), [
        [1, [2]],
        [2, [4, 5]],
        [3, [3]],
      ]),
    );
    const pieces: PreflightPiece[] = [
      { ...passing(1, "Heron"), pages: [{ pageIndex: 1, verdict: null, fileName: null }] },
      {
        ...passing(2, "Tide Table", 2),
        pages: [
          { pageIndex: 1, verdict: "pass", fileName: "left.png" },
          { pageIndex: 2, verdict: "blocker", fileName: "right.png" },
        ],
      },
      { ...passing(3, "Gull"), pages: [{ pageIndex: 1, verdict: "warning", fileName: "g.png" }] },
    ];
    const result = preflight({ slug: "tide", state, pieces });
    expect(result.blockers).toBe(2);
    expect(result.warnings).toBe(1);
    const missing = result.entries.find((e) => e.code === "file-missing")!;
    expect(missing.message).toBe("“Heron” has no file for page 1 of 1.");
    expect(missing.fixHref).toBe("/studio/tide/submissions/1");
    const bad = result.entries.find((e) => e.code === "file-blocker")!;
    expect(bad.message).toContain("page 2 of 2");
    expect(bad.message).toContain("right.png");
    expect(bad.pages).toEqual([4, 5]);
    const warned = result.entries.find((e) => e.code === "file-warning")!;
    expect(warned.severity).toBe("warning");
    // Blockers come first.
    expect(result.entries.map((e) => e.severity)).toEqual(["blocker", "blocker", "warning"]);
  });

  it("credit lines not yet approved warn, counted", () => {
    const state = fullMap(
      withPlaced(map(8, [single(1, ["black"]), single(2, ["black"])]), [
        [1, [4]],
        [2, [5]],
      ]),
    );
    const result = preflight({
      slug: "tide",
      state,
      pieces: [
        { ...passing(1, "Heron"), creditApprovedAt: null },
        { ...passing(2, "Gull"), creditApprovedAt: null },
      ],
    });
    expect(result.ok).toBe(true);
    const entry = result.entries.find((e) => e.code === "credit-not-approved")!;
    expect(entry.message).toBe(
      "2 credit lines are not approved by their contributors yet: “Heron” and “Gull”.",
    );
  });

  it("a spread split across sheets warns: 8 pages, a spread on 2–3 prints on sheets 1 and 2 (saddle stitch, sheet 1 carries 1, 2, 7, 8)", () => {
    const state = fullMap(withPlaced(map(8, [spread(1, ["black"])]), [[1, [2, 3]]]));
    const result = preflight({ slug: "tide", state, pieces: [passing(1, "Tide Table", 2)] });
    const entry = result.entries.find((e) => e.code === "spread-across-sheets")!;
    expect(entry.severity).toBe("warning");
    expect(entry.message).toContain("page 2 on sheet 1, page 3 on sheet 2");
    expect(result.ok).toBe(true);
  });

  it("a side carrying more inks than the press has warns as ink overload", () => {
    const state = fullMap(
      withPlaced(
        map(8, [single(1, ["black", "teal"]), single(2, ["red"])], {
          pressInks: ["black", "teal"],
        }),
        [
          [1, [4]],
          [2, [5]],
        ],
      ),
    );
    const result = preflight({
      slug: "tide",
      state,
      pieces: [passing(1, "Heron"), passing(2, "Gull")],
    });
    // Sheet 2's front carries pages 6 and 3, its back 4 and 5: black, teal and red on one side.
    const entry = result.entries.find((e) => e.code === "ink-overload")!;
    expect(entry.severity).toBe("warning");
    expect(entry.message).toContain("3 inks");
  });

  it("a map that breaks a rule blocks with the map's own message", () => {
    const state = fullMap(map(10, []));
    const result = preflight({ slug: "tide", state, pieces: [] });
    const entry = result.entries.find((e) => e.code === "map-rule")!;
    expect(entry.severity).toBe("blocker");
    expect(entry.message).toContain("Add 2 blank pages");
  });
});
