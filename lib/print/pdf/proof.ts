/**
 * TEMPORARY (replaced by the builders branch): a minimal reader proof, one PDF page per reader
 * spread (the cover alone, 2–3, …, the back cover alone), each page at trim plus bleed.
 */
import { PDFDocument } from "pdf-lib";
import { mmToPt, placeRow } from "./temporary-place";
import type { ProducedPdf, ProofInput } from "./types";

export async function readerProof(input: ProofInput): Promise<ProducedPdf> {
  const doc = await PDFDocument.create();
  doc.setTitle(input.title);
  const total = input.spreads.reduce((n, s) => n + s.pages.length, 0);
  let done = 0;
  const tick = async () => {
    done++;
    await input.onProgress?.(done, total);
  };
  const boxW = mmToPt(input.trimWidthMm + 2 * input.bleedMm);
  const boxH = mmToPt(input.trimHeightMm + 2 * input.bleedMm);
  for (const spread of input.spreads) {
    const page = doc.addPage([boxW * Math.max(1, spread.pages.length), boxH]);
    await placeRow(doc, page, spread.pages, { x0: 0, y0: 0, w: boxW, h: boxH }, tick);
  }
  const bytes = await doc.save();
  return { bytes, pageCount: doc.getPageCount() };
}
