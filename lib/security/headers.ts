/**
 * The security headers every page answers with. Pure: the proxy passes in the nonce, whether this
 * is a development server, the upload host the browser sends files to, and whether the request
 * came over https.
 *
 * The script policy is a per-request nonce with 'strict-dynamic' (CSP Level 3, W3C, §8.2
 * "Usage of 'strict-dynamic'"): the framework's own scripts carry the nonce and the chunks they
 * load inherit the trust; no inline script runs without it. Styles keep 'unsafe-inline' because
 * React writes style attributes (progress bars, drag previews); the brief forbids it for scripts only.
 */

export interface HeaderContext {
  /** A fresh random value per request (base64). */
  nonce: string;
  /** `next dev` evaluates code for fast refresh and needs 'unsafe-eval'. */
  development: boolean;
  /** Origins outside this one the browser may connect to: the upload host's ingest URL. */
  connectOrigins: readonly string[];
  /** HSTS only makes sense, and is only honoured, over https (RFC 6797 §7.2). */
  https: boolean;
}

/** The Content-Security-Policy value. */
export function contentSecurityPolicy(ctx: HeaderContext): string {
  const script = [`'self'`, `'nonce-${ctx.nonce}'`, `'strict-dynamic'`];
  if (ctx.development) script.push(`'unsafe-eval'`);
  const connect = [`'self'`, ...new Set(ctx.connectOrigins)];
  if (ctx.development) connect.push("ws:");
  const directives: Record<string, string[]> = {
    "default-src": [`'self'`],
    "script-src": script,
    "style-src": [`'self'`, `'unsafe-inline'`],
    "img-src": [`'self'`, "blob:", "data:"],
    "font-src": [`'self'`],
    "connect-src": connect,
    "worker-src": [`'self'`, "blob:"],
    "object-src": [`'none'`],
    "base-uri": [`'self'`],
    "form-action": [`'self'`],
    // Nobody may frame Quireline (clickjacking); CSP Level 3 §7.1 frame-ancestors.
    "frame-ancestors": [`'none'`],
  };
  const parts = Object.entries(directives).map(([name, values]) => `${name} ${values.join(" ")}`);
  if (ctx.https) parts.push("upgrade-insecure-requests");
  return parts.join("; ");
}

/** Every security header, CSP included, as name → value. */
export function securityHeaders(ctx: HeaderContext): Record<string, string> {
  const headers: Record<string, string> = {
    "Content-Security-Policy": contentSecurityPolicy(ctx),
    "Referrer-Policy": "strict-origin-when-cross-origin",
    "X-Content-Type-Options": "nosniff",
    // The older header for browsers without frame-ancestors.
    "X-Frame-Options": "DENY",
    // Quireline uses none of these device features.
    "Permissions-Policy": "camera=(), microphone=(), geolocation=(), payment=(), usb=()",
    "Cross-Origin-Opener-Policy": "same-origin",
  };
  if (ctx.https) headers["Strict-Transport-Security"] = "max-age=31536000; includeSubDomains";
  return headers;
}

/** The origin (scheme://host:port) of a URL, or null when it is not one. */
export function originOf(url: string | undefined | null): string | null {
  if (!url) return null;
  try {
    const origin = new URL(url).origin;
    return origin === "null" ? null : origin;
  } catch {
    return null;
  }
}
