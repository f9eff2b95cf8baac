/**
 * The API as the file system declares it: every `app/api/**\/route.ts` and the HTTP methods it
 * exports. The access matrix and the JSON fuzzer start from this list, so a new route or method
 * cannot slip past them: it has no entry in their tables and they fail.
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative, sep } from "node:path";

export const HTTP_METHODS = ["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"] as const;
export type HttpMethod = (typeof HTTP_METHODS)[number];

export type ApiRoute = {
  /** URL pattern as the folders spell it, e.g. `/api/sessions/[sessionId]/results`. */
  path: string;
  /** Import specifier for the handler module. */
  module: string;
  methods: HttpMethod[];
  /** Methods whose handler reads a JSON body (calls `readJson`). */
  jsonMethods: HttpMethod[];
};

/** Methods whose own `export const METHOD = …` block calls readJson. */
export function jsonReadingMethods(source: string): HttpMethod[] {
  const starts = [...source.matchAll(/export\s+(?:const|async\s+function|function)\s+([A-Z]+)\b/g)];
  return starts
    .filter((m, i) => /\breadJson\s*\(/.test(source.slice(m.index, starts[i + 1]?.index ?? source.length)))
    .map((m) => m[1] as HttpMethod)
    .filter((m) => (HTTP_METHODS as readonly string[]).includes(m));
}

/** Exported method names, whichever way the module writes the export. */
export function exportedMethods(source: string): HttpMethod[] {
  const found = new Set<HttpMethod>();
  const isMethod = (name: string): name is HttpMethod => (HTTP_METHODS as readonly string[]).includes(name);
  for (const m of source.matchAll(/export\s+(?:const|let|var|async\s+function|function)\s+([A-Z]+)\b/g)) {
    if (isMethod(m[1])) found.add(m[1]);
  }
  // `export { handler as GET, handler as POST }` and `export { GET }`
  for (const block of source.matchAll(/export\s*\{([^}]*)\}/g)) {
    for (const part of block[1].split(",")) {
      const name =
        part
          .trim()
          .split(/\s+as\s+/)
          .pop()
          ?.trim() ?? "";
      if (isMethod(name)) found.add(name);
    }
  }
  return HTTP_METHODS.filter((m) => found.has(m));
}

export function discoverApiRoutes(root = process.cwd()): ApiRoute[] {
  const apiDir = join(root, "app", "api");
  const files: string[] = [];
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir)) {
      const path = join(dir, entry);
      if (statSync(path).isDirectory()) walk(path);
      else if (/^route\.(ts|tsx|js|mjs)$/.test(entry)) files.push(path);
    }
  };
  walk(apiDir);
  return files.sort().map((file) => {
    const source = readFileSync(file, "utf8");
    const folder = relative(join(root, "app"), file).split(sep).slice(0, -1);
    return {
      path: `/${folder.join("/")}`,
      module: `@/app/${folder.join("/")}/route`,
      methods: exportedMethods(source),
      jsonMethods: jsonReadingMethods(source),
    };
  });
}

/** "PUT /api/sessions/[sessionId]/results" for every route × exported method. */
export function routeKeys(routes: ApiRoute[]): string[] {
  return routes.flatMap((r) => r.methods.map((m) => `${m} ${r.path}`));
}
