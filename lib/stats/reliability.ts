import { chiSquareQuantile } from "./distributions";
import { iccFromMeanSquares } from "./icc";
import { type TwoWayMeanSquares, twoWayMeanSquares } from "./two-way-anova";
import { assertConfidence, assertDegreesOfFreedom, assertNonNegative, assertPairs } from "./validate";

export interface TestRetest {
  n: number;
  df: number;
  confidence: number;
  changeInMean: number;
  typicalError: number;
  typicalErrorLower: number;
  typicalErrorUpper: number;
  /** null unless every score is above zero. */
  cvPercent: number | null;
  icc31: number | null;
  icc21: number | null;
  icc31Lower: number | null;
  icc31Upper: number | null;
  icc21Lower: number | null;
  icc21Upper: number | null;
  meanSquares: TwoWayMeanSquares;
}

/**
 * Test–retest reliability of a test from two trials of the same athletes.
 *
 * Source: Hopkins (2000), "Measures of reliability in sports medicine and
 * science", Sports Med 30:1–15.
 * - Change in the mean: mean(trial2 − trial1), kept apart from the typical
 *   error so learning or fatigue effects stay visible.
 * - Typical error TE = SD(trial2 − trial1)/√2 (= √MSE of the two-way ANOVA).
 * - Its limits treat TE² as a variance on ν = n − 1 df, see
 *   {@link typicalErrorLimits}.
 * - CV% from logs: s = SD(ln t2 − ln t1)/√2, CV = 100·(e^s − 1); null unless
 *   every score is positive, since a log needs it.
 * - ICC(3,1) and ICC(2,1) with limits, via {@link twoWayMeanSquares} (k = 2)
 *   and {@link iccFromMeanSquares}.
 *
 * @param trial1 each athlete's first trial
 * @param trial2 the same athletes' second trial, in the same order
 * @param options `confidence` of every interval (default 0.95)
 * @returns change in mean, TE with limits, CV%, ICCs with limits, mean squares
 * @throws {StatsInputError} when the trials differ in length, hold fewer than
 * 2 athletes or a score that is not a finite number, or `confidence` is not
 * strictly between 0 and 1
 * @example
 * // Weir (2005) dataset A (METHODS.md §3.6)
 * const r = testRetest([146, 148, 170, 90, 157, 156, 176, 205],
 *                      [140, 152, 152, 99, 145, 153, 167, 218]);
 * r.typicalError; // => 7.556926… (Weir: SEM 7.6)
 * r.cvPercent; // => 5.1616…
 */
export function testRetest(
  trial1: ArrayLike<number>,
  trial2: ArrayLike<number>,
  options: { confidence?: number } = {},
): TestRetest {
  const confidence = options.confidence ?? 0.95;
  assertConfidence(confidence);
  assertPairs(trial1, trial2, ["Trial 1", "trial 2"]);
  const n = trial1.length;
  const df = n - 1;
  const diff = changeStats(trial1, trial2, (x) => x);
  const typicalError = diff.sd / Math.SQRT2;
  const limits = typicalErrorLimits(typicalError, df, confidence);
  const rows: number[][] = new Array(n);
  for (let i = 0; i < n; i++) rows[i] = [trial1[i], trial2[i]];
  const meanSquares = twoWayMeanSquares(rows);
  const icc = iccFromMeanSquares(meanSquares, { confidence });
  return {
    n,
    df,
    confidence,
    changeInMean: diff.mean,
    typicalError,
    typicalErrorLower: limits.lower,
    typicalErrorUpper: limits.upper,
    cvPercent: logCvPercent(trial1, trial2),
    icc31: icc.icc31,
    icc21: icc.icc21,
    icc31Lower: icc.icc31Lower,
    icc31Upper: icc.icc31Upper,
    icc21Lower: icc.icc21Lower,
    icc21Upper: icc.icc21Upper,
    meanSquares,
  };
}

/**
 * Confidence limits for a typical error, from the chi-square distribution of a
 * variance.
 *
 * TE² is a variance on ν degrees of freedom, so the limits are
 * [TE·√(ν/χ²_{1−α/2,ν}), TE·√(ν/χ²_{α/2,ν})] (Hopkins 2000, Sports Med
 * 30:1–15; the standard variance interval). ν is n − 1 for two trials and
 * (n − 1)(k − 1) for k trials. The limits are not symmetric about TE.
 *
 * @param typicalError the typical error, zero or more
 * @param df its degrees of freedom, above zero
 * @param confidence confidence level in (0, 1), default 0.95
 * @returns lower and upper limit, in score units
 * @throws {StatsInputError} when the typical error is negative or not a
 * number, `df` is not above zero, or `confidence` is not strictly between 0
 * and 1
 * @example
 * // Bland & Altman (1986) Wright meter retest, TE 15.3612 on 16 df (METHODS.md §3.5)
 * typicalErrorLimits(15.3612, 16, 0.95); // => { lower: 11.440558…, upper: 23.378654… }
 */
export function typicalErrorLimits(
  typicalError: number,
  df: number,
  confidence = 0.95,
): { lower: number; upper: number } {
  assertNonNegative(typicalError, "The typical error");
  assertDegreesOfFreedom(df);
  assertConfidence(confidence);
  const alpha = 1 - confidence;
  return {
    lower: typicalError * Math.sqrt(df / chiSquareQuantile(1 - alpha / 2, df)),
    upper: typicalError * Math.sqrt(df / chiSquareQuantile(alpha / 2, df)),
  };
}

/** CV% = 100·(e^s − 1), s = SD(ln t2 − ln t1)/√2; null if any score is ≤ 0. */
function logCvPercent(trial1: ArrayLike<number>, trial2: ArrayLike<number>): number | null {
  for (let i = 0; i < trial1.length; i++) if (!(trial1[i] > 0 && trial2[i] > 0)) return null;
  const s = changeStats(trial1, trial2, Math.log).sd / Math.SQRT2;
  return 100 * Math.expm1(s);
}

/** Mean and SD (n − 1) of f(t2ᵢ) − f(t1ᵢ), two passes, no arrays. */
function changeStats(
  trial1: ArrayLike<number>,
  trial2: ArrayLike<number>,
  f: (x: number) => number,
): { mean: number; sd: number } {
  const n = trial1.length;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += f(trial2[i]) - f(trial1[i]);
  const mean = sum / n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (f(trial2[i]) - f(trial1[i]) - mean) ** 2;
  return { mean, sd: Math.sqrt(ss / (n - 1)) };
}
