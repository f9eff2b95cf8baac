/**
 * What the README points a newcomer at is there: every command it names is a script, every
 * picture and example file it names exists, and nothing in examples/ or docs/screenshots/ is
 * left out of it (or, for an example, out of the test that imports it).
 */
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";

const readme = readFileSync("README.md", "utf8");
const named = (pattern: RegExp) => [...new Set([...readme.matchAll(pattern)].map((m) => m[1]))].sort();

describe("README", () => {
  it("names only npm scripts that exist", () => {
    const scripts = Object.keys(JSON.parse(readFileSync("package.json", "utf8")).scripts);
    const commands = named(/npm run ([\w:-]+)/g);
    expect(commands.length).toBeGreaterThan(5);
    expect(commands.filter((c) => !scripts.includes(c))).toEqual([]);
  });

  it("shows every picture in docs/screenshots/, and only those", () => {
    const shown = named(/\(docs\/screenshots\/([\w.-]+\.png)\)/g);
    expect(shown).toEqual(readdirSync("docs/screenshots").sort());
    expect(shown.length).toBeGreaterThanOrEqual(5);
  });

  it("names every file in examples/, each imported by the examples test", () => {
    const files = readdirSync("examples").sort();
    expect(named(/`examples\/([\w.-]+\.csv)`/g)).toEqual(files);
    const test = readFileSync("tests/integration/examples.test.ts", "utf8");
    expect(files.filter((f) => !test.includes(`"${f}"`))).toEqual([]);
  });

  it("points only at files that exist", () => {
    const paths = named(/`((?:tests|scripts|lib|docs|examples|bench)\/[\w./-]+)`/g);
    expect(paths.filter((p) => !existsSync(p))).toEqual([]);
  });
});
