/**
 * One side of the print-file bench (tests/bench/pdf.ts), in a process of its own so that its peak
 * RSS is measured alone: `impose` builds the imposed booklet with lib/print/pdf; `bare` copies the
 * same JPEGs into a plain pdf-lib document. Prints one JSON line.
 */
import { readFile } from "node:fs/promises";
import { join } from "node:path";
import { PDFDocument } from "pdf-lib";
import { creepPerSheetMm } from "../../lib/print/creep";
import { saddleStitchSheets } from "../../lib/print/imposition";
import { imposeBooklet } from "../../lib/print/pdf/impose";
import type { SideInput } from "../../lib/print/pdf/types";
import { mmToPt } from "../../lib/print/units";
import { time } from "./images";

const [mode, dir, pagesArg, filesArg, runsArg] = process.argv.slice(2);
const pages = Number(pagesArg);
const files = Number(filesArg);
const runs = Number(runsArg);
const fileFor = (page: number) => join(dir ?? ".", `page-${(page - 1) % files}.jpg`);
let outputBytes = 0;

async function impose(): Promise<void> {
  const sides: SideInput[] = saddleStitchSheets(pages).flatMap((s) =>
    (["front", "back"] as const).map((side) => ({
      sheet: s.sheet,
      side,
      stockNote: null,
      pages: [s[side].left, s[side].right].map((page) => ({
        page,
        content: {
          kind: "art" as const,
          title: `Piece ${page}`,
          credit: null,
          load: async () => ({ format: "jpeg" as const, bytes: await readFile(fileFor(page)) }),
        },
      })),
    })),
  );
  const out = await imposeBooklet({
    title: "Bench booklet",
    trimWidthMm: 148,
    trimHeightMm: 210,
    bleedMm: 3,
    sheet: { name: "A3", widthMm: 297, heightMm: 420 },
    sides,
    creepMm: creepPerSheetMm(pages / 4, 0.1),
    ink: null,
  });
  outputBytes = out.bytes.length;
}

async function bare(): Promise<void> {
  const doc = await PDFDocument.create();
  const [w, h] = [mmToPt(154), mmToPt(216)];
  for (let page = 1; page <= pages; page++) {
    const image = await doc.embedJpg(await readFile(fileFor(page)));
    doc.addPage([w, h]).drawImage(image, { x: 0, y: 0, width: w, height: h });
  }
  outputBytes = (await doc.save()).length;
}

async function main(): Promise<void> {
  if (mode !== "impose" && mode !== "bare")
    throw new Error(`mode must be impose or bare, got ${mode}`);
  const timing = await time(runs, mode === "impose" ? impose : bare);
  // maxRSS is in kilobytes (getrusage ru_maxrss on Linux).
  const peakRssMb = Math.round((process.resourceUsage().maxRSS / 1024) * 10) / 10;
  console.log(
    JSON.stringify({
      mode,
      timing,
      peakRssMb,
      outputMb: Math.round((outputBytes / 2 ** 20) * 100) / 100,
    }),
  );
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});
