// The app's routes as the file tree declares them: every route handler under app/api with the
// HTTP methods its module exports, and every page under /studio. Tests that must cover every
// route read them from here, so a route added without a test row fails those tests.
import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";

const ROOT = path.resolve(import.meta.dirname, "../..");
const METHODS = ["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"] as const;
export type Method = (typeof METHODS)[number];

/** Files under `dir` (relative to the project) whose name is `name`, as paths from the project root. */
function filesNamed(dir: string, name: string): string[] {
  const found: string[] = [];
  const walk = (rel: string) => {
    for (const entry of readdirSync(path.join(ROOT, rel), { withFileTypes: true })) {
      const child = path.posix.join(rel, entry.name);
      if (entry.isDirectory()) walk(child);
      else if (entry.name === name) found.push(child);
    }
  };
  walk(dir);
  return found.sort();
}

/** The URL pattern of a route file: route groups dropped, `[param]` kept as written. */
export function urlPatternOf(file: string): string {
  const dir = path.posix.dirname(file).replace(/^app/, "");
  const parts = dir.split("/").filter((p) => p && !/^\(.*\)$/.test(p));
  return `/${parts.join("/")}`;
}

/** The HTTP methods a route module exports, read from its source. */
export function methodsOf(source: string): Method[] {
  const found = new Set<Method>();
  for (const m of source.matchAll(/export\s+(?:const|async\s+function|function)\s+([A-Z]+)\b/g))
    if ((METHODS as readonly string[]).includes(m[1]!)) found.add(m[1] as Method);
  for (const m of source.matchAll(/export\s+const\s+\{([^}]*)\}/g))
    for (const name of m[1]!.split(",").map((s) =>
      s
        .trim()
        .split(/\s*:\s*/)
        .pop()!,
    ))
      if ((METHODS as readonly string[]).includes(name)) found.add(name as Method);
  return METHODS.filter((m) => found.has(m));
}

export type ApiRoute = { file: string; pattern: string; methods: Method[] };

/** Every route handler under app/api. */
export function apiRoutes(): ApiRoute[] {
  return filesNamed("app/api", "route.ts").map((file) => ({
    file,
    pattern: urlPatternOf(file),
    methods: methodsOf(readFileSync(path.join(ROOT, file), "utf8")),
  }));
}

/** Every page under /studio, as URL patterns. */
export function studioPages(): string[] {
  return filesNamed("app", "page.tsx")
    .map(urlPatternOf)
    .filter((p) => p === "/studio" || p.startsWith("/studio/"));
}

/** Fills a pattern's `[param]`s from `values`; throws naming a parameter that has no value. */
export function fillPattern(pattern: string, values: Record<string, string | number>): string {
  return pattern.replace(/\[(?:\.\.\.)?([^\]]+)\]/g, (_, name: string) => {
    if (!(name in values)) throw new Error(`no value for [${name}] in ${pattern}`);
    return encodeURIComponent(String(values[name]));
  });
}
