/** The proxy's list of API methods must be exactly what the route files export. */
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { describe, expect, it } from "vitest";
import { allowedApiMethods, ROUTE_METHODS } from "@/lib/api/methods";

const apiDir = join(__dirname, "..", "..", "app", "api");
const METHODS = ["GET", "HEAD", "OPTIONS", "POST", "PUT", "PATCH", "DELETE"];

function routeFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return routeFiles(path);
    return name === "route.ts" ? [path] : [];
  });
}

/** `export const GET = …`, `export async function GET`, `export { handler as GET }`. */
function exportedMethods(source: string): string[] {
  const found = new Set<string>();
  for (const m of source.matchAll(/export\s+(?:const|async\s+function|function)\s+([A-Z]+)\b/g)) found.add(m[1]);
  for (const block of source.matchAll(/export\s*\{([^}]*)\}/g)) {
    for (const part of block[1].split(",")) found.add(part.trim().split(/\s+as\s+/).pop()!.trim());
  }
  return METHODS.filter((m) => found.has(m));
}

describe("API methods", () => {
  it("lists every route file with the methods it exports", () => {
    const actual = Object.fromEntries(
      routeFiles(apiDir).map((file) => [relative(apiDir, file).replace(/\/?route\.ts$/, ""), exportedMethods(readFileSync(file, "utf8"))]),
    );
    const listed = Object.fromEntries(Object.entries(ROUTE_METHODS).map(([route, methods]) => [route, [...methods].sort()]));
    const sorted = Object.fromEntries(Object.entries(actual).map(([route, methods]) => [route, [...methods].sort()]));
    expect(listed).toEqual(sorted);
  });

  it("answers with the Allow list Next.js would give: HEAD with GET, OPTIONS always", () => {
    expect(allowedApiMethods("/api/me")).toEqual(["GET", "HEAD", "OPTIONS"]);
    expect(allowedApiMethods("/api/sessions/12/results")).toEqual(["OPTIONS", "PUT"]);
    expect(allowedApiMethods("/api/tests/3")).toEqual(["DELETE", "GET", "HEAD", "OPTIONS", "PATCH"]);
    expect(allowedApiMethods("/api/auth/callback/credentials")).toEqual(["GET", "HEAD", "OPTIONS", "POST"]);
    expect(allowedApiMethods("/api/nothing-here")).toBeNull();
    expect(allowedApiMethods("/api/sessions/12/results/extra")).toBeNull();
  });
});
