// Streaming multipart/form-data parser: writes the "file" part straight to disk.

import { createHash } from "node:crypto";
import { createWriteStream, rmSync } from "node:fs";

import { BadRequestError } from "./http.mjs";

function boundaryOf(contentType) {
  const m = /boundary=(?:"([^"]+)"|([^;]+))/i.exec(contentType ?? "");
  return m ? (m[1] ?? m[2]).trim() : null;
}

function parsePartHeaders(text) {
  const headers = {};
  for (const line of text.split("\r\n")) {
    const i = line.indexOf(":");
    if (i > 0) headers[line.slice(0, i).trim().toLowerCase()] = line.slice(i + 1).trim();
  }
  const cd = headers["content-disposition"] ?? "";
  const name = /\bname="([^"]*)"/i.exec(cd)?.[1] ?? /\bname=([^;]+)/i.exec(cd)?.[1] ?? null;
  const filenameStar = /\bfilename\*=(?:UTF-8'')?([^;]+)/i.exec(cd)?.[1];
  let filename = /\bfilename="([^"]*)"/i.exec(cd)?.[1] ?? null;
  if (filenameStar) {
    try {
      filename = decodeURIComponent(filenameStar);
    } catch {
      /* keep the plain filename */
    }
  }
  return { name, filename, contentType: headers["content-type"] ?? null };
}

/**
 * Read a multipart body from `req`, streaming the part named `field` into `destPath`.
 * Stops writing (but keeps counting) once `maxBytes` is exceeded.
 * @returns {Promise<{size: number, md5: string, filename: string|null, contentType: string|null} | null>}
 */
export async function receiveMultipartFile(req, { field, destPath, maxBytes }) {
  const boundary = boundaryOf(req.headers["content-type"]);
  if (!boundary || !/^multipart\/form-data/i.test(req.headers["content-type"] ?? "")) {
    throw new BadRequestError("expected a multipart/form-data body");
  }
  const delim = Buffer.from(`\r\n--${boundary}`);
  const headerEnd = Buffer.from("\r\n\r\n");
  // Prefix CRLF so the first delimiter matches like every later one.
  let buf = Buffer.from("\r\n");
  let state = "preamble"; // preamble | afterDelim | headers | body | done
  let part = null; // {isFile, out?, hash?, size}
  let result = null;
  let out = null;
  let outError = null;

  const openOut = () => {
    outError = null;
    out = createWriteStream(destPath, { highWaterMark: 4 * 1024 * 1024 });
    out.on("error", (err) => {
      outError = err;
    });
  };

  const waitFor = (event) =>
    new Promise((res, rej) => {
      if (outError) return rej(outError);
      const onEvent = () => {
        out.off("error", onError);
        res();
      };
      const onError = (err) => {
        out.off(event, onEvent);
        rej(err);
      };
      out.once(event, onEvent);
      out.once("error", onError);
    });

  const writeOut = async (chunk) => {
    if (!part || !part.isFile || chunk.length === 0) return;
    part.size += chunk.length;
    part.hash.update(chunk);
    if (part.size > maxBytes) {
      part.tooLarge = true;
      return;
    }
    if (outError) throw outError;
    if (!out.write(chunk)) await waitFor("drain");
  };

  const finishPart = async () => {
    if (part && part.isFile && !result) {
      const finished = waitFor("finish");
      out.end();
      await finished;
      result = {
        size: part.size,
        md5: part.hash.digest("hex"),
        filename: part.filename,
        contentType: part.contentType,
        tooLarge: Boolean(part.tooLarge),
      };
      out = null;
    }
    part = null;
  };

  try {
    for await (const chunk of req) {
      buf = buf.length ? Buffer.concat([buf, chunk]) : chunk;
      let progressed = true;
      while (progressed && state !== "done") {
        progressed = false;
        if (state === "preamble") {
          const i = buf.indexOf(delim);
          if (i >= 0) {
            buf = buf.subarray(i + delim.length);
            state = "afterDelim";
            progressed = true;
          } else if (buf.length > delim.length) {
            buf = buf.subarray(buf.length - delim.length);
          }
        } else if (state === "afterDelim") {
          if (buf.length < 2) break;
          if (buf[0] === 0x2d && buf[1] === 0x2d) {
            state = "done";
            break;
          }
          const eol = buf.indexOf("\r\n");
          if (eol < 0) {
            if (buf.length > 1024) throw new BadRequestError("malformed multipart delimiter line");
            break;
          }
          buf = buf.subarray(eol + 2);
          state = "headers";
          progressed = true;
        } else if (state === "headers") {
          const i = buf.indexOf(headerEnd);
          if (i < 0) {
            if (buf.length > 16 * 1024)
              throw new BadRequestError("multipart part headers too large");
            break;
          }
          const info = parsePartHeaders(buf.subarray(0, i).toString("utf8"));
          buf = buf.subarray(i + headerEnd.length);
          const isFile = info.name === field && !result;
          part = { ...info, isFile, size: 0, hash: isFile ? createHash("md5") : null };
          if (isFile) openOut();
          state = "body";
          progressed = true;
        } else if (state === "body") {
          const i = buf.indexOf(delim);
          if (i >= 0) {
            await writeOut(buf.subarray(0, i));
            buf = buf.subarray(i + delim.length);
            await finishPart();
            state = "afterDelim";
            progressed = true;
          } else {
            const safe = buf.length - (delim.length - 1);
            if (safe > 0) {
              await writeOut(buf.subarray(0, safe));
              buf = Buffer.from(buf.subarray(safe));
            }
          }
        }
      }
    }
  } finally {
    if (out) {
      out.destroy();
      out = null;
    }
  }
  if (state !== "done") {
    rmSync(destPath, { force: true });
    throw new BadRequestError("multipart body ended before the closing boundary");
  }
  return result;
}
