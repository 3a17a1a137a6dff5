import { describe, expect, it } from "vitest";
import { checkMap } from "@/lib/map";
import { codes, map, run, single, spread, withPlaced } from "./fixtures";

describe("page count for the binding", () => {
  it("saddle stitch: 10 pages ask for 2 blanks, pages 11 and 12 (a multiple of 4 pages, IWPCUG puzzle 'Pages of a booklet': 10 → 12)", () => {
    const check = checkMap(map(10, []));
    const m = check.errors.find((e) => e.code === "page-count-not-multiple-of-4");
    expect(m?.pages).toEqual([11, 12]);
    expect(m?.message).toContain("Add 2 blank pages (pages 11 and 12) to make 12");
    expect(m?.message).toContain("take out 2 pages to make 8");
    expect(check.ok).toBe(false);
  });

  it("13 → 16 with 3 blanks; 17 → 20 with 3 blanks (padding to a multiple of 4, IWPCUG puzzle 'Pages of a booklet')", () => {
    expect(
      checkMap(map(13, [])).errors.find((e) => e.code === "page-count-not-multiple-of-4")?.pages,
    ).toEqual([14, 15, 16]);
    expect(
      checkMap(map(17, [])).errors.find((e) => e.code === "page-count-not-multiple-of-4")?.pages,
    ).toEqual([18, 19, 20]);
    expect(codes(checkMap(map(16, [])).errors)).toEqual([]);
  });

  it("fold-only takes 4, 6 or 8 pages (common practice, no source)", () => {
    expect(codes(checkMap(map(6, [], { binding: "fold-only" })).errors)).toEqual([]);
    expect(codes(checkMap(map(12, [], { binding: "fold-only" })).errors)).toEqual([
      "fold-only-page-count",
    ]);
  });

  it("over the page limit names the pages to take out", () => {
    const m = checkMap(map(24, [], { maxPages: 20 })).errors.find(
      (e) => e.code === "over-max-pages",
    );
    expect(m?.pages).toEqual([21, 22, 23, 24]);
    expect(m?.message).toContain("more than the 20");
  });

  it("slots must cover pages 1..N once", () => {
    const base = map(8, []);
    const broken = { ...base, slots: [...base.slots.slice(0, 6), { ...base.slots[0]!, page: 1 }] };
    const m = checkMap(broken).errors.find((e) => e.code === "slots-do-not-match-pages");
    expect(m?.pages).toEqual([1, 7, 8]);
  });
});

describe("where pieces sit", () => {
  it("a spread on an even page and the next is fine; on odd|even it is an error", () => {
    const good = withPlaced(map(8, [spread(1, ["black"])]), [[1, [4, 5]]]);
    expect(checkMap(good).ok).toBe(true);
    const bad = withPlaced(map(8, [spread(1, ["black"])]), [[1, [3, 4]]]);
    const m = checkMap(bad).errors.find((e) => e.code === "spread-not-on-facing-pages");
    expect(m?.pages).toEqual([3, 4]);
    const apart = withPlaced(map(8, [spread(1, ["black"])]), [[1, [2, 5]]]);
    expect(codes(checkMap(apart).errors)).toContain("spread-not-on-facing-pages");
  });

  it("a spread off the centre sheet warns that it crosses two sheets; the centre spread does not (N + 1 rule, GeeksforGeeks 'Puzzle 28 (Newspaper Puzzle)')", () => {
    const off = checkMap(withPlaced(map(8, [spread(1, ["black"])]), [[1, [2, 3]]]));
    const w = off.warnings.find((x) => x.code === "spread-across-sheets");
    expect(w?.message).toContain("page 2 on sheet 1, page 3 on sheet 2");
    expect(w?.message).toContain("pages 4 and 5");
    const centre = checkMap(withPlaced(map(8, [spread(1, ["black"])]), [[1, [4, 5]]]));
    expect(codes(centre.warnings)).not.toContain("spread-across-sheets");
  });

  it("a run must be contiguous and in order", () => {
    const good = withPlaced(map(8, [run(1, 3, ["black"])]), [[1, [3, 4, 5]]]);
    expect(checkMap(good).ok).toBe(true);
    const gap = withPlaced(map(8, [run(1, 3, ["black"])]), [[1, [3, 4, 6]]]);
    expect(codes(checkMap(gap).errors)).toEqual(["run-out-of-order"]);
    const swapped = withPlaced(map(8, [run(1, 3, ["black"])]), [[1, [3, 5, 4]]]);
    expect(codes(checkMap(swapped).errors)).toEqual(["run-out-of-order"]);
  });

  it("a piece page placed twice, and a reserved page holding a piece, are errors", () => {
    const twice = withPlaced(map(8, [single(1, ["black"])]), [
      [1, [2]],
      [1, [6]],
    ]);
    const m = checkMap(twice).errors.find((e) => e.code === "piece-page-placed-twice");
    expect(m?.pages).toEqual([2, 6]);
    const state = withPlaced(map(8, [single(1, ["black"])]), [[1, [2]]]);
    state.slots[1]!.reservation = "contents";
    expect(codes(checkMap(state).errors)).toContain("reserved-slot-holds-piece");
  });

  it("every accepted piece is placed or left out; a partial placement names the missing pages", () => {
    const pieces = [
      single(1, ["black"]),
      single(2, ["black"], { leftOut: true }),
      run(3, 3, ["teal"]),
    ];
    const state = withPlaced(map(8, pieces), [[3, [2, 3]]]);
    const check = checkMap(state);
    expect(check.errors.find((e) => e.code === "piece-not-placed")?.pieceIds).toEqual([1]);
    const partial = check.errors.find((e) => e.code === "piece-placed-partially");
    expect(partial?.message).toContain("its page 3 is missing");
    expect(check.errors.some((e) => e.pieceIds.includes(2))).toBe(false);
  });

  it("unknown pieces and bad page indexes are errors", () => {
    const state = withPlaced(map(8, [single(1, ["black"])]), [
      [1, [1]],
      [99, [2]],
    ]);
    state.slots[0]!.piecePageIndex = 2;
    expect(codes(checkMap(state).errors).sort()).toEqual(
      ["piece-not-placed", "piece-page-index-invalid", "unknown-piece"].sort(),
    );
  });
});

describe("ink warnings", () => {
  it("a side with 2 inks on a one-ink duplicator needs 2 passes and says so (Fancyclopedia 'Mimeography': one run per colour)", () => {
    // 8 pages: sheet 1 front is 8|1 (pages sharing a side sum to N + 1, GeeksforGeeks "Puzzle 28 (Newspaper Puzzle)", geeksforgeeks.org/puzzle-28-newspaper-puzzle/).
    const state = withPlaced(map(8, [single(1, ["black"]), single(2, ["teal"])]), [
      [1, [1]],
      [2, [8]],
    ]);
    const w = checkMap(state).warnings.find((x) => x.code === "side-needs-several-passes");
    expect(w?.pages).toEqual([1, 8]);
    expect(w?.pieceIds).toEqual([1, 2]);
    expect(w?.message).toContain("Sheet 1 front (pages 8 and 1) carries black and teal");
    expect(w?.message).toContain("2 times (2 inks ÷ 1, rounded up)");
    // A press laying 2 inks per pass needs one pass: no warning.
    expect(codes(checkMap({ ...state, inksPerPass: 2 }).warnings)).not.toContain(
      "side-needs-several-passes",
    );
  });

  it("inks the press lacks, and more inks than it has, are flagged", () => {
    const state = withPlaced(
      map(8, [single(1, ["black", "gold"]), single(2, ["teal"])], { pressInks: ["black", "teal"] }),
      [
        [1, [1]],
        [2, [8]],
      ],
    );
    const w = checkMap(state).warnings;
    expect(w.find((x) => x.code === "ink-not-on-press")?.message).toContain("needs gold");
    expect(w.find((x) => x.code === "side-over-press-inks")?.message).toContain(
      "3 inks (black, teal and gold) but the press has only 2 inks",
    );
  });

  it("errors come before warnings and ok follows errors", () => {
    const state = withPlaced(map(10, [single(1, ["black"])]), [[1, [1]]]);
    const check = checkMap(state);
    expect(check.messages[0]?.severity).toBe("error");
    expect(check.messages.findIndex((m) => m.severity === "warning")).toBeGreaterThan(
      check.messages.findLastIndex((m) => m.severity === "error"),
    );
    expect(check.ok).toBe(false);
  });
});
