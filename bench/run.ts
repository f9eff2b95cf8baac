/**
 * Runs every `bench/*.bench.ts` (see harness.ts), prints a table and writes
 * `bench/results/latest.json` and the same table in Markdown, `bench/results/latest.md`.
 *
 *   npm run bench            # all benchmark files
 *   npm run bench -- stats   # only files whose name contains "stats"
 *
 * A filtered run merges its results into latest.json (same names replaced,
 * others kept); a full run rewrites it.
 */
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { cpus } from "node:os";
import { basename, dirname, join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import {
  type BenchModule,
  type BenchResult,
  discoverBenchFiles,
  formatMarkdown,
  formatTable,
  verdict,
} from "./harness";

const benchDir = dirname(fileURLToPath(import.meta.url));
const resultsFile = join(benchDir, "results", "latest.json");
const markdownFile = join(benchDir, "results", "latest.md");

async function main(): Promise<void> {
  const filters = process.argv.slice(2).filter((arg) => !arg.startsWith("-"));
  const files = discoverBenchFiles(benchDir, filters);
  if (files.length === 0) {
    console.error(`No bench/*.bench.ts file matches ${filters.join(", ") || "(no filter)"}.`);
    process.exitCode = 1;
    return;
  }
  const results: BenchResult[] = [];
  for (const file of files) {
    console.log(`running ${basename(file)} …`);
    try {
      results.push(...(await runFile(file)));
    } catch (error) {
      // One broken benchmark file should not hide the others' numbers.
      console.error(`${basename(file)} failed:`, error);
      process.exitCode = 1;
    }
  }
  console.log(`\n${formatTable(results)}\n`);
  const written = filters.length > 0 ? mergeWithPrevious(results) : results;
  mkdirSync(dirname(resultsFile), { recursive: true });
  writeFileSync(resultsFile, `${JSON.stringify(written, null, 2)}\n`);
  const cpu = cpus();
  const machine = `${new Date().toISOString().slice(0, 10)}, Node ${process.version}, ${cpu.length} × ${cpu[0]?.model.trim() ?? "CPU"}`;
  writeFileSync(markdownFile, formatMarkdown(written, `Benchmarks (\`npm run bench\`; ${machine})`));
  console.log(`wrote ${written.length} results to ${resultsFile} and ${markdownFile}`);
  const failed = written.filter((r) => verdict(r) === "FAIL").map((r) => r.name);
  if (failed.length) console.log(`above target: ${failed.join(", ")}`);
}

async function runFile(file: string): Promise<BenchResult[]> {
  const mod = (await import(pathToFileURL(file).href)) as Partial<BenchModule>;
  if (typeof mod.default !== "function") {
    throw new Error("it must export a default async function returning BenchResult[].");
  }
  const results = await mod.default();
  if (!Array.isArray(results)) throw new Error("its default export must resolve to an array of results.");
  return results;
}

function mergeWithPrevious(results: BenchResult[]): BenchResult[] {
  if (!existsSync(resultsFile)) return results;
  let previous: BenchResult[] = [];
  try {
    const parsed: unknown = JSON.parse(readFileSync(resultsFile, "utf8"));
    if (Array.isArray(parsed)) previous = parsed as BenchResult[];
  } catch {
    // A corrupt file is simply replaced.
  }
  const fresh = new Map(results.map((r) => [r.name, r]));
  const merged = previous.map((r) => fresh.get(r.name) ?? r);
  for (const r of results) if (!previous.some((p) => p.name === r.name)) merged.push(r);
  return merged;
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});
