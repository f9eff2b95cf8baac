/**
 * Benchmarks for lib/stats.
 *
 * - stats-paired-n30-us: one full pairedChange on 30 pairs (validation, two
 *   passes, t quantile, p-value), microseconds per call.
 * - stats-paired-n10000-ratio: pairedChange on 10 000 pairs divided by a bare
 *   Float64Array loop that computes only the mean and SD of the differences.
 *   Target ≤ 3.
 */
import { pairedChange } from "../lib/stats";
import { type BenchResult, compare, measure, seededRandom } from "./harness";

function squad(n: number, seed: number): { pre: number[]; post: number[] } {
  const random = seededRandom(seed);
  const pre: number[] = new Array(n);
  const post: number[] = new Array(n);
  for (let i = 0; i < n; i++) {
    pre[i] = 40 + 8 * (random() - 0.5); // CMJ-like heights, cm
    post[i] = pre[i] + 1 + 2 * (random() - 0.5);
  }
  return { pre, post };
}

/** The least work that yields the same mean and SD of the differences. */
function bareMeanSd(pre: Float64Array, post: Float64Array): number {
  const n = pre.length;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += post[i] - pre[i];
  const mean = sum / n;
  let ss = 0;
  for (let i = 0; i < n; i++) {
    const dev = post[i] - pre[i] - mean;
    ss += dev * dev;
  }
  return mean + Math.sqrt(ss / (n - 1));
}

export default async function statsBench(): Promise<BenchResult[]> {
  const small = squad(30, 1);
  const n30 = measure(() => pairedChange(small.pre, small.post), { minTimeMs: 400 });

  const large = squad(10_000, 2);
  const pre64 = Float64Array.from(large.pre);
  const post64 = Float64Array.from(large.post);
  // Interleaved, so that load from other processes affects both sides alike.
  const vs = compare(
    () => pairedChange(large.pre, large.post),
    () => bareMeanSd(pre64, post64),
    {
      minTimeMs: 1000,
    },
  );
  const { ratio, fn: full, baseline: bare } = vs;

  return [
    {
      name: "stats-paired-n30-us",
      value: n30.medianNs / 1000,
      unit: "us",
      detail: `median of ${n30.samples} samples × ${n30.callsPerSample} calls`,
    },
    {
      name: "stats-paired-n10000-ratio",
      value: ratio,
      unit: "×",
      baseline: bare.medianNs / 1000,
      baselineUnit: "us",
      ratio,
      target: 3,
      detail: `pairedChange ${(full.medianNs / 1000).toFixed(1)} us vs bare Float64Array loop ${(bare.medianNs / 1000).toFixed(1)} us`,
    },
  ];
}
