import { assertNonNegative, assertPositive } from "./validate";

/**
 * Trials to average on each test day so the typical error of the mean falls
 * below the SWC.
 *
 * The smallest whole k with TE/√k < SWC, since the error of a mean of k
 * independent trials is TE/√k, the standard error of a mean (any statistics
 * handbook; PRODUCT.md §4, planning). Equality does not count as "below", so
 * TE = SWC needs 2 trials.
 *
 * @param typicalError the test's typical error for one trial, zero or more
 * @param swc the smallest worthwhile change, above zero
 * @returns the number of trials, at least 1
 * @throws {StatsInputError} when the typical error is negative or not a
 * number, or the SWC is not above zero
 * @example
 * // 10 m sprint, Duthie et al. (2006): TE 0.02 s, SWC 0.01 s
 * trialsToDetect(0.02, 0.01); // => 5
 */
export function trialsToDetect(typicalError: number, swc: number): number {
  assertNonNegative(typicalError, "The typical error");
  assertPositive(swc, "The smallest worthwhile change");
  // Equality is not "below": read 0.3 and 0.1 as typed (in binary, 0.3/0.1 is
  // 2.9999999999999996), so shave a negligible 1e-12 off the target.
  const target = swc * (1 - 1e-12);
  let k = Math.max(1, Math.floor((typicalError / swc) ** 2));
  while (k > 1 && typicalError / Math.sqrt(k - 1) < target) k--;
  while (!(typicalError / Math.sqrt(k) < target)) k++;
  return k;
}
