// Receiving the PUT's multipart/form-data body with busboy: the "file" part streams straight
// to disk while its bytes are counted and hashed (md5, the SDK's fileHash).

import { createHash } from "node:crypto";
import { createWriteStream } from "node:fs";
import { Transform } from "node:stream";
import { pipeline } from "node:stream/promises";

import busboy from "busboy";

import { BadRequestError } from "./http.mjs";

const NOT_MULTIPART = "expected a multipart/form-data body";

/** busboy's parse errors, answered (400) in the fake's own words. */
const PARSE_ERRORS = {
  "Unexpected end of form": "multipart body ended before the closing boundary",
  "Unexpected end of file": "multipart body ended before the closing boundary",
  "Malformed part header": "malformed multipart part header (or headers over 16 KiB)",
};

/**
 * Counts and hashes every byte of the file part, passing on only the first `maxBytes`: a body
 * larger than the declared size is still read to its end, so the answer can say how large it was.
 */
function meter(maxBytes) {
  const hash = createHash("md5");
  const counted = { size: 0, tooLarge: false, md5: () => hash.digest("hex") };
  const stream = new Transform({
    transform(chunk, _encoding, callback) {
      counted.size += chunk.length;
      hash.update(chunk);
      if (counted.size > maxBytes) {
        counted.tooLarge = true;
        const room = maxBytes - (counted.size - chunk.length);
        return callback(null, room > 0 ? chunk.subarray(0, room) : undefined);
      }
      callback(null, chunk);
    },
  });
  return { stream, counted };
}

/**
 * Read a multipart body from `req`, streaming the first file part named `field` into `destPath`.
 * Stops writing (but keeps counting) once `maxBytes` is exceeded.
 * @returns {Promise<{size: number, md5: string, filename: string|null, contentType: string|null, tooLarge: boolean} | null>}
 *   null when the body has no file part named `field`
 */
export async function receiveMultipartFile(req, { field, destPath, maxBytes }) {
  if (!/^multipart\/form-data/i.test(req.headers["content-type"] ?? "")) {
    throw new BadRequestError(NOT_MULTIPART);
  }
  let parser;
  try {
    // utf8: browsers send file names as raw UTF-8 in the part headers.
    parser = busboy({ headers: req.headers, defParamCharset: "utf8" });
  } catch {
    throw new BadRequestError(NOT_MULTIPART);
  }

  /** @type {Promise<NonNullable<Awaited<ReturnType<typeof receiveMultipartFile>>>> | null} */
  let received = null;
  /** @type {import("node:fs").WriteStream | null} */
  let out = null;
  parser.on("file", (name, file, info) => {
    if (name !== field || received) {
      file.resume();
      return;
    }
    const { stream, counted } = meter(maxBytes);
    out = createWriteStream(destPath, { highWaterMark: 4 * 1024 * 1024 });
    received = pipeline(file, stream, out).then(() => ({
      size: counted.size,
      md5: counted.md5(),
      filename: info.filename ?? null,
      contentType: info.mimeType ?? null,
      tooLarge: counted.tooLarge,
    }));
    // Awaited below; a parse error rejects it too, before anyone awaits it.
    received.catch(() => {});
  });

  let parseError = null;
  parser.once("error", (err) => {
    parseError = err;
  });
  try {
    await pipeline(req, parser);
  } catch (err) {
    // Let the file's own pipeline settle, so no write is still open when the caller removes it.
    await received?.catch(() => {});
    // A stream destroyed before its file finished opening still opens (creating it) and then
    // closes: wait for that close, so the caller's removal comes after the file exists.
    if (out && !out.closed) await new Promise((resolve) => out.once("close", resolve));
    // busboy's messages about the body itself; anything else (a client that went away) is thrown as is.
    if (parseError && Object.hasOwn(PARSE_ERRORS, parseError.message))
      throw new BadRequestError(PARSE_ERRORS[parseError.message]);
    throw err;
  }
  return received ? await received : null;
}
