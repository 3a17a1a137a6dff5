/**
 * TEMPORARY (replaced by the builders branch): a minimal imposed print file, one PDF page per
 * sheet side in print order, the side's pages side by side at trim plus bleed, centred on the
 * press sheet (laid landscape when the row is wider than tall). The real builder adds marks,
 * the slug line and creep.
 */
import { PDFDocument } from "pdf-lib";
import { mmToPt, placeRow } from "./temporary-place";
import type { ImposeInput, ProducedPdf } from "./types";

export async function imposeBooklet(input: ImposeInput): Promise<ProducedPdf> {
  const doc = await PDFDocument.create();
  doc.setTitle(input.title);
  const total = input.sides.reduce((n, s) => n + s.pages.length, 0);
  let done = 0;
  const tick = async () => {
    done++;
    await input.onProgress?.(done, total);
  };
  const boxW = mmToPt(input.trimWidthMm + 2 * input.bleedMm);
  const boxH = mmToPt(input.trimHeightMm + 2 * input.bleedMm);
  for (const side of input.sides) {
    const rowW = boxW * Math.max(1, side.pages.length);
    const portraitW = mmToPt(input.sheet.widthMm);
    const portraitH = mmToPt(input.sheet.heightMm);
    const landscape = rowW > boxH;
    const [w, h] = landscape ? [portraitH, portraitW] : [portraitW, portraitH];
    const page = doc.addPage([w, h]);
    await placeRow(
      doc,
      page,
      side.pages,
      { x0: (w - rowW) / 2, y0: (h - boxH) / 2, w: boxW, h: boxH },
      tick,
    );
  }
  const bytes = await doc.save();
  return { bytes, pageCount: doc.getPageCount() };
}
