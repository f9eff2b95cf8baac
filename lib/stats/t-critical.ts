/**
 * Two-sided critical value of Student's t: t_{1−α/2}(df) with α = 1 − confidence.
 * `df = Infinity` gives the normal value z_{1−α/2}.
 *
 * Cross-checked against the NIST/SEMATECH e-Handbook of Statistical Methods,
 * §1.3.6.7.2 (critical values of Student's t), and R's `qt()`.
 *
 * @example
 * tCritical(0.95, 5); // 2.570582 (NIST: 2.571)
 * tCritical(0.95, Infinity); // 1.959964
 */
import { studentTQuantile } from "./distributions";
import { assertConfidence, assertDegreesOfFreedom } from "./validate";

export function tCritical(confidence: number, df: number): number {
  assertConfidence(confidence);
  assertDegreesOfFreedom(df);
  return studentTQuantile(1 - (1 - confidence) / 2, df);
}

/**
 * Two-sided normal critical value z_{1−α/2}.
 *
 * @example
 * zCritical(0.9); // 1.644854
 */
export function zCritical(confidence: number): number {
  return tCritical(confidence, Infinity);
}
