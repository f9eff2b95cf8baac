/**
 * The layers point one way: app → components → hooks → lib → db. A module may import from its
 * own layer and the layers to its right, never to its left; browser modules never import the
 * database or the server-only parts of lib (type-only imports are erased and allowed).
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";
import { describe, expect, it } from "vitest";

const root = join(__dirname, "..", "..");
const LAYERS = ["app", "components", "hooks", "lib", "db"] as const;
type Layer = (typeof LAYERS)[number];

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return sourceFiles(path);
    return /\.(ts|tsx)$/.test(name) && !name.endsWith(".d.ts") ? [path] : [];
  });
}

type Import = { target: string; typeOnly: boolean };

/** Every project import (`@/…` or relative), resolved to a path from the repository root. */
function importsOf(file: string): Import[] {
  const text = readFileSync(file, "utf8");
  const found: Import[] = [];
  for (const m of text.matchAll(/^(?:import|export)\s+(type\s+)?[^;]*?from\s+"([^"]+)"/gms)) {
    const spec = m[2];
    let target: string | null = null;
    if (spec.startsWith("@/")) target = spec.slice(2);
    else if (spec.startsWith(".")) target = relative(root, join(file, "..", spec));
    if (target) found.push({ target, typeOnly: Boolean(m[1]) });
  }
  return found;
}

const layerOf = (path: string): Layer | null => LAYERS.find((l) => path === l || path.startsWith(`${l}/`)) ?? null;
const isClient = (file: string) => /^["']use client["']/.test(readFileSync(file, "utf8").trimStart());
// lib/auth/password (hashing for the seed script) and lib/auth/permissions (the role rules the
// screens share) are plain modules; the rest of lib/auth is the server's gate.
const PLAIN_AUTH = "(?!password|permissions)";
const SERVER_ONLY = [/^db\//, /^lib\/data\//, new RegExp(`^lib/auth/${PLAIN_AUTH}`), /^lib\/api\//];

const files = LAYERS.flatMap((layer) => sourceFiles(join(root, layer))).map((f) => ({
  abs: f,
  rel: relative(root, f),
}));

describe("layers", () => {
  it("finds the source tree", () => {
    expect(files.length).toBeGreaterThan(100);
  });

  it("every import points to the same layer or one to its right", () => {
    const wrong: string[] = [];
    for (const file of files) {
      const from = layerOf(file.rel)!;
      for (const { target } of importsOf(file.abs)) {
        const to = layerOf(target);
        // db/schema builds its columns from the plain domain module; nothing else in db reaches up.
        if (from === "db" && target === "lib/domain") continue;
        if (to && LAYERS.indexOf(to) < LAYERS.indexOf(from)) wrong.push(`${file.rel} → ${target}`);
      }
    }
    expect(wrong).toEqual([]);
  });

  it("browser modules import no database or server-only module at run time", () => {
    const wrong: string[] = [];
    for (const file of files.filter((f) => isClient(f.abs))) {
      for (const { target, typeOnly } of importsOf(file.abs)) {
        if (!typeOnly && SERVER_ONLY.some((p) => p.test(target))) wrong.push(`${file.rel} → ${target}`);
      }
    }
    expect(wrong).toEqual([]);
  });

  it("the data layer, the auth gate and the database client are marked server-only", () => {
    const guarded = files.filter((f) => new RegExp(`^(lib/data/|db/client\\.ts$|lib/auth/${PLAIN_AUTH})`).test(f.rel));
    expect(guarded.length).toBeGreaterThan(10);
    const unmarked = guarded
      .filter((f) => !/^import "server-only";$/m.test(readFileSync(f.abs, "utf8")))
      .map((f) => f.rel);
    expect(unmarked).toEqual([]);
  });

  it("the data layer does not import the HTTP layer", () => {
    const wrong = files
      .filter((f) => f.rel.startsWith("lib/data/"))
      .flatMap((f) =>
        importsOf(f.abs)
          .filter((i) => i.target.startsWith("lib/api/"))
          .map((i) => `${f.rel} → ${i.target}`),
      );
    expect(wrong).toEqual([]);
  });

  it("no two modules of lib import each other", () => {
    const graph = new Map<string, Set<string>>();
    for (const f of files.filter((x) => x.rel.startsWith("lib/"))) {
      graph.set(f.rel.replace(/\.tsx?$/, ""), new Set(importsOf(f.abs).map((i) => i.target.replace(/\.tsx?$/, ""))));
    }
    const cycles: string[] = [];
    for (const [a, targets] of graph)
      for (const b of targets) if (a < b && graph.get(b)?.has(a)) cycles.push(`${a} ↔ ${b}`);
    expect(cycles).toEqual([]);
  });
});
