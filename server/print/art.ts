import "server-only";
/**
 * Page art as the print-file builders take it: JPEG stays JPEG, an 8-bit PNG stays PNG, a PDF
 * stays PDF, and anything else (TIFF, WebP, a 16-bit PNG, …) is converted once to PNG with sharp
 * at its full size (never scaled down; CMYK and other colour spaces become sRGB).
 */
import sharp from "sharp";
import type { ArtBytes } from "@/lib/print/pdf/types";

const startsWith = (bytes: Uint8Array, magic: number[]) => magic.every((b, i) => bytes[i] === b);

// ISO 32000-1 §7.5.2: a PDF file begins with "%PDF-".
const PDF = [0x25, 0x50, 0x44, 0x46, 0x2d];
// ISO/IEC 10918-1 (JPEG): the SOI marker FF D8, then another marker (FF).
const JPEG = [0xff, 0xd8, 0xff];
// ISO/IEC 15948 (PNG) §5.2: the eight-byte signature.
const PNG = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

/**
 * The bit depth of a PNG: the IHDR chunk comes first (PNG §5.6), its data starts at byte 16
 * (signature 8 + length 4 + type 4), and bit depth is its ninth byte (§11.2.2), byte 24.
 */
export function pngBitDepth(bytes: Uint8Array): number | null {
  if (!startsWith(bytes, PNG) || bytes.length < 26) return null;
  return bytes[24] ?? null;
}

/**
 * A Node Buffer is often a view into a shared pool (its byteOffset is not 0); pdf-lib reads the
 * underlying ArrayBuffer from the start, so such a view is copied into its own buffer first.
 */
function ownBuffer(bytes: Uint8Array): Uint8Array {
  if (bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength) return bytes;
  return new Uint8Array(bytes);
}

/** The art in a format the builders place, converting only what they cannot. */
export async function artBytesOf(
  input: Uint8Array,
  { maxPixels }: { maxPixels: number },
): Promise<ArtBytes & { converted: boolean }> {
  const bytes = ownBuffer(input);
  if (startsWith(bytes, PDF)) return { bytes, format: "pdf", converted: false };
  if (startsWith(bytes, JPEG)) return { bytes, format: "jpeg", converted: false };
  const depth = pngBitDepth(bytes);
  if (depth !== null && depth <= 8) return { bytes, format: "png", converted: false };
  // sharp writes 8 bits per channel to PNG unless told otherwise (verified by running sharp 0.35
  // on a 16-bit RGB and a 16-bit grey PNG: IHDR bit depth 8 out).
  const png = await sharp(bytes, { limitInputPixels: maxPixels }).png().toBuffer();
  return { bytes: new Uint8Array(png), format: "png", converted: true };
}
