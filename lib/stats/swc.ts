import { meanUnchecked, varianceAbout } from "./describe";
import { assertNonNegative, assertPositive, assertSample } from "./validate";

/**
 * Smallest worthwhile change from the spread of the squad's baseline scores.
 *
 * SWC = factor × between-athlete SD of the baseline scores (sample SD, n − 1).
 * The default 0.2 is Cohen's "small" standardized effect, the default Hopkins
 * (2004, Sportscience 8:1–7) gives for team sports: "one-fifth of the
 * between-athlete SD".
 *
 * @param baseline the squad's pre (baseline) scores, two or more
 * @param factor multiple of the SD, default 0.2
 * @returns the SWC in score units
 * @throws {StatsInputError} when `baseline` is not a list, holds fewer than 2
 * scores or a score that is not a finite number, or `factor` is not above zero
 * @example
 * // Weir (2005) dataset A, trial 1: SD 32.77194 (METHODS.md §2)
 * smallestWorthwhileChange([146, 148, 170, 90, 157, 156, 176, 205]); // => 6.5543878…
 */
export function smallestWorthwhileChange(baseline: ArrayLike<number>, factor = 0.2): number {
  assertSample(baseline, "baseline", 2);
  assertPositive(factor, "The SWC factor");
  return factor * Math.sqrt(varianceAbout(baseline, meanUnchecked(baseline)));
}

/**
 * Smallest worthwhile change from a within-athlete CV, for solo-sport
 * performance, where the SWC follows competition variability rather than
 * squad spread.
 *
 * SWC = factor × CV% × mean / 100. The default 0.3 × CV is from Hopkins
 * (2004, Sportscience 8:1–7); Hopkins, Hawley & Burke (1999, MSSE 31:472–485)
 * put it at about half the CV.
 *
 * @param meanValue the typical score, above zero (e.g. 3.10 s)
 * @param cvPercent the within-athlete CV in percent (1.0 for 1%)
 * @param factor multiple of the CV, default 0.3
 * @returns the SWC in score units
 * @throws {StatsInputError} when `meanValue` or `factor` is not above zero, or
 * `cvPercent` is negative or not a number
 * @example
 * swcFromCv(3.10, 1.0); // => 0.0093 (20 m sprint, CV 1%; METHODS.md §2)
 */
export function swcFromCv(meanValue: number, cvPercent: number, factor = 0.3): number {
  assertPositive(meanValue, "The mean score for a CV-based SWC");
  assertNonNegative(cvPercent, "The CV");
  assertPositive(factor, "The SWC factor");
  return (factor * cvPercent * meanValue) / 100;
}
