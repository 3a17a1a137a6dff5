/**
 * Print-file bench: the imposed PDF of a 64-page booklet of 300 ppi JPEG art (A5 + 3 mm bleed, so
 * 1819 x 2551 px a page; A5 on A3 with marks and linear creep) beside a bare pdf-lib copy of the
 * same 64 pages (each JPEG embedded and drawn once on a page of its own size, nothing else), both in
 * this run on the same files. Each runs in its own child process so its peak RSS is its own.
 * Exported for tests/bench/run.ts; run alone with `node --import tsx tests/bench/pdf.ts`.
 * No thresholds: the figures are for reading, not for passing (the goal is a time ratio of 2 or less).
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import sharp from "sharp";
import { pixelsFor } from "../../lib/print/spec";
import type { Timing } from "./images";

export const PDF_BENCH_PAGES = 64;
/** Distinct JPEGs, each used for PDF_BENCH_PAGES / PDF_BENCH_FILES pages (read from disk each time). */
export const PDF_BENCH_FILES = 16;
export const PDF_BENCH_RUNS = 3;

export interface ChildReport {
  mode: "impose" | "bare";
  timing: Timing;
  peakRssMb: number;
  outputMb: number;
}

async function makeJpegs(
  dir: string,
): Promise<{ files: string[]; widthPx: number; heightPx: number; totalMb: number }> {
  const { widthPx, heightPx } = pixelsFor({ widthMm: 154, heightMm: 216 }, 300);
  const files: string[] = [];
  let total = 0;
  for (let i = 0; i < PDF_BENCH_FILES; i++) {
    // Gaussian noise over a grey gives a JPEG of photographic size (not a tiny flat file).
    const bytes = await sharp({
      create: {
        width: widthPx,
        height: heightPx,
        channels: 3,
        background: { r: 90 + i * 8, g: 120, b: 150 },
        noise: { type: "gaussian", mean: 128, sigma: 18 },
      },
    })
      .jpeg({ quality: 82 })
      .toBuffer();
    const file = join(dir, `page-${i}.jpg`);
    writeFileSync(file, bytes);
    files.push(file);
    total += bytes.length;
  }
  return { files, widthPx, heightPx, totalMb: round2(total / 2 ** 20) };
}

const round2 = (v: number) => Math.round(v * 100) / 100;

function runChild(mode: "impose" | "bare", dir: string): ChildReport {
  const child = fileURLToPath(new URL("./pdf-child.ts", import.meta.url));
  const run = spawnSync(
    process.execPath,
    [
      "--import",
      "tsx",
      child,
      mode,
      dir,
      String(PDF_BENCH_PAGES),
      String(PDF_BENCH_FILES),
      String(PDF_BENCH_RUNS),
    ],
    { encoding: "utf8", maxBuffer: 1 << 20 },
  );
  if (run.status !== 0) throw new Error(`pdf bench child (${mode}) failed: ${run.stderr}`);
  return JSON.parse(run.stdout) as ChildReport;
}

export async function benchPdf() {
  const dir = mkdtempSync(join(tmpdir(), "quireline-bench-pdf-"));
  try {
    const art = await makeJpegs(dir);
    const bare = runChild("bare", dir);
    const impose = runChild("impose", dir);
    return {
      pages: PDF_BENCH_PAGES,
      art: `${PDF_BENCH_FILES} JPEGs of ${art.widthPx} x ${art.heightPx} px (300 ppi at A5 + 3 mm bleed), ${art.totalMb} MB`,
      imposed: impose,
      barePdfLibCopy: bare,
      ratio: round2(impose.timing.medianMs / bare.timing.medianMs),
      cpuRatio: round2(impose.timing.cpuMedianMs / bare.timing.cpuMedianMs),
      peakRssRatio: round2(impose.peakRssMb / bare.peakRssMb),
      goal: "ratio <= 2",
    };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  benchPdf()
    .then((r) => console.log(JSON.stringify(r, null, 2)))
    .catch((error: unknown) => {
      console.error(error);
      process.exitCode = 1;
    });
}
