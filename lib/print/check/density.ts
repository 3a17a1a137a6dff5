/**
 * Declared density read straight from the file header, because sharp rounds it (a PNG written
 * at 11811 px/m reads 300, not 299.9994) and reports 72 when the file declares none.
 * - PNG pHYs (ISO/IEC 15948 §11.3.5.3): x, y pixels per unit (4 bytes each), unit 0 = aspect
 *   ratio only, 1 = metre.
 * - JFIF APP0 (JFIF 1.02 p. 5): units 0 = aspect ratio only, 1 = dots per inch, 2 = per cm.
 * - TIFF and Exif IFD0 (TIFF 6.0): XResolution 282, YResolution 283 (RATIONAL),
 *   ResolutionUnit 296: 1 = none, 2 = inch (default), 3 = centimetre.
 *   Mind the trap: inches are 1 in JFIF but 2 in TIFF.
 */
import { ppcmToPpi, ppmToPpi } from "../units";
import type { ArtworkFormat, DeclaredDensity } from "./types";

/** The density the file declares, or null when it declares none (or we cannot read it). */
export function readDeclaredDensity(
  bytes: Uint8Array,
  format: ArtworkFormat,
): DeclaredDensity | null {
  try {
    if (format === "png") return pngDensity(bytes);
    if (format === "jpeg") return jpegDensity(bytes);
    if (format === "tiff") return tiffDensity(bytes, 0, "tiff");
  } catch {
    return null;
  }
  return null;
}

function view(bytes: Uint8Array): DataView {
  return new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
}

function pngDensity(bytes: Uint8Array): DeclaredDensity | null {
  const dv = view(bytes);
  let offset = 8;
  while (offset + 8 <= bytes.length) {
    const length = dv.getUint32(offset);
    const type = String.fromCharCode(...bytes.subarray(offset + 4, offset + 8));
    if (type === "IDAT" || type === "IEND") return null; // pHYs must precede the first IDAT
    if (type === "pHYs" && length === 9 && offset + 17 <= bytes.length) {
      const x = dv.getUint32(offset + 8);
      const y = dv.getUint32(offset + 12);
      const unit = bytes[offset + 16];
      if (unit === 1)
        return { xPpi: ppmToPpi(x), yPpi: ppmToPpi(y), source: "png-phys", unit: "metre" };
      return { xPpi: null, yPpi: null, source: "png-phys", unit: "none" };
    }
    offset += 12 + length;
  }
  return null;
}

function jpegDensity(bytes: Uint8Array): DeclaredDensity | null {
  const dv = view(bytes);
  let offset = 2;
  let exif: DeclaredDensity | null = null;
  let jfifAspectOnly: DeclaredDensity | null = null;
  while (offset + 4 <= bytes.length) {
    if (bytes[offset] !== 0xff) return exif ?? jfifAspectOnly;
    const marker = bytes[offset + 1] ?? 0;
    if (marker === 0xff) {
      offset += 1; // fill byte
      continue;
    }
    if (marker === 0xda || marker === 0xd9) break; // start of scan or end: no more headers
    const length = dv.getUint16(offset + 2);
    const start = offset + 4;
    if (
      marker === 0xe0 &&
      ascii(bytes, start, start + 5) === "JFIF\0" &&
      start + 12 <= bytes.length
    ) {
      const units = bytes[start + 7];
      const x = dv.getUint16(start + 8);
      const y = dv.getUint16(start + 10);
      if (units === 1) return { xPpi: x, yPpi: y, source: "jfif", unit: "inch" };
      if (units === 2)
        return { xPpi: ppcmToPpi(x), yPpi: ppcmToPpi(y), source: "jfif", unit: "cm" };
      jfifAspectOnly = { xPpi: null, yPpi: null, source: "jfif", unit: "none" };
    }
    if (marker === 0xe1 && ascii(bytes, start, start + 6) === "Exif\0\0" && exif === null) {
      exif = tiffDensity(bytes.subarray(start + 6, offset + 2 + length), 0, "exif");
    }
    offset += 2 + length;
  }
  // Exif densities with a real unit beat a JFIF aspect ratio.
  if (exif && exif.unit !== "none") return exif;
  return jfifAspectOnly ?? exif;
}

function ascii(bytes: Uint8Array, start: number, end: number): string {
  return String.fromCharCode(...bytes.subarray(start, Math.min(end, bytes.length)));
}

function tiffDensity(
  bytes: Uint8Array,
  base: number,
  source: "tiff" | "exif",
): DeclaredDensity | null {
  const dv = view(bytes);
  const little = bytes[base] === 0x49;
  if (dv.getUint16(base + 2, little) !== 42) return null; // BigTIFF and others: not read here
  const ifd = base + dv.getUint32(base + 4, little);
  const count = dv.getUint16(ifd, little);
  let x: number | null = null;
  let y: number | null = null;
  let unitCode = 2; // TIFF 6.0: ResolutionUnit default is 2 (inch)
  for (let i = 0; i < count; i++) {
    const entry = ifd + 2 + i * 12;
    if (entry + 12 > bytes.length) break;
    const tag = dv.getUint16(entry, little);
    const type = dv.getUint16(entry + 2, little);
    if ((tag === 282 || tag === 283) && type === 5) {
      const at = base + dv.getUint32(entry + 8, little);
      const den = dv.getUint32(at + 4, little);
      const value = den === 0 ? null : dv.getUint32(at, little) / den;
      if (tag === 282) x = value;
      else y = value;
    } else if (tag === 296 && type === 3) {
      unitCode = dv.getUint16(entry + 8, little);
    }
  }
  if (x === null && y === null) return null;
  if (unitCode === 2) return { xPpi: x, yPpi: y ?? x, source, unit: "inch" };
  if (unitCode === 3)
    return {
      xPpi: x === null ? null : ppcmToPpi(x),
      yPpi: ppcmToPpi(y ?? x ?? 0),
      source,
      unit: "cm",
    };
  return { xPpi: null, yPpi: null, source, unit: "none" };
}
