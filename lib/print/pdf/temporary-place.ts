/**
 * TEMPORARY (replaced by the builders branch): the shared part of the minimal stand-ins for
 * imposeBooklet and readerProof, so the print queue builds and its tests run until the real
 * builders land. One PDF page per side or spread, each reader page's art scaled into its
 * trim-plus-bleed box; no marks, no slug line, no creep.
 */
import { PDFDocument, type PDFPage } from "pdf-lib";
import { MM_PER_INCH } from "@/lib/print/units";
import type { PlacedPage } from "./types";

/** PDF user space is 1/72 inch (ISO 32000-1 §8.3.2.3). */
export const mmToPt = (mm: number) => (mm / MM_PER_INCH) * 72;

/** Draws each page's art side by side in boxes of `boxW` x `boxH` points, starting at x0, y0. */
export async function placeRow(
  doc: PDFDocument,
  page: PDFPage,
  pages: PlacedPage[],
  box: { x0: number; y0: number; w: number; h: number },
  tick: () => Promise<void>,
): Promise<void> {
  for (const [i, placed] of pages.entries()) {
    const x = box.x0 + i * box.w;
    if (placed.content.kind === "art") {
      const art = await placed.content.load();
      if (art.format === "pdf") {
        const [embedded] = await doc.embedPdf(art.bytes, [0]);
        if (!embedded) throw new Error(`page ${placed.page}: the PDF has no page`);
        page.drawPage(embedded, { x, y: box.y0, width: box.w, height: box.h });
      } else {
        const image =
          art.format === "jpeg" ? await doc.embedJpg(art.bytes) : await doc.embedPng(art.bytes);
        page.drawImage(image, { x, y: box.y0, width: box.w, height: box.h });
      }
    } else if (placed.content.kind === "text") {
      page.drawText(placed.content.heading, { x: x + 20, y: box.y0 + box.h - 40, size: 14 });
      placed.content.lines.forEach((line, n) =>
        page.drawText(line, { x: x + 20, y: box.y0 + box.h - 64 - n * 14, size: 9 }),
      );
    }
    await tick();
  }
}
