/** File type from magic bytes, and from a declared name or media type, so the two can be compared. */
import { FORMAT_NAMES, type ArtworkFormat } from "./types";

function startsWith(bytes: Uint8Array, signature: readonly number[], offset = 0): boolean {
  if (bytes.length < offset + signature.length) return false;
  return signature.every((b, i) => bytes[offset + i] === b);
}

function ascii(bytes: Uint8Array, start: number, end: number): string {
  return String.fromCharCode(...bytes.subarray(start, Math.min(end, bytes.length)));
}

/** The format the bytes say, whatever the file is called. */
export function sniffFormat(bytes: Uint8Array): ArtworkFormat {
  if (bytes.length === 0) return "empty";
  // PNG signature (ISO/IEC 15948 §5.2): 89 50 4E 47 0D 0A 1A 0A.
  if (startsWith(bytes, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return "png";
  // JPEG SOI marker followed by another marker.
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return "jpeg";
  // TIFF byte-order mark and 42 (TIFF 6.0 header); 43 is BigTIFF.
  if (startsWith(bytes, [0x49, 0x49, 0x2a, 0x00]) || startsWith(bytes, [0x4d, 0x4d, 0x00, 0x2a]))
    return "tiff";
  if (startsWith(bytes, [0x49, 0x49, 0x2b, 0x00]) || startsWith(bytes, [0x4d, 0x4d, 0x00, 0x2b]))
    return "tiff";
  if (ascii(bytes, 0, 4) === "RIFF" && ascii(bytes, 8, 12) === "WEBP") return "webp";
  // ISO 32000-1 §7.5.2: the header is "%PDF-"; readers accept it within the first 1024 bytes.
  const head = ascii(bytes, 0, 1024);
  if (head.includes("%PDF-")) return "pdf";
  if (head.startsWith("GIF87a") || head.startsWith("GIF89a")) return "gif";
  if (head.startsWith("BM")) return "bmp";
  if (head.startsWith("8BPS")) return "psd";
  if (
    ascii(bytes, 4, 8) === "ftyp" &&
    /^(heic|heix|hevc|mif1|msf1|avif|heif)/.test(ascii(bytes, 8, 12))
  )
    return "heif";
  if (startsWith(bytes, [0x50, 0x4b, 0x03, 0x04])) return "zip";
  const text = head.trimStart().toLowerCase();
  if (text.startsWith("<svg") || (text.startsWith("<?xml") && text.includes("<svg"))) return "svg";
  return "unknown";
}

const EXTENSIONS: Record<string, ArtworkFormat> = {
  png: "png",
  jpg: "jpeg",
  jpeg: "jpeg",
  jpe: "jpeg",
  jfif: "jpeg",
  tif: "tiff",
  tiff: "tiff",
  webp: "webp",
  pdf: "pdf",
  gif: "gif",
  bmp: "bmp",
  heic: "heif",
  heif: "heif",
  avif: "heif",
  psd: "psd",
  svg: "svg",
  zip: "zip",
};

const MEDIA_TYPES: Record<string, ArtworkFormat> = {
  "image/png": "png",
  "image/jpeg": "jpeg",
  "image/jpg": "jpeg",
  "image/pjpeg": "jpeg",
  "image/tiff": "tiff",
  "image/webp": "webp",
  "application/pdf": "pdf",
  "image/gif": "gif",
  "image/bmp": "bmp",
  "image/heic": "heif",
  "image/heif": "heif",
  "image/avif": "heif",
  "image/vnd.adobe.photoshop": "psd",
  "image/svg+xml": "svg",
  "application/zip": "zip",
};

/** The format a file name's extension claims, if it names one we know. */
export function formatFromFilename(filename: string): ArtworkFormat | undefined {
  const dot = filename.lastIndexOf(".");
  if (dot === -1) return undefined;
  return EXTENSIONS[filename.slice(dot + 1).toLowerCase()];
}

/** The format a media type claims, if we know it. */
export function formatFromMimeType(mimeType: string): ArtworkFormat | undefined {
  return MEDIA_TYPES[mimeType.split(";")[0]?.trim().toLowerCase() ?? ""];
}

/** Upper-case name of a format for messages. */
export function formatName(format: ArtworkFormat): string {
  return FORMAT_NAMES[format];
}
