import { studentTQuantile } from "./distributions";
import { assertConfidence, assertDegreesOfFreedom } from "./validate";

/**
 * Two-sided critical value of Student's t for a confidence level.
 *
 * t_{1−α/2}(df) with α = 1 − confidence; `df = Infinity` gives the normal
 * z_{1−α/2}. Source: NIST/SEMATECH e-Handbook of Statistical Methods,
 * §1.3.6.7.2 (critical values of Student's t), cross-checked with R's `qt()`.
 *
 * @param confidence confidence level in (0, 1), e.g. 0.9 for a 90% interval
 * @param df degrees of freedom (n − 1 for n athletes), or Infinity
 * @returns the multiplier of the standard error
 * @throws {StatsInputError} when `confidence` is not strictly between 0 and 1,
 * or `df` is not above zero
 * @example
 * tCritical(0.95, 5); // => 2.570581835636279 (NIST table: 2.571)
 */
export function tCritical(confidence: number, df: number): number {
  assertConfidence(confidence);
  assertDegreesOfFreedom(df);
  return studentTQuantile(1 - (1 - confidence) / 2, df);
}

/**
 * Two-sided normal critical value z_{1−α/2} for a confidence level.
 *
 * The limit of `tCritical` as df → ∞ (NIST/SEMATECH e-Handbook §1.3.6.7.2,
 * last row of the t table).
 *
 * @param confidence confidence level in (0, 1)
 * @returns the multiplier, e.g. 1.644854 for 90%
 * @throws {StatsInputError} when `confidence` is not strictly between 0 and 1
 * @example
 * zCritical(0.9); // => 1.6448536269514724
 */
export function zCritical(confidence: number): number {
  return tCritical(confidence, Infinity);
}
