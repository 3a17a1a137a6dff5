/**
 * Spec-check bench on 100-megapixel files made here (never committed): an 8-bit JPEG, an 8-bit
 * PNG, a 16-bit PNG and an LZW CMYK TIFF. Each check is printed beside baselines timed in the same
 * run on the same bytes: sharp's metadata() (header only), a bare sharp decode to raw pixels, and
 * ImageMagick's `identify -verbose` (a full read with statistics) when the binary is there.
 * No thresholds: the figures are for reading, not for passing.
 */
import { spawnSync } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { performance } from "node:perf_hooks";
import sharp from "sharp";
import { checkArtwork, checkArtworkHeader } from "../../lib/print/check";
import type { PrintSpec } from "../../lib/print/spec";

export interface Timing {
  runs: number;
  medianMs: number;
  minMs: number;
  maxMs: number;
  /** Median CPU time over all threads (and the child process, for identify), ms. */
  cpuMedianMs: number;
}

const round3 = (v: number) => Math.round(v * 1000) / 1000;
const median = (values: number[]) => [...values].sort((a, b) => a - b)[values.length >> 1] ?? 0;

function summarise(wall: number[], cpu: number[]): Timing {
  const sorted = [...wall].sort((a, b) => a - b);
  return {
    runs: wall.length,
    medianMs: round3(median(wall)),
    minMs: round3(sorted[0] ?? 0),
    maxMs: round3(sorted[sorted.length - 1] ?? 0),
    cpuMedianMs: round3(median(cpu)),
  };
}

/** Wall and CPU time of an in-process task (libvips' worker threads count towards CPU). */
export async function time(runs: number, fn: () => Promise<unknown> | unknown): Promise<Timing> {
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < runs; i++) {
    const startCpu = process.cpuUsage();
    const start = performance.now();
    await fn();
    wall.push(performance.now() - start);
    const used = process.cpuUsage(startCpu);
    cpu.push((used.user + used.system) / 1000);
  }
  return summarise(wall, cpu);
}

export type BigImageKind = "jpeg" | "png" | "png16" | "tiff-cmyk";

const EXTENSIONS: Record<BigImageKind, string> = {
  jpeg: "jpg",
  png: "png",
  png16: "png",
  "tiff-cmyk": "tif",
};

const SIDE = 10_000; // 10000 x 10000 = 100 megapixels

/** A grey page with a dark disc, in the format asked for. */
async function bigImage(kind: BigImageKind): Promise<Buffer> {
  if (kind === "tiff-cmyk") {
    // Converting 100 MP to CMYK through an ICC profile takes minutes: convert a 1000 px page,
    // then enlarge it in CMYK (nearest neighbour keeps the pixels CMYK values as they are).
    const small = await sharp({
      create: { width: 1000, height: 1000, channels: 3, background: "#8a8a8a" },
    })
      .composite([{ input: disc(400), top: 300, left: 300 }])
      .removeAlpha()
      .toColourspace("cmyk")
      .tiff({ compression: "none" })
      .toBuffer();
    return sharp(small, { limitInputPixels: false })
      .pipelineColourspace("cmyk")
      .resize({ width: SIDE, height: SIDE, kernel: "nearest" })
      .toColourspace("cmyk")
      .tiff({ compression: "lzw" })
      .toBuffer();
  }
  const image = sharp({
    create: { width: SIDE, height: SIDE, channels: 3, background: "#8a8a8a" },
    limitInputPixels: false,
  }).composite([{ input: disc(4000), top: 3000, left: 3000 }]);
  if (kind === "jpeg") return image.jpeg({ quality: 85 }).toBuffer();
  if (kind === "png16") return image.toColourspace("rgb16").png({ compressionLevel: 1 }).toBuffer();
  return image.png({ compressionLevel: 1 }).toBuffer();
}

function disc(size: number): Buffer {
  const r = size / 2;
  return Buffer.from(
    `<svg xmlns="http://www.w3.org/2000/svg" width="${size}" height="${size}"><circle cx="${r}" cy="${r}" r="${r * 0.9}" fill="#222"/></svg>`,
  );
}

function hasIdentify(): boolean {
  return spawnSync("identify", ["-version"], { stdio: "ignore" }).status === 0;
}

/**
 * Finds ImageMagick's identify, installing Debian's package when running as root; null when it
 * is not there and cannot be installed.
 */
export function ensureIdentify(): boolean {
  if (hasIdentify()) return true;
  if (process.getuid?.() !== 0) return false;
  const apt = (args: string[]) =>
    spawnSync("apt-get", args, {
      stdio: ["ignore", "ignore", "inherit"],
      env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" },
    }).status === 0;
  console.error("bench: installing imagemagick for the identify baseline");
  const install = ["install", "-y", "-qq", "--no-install-recommends", "imagemagick"];
  if (!apt(install) && apt(["update", "-qq"])) apt(install);
  return hasIdentify();
}

/**
 * Debian's ImageMagick policy caps its pixel cache at 256 MiB of memory, which sends a
 * 100-megapixel file to a disk cache and makes identify slower than it need be. A policy of our
 * own (found first through MAGICK_CONFIGURE_PATH) lifts the memory limits, so the baseline is
 * identify at its fastest on this machine.
 */
function identifyPolicyDir(dir: string): string {
  const policyDir = join(dir, "imagemagick");
  mkdirSync(policyDir, { recursive: true });
  writeFileSync(
    join(policyDir, "policy.xml"),
    `<policymap>
  <policy domain="resource" name="memory" value="8GiB"/>
  <policy domain="resource" name="map" value="8GiB"/>
  <policy domain="resource" name="area" value="1GP"/>
  <policy domain="resource" name="disk" value="16GiB"/>
</policymap>
`,
  );
  return policyDir;
}

/** `identify -verbose` on a file; wall time here, CPU time from the shell's `times` (children). */
function timeIdentify(runs: number, file: string, policyDir: string): Timing {
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < runs; i++) {
    const start = performance.now();
    const run = spawnSync("sh", ["-c", 'identify -verbose "$1" > /dev/null && times', "sh", file], {
      encoding: "utf8",
      env: { ...process.env, MAGICK_CONFIGURE_PATH: policyDir },
    });
    wall.push(performance.now() - start);
    if (run.status !== 0) throw new Error(`identify failed on ${file}: ${run.stderr}`);
    // `times` prints the shell's user/system times, then its children's: "0m15.533s 0m1.119s".
    const children = run.stdout.trim().split("\n").at(-1) ?? "";
    const seconds = [...children.matchAll(/(\d+)m([\d.]+)s/g)].map(
      (m) => Number(m[1]) * 60 + Number(m[2]),
    );
    cpu.push(seconds.reduce((sum, s) => sum + s, 0) * 1000);
  }
  return summarise(wall, cpu);
}

const ratio = (a: Timing, b: Timing | null) =>
  b && b.medianMs > 0 ? Math.round((a.medianMs / b.medianMs) * 100) / 100 : null;
/** The same over CPU time, steadier than wall time on a machine others are using. */
const cpuRatio = (a: Timing, b: Timing | null) =>
  b && b.cpuMedianMs > 0 ? Math.round((a.cpuMedianMs / b.cpuMedianMs) * 100) / 100 : null;

/** One 100 MP file: the checks and their baselines, timed in this run, with the ratios. */
async function imageBench(
  kind: BigImageKind,
  spec: PrintSpec,
  work: { dir: string; policyDir: string | null },
) {
  const bytes = await bigImage(kind);
  const file = join(work.dir, `page-${kind}.${EXTENSIONS[kind]}`);
  writeFileSync(file, bytes);
  const options = { maxPixels: 150_000_000 };
  const header = await checkArtworkHeader(bytes, spec, options);
  const full = await checkArtwork(bytes, spec, options);
  const timings = {
    sharpMetadata: await time(7, () => sharp(bytes, { limitInputPixels: false }).metadata()),
    sharpRawDecode: await time(3, () => sharp(bytes, { limitInputPixels: false }).raw().toBuffer()),
    // identify takes tens of seconds on 100 MP: three runs for the two cases the ratios are
    // watched on (CMYK TIFF, 16-bit PNG), one for the others.
    identifyVerbose: work.policyDir
      ? timeIdentify(kind === "tiff-cmyk" || kind === "png16" ? 3 : 1, file, work.policyDir)
      : null,
    headerCheck: await time(7, () => checkArtworkHeader(bytes, spec, options)),
    fullCheck: await time(3, () => checkArtwork(bytes, spec, options)),
  };
  return {
    kind,
    format: full.format,
    widthPx: full.measured.widthPx,
    heightPx: full.measured.heightPx,
    megapixels: full.measured.megapixels,
    colourSpace: full.measured.colourSpace,
    bitDepth: full.measured.bitDepth,
    bytes: bytes.length,
    headerVerdict: header.verdict,
    fullVerdict: full.verdict,
    fullFindings: full.findings.map((f) => f.code),
    timings,
    ratios: {
      headerCheckOverMetadata: ratio(timings.headerCheck, timings.sharpMetadata),
      fullCheckOverMetadata: ratio(timings.fullCheck, timings.sharpMetadata),
      fullCheckOverRawDecode: ratio(timings.fullCheck, timings.sharpRawDecode),
      fullCheckOverIdentify: ratio(timings.fullCheck, timings.identifyVerbose),
    },
    cpuRatios: {
      fullCheckOverRawDecode: cpuRatio(timings.fullCheck, timings.sharpRawDecode),
      fullCheckOverIdentify: cpuRatio(timings.fullCheck, timings.identifyVerbose),
    },
  };
}

/** Every 100 MP case, with the CMYK TIFF's full check over identify picked out. */
export async function benchImages(spec: PrintSpec) {
  const dir = mkdtempSync(join(tmpdir(), "quireline-bench-"));
  try {
    const policyDir = ensureIdentify() ? identifyPolicyDir(dir) : null;
    const images = [];
    for (const kind of ["jpeg", "png", "png16", "tiff-cmyk"] as const)
      images.push(await imageBench(kind, spec, { dir, policyDir }));
    const tiff = images.find((i) => i.kind === "tiff-cmyk");
    return {
      identify: policyDir ? identifyVersion() : null,
      tiffCmykFullCheckOverIdentify: tiff?.ratios.fullCheckOverIdentify ?? null,
      tiffCmykFullCheckOverIdentifyCpu: tiff?.cpuRatios.fullCheckOverIdentify ?? null,
      images,
    };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function identifyVersion(): string | null {
  const out = spawnSync("identify", ["-version"], { encoding: "utf8" }).stdout ?? "";
  return /Version: (.+?) https?:/.exec(out)?.[1]?.trim() ?? null;
}
