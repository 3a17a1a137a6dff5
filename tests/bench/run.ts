/**
 * `npm run bench`: prints JSON timings for the print engine. The header-only and full spec
 * checks run on 100-megapixel files (JPEG, PNG, 16-bit PNG, CMYK TIFF; see ./images.ts) beside
 * baselines timed in the same run on the same bytes: sharp's metadata(), a bare sharp decode and
 * ImageMagick's `identify -verbose`. Then imposition math for 96 pages, cost tables for 20
 * quantities, the page-map proposal (200 pieces into 96 pages), and the imposed print PDF of 64
 * pages of 300 ppi JPEG art beside a bare pdf-lib copy of the same pages (./pdf.ts).
 * No thresholds: the figures are for reading, not for passing. This is the compute part of the
 * bench; ./load.ts, run after it by scripts/launch.mjs, is the load part.
 */
import sharp from "sharp";
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
import { benchImages, time } from "./images";
import { benchMap } from "./map";
import { benchPdf } from "./pdf";

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
  const images = await benchImages(spec);

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
    ...images,
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
    printFile64Pages: await benchPdf(),
  };
  console.log(JSON.stringify(report, null, 2));
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});
