/**
 * Test files built without the checker's own code: PNGs with pngjs plus a hand-written pHYs
 * chunk, TIFFs written byte by byte, JFIF segments written by hand, PDFs with pdf-lib or by hand.
 */
import { PNG } from "pngjs";
import { PDFDocument } from "pdf-lib";

const CRC_TABLE = (() => {
  const table = new Uint32Array(256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    table[n] = c >>> 0;
  }
  return table;
})();

/** CRC-32 as PNG computes it (ISO/IEC 15948 Annex D). */
export function crc32(bytes: Uint8Array): number {
  let c = 0xffffffff;
  for (const b of bytes) c = (CRC_TABLE[(c ^ b) & 0xff] ?? 0) ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

/** One PNG chunk: length, type, data, CRC over type and data. */
export function pngChunk(type: string, data: Uint8Array): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const typeAndData = Buffer.concat([Buffer.from(type, "latin1"), Buffer.from(data)]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(typeAndData));
  return Buffer.concat([length, typeAndData, crc]);
}

/** The 9-byte pHYs payload: x and y pixels per unit, unit (0 unknown, 1 metre). */
export function physData(xPpm: number, yPpm: number, unit: 0 | 1): Buffer {
  const data = Buffer.alloc(9);
  data.writeUInt32BE(xPpm, 0);
  data.writeUInt32BE(yPpm, 4);
  data[8] = unit;
  return data;
}

export type Paint = (x: number, y: number) => [number, number, number, number];

/** A PNG from a paint function; RGBA in, written with the colour type asked for. */
export function makePng(
  width: number,
  height: number,
  paint: Paint = () => [255, 255, 255, 255],
  options: { colorType?: 0 | 2 | 4 | 6; phys?: Buffer } = {},
): Buffer {
  const png = new PNG({ width, height });
  for (let y = 0; y < height; y++)
    for (let x = 0; x < width; x++) {
      const [r, g, b, a] = paint(x, y);
      const i = (y * width + x) * 4;
      png.data[i] = r;
      png.data[i + 1] = g;
      png.data[i + 2] = b;
      png.data[i + 3] = a;
    }
  const colorType = options.colorType ?? 2;
  const encoded = PNG.sync.write(png, { colorType, inputHasAlpha: true });
  if (!options.phys) return encoded;
  // Signature (8) + IHDR chunk (4 + 4 + 13 + 4 = 25): pHYs goes right after IHDR, before IDAT.
  return Buffer.concat([
    encoded.subarray(0, 33),
    pngChunk("pHYs", options.phys),
    encoded.subarray(33),
  ]);
}

/** Full-bleed grey block with a white frame of `framePx` pixels. */
export function framed(width: number, height: number, framePx: number, ink = 40): Paint {
  return (x, y) =>
    x < framePx || y < framePx || x >= width - framePx || y >= height - framePx
      ? [255, 255, 255, 255]
      : [ink, ink, ink, 255];
}

/**
 * A minimal uncompressed greyscale TIFF (TIFF 6.0 baseline, little-endian) with
 * XResolution/YResolution as rationals and a ResolutionUnit (2 inch, 3 centimetre).
 */
export function makeTiff(
  width: number,
  height: number,
  res: { num: number; den: number; unit: 1 | 2 | 3 },
): Buffer {
  const entries: Array<[tag: number, type: number, count: number, value: number]> = [];
  const pixels = Buffer.alloc(width * height, 255);
  const headerSize = 8;
  const entryCount = 12;
  const ifdSize = 2 + entryCount * 12 + 4;
  const rationalAt = headerSize + ifdSize;
  const pixelsAt = rationalAt + 16;
  entries.push(
    [256, 4, 1, width], // ImageWidth
    [257, 4, 1, height], // ImageLength
    [258, 3, 1, 8], // BitsPerSample
    [259, 3, 1, 1], // Compression: none
    [262, 3, 1, 1], // PhotometricInterpretation: BlackIsZero
    [273, 4, 1, pixelsAt], // StripOffsets
    [277, 3, 1, 1], // SamplesPerPixel
    [278, 4, 1, height], // RowsPerStrip
    [279, 4, 1, pixels.length], // StripByteCounts
    [282, 5, 1, rationalAt], // XResolution
    [283, 5, 1, rationalAt + 8], // YResolution
    [296, 3, 1, res.unit], // ResolutionUnit
  );
  const out = Buffer.alloc(pixelsAt + pixels.length);
  out.write("II", 0, "latin1");
  out.writeUInt16LE(42, 2);
  out.writeUInt32LE(headerSize, 4);
  out.writeUInt16LE(entryCount, headerSize);
  entries.forEach(([tag, type, count, value], i) => {
    const at = headerSize + 2 + i * 12;
    out.writeUInt16LE(tag, at);
    out.writeUInt16LE(type, at + 2);
    out.writeUInt32LE(count, at + 4);
    if (type === 3) out.writeUInt16LE(value, at + 8);
    else out.writeUInt32LE(value, at + 8);
  });
  out.writeUInt32LE(0, headerSize + 2 + entryCount * 12);
  for (const off of [rationalAt, rationalAt + 8]) {
    out.writeUInt32LE(res.num, off);
    out.writeUInt32LE(res.den, off + 4);
  }
  pixels.copy(out, pixelsAt);
  return out;
}

/** A JFIF 1.02 APP0 segment written by hand: units 0 none, 1 dpi, 2 dots per cm. */
export function jfifSegment(units: 0 | 1 | 2, x: number, y: number): Buffer {
  const seg = Buffer.alloc(18);
  seg.writeUInt16BE(0xffe0, 0);
  seg.writeUInt16BE(16, 2);
  seg.write("JFIF\0", 4, "latin1");
  seg.writeUInt16BE(0x0102, 9);
  seg[11] = units;
  seg.writeUInt16BE(x, 12);
  seg.writeUInt16BE(y, 14);
  seg[16] = 0;
  seg[17] = 0;
  return seg;
}

/** Replaces any APP0 in a JPEG with the given one (inserted right after SOI). */
export function withJfif(jpeg: Buffer, app0: Buffer): Buffer {
  let rest = jpeg.subarray(2);
  if (rest[0] === 0xff && rest[1] === 0xe0) rest = rest.subarray(2 + rest.readUInt16BE(2));
  return Buffer.concat([jpeg.subarray(0, 2), app0, rest]);
}

/** One-page PDF with optional boxes, all in points. */
export async function makePdf(
  pages: Array<{
    media: [number, number];
    trim?: [number, number, number, number];
    bleed?: [number, number, number, number];
    rotate?: number;
  }>,
): Promise<Uint8Array> {
  const { degrees } = await import("pdf-lib");
  const doc = await PDFDocument.create();
  for (const p of pages) {
    const page = doc.addPage(p.media);
    page.drawRectangle({ x: 0, y: 0, width: p.media[0], height: p.media[1] });
    if (p.trim) page.setTrimBox(...p.trim);
    if (p.bleed) page.setBleedBox(...p.bleed);
    if (p.rotate) page.setRotation(degrees(p.rotate));
  }
  return doc.save({ useObjectStreams: false });
}

/** A hand-written one-page PDF whose trailer names an /Encrypt dictionary. */
export function encryptedPdf(): Buffer {
  const objects = [
    "<< /Type /Catalog /Pages 2 0 R >>",
    "<< /Type /Pages /Kids [3 0 R] /Count 1 >>",
    "<< /Type /Page /Parent 2 0 R /MediaBox [0 0 396 612] >>",
    "<< /Filter /Standard /V 1 /R 2 /O <00112233445566778899aabbccddeeff00112233445566778899aabbccddeeff> /U <00112233445566778899aabbccddeeff00112233445566778899aabbccddeeff> /P -44 >>",
  ];
  let body = "%PDF-1.4\n";
  const offsets: number[] = [];
  objects.forEach((o, i) => {
    offsets.push(body.length);
    body += `${i + 1} 0 obj\n${o}\nendobj\n`;
  });
  const xrefAt = body.length;
  body += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n`;
  for (const off of offsets) body += `${String(off).padStart(10, "0")} 00000 n \n`;
  body += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R /Encrypt 4 0 R /ID [<0123456789abcdef0123456789abcdef> <0123456789abcdef0123456789abcdef>] >>\nstartxref\n${xrefAt}\n%%EOF\n`;
  return Buffer.from(body, "latin1");
}
