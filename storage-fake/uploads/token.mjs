// The token the app and the fake share, and the HMAC signatures made with its api key
// (presigned ingest URLs, signed file URLs, hook payloads).

import { createHmac, timingSafeEqual } from "node:crypto";

const SIGNATURE_PREFIX = "hmac-sha256=";

/**
 * Decode and validate an UPLOADTHING_TOKEN the same way the SDK does.
 * @param {string} token
 * @returns {{apiKey: string, appId: string, regions: string[], ingestHost: string}}
 */
export function parseToken(token) {
  if (!token || typeof token !== "string") {
    throw new Error("UPLOADTHING_TOKEN is required (the same token the app uses)");
  }
  let parsed;
  try {
    parsed = JSON.parse(Buffer.from(token.trim(), "base64").toString("utf8"));
  } catch {
    throw new Error("UPLOADTHING_TOKEN is not base64-encoded JSON");
  }
  if (!parsed || typeof parsed.apiKey !== "string" || !parsed.apiKey.startsWith("sk_")) {
    throw new Error('UPLOADTHING_TOKEN: apiKey must be a string starting with "sk_"');
  }
  if (typeof parsed.appId !== "string" || parsed.appId === "") {
    throw new Error("UPLOADTHING_TOKEN: appId must be a non-empty string");
  }
  if (!Array.isArray(parsed.regions) || parsed.regions.length === 0) {
    throw new Error("UPLOADTHING_TOKEN: regions must be a non-empty array");
  }
  return {
    apiKey: parsed.apiKey,
    appId: parsed.appId,
    regions: parsed.regions,
    ingestHost: parsed.ingestHost ?? "ingest.uploadthing.com",
  };
}

/** `hmac-sha256=<hex>` over `payload`, keyed with the api key (utf8). */
export function signPayload(payload, apiKey) {
  return SIGNATURE_PREFIX + createHmac("sha256", apiKey).update(payload).digest("hex");
}

/** Constant-time check of a `hmac-sha256=<hex>` signature. */
export function verifyPayload(payload, signature, apiKey) {
  if (typeof signature !== "string" || !signature.startsWith(SIGNATURE_PREFIX)) return false;
  const given = Buffer.from(signature.slice(SIGNATURE_PREFIX.length), "hex");
  const expected = createHmac("sha256", apiKey).update(payload).digest();
  return given.length === expected.length && timingSafeEqual(given, expected);
}

/** Constant-time string comparison. */
export function safeEqual(a, b) {
  const x = Buffer.from(String(a ?? ""));
  const y = Buffer.from(String(b ?? ""));
  return x.length === y.length && timingSafeEqual(x, y);
}
