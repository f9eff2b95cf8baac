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
 * Arithmetic mean of a list of scores.
 *
 * x̄ = Σxᵢ / n (any statistics handbook, e.g. NIST/SEMATECH e-Handbook
 * §1.3.5.1).
 *
 * @param values one or more finite scores
 * @returns the mean
 * @throws {StatsInputError} when `values` is not a list, is empty, or holds a
 * score that is not a finite number
 * @example
 * mean([1, 2, 3, 4]); // => 2.5
 */
export function mean(values: ArrayLike<number>): number {
  assertSample(values, "", 1);
  return meanUnchecked(values);
}

/**
 * Sample variance, with Bessel's n − 1 divisor.
 *
 * s² = Σ(xᵢ − x̄)² / (n − 1) (NIST/SEMATECH e-Handbook §1.3.5.6).
 *
 * @param values two or more finite scores
 * @returns the sample variance
 * @throws {StatsInputError} when `values` is not a list, holds fewer than 2
 * scores, or holds a score that is not a finite number
 * @example
 * sampleVariance([2, 4, 4, 4, 5, 5, 7, 9]); // => 4.571428571428571
 */
export function sampleVariance(values: ArrayLike<number>): number {
  assertSample(values, "", 2);
  return varianceAbout(values, meanUnchecked(values));
}

/**
 * Sample standard deviation, with Bessel's n − 1 divisor.
 *
 * s = √(Σ(xᵢ − x̄)² / (n − 1)) (NIST/SEMATECH e-Handbook §1.3.5.6).
 *
 * @param values two or more finite scores
 * @returns the sample SD
 * @throws {StatsInputError} when `values` is not a list, holds fewer than 2
 * scores, or holds a score that is not a finite number
 * @example
 * sampleSd([2, 4, 4, 4, 5, 5, 7, 9]); // => 2.138089935299395
 */
export function sampleSd(values: ArrayLike<number>): number {
  return Math.sqrt(sampleVariance(values));
}

/**
 * Arithmetic mean x̄ = Σxᵢ / n without input checks, for callers that have
 * already validated (checking again would double the cost of a hot loop).
 *
 * Does not throw: an empty list gives NaN.
 *
 * @param values finite scores, at least one
 * @returns the mean
 * @example
 * meanUnchecked([1, 2, 3, 4]); // => 2.5
 */
export function meanUnchecked(values: ArrayLike<number>): number {
  let sum = 0;
  for (let i = 0; i < values.length; i++) sum += values[i];
  return sum / values.length;
}

/**
 * Σ(xᵢ − centre)² / (n − 1) without input checks; with centre = x̄ it is the
 * sample variance (NIST/SEMATECH e-Handbook §1.3.5.6).
 *
 * Does not throw: one score gives NaN (0/0).
 *
 * @param values finite scores, at least two
 * @param centre the point deviations are taken from, normally the mean
 * @returns the sum of squared deviations over n − 1
 * @example
 * varianceAbout([2, 4, 4, 4, 5, 5, 7, 9], 5); // => 4.571428571428571
 */
export function varianceAbout(values: ArrayLike<number>, centre: number): number {
  let ss = 0;
  for (let i = 0; i < values.length; i++) {
    const dev = values[i] - centre;
    ss += dev * dev;
  }
  return ss / (values.length - 1);
}
