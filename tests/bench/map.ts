/**
 * Page-map bench: how long proposePlacement takes on large maps, with what it managed to place.
 * Exported for tests/bench/run.ts; run on its own with `node --import tsx tests/bench/map.ts`.
 * No thresholds: the figures are for reading, not for passing.
 */
import { performance } from "node:perf_hooks";
import { checkMap, emptyMap, proposePlacement } from "../../lib/map";
import type { MapPiece, MapState } from "../../lib/map";

const INK_SETS = [["black"], ["teal"], ["black", "teal"], ["red"], ["black", "red"]];

function pieces(count: number, spreadEvery: number): MapPiece[] {
  return Array.from({ length: count }, (_, i): MapPiece => {
    const id = i + 1;
    const inks = INK_SETS[(id * 7) % INK_SETS.length] ?? ["black"];
    return spreadEvery > 0 && id % spreadEvery === 0
      ? { id, title: `Spread ${id}`, kind: "spread", pageCount: 2, inks }
      : { id, title: `Page ${id}`, kind: "single", pageCount: 1, inks };
  });
}

function state(pageCount: number, list: MapPiece[]): MapState {
  return emptyMap({
    binding: "saddle-stitch",
    pageCount,
    maxPages: pageCount,
    inksPerPass: 1,
    pressInks: ["black", "teal", "red"],
    pieces: list,
  });
}

function median(
  runs: number,
  fn: () => unknown,
): { medianMs: number; minMs: number; maxMs: number; runs: number } {
  const samples: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t = performance.now();
    fn();
    samples.push(performance.now() - t);
  }
  samples.sort((a, b) => a - b);
  const r = (v: number) => Math.round(v * 100) / 100;
  return {
    runs,
    medianMs: r(samples[Math.floor(runs / 2)] ?? 0),
    minMs: r(samples[0] ?? 0),
    maxMs: r(samples[runs - 1] ?? 0),
  };
}

function one(pageCount: number, list: MapPiece[], runs: number) {
  const s = state(pageCount, list);
  const proposal = proposePlacement(s);
  const timing = median(runs, () => proposePlacement(s));
  return {
    pages: pageCount,
    pieces: list.length,
    placed: proposal.placed.length,
    unplaced: proposal.unplaced.length,
    passesPerCopy: proposal.passesAfter,
    otherErrors: checkMap(proposal.state).errors.filter((e) => e.code !== "piece-not-placed")
      .length,
    ...timing,
  };
}

/** Figures for the page-map engine; proposal200into96Ms is the headline. */
export function benchMap() {
  const big = one(96, pieces(200, 5), 9);
  const fits = one(96, pieces(90, 0), 9);
  const mixed = one(96, pieces(60, 4), 9);
  return {
    proposal200into96Ms: big.medianMs,
    proposal200into96: big,
    proposal90SinglesInto96: fits,
    proposal60MixedInto96: mixed,
  };
}

if (process.argv[1] && import.meta.url.endsWith(process.argv[1].split("/").pop() ?? "\u0000"))
  console.log(JSON.stringify(benchMap(), null, 2));
