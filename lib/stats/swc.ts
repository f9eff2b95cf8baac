/**
 * Smallest worthwhile change (SWC).
 */
import { meanUnchecked, varianceAbout } from "./describe";
import { assertNonNegative, assertPositive, assertSample } from "./validate";

/**
 * SWC = factor × between-athlete SD of the baseline scores (sample SD, n − 1).
 *
 * The default 0.2 is Cohen's "small" standardized effect, the default Hopkins
 * (2004, Sportscience 8:1–7) gives for team sports: "one-fifth of the
 * between-athlete SD".
 *
 * @example
 * // Weir (2005) dataset A, trial 1: SD 32.77194
 * smallestWorthwhileChange([146, 148, 170, 90, 157, 156, 176, 205]); // 6.554388
 */
export function smallestWorthwhileChange(baseline: ArrayLike<number>, factor = 0.2): number {
  assertSample(baseline, "baseline", 2);
  assertPositive(factor, "The SWC factor");
  return factor * Math.sqrt(varianceAbout(baseline, meanUnchecked(baseline)));
}

/**
 * SWC from a within-athlete CV, for solo-sport performance:
 * SWC = factor × CV% × mean / 100.
 *
 * The default 0.3 × CV is from Hopkins (2004, Sportscience 8:1–7); Hopkins,
 * Hawley & Burke (1999, MSSE 31:472–485) put it at about half the CV.
 *
 * @example
 * swcFromCv(3.10, 1.0); // 0.0093 (20 m sprint, CV 1%)
 */
export function swcFromCv(meanValue: number, cvPercent: number, factor = 0.3): number {
  assertPositive(meanValue, "The mean score for a CV-based SWC");
  assertNonNegative(cvPercent, "The CV");
  assertPositive(factor, "The SWC factor");
  return (factor * cvPercent * meanValue) / 100;
}
