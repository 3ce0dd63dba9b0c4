// Reads the routes the app has: files under src/pages (with the methods each exports) and the
// route list of the built server, which also holds routes that integrations inject.
import fs from "node:fs";
import path from "node:path";

export const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
export type Method = (typeof METHODS)[number];

const ROUTE_FILE = /\.(astro|md|mdx|html|ts|js|mjs)$/;

export interface RouteFile {
  file: string;
  route: string;
  methods: Method[];
}

/** src/pages/api/admin/users/[id]/index.ts → /api/admin/users/[id]; [id].html.ts → [id].html. */
export function routeOfFile(relative: string): string {
  const withoutExt = relative.split(path.sep).join("/").replace(ROUTE_FILE, "");
  const route = `/${withoutExt}`.replace(/\/index$/, "");
  return route === "" ? "/" : route;
}

/** The HTTP methods an endpoint file exports, or a page handles. */
export function exportedMethods(source: string, file: string): Method[] {
  if (!/\.(ts|js|mjs)$/.test(file)) {
    // A page answers GET, and any other method its frontmatter tests for.
    const tested = [...source.matchAll(/Astro\.request\.method\s*===?\s*["']([A-Z]+)["']/g)];
    return METHODS.filter((m) => m === "GET" || tested.some((t) => t[1] === m));
  }
  const names = new Set<string>();
  for (const m of source.matchAll(
    /export\s+(?:const|let|var|async\s+function|function)\s+([A-Z]+)\b/g,
  ))
    names.add(m[1] ?? "");
  for (const m of source.matchAll(/export\s+(?:const|let)\s*\{([^}]*)\}/g))
    for (const n of (m[1] ?? "").split(",")) names.add(n.trim());
  for (const m of source.matchAll(/export\s*\{([^}]*)\}/g))
    for (const n of (m[1] ?? "").split(",")) names.add((n.split(/\s+as\s+/).pop() ?? "").trim());
  return METHODS.filter((method) => names.has(method) || names.has("ALL"));
}

/** Every route file; names starting with "_" are private to Astro and make no route. */
export function listRouteFiles(pagesDir: string): RouteFile[] {
  const out: RouteFile[] = [];
  for (const entry of fs.readdirSync(pagesDir, { recursive: true, withFileTypes: true })) {
    if (!entry.isFile() || !ROUTE_FILE.test(entry.name)) continue;
    const full = path.join(entry.parentPath, entry.name);
    const relative = path.relative(pagesDir, full);
    if (relative.split(path.sep).some((part) => part.startsWith("_"))) continue;
    out.push({
      file: relative,
      route: routeOfFile(relative),
      methods: exportedMethods(fs.readFileSync(full, "utf8"), relative),
    });
  }
  return out.sort((a, b) => a.route.localeCompare(b.route));
}

/** The route patterns of the built server (dist/server/manifest_*.mjs). */
export function listBuiltRoutes(serverDir: string): string[] {
  const manifest = fs.readdirSync(serverDir).find((f) => /^manifest_.*\.mjs$/.test(f));
  if (!manifest) throw new Error(`no manifest in ${serverDir}: build the app first`);
  const text = fs.readFileSync(path.join(serverDir, manifest), "utf8");
  return [...new Set([...text.matchAll(/"route":"([^"]+)"/g)].map((m) => m[1] ?? ""))].sort();
}

/** Whether a concrete path fits a pattern ([x] is one segment, [...x] any rest). */
export function isPathOfRoute(samplePath: string, route: string): boolean {
  const pathname = samplePath.split("?")[0] ?? "";
  const source = route
    .split(/(\[\.\.\.[^\]]+\]|\[[^\]]+\])/)
    .map((part) =>
      part.startsWith("[...")
        ? ".+"
        : part.startsWith("[")
          ? "[^/]+"
          : part.replace(/[.*+?^${}()|\\]/g, "\\$&"),
    )
    .join("");
  return new RegExp(`^${source}$`).test(pathname);
}
