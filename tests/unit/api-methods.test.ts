/** The proxy's list of API methods must be exactly what the route files export. */
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { describe, expect, it } from "vitest";
import { allowedApiMethods, methodRefusal, ROUTE_METHODS } from "@/lib/api/methods";

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
    for (const part of block[1].split(","))
      found.add(
        part
          .trim()
          .split(/\s+as\s+/)
          .pop()!
          .trim(),
      );
  }
  return METHODS.filter((m) => found.has(m));
}

describe("API methods", () => {
  it("lists every route file with the methods it exports", () => {
    const actual = Object.fromEntries(
      routeFiles(apiDir).map((file) => [
        relative(apiDir, file).replace(/\/?route\.ts$/, ""),
        exportedMethods(readFileSync(file, "utf8")),
      ]),
    );
    const listed = Object.fromEntries(
      Object.entries(ROUTE_METHODS).map(([route, methods]) => [route, [...methods].sort()]),
    );
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

  it("refuses what an address does not take, in the API's error shape on the API", () => {
    expect(methodRefusal("GET", "/api/me")).toBeNull();
    expect(methodRefusal("PATCH", "/api/me")).toMatchObject({
      status: 405,
      allow: ["GET", "HEAD", "OPTIONS"],
      contentType: "application/json",
    });
    expect(JSON.parse(methodRefusal("TRACE", "/api/me")!.body).error.code).toBe("method_not_allowed");
    expect(methodRefusal("GET", "/api/nothing-here")).toMatchObject({ status: 404, allow: null });
    expect(methodRefusal("TRACE", "/sign-in")).toMatchObject({
      status: 405,
      allow: ["GET", "HEAD"],
      contentType: expect.stringContaining("text/plain"),
    });
    expect(methodRefusal("POST", "/sessions/4")).toMatchObject({ status: 405 });
    // A server action posts to its page; Next.js's own addresses answer for themselves.
    expect(methodRefusal("POST", "/sessions/4", { serverAction: true })).toBeNull();
    expect(methodRefusal("POST", "/api/me", { serverAction: true })).toMatchObject({ status: 405 });
    expect(methodRefusal("POST", "/_next/static/chunks/x.js")).toBeNull();
  });
});
