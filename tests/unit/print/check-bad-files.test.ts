import fc from "fast-check";
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { checkArtwork, checkArtworkHeader, sniffFormat } from "@/lib/print/check";
import type { PrintSpec } from "@/lib/print/spec";
import { crc32, makePng } from "./fixtures";

const spec: PrintSpec = {
  trimWidthMm: 148,
  trimHeightMm: 210,
  bleedMm: 3,
  safeMarginMm: 5,
  minPpi: 100,
  printMethod: "laser-black",
  inks: [],
};
const page = () => makePng(606, 850, () => [90, 90, 90, 255]); // A5 + 3 mm at 100 ppi ≈ 606.3 x 850.4 px

describe("files that are not what they claim, or not whole", () => {
  it("empty file", async () => {
    const r = await checkArtwork(new Uint8Array(0), spec, { filename: "page.png" });
    expect(r.format).toBe("empty");
    expect(r.findings.map((f) => f.code)).toEqual(["file-empty"]);
    expect(r.verdict).toBe("blocker");
  });

  it("magic bytes decide the type (PNG §5.2 signature, JPEG SOI, TIFF II*/MM*, RIFF WEBP, %PDF-)", async () => {
    expect(sniffFormat(page())).toBe("png");
    expect(sniffFormat(await sharp(page()).jpeg().toBuffer())).toBe("jpeg");
    expect(sniffFormat(await sharp(page()).tiff().toBuffer())).toBe("tiff");
    expect(sniffFormat(await sharp(page()).webp().toBuffer())).toBe("webp");
    expect(sniffFormat(Buffer.from("%PDF-1.7\n"))).toBe("pdf");
    expect(sniffFormat(Buffer.from("GIF89a\x01\x00"))).toBe("gif");
  });

  it("a JPEG named .png is checked as JPEG, with a warning to rename it", async () => {
    const jpeg = await sharp(page()).jpeg().toBuffer();
    const r = await checkArtwork(jpeg, spec, { filename: "page.png" });
    expect(r.format).toBe("jpeg");
    expect(r.measured.declaredFormat).toBe("png");
    const f = r.findings.find((x) => x.code === "file-type-mismatch");
    expect(f?.severity).toBe("warning");
    expect(f?.message).toBe(
      "The file is named as PNG, but its contents are JPEG; it was checked as JPEG.",
    );
  });

  it("a GIF behind a .png name is refused as unsupported", async () => {
    const r = await checkArtwork(
      Buffer.from("GIF89a\x01\x00\x01\x00\x00\x00\x00;", "latin1"),
      spec,
      { filename: "page.png", mimeType: "image/png" },
    );
    expect(r.findings.map((f) => f.code)).toEqual(["file-unsupported"]);
    expect(r.findings[0]?.message).toContain("named as PNG");
  });

  it("unrecognised bytes", async () => {
    const r = await checkArtwork(Buffer.from("this is a shopping list, not a drawing"), spec, {
      mimeType: "image/jpeg",
    });
    expect(r.findings.map((f) => f.code)).toEqual(["file-unrecognised"]);
  });

  it("a PNG cut in half is truncated (no IEND), in the header check too", async () => {
    const png = page();
    const cut = png.subarray(0, Math.floor(png.length / 2));
    for (const check of [checkArtwork, checkArtworkHeader]) {
      const r = await check(cut, spec);
      expect(r.findings.map((f) => f.code)).toContain("file-truncated");
      expect(r.verdict).toBe("blocker");
    }
  });

  it("a JPEG cut in half is truncated", async () => {
    const jpeg = await sharp({
      create: {
        width: 606,
        height: 850,
        channels: 3,
        background: "#808080",
        noise: { type: "gaussian", mean: 128, sigma: 40 },
      },
    })
      .jpeg()
      .toBuffer();
    const r = await checkArtwork(jpeg.subarray(0, Math.floor(jpeg.length / 2)), spec);
    expect(r.findings.map((f) => f.code)).toContain("file-truncated");
  });

  it("a PNG whose compressed data is garbled is damaged, not a crash", async () => {
    const png = Buffer.from(page());
    const idat = png.indexOf("IDAT");
    for (let i = idat + 8; i < idat + 40; i++) png[i] = 0xaa;
    const r = await checkArtwork(png, spec);
    expect(r.verdict).toBe("blocker");
    expect(r.findings.some((f) => f.code === "file-damaged" || f.code === "file-truncated")).toBe(
      true,
    );
  });
});

describe("decompression bombs are refused before decoding", () => {
  it("a 60000 x 60000 px header on a tiny PNG: too many pixels, never decoded", async () => {
    const png = Buffer.from(makePng(8, 8));
    // Rewrite IHDR width and height (ISO/IEC 15948 §11.2.2) and its CRC.
    png.writeUInt32BE(60000, 16);
    png.writeUInt32BE(60000, 20);
    png.writeUInt32BE(crc32(png.subarray(12, 29)), 29);
    const r = await checkArtwork(png, spec);
    expect(r.measured.widthPx).toBe(60000);
    // Had it been decoded, the garbled data would have produced file-damaged instead.
    expect(r.findings.map((f) => f.code)).toEqual(["too-many-pixels"]);
    expect(r.findings[0]?.message).toContain("3600 megapixels");
  });

  it("the limit is configurable", async () => {
    const r = await checkArtworkHeader(page(), spec, { maxPixels: 100_000 });
    expect(r.findings.map((f) => f.code)).toEqual(["too-many-pixels"]);
  });
});

describe("never throws", () => {
  it("random bytes after a PNG, JPEG, TIFF or PDF signature always give a report", async () => {
    const signatures = [
      [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a],
      [0xff, 0xd8, 0xff],
      [0x49, 0x49, 0x2a, 0x00],
      [...Buffer.from("%PDF-1.4\n")],
    ];
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(...signatures),
        fc.uint8Array({ maxLength: 400 }),
        async (sig, rest) => {
          const report = await checkArtwork(Uint8Array.from([...sig, ...rest]), spec);
          expect(["blocker", "warning", "note", "pass"]).toContain(report.verdict);
        },
      ),
      { numRuns: 60 },
    );
  });
});
