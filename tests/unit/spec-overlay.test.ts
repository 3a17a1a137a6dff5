import { describe, expect, it } from "vitest";
import { overlayLayout } from "@/lib/pieces/overlay";
import { specOf } from "@/lib/print/spec";
import { inToMm } from "@/lib/print/units";

// Half letter 5.5 x 8.5 in with 1/8 in bleed and a 1/4 in safe margin. 1 in = 25.4 mm exactly
// (NBS Circular 572 Addendum, 1960: the international yard is 0.9144 m); half letter + 1/8 in bleed =
// 5.75 x 8.75 in (trim + 2 x bleed, derived).
// Built the way the pages build it: specOf over the anthology's columns.
const spec = specOf({
  trimPreset: "half-letter",
  trimWidthMm: inToMm(5.5),
  trimHeightMm: inToMm(8.5),
  bleedMm: inToMm(0.125),
  safeMarginMm: inToMm(0.25),
  minPpi: 300,
  printMethod: "duplicator",
  inks: ["black"],
});
const close = (a: number, b: number) => expect(a).toBeCloseTo(b, 6);

describe("overlayLayout", () => {
  it("puts the bleed 3.175 mm outside the trim and the safe line 6.35 mm inside it", () => {
    const l = overlayLayout(spec, null);
    close(l.bleed.x, -3.175);
    close(l.bleed.width, inToMm(5.75));
    close(l.bleed.height, inToMm(8.75));
    close(l.safe!.x, 6.35);
    close(l.safe!.width, inToMm(5));
    expect(l.image).toBeNull();
    expect(l.placement).toBe("none");
  });

  it("a 1725 x 2625 px file fills the bleed box; a 1650 x 2550 px file only the trim", () => {
    const full = overlayLayout(spec, {
      byteLength: 1,
      widthPx: 1725,
      heightPx: 2625,
      sizeMatch: "trim-and-bleed",
    });
    expect(full.image).toEqual(full.bleed);
    const trimOnly = overlayLayout(spec, {
      byteLength: 1,
      widthPx: 1650,
      heightPx: 2550,
      sizeMatch: "trim-only",
    });
    expect(trimOnly.image).toEqual(trimOnly.trim);
    expect(trimOnly.placement).toBe("fills-trim");
  });

  it("a square file is scaled to cover the page, centred, overflowing left and right", () => {
    const l = overlayLayout(spec, {
      byteLength: 1,
      widthPx: 1000,
      heightPx: 1000,
      sizeMatch: "mismatch",
    });
    // Covering 5.75 x 8.75 in needs an 8.75 in square, centred on the page.
    close(l.image!.width, inToMm(8.75));
    close(l.image!.height, inToMm(8.75));
    close(l.image!.y, l.bleed.y);
    close(l.image!.x + l.image!.width / 2, spec.trimWidthMm / 2);
    expect(l.view.width).toBeGreaterThan(l.image!.width);
  });

  it("a PDF with no trim box but a trim + bleed page fills the bleed box", () => {
    const box = (widthMm: number, heightMm: number, explicit: boolean) => ({
      xPt: 0,
      yPt: 0,
      widthPt: (widthMm / 25.4) * 72,
      heightPt: (heightMm / 25.4) * 72,
      widthMm,
      heightMm,
      explicit,
    });
    const page = { page: 1, rotateDeg: 0, userUnit: 1, bleedMm: 0 };
    const media = box(inToMm(5.75), inToMm(8.75), true);
    const l = overlayLayout(
      spec,
      {
        byteLength: 1,
        pdfPages: [
          {
            ...page,
            mediaBox: media,
            cropBox: media,
            bleedBox: media,
            trimBox: { ...media, explicit: false },
            artBox: media,
          },
        ],
      },
      "pdf",
    );
    close(l.image!.x, l.bleed.x);
    close(l.image!.width, l.bleed.width);
  });

  it("a PDF whose TrimBox sits 9 pt inside the page lines its trim up with the spec's", () => {
    // ISO 32000-1 §14.11.2 page boundaries; 1 pt = 1/72 in, so 9 pt = 1/8 in = 3.175 mm and a
    // 414 x 630 pt page is 5.75 x 8.75 in: half letter with 1/8 in bleed.
    const pt = (v: number) => (v / 72) * inToMm(1);
    const box = (x: number, y: number, w: number, h: number, explicit = true) => ({
      xPt: x,
      yPt: y,
      widthPt: w,
      heightPt: h,
      widthMm: pt(w),
      heightMm: pt(h),
      explicit,
    });
    const media = box(0, 0, 414, 630);
    const l = overlayLayout(
      spec,
      {
        byteLength: 1,
        pdfPages: [
          {
            page: 1,
            rotateDeg: 0,
            userUnit: 1,
            bleedMm: pt(9),
            mediaBox: media,
            cropBox: media,
            bleedBox: media,
            trimBox: box(9, 9, 396, 612),
            artBox: media,
          },
        ],
      },
      "pdf",
    );
    close(l.image!.x, -3.175);
    close(l.image!.y, -3.175);
    close(l.image!.width, inToMm(5.75));
    expect(l.placement).toBe("pdf-boxes");
  });
});
