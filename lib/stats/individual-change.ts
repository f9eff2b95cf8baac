import { tCritical } from "./t-critical";
import { assertConfidence, assertDegreesOfFreedom, assertFinite, assertNonNegative } from "./validate";
import { classifyChange, orientInterval, type Verdict } from "./verdict";

export interface IndividualChangeInput {
  pre: number;
  post: number;
  typicalError: number;
  /** df of the reliability study that gave the TE (n − 1 for two trials). */
  typicalErrorDf?: number;
  swc: number;
  /** Default 0.90. */
  confidence?: number;
  /** Default true; false for times and other lower-is-better scores. */
  higherIsBetter?: boolean;
}

export interface IndividualChange {
  /** post − pre, in score units. */
  change: number;
  ciLower: number;
  ciUpper: number;
  /** The change with "better" positive: −change for lower-is-better tests. */
  betterChange: number;
  betterLower: number;
  betterUpper: number;
  /** √2·TE. */
  standardError: number;
  /** t or z multiplier used for the interval. */
  quantile: number;
  confidence: number;
  verdict: Verdict;
}

/**
 * One athlete's change between two single tests, with an interval for the true
 * change and a verdict against the SWC.
 *
 * Each test carries independent error TE, so the observed change has
 * SE = √2·TE and the interval is change ± q·√2·TE (Swinton et al. 2018,
 * Front Nutr 5:41). q is t_{1−α/2}(ν) when the TE's degrees of freedom ν are
 * known from its reliability study, else z_{1−α/2}, because z understates the
 * uncertainty when the TE comes from a small study (METHODS.md §4.4). The
 * verdict is {@link classifyChange} on the interval oriented so that positive
 * means better.
 *
 * Do not pass the SD of change scores of a control group as `typicalError`:
 * that SD already equals √2·TE.
 *
 * @param input scores, typical error (and its df), SWC, confidence (default
 * 0.90) and direction (default higher is better)
 * @returns the change, its interval raw and oriented, and the verdict code
 * @throws {StatsInputError} when a score is not a finite number, the typical
 * error or SWC is negative or not a number, the confidence is not strictly
 * between 0 and 1, or `typicalErrorDf` is given but not above zero
 * @example
 * // CMJ: 40.0 → 42.5 cm, TE 1.0 cm on 19 df, SWC 0.8 cm (METHODS.md §4.4)
 * const r = individualChange({ pre: 40, post: 42.5, typicalError: 1, typicalErrorDf: 19, swc: 0.8 });
 * [r.ciLower, r.ciUpper]; // => [0.054636…, 4.945363…] (METHODS.md: 0.055 to 4.945)
 * r.verdict; // => "gain"
 */
export function individualChange(input: IndividualChangeInput): IndividualChange {
  const { pre, post, typicalError, typicalErrorDf, swc } = input;
  const confidence = input.confidence ?? 0.9;
  const higherIsBetter = input.higherIsBetter ?? true;
  assertFinite(pre, "The pre score");
  assertFinite(post, "The post score");
  assertNonNegative(typicalError, "The typical error");
  assertNonNegative(swc, "The smallest worthwhile change");
  assertConfidence(confidence);
  if (typicalErrorDf !== undefined) assertDegreesOfFreedom(typicalErrorDf, "The typical error's degrees of freedom");

  const change = post - pre;
  const standardError = Math.SQRT2 * typicalError;
  const quantile = tCritical(confidence, typicalErrorDf ?? Infinity);
  const ciLower = change - quantile * standardError;
  const ciUpper = change + quantile * standardError;
  const better = orientInterval(ciLower, ciUpper, higherIsBetter);
  return {
    change,
    ciLower,
    ciUpper,
    betterChange: higherIsBetter ? change : 0 - change,
    betterLower: better.lower,
    betterUpper: better.upper,
    standardError,
    quantile,
    confidence,
    verdict: classifyChange(better, swc),
  };
}

/**
 * Minimal detectable change: the smallest change one athlete's two tests can
 * show beyond their measurement error.
 *
 * MDC = z_{1−α/2}·√2·TE (Weir 2005, JSCR 19:231–240, "minimal difference");
 * it equals the half-width of the limits of agreement. Uses the exact z
 * (1.959964 at 95%), so it sits 0.002% below the textbook 1.96·√2·TE.
 *
 * @param typicalError the test's typical error, zero or more
 * @param confidence confidence level in (0, 1), default 0.95
 * @returns the MDC in score units
 * @throws {StatsInputError} when the typical error is negative or not a
 * number, or the confidence is not strictly between 0 and 1
 * @example
 * minimalDetectableChange(1.0); // => 2.7718076… (METHODS.md §4.4: 2.77186 is 1.96·√2)
 */
export function minimalDetectableChange(typicalError: number, confidence = 0.95): number {
  assertNonNegative(typicalError, "The typical error");
  return tCritical(confidence, Infinity) * Math.SQRT2 * typicalError;
}
