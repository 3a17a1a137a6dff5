/**
 * Whether a state-changing request comes from this site, by the headers a browser sets and a
 * page cannot forge: `Sec-Fetch-Site` (W3C Fetch Metadata Request Headers) and `Origin`
 * (RFC 6454 §7; the Fetch standard sends it on every non-GET request). A request with neither
 * header is not from a browser page, so it carries no victim's cookies and is let through.
 */
export interface RequestOriginFacts {
  method: string;
  origin: string | null;
  secFetchSite: string | null;
  /** The origins this app is reached at, e.g. "http://localhost:3000". */
  ownOrigins: readonly string[];
}

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

export function isSameSiteRequest(facts: RequestOriginFacts): boolean {
  if (SAFE_METHODS.has(facts.method.toUpperCase())) return true;
  const site = facts.secFetchSite?.trim().toLowerCase();
  // "none" is a request the person started themselves (typed URL, bookmark), never a page's.
  if (site && site !== "same-origin" && site !== "none") return false;
  if (facts.origin === null) return true;
  const origin = facts.origin.trim().toLowerCase();
  // "null" is what sandboxed frames, data: URLs and some redirects send: never this site.
  if (origin === "null") return false;
  return facts.ownOrigins.some((own) => {
    try {
      return new URL(own).origin.toLowerCase() === origin;
    } catch {
      return false;
    }
  });
}
