/**
 * `npm run bench`: prints JSON timings for the print engine. The header-only and full spec
 * checks run on a 100-megapixel JPEG beside sharp's bare metadata() on the same bytes (the
 * baseline, same run); then imposition math for 96 pages, cost tables for 20 quantities and the
 * page-map proposal (200 pieces into 96 pages).
 * No thresholds: the figures are for reading, not for passing.
 */
import { performance } from "node:perf_hooks";
import sharp from "sharp";
import { checkArtwork, checkArtworkHeader } from "../../lib/print/check";
import { costTable, compareWithShop, breakEven, type HomeRunInputs } from "../../lib/print/costs";
import { pageShifts } from "../../lib/print/creep";
import {
  locatePage,
  planSaddleStitch,
  printerSpreadOrder,
  readerSpreads,
} from "../../lib/print/imposition";
import { planInkPasses } from "../../lib/print/passes";
import type { PrintSpec } from "../../lib/print/spec";
import { benchMap } from "./map";

interface Timing {
  runs: number;
  medianMs: number;
  minMs: number;
  maxMs: number;
}

async function time(runs: number, fn: () => Promise<unknown> | unknown): Promise<Timing> {
  const samples: number[] = [];
  for (let i = 0; i < runs; i++) {
    const start = performance.now();
    await fn();
    samples.push(performance.now() - start);
  }
  samples.sort((a, b) => a - b);
  const round = (v: number) => Math.round(v * 1000) / 1000;
  return {
    runs,
    medianMs: round(samples[Math.floor(samples.length / 2)] ?? 0),
    minMs: round(samples[0] ?? 0),
    maxMs: round(samples[samples.length - 1] ?? 0),
  };
}

async function bigImage(format: "jpeg" | "png"): Promise<Buffer> {
  const side = 10_000; // 10000 x 10000 = 100 megapixels
  const mark = Buffer.from(
    `<svg xmlns="http://www.w3.org/2000/svg" width="4000" height="4000"><circle cx="2000" cy="2000" r="1800" fill="#222"/></svg>`,
  );
  const image = sharp({
    create: { width: side, height: side, channels: 3, background: "#8a8a8a" },
    limitInputPixels: false,
  }).composite([{ input: mark, top: 3000, left: 3000 }]);
  return format === "jpeg"
    ? image.jpeg({ quality: 85 }).toBuffer()
    : image.png({ compressionLevel: 1 }).toBuffer();
}

async function imageBench(format: "jpeg" | "png", spec: PrintSpec) {
  const bytes = await bigImage(format);
  const options = { maxPixels: 150_000_000 };
  const header = await checkArtworkHeader(bytes, spec, options);
  const full = await checkArtwork(bytes, spec, options);
  const timings = {
    sharpMetadataBaseline: await time(7, () =>
      sharp(bytes, { limitInputPixels: false }).metadata(),
    ),
    headerCheck: await time(7, () => checkArtworkHeader(bytes, spec, options)),
    fullCheck: await time(3, () => checkArtwork(bytes, spec, options)),
  };
  const ratio = (t: Timing) =>
    Math.round((t.medianMs / timings.sharpMetadataBaseline.medianMs) * 10) / 10;
  return {
    format: full.format,
    widthPx: full.measured.widthPx,
    heightPx: full.measured.heightPx,
    megapixels: full.measured.megapixels,
    bytes: bytes.length,
    headerVerdict: header.verdict,
    fullVerdict: full.verdict,
    fullFindings: full.findings.map((f) => f.code),
    timings,
    headerCheckOverBaseline: ratio(timings.headerCheck),
    fullCheckOverBaseline: ratio(timings.fullCheck),
  };
}

async function main(): Promise<void> {
  // 200 x 200 mm trim + 3 mm bleed: 10000 px across 206 mm is about 1233 ppi.
  const spec: PrintSpec = {
    trimWidthMm: 200,
    trimHeightMm: 200,
    bleedMm: 3,
    safeMarginMm: 5,
    minPpi: 300,
    printMethod: "laser-colour",
    inks: [],
  };
  const images = [await imageBench("jpeg", spec), await imageBench("png", spec)];

  const imposition = () => {
    const plan = planSaddleStitch({ contentPages: 93, cover: "separate" });
    for (let p = 1; p <= plan.pages; p++) locatePage(p, plan.pages);
    printerSpreadOrder(plan.pages);
    readerSpreads(plan.pages);
    pageShifts(plan.pages, 0.1, "round-fold");
    return planInkPasses({
      pages: plan.pages,
      copies: 120,
      inkOrder: ["black", "red", "blue"],
      pieces: [
        { id: "a", inks: ["black"] },
        { id: "b", inks: ["black", "red"] },
        { id: "c", inks: ["blue"] },
      ],
      placements: Array.from({ length: plan.pages }, (_, i) => ({
        page: i + 1,
        pieceId: ["a", "b", "c"][i % 3] ?? "a",
      })),
    });
  };
  const passes = imposition();

  const quantities = Array.from({ length: 20 }, (_, i) => (i + 1) * 25);
  const inputs: HomeRunInputs = {
    insideSheetsPerCopy: 23,
    coverSheetsPerCopy: 1,
    passesPerCopy: passes.passesPerCopy,
    mastersPerRun: passes.mastersPerRun,
    insidePaper: { priceCents: 899, perQuantity: 500 },
    coverPaper: { priceCents: 1899, perQuantity: 250 },
    perPass: { priceCents: 1, perQuantity: 3 },
    perMaster: { priceCents: 120, perQuantity: 1 },
    staples: { priceCents: 450, perQuantity: 5000 },
    spoilageRate: 0.05,
    labour: {
      steps: [{ id: "all", label: "All steps", setupMinutes: 10, minutesPerCopy: 1.5 }],
      centsPerHour: 1500,
    },
  };
  const quotes = [
    { copies: 25, totalCents: 9000 },
    { copies: 100, totalCents: 24000 },
    { copies: 250, totalCents: 45000 },
    { copies: 500, totalCents: 70000 },
  ];
  const costs = () => {
    costTable(inputs, quantities);
    return compareWithShop(inputs, quotes, quantities);
  };

  const report = {
    node: process.version,
    sharp: sharp.versions.sharp,
    libvips: sharp.versions.vips,
    images,
    imposition96Pages: {
      pages: 96,
      sheets: 24,
      passesPerCopy: passes.passesPerCopy,
      ...(await time(500, imposition)),
    },
    costTables20Quantities: {
      quantities: quantities.length,
      breakEven: breakEven(inputs, quotes, 1000),
      ...(await time(500, costs)),
    },
    pageMapProposal: benchMap(),
  };
  console.log(JSON.stringify(report, null, 2));
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});
