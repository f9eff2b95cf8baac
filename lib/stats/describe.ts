/**
 * Mean and sample standard deviation in plain loops.
 *
 * Two passes (sum, then squared deviations from the mean) rather than a running
 * sum of squares: the one-pass Σx² − n·x̄² formula loses digits when scores sit
 * far from zero with small spread (e.g. sprint times of 3.05–3.15 s), and the
 * second pass costs little. No arrays are allocated, so these run in O(n)
 * with O(1) memory.
 *
 * The SD uses the n − 1 divisor throughout (METHODS.md §8); Student's 1908
 * summary used n, which is why some textbook values differ by √((n − 1)/n).
 */
import { assertSample } from "./validate";

/**
 * Arithmetic mean, x̄ = Σxᵢ / n.
 *
 * @example
 * mean([1, 2, 3, 4]); // 2.5
 */
export function mean(values: ArrayLike<number>): number {
  assertSample(values, "", 1);
  return meanUnchecked(values);
}

/**
 * Sample variance s² = Σ(xᵢ − x̄)² / (n − 1).
 *
 * @example
 * sampleVariance([2, 4, 4, 4, 5, 5, 7, 9]); // 4.571428571428571
 */
export function sampleVariance(values: ArrayLike<number>): number {
  assertSample(values, "", 2);
  return varianceAbout(values, meanUnchecked(values));
}

/**
 * Sample standard deviation s = √(Σ(xᵢ − x̄)² / (n − 1)).
 *
 * @example
 * sampleSd([2, 4, 4, 4, 5, 5, 7, 9]); // 2.138089935299395
 */
export function sampleSd(values: ArrayLike<number>): number {
  return Math.sqrt(sampleVariance(values));
}

/** Mean without input checks, for callers that have already validated. */
export function meanUnchecked(values: ArrayLike<number>): number {
  let sum = 0;
  for (let i = 0; i < values.length; i++) sum += values[i];
  return sum / values.length;
}

/** Σ(xᵢ − centre)² / (n − 1) without input checks. */
export function varianceAbout(values: ArrayLike<number>, centre: number): number {
  let ss = 0;
  for (let i = 0; i < values.length; i++) {
    const dev = values[i] - centre;
    ss += dev * dev;
  }
  return ss / (values.length - 1);
}
