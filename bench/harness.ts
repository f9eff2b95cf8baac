/**
 * Tiny benchmark harness.
 *
 * Adding a benchmark: create `bench/<topic>.bench.ts` whose default export is
 * `async function (): Promise<BenchResult[]>`. `bench/run.ts` imports every
 * `*.bench.ts` in this folder (sorted by file name), runs it, prints a table
 * and writes `bench/results/latest.json`. `npm run bench -- <word>` runs only
 * the files whose name contains <word>.
 */
import { readdirSync } from "node:fs";
import { join } from "node:path";
import { mulberry32 } from "../scripts/seeded-random";

export interface BenchResult {
  /** Stable kebab-case id, e.g. "stats-paired-n30-us"; ends with its unit by convention. */
  name: string;
  value: number;
  unit: string;
  /** The reference measurement the value is compared with, in `baselineUnit` (default: unit of the timings). */
  baseline?: number;
  baselineUnit?: string;
  /** value ÷ baseline style comparison, when there is one. */
  ratio?: number;
  /** Upper bound the value should stay under. */
  target?: number;
  /** One line for humans. */
  detail?: string;
}

/** What a `*.bench.ts` file exports by default. */
export type BenchModule = { default: () => Promise<BenchResult[]> };

export interface MeasureOptions {
  /** Keep sampling until this much time has passed (default 500 ms). */
  minTimeMs?: number;
  /** Calls before timing starts, so the JIT has optimised the code (default 200). */
  warmup?: number;
  /** …and keep warming up for at least this long (default 300 ms): V8 may need several
   * deoptimise/re-optimise rounds before a long loop settles. */
  warmupMs?: number;
  /** At least this many samples (default 15). */
  minSamples?: number;
}

export interface Measurement {
  /** Median time of one call, in nanoseconds. */
  medianNs: number;
  /** Fastest sample, per call, in nanoseconds. */
  minNs: number;
  samples: number;
  callsPerSample: number;
}

/** Results are written here so the optimiser cannot drop the measured calls. */
let sink: unknown;

/** The last value a measured function returned (keeps `sink` observable). */
export function lastResult(): unknown {
  return sink;
}

/**
 * Times `fn` and returns the median per-call time over repeated samples.
 * Each sample batches enough calls to last ~1 ms, because a single
 * `process.hrtime.bigint()` reading costs tens of nanoseconds.
 */
export function measure(fn: () => unknown, options: MeasureOptions = {}): Measurement {
  const minTimeMs = options.minTimeMs ?? 500;
  const warmup = options.warmup ?? 200;
  const minSamples = options.minSamples ?? 15;
  warm(
    () => {
      sink = fn();
    },
    warmup,
    options.warmupMs ?? 300,
  );

  const callsPerSample = calibrate(fn);
  const perCall: number[] = [];
  const deadline = process.hrtime.bigint() + BigInt(Math.round(minTimeMs * 1e6));
  while (perCall.length < minSamples || process.hrtime.bigint() < deadline) {
    perCall.push(sample(fn, callsPerSample));
  }
  return summarise(perCall, callsPerSample);
}

export interface Comparison {
  /** Median over rounds of (time of fn ÷ time of baseline). */
  ratio: number;
  fn: Measurement;
  baseline: Measurement;
}

/**
 * Times `fn` against `baseline`, alternating one sample of each per round so
 * that load from other processes hits both alike; the ratio is the median of
 * the per-round ratios.
 */
export function compare(fn: () => unknown, baseline: () => unknown, options: MeasureOptions = {}): Comparison {
  const minTimeMs = options.minTimeMs ?? 500;
  const warmup = options.warmup ?? 200;
  const minSamples = options.minSamples ?? 15;
  warm(
    () => {
      sink = fn();
      sink = baseline();
    },
    warmup,
    options.warmupMs ?? 300,
  );
  const callsFn = calibrate(fn);
  const callsBase = calibrate(baseline);
  const fnTimes: number[] = [];
  const baseTimes: number[] = [];
  const ratios: number[] = [];
  const deadline = process.hrtime.bigint() + BigInt(Math.round(minTimeMs * 1e6));
  while (ratios.length < minSamples || process.hrtime.bigint() < deadline) {
    const b = sample(baseline, callsBase);
    const f = sample(fn, callsFn);
    baseTimes.push(b);
    fnTimes.push(f);
    ratios.push(f / b);
  }
  return {
    ratio: median(ratios.sort((x, y) => x - y)),
    fn: summarise(fnTimes, callsFn),
    baseline: summarise(baseTimes, callsBase),
  };
}

function warm(step: () => void, calls: number, ms: number): void {
  const until = process.hrtime.bigint() + BigInt(Math.round(ms * 1e6));
  for (let i = 0; i < calls || process.hrtime.bigint() < until; i++) step();
}

function sample(fn: () => unknown, calls: number): number {
  const start = process.hrtime.bigint();
  for (let i = 0; i < calls; i++) sink = fn();
  return Number(process.hrtime.bigint() - start) / calls;
}

function summarise(perCall: number[], callsPerSample: number): Measurement {
  const sorted = [...perCall].sort((a, b) => a - b);
  return { medianNs: median(sorted), minNs: sorted[0], samples: sorted.length, callsPerSample };
}

/**
 * Calls per sample so that one sample takes about 1 ms; the largest of three
 * estimates, so one slow (GC or JIT) reading does not shrink the batch.
 */
function calibrate(fn: () => unknown): number {
  let best = 1;
  for (let attempt = 0; attempt < 3; attempt++) best = Math.max(best, calibrateOnce(fn));
  return best;
}

function calibrateOnce(fn: () => unknown): number {
  let calls = 1;
  for (;;) {
    const elapsed = sample(fn, calls) * calls;
    if (elapsed >= 1e6 || calls >= 1 << 24) return calls;
    calls = elapsed <= 0 ? calls * 16 : Math.min(calls * 16, Math.ceil((calls * 1.05e6) / elapsed));
  }
}

function median(sorted: number[]): number {
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

/** Deterministic PRNG (mulberry32) so benchmark inputs are identical run to run. */
export const seededRandom = mulberry32;

/** The `*.bench.ts` files in `dir`, sorted, optionally only those whose name contains a filter word. */
export function discoverBenchFiles(dir: string, filters: readonly string[] = []): string[] {
  return readdirSync(dir)
    .filter((file) => file.endsWith(".bench.ts"))
    .filter((file) => filters.length === 0 || filters.some((word) => file.includes(word)))
    .sort()
    .map((file) => join(dir, file));
}

/** "pass" or "FAIL" against the target (an upper bound), or "" when the figure has none. */
export function verdict(r: BenchResult): string {
  if (r.target === undefined) return "";
  return r.value <= r.target ? "pass" : "FAIL";
}

/** The cells of one row, shared by the terminal and the Markdown table. */
function cells(r: BenchResult): string[] {
  return [
    r.name,
    formatNumber(r.value),
    r.unit,
    r.baseline === undefined ? "" : `${formatNumber(r.baseline)}${r.baselineUnit ? ` ${r.baselineUnit}` : ""}`,
    r.ratio === undefined ? "" : formatNumber(r.ratio),
    r.target === undefined ? "" : `≤ ${formatNumber(r.target)}`,
    verdict(r),
  ];
}

const HEADER = ["name", "value", "unit", "baseline", "ratio", "target", "ok"];

/** Fixed-width table of results for the terminal. */
export function formatTable(results: readonly BenchResult[]): string {
  const rows = results.map(cells);
  const widths = HEADER.map((h, i) => Math.max(h.length, ...rows.map((row) => row[i].length)));
  const line = (row: string[]) =>
    row
      .map((c, i) => c.padEnd(widths[i]))
      .join("  ")
      .trimEnd();
  return [line(HEADER), line(widths.map((w) => "-".repeat(w))), ...rows.map(line)].join("\n");
}

/** The same table in Markdown, with each figure's one-line description. */
export function formatMarkdown(results: readonly BenchResult[], heading: string): string {
  const escapePipes = (text: string) => text.replace(/\|/g, "\\|");
  const header = [...HEADER, "what"];
  const rows = results.map((r) => [...cells(r), r.detail ?? ""].map(escapePipes));
  return [
    heading,
    "",
    `| ${header.join(" | ")} |`,
    `|${header.map((_, i) => (i === 1 || i === 4 ? "---:" : "---")).join("|")}|`,
    ...rows.map((row) => `| ${row.join(" | ")} |`),
    "",
  ].join("\n");
}

function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  const abs = Math.abs(value);
  if (abs >= 1000) return value.toFixed(0);
  if (abs >= 100) return value.toFixed(1);
  if (abs >= 1) return value.toFixed(2);
  return value.toPrecision(3);
}
