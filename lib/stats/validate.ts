/**
 * Input guards shared by the statistics functions. Each throws a
 * {@link StatsInputError} with a plain message, so an API error or the UI never
 * has to translate NaN or a stack trace. No formula or published source
 * applies to these: they only check input.
 */
import { StatsInputError } from "./errors";

/** Formats a number for an error message without a wall of digits. */
function show(value: number): string {
  return Number.isFinite(value) ? String(Number(value.toPrecision(6))) : String(value);
}

/**
 * Guard: a finite number.
 *
 * @param value the input to check
 * @param what how the message names it, e.g. "The typical error"
 * @throws {StatsInputError} when `value` is not a number, or is NaN or ±Infinity
 * @example
 * assertFinite(NaN, "The pre score"); // throws "The pre score must be a number (got NaN)."
 */
export function assertFinite(value: number, what: string): void {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new StatsInputError(`${what} must be a number (got ${String(value)}).`);
  }
}

/**
 * Guard: a finite number that is zero or more (a typical error, an SWC).
 *
 * @param value the input to check
 * @param what how the message names it
 * @throws {StatsInputError} when `value` is not finite or is below zero
 * @example
 * assertNonNegative(-1, "The typical error"); // throws "The typical error cannot be negative (got -1)."
 */
export function assertNonNegative(value: number, what: string): void {
  assertFinite(value, what);
  if (value < 0) throw new StatsInputError(`${what} cannot be negative (got ${show(value)}).`);
}

/**
 * Guard: a finite number above zero (an SD, a half-width).
 *
 * @param value the input to check
 * @param what how the message names it
 * @throws {StatsInputError} when `value` is not finite or is zero or below
 * @example
 * assertPositive(0, "The SD of the change scores"); // throws "The SD of the change scores must be above zero (got 0)."
 */
export function assertPositive(value: number, what: string): void {
  assertFinite(value, what);
  if (value <= 0) throw new StatsInputError(`${what} must be above zero (got ${show(value)}).`);
}

/**
 * Guard: a finite number of at least `min` (e.g. 2 athletes).
 *
 * @param value the input to check
 * @param min the smallest value allowed
 * @param what how the message names it
 * @throws {StatsInputError} when `value` is not finite or is below `min`
 * @example
 * assertAtLeast(1, 2, "The number of athletes"); // throws "The number of athletes must be at least 2 (got 1)."
 */
export function assertAtLeast(value: number, min: number, what: string): void {
  assertFinite(value, what);
  if (value < min) throw new StatsInputError(`${what} must be at least ${min} (got ${show(value)}).`);
}

/**
 * Guard: a probability strictly between 0 and 1, e.g. a confidence level,
 * alpha or power. Its message suggests 0.9 because the common slip is 90.
 *
 * @param value the input to check
 * @param what how the message names it
 * @throws {StatsInputError} when `value` is not a number in (0, 1)
 * @example
 * assertProbability(90, "The power"); // throws "The power must be between 0 and 1, e.g. 0.9 for 90% (got 90)."
 */
export function assertProbability(value: number, what: string): void {
  if (typeof value !== "number" || !(value > 0 && value < 1)) {
    throw new StatsInputError(`${what} must be between 0 and 1, e.g. 0.9 for 90% (got ${String(value)}).`);
  }
}

/**
 * Guard: a confidence level in (0, 1).
 *
 * @param confidence the input to check
 * @throws {StatsInputError} when `confidence` is not a number in (0, 1)
 * @example
 * assertConfidence(95); // throws "The confidence level must be between 0 and 1, e.g. 0.9 for 90% (got 95)."
 */
export function assertConfidence(confidence: number): void {
  assertProbability(confidence, "The confidence level");
}

/**
 * Guard: degrees of freedom above zero, or Infinity for the normal limit.
 *
 * @param df the input to check
 * @param what how the message names it (default "The degrees of freedom")
 * @throws {StatsInputError} when `df` is not a number, is NaN, or is zero or below
 * @example
 * assertDegreesOfFreedom(0); // throws "The degrees of freedom must be above zero (got 0)."
 */
export function assertDegreesOfFreedom(df: number, what = "The degrees of freedom"): void {
  if (typeof df !== "number" || Number.isNaN(df) || df <= 0) {
    throw new StatsInputError(`${what} must be above zero (got ${String(df)}).`);
  }
}

/**
 * Guard: two aligned score lists of equal length with at least two pairs, all
 * finite.
 *
 * @param first first list, e.g. pre scores
 * @param second second list, e.g. post scores
 * @param labels names of the lists in messages, e.g. ["Pre", "post"]
 * @throws {StatsInputError} when either is not a list, their lengths differ,
 * there are fewer than 2 pairs, or a score is not a finite number
 * @example
 * assertPairs([1, 2], [3], ["Pre", "post"]); // throws "Pre and post need the same number of scores (got 2 and 1)."
 */
export function assertPairs(
  first: ArrayLike<number>,
  second: ArrayLike<number>,
  labels: readonly [string, string],
): void {
  if (first == null || second == null || typeof first.length !== "number" || typeof second.length !== "number") {
    throw new StatsInputError(`${labels[0]} and ${labels[1]} scores must both be lists of numbers.`);
  }
  if (first.length !== second.length) {
    throw new StatsInputError(
      `${labels[0]} and ${labels[1]} need the same number of scores (got ${first.length} and ${second.length}).`,
    );
  }
  if (first.length < 2) {
    throw new StatsInputError(
      `At least 2 athletes with both ${labels[0].toLowerCase()} and ${labels[1]} scores are needed (got ${first.length}).`,
    );
  }
  assertFiniteScores(first, labels[0]);
  assertFiniteScores(second, labels[1]);
}

/**
 * Guard: every entry a finite number. The message names the first bad entry by
 * its 1-based position, the way a coach counts rows.
 *
 * @param values the list to check
 * @param label how the message names the list, e.g. "post" (may be "")
 * @throws {StatsInputError} when an entry is not a finite number
 * @example
 * assertFiniteScores([1, NaN], "post"); // throws "Post score 2 is not a number (got NaN)."
 */
export function assertFiniteScores(values: ArrayLike<number>, label: string): void {
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (typeof v !== "number" || !Number.isFinite(v)) {
      throw new StatsInputError(
        `${label ? `${capitalise(label)} score` : "Score"} ${i + 1} is not a number (got ${String(v)}).`,
      );
    }
  }
}

/**
 * Guard: a list of at least `min` finite scores.
 *
 * @param values the list to check
 * @param label how the message names the scores, e.g. "baseline" (may be "")
 * @param min the fewest scores allowed (default 2)
 * @throws {StatsInputError} when `values` is not a list, is shorter than
 * `min`, or holds a score that is not a finite number
 * @example
 * assertSample([5], "baseline"); // throws "At least 2 baseline scores are needed (got 1)."
 */
export function assertSample(values: ArrayLike<number>, label: string, min = 2): void {
  const named = label ? `${label} scores` : "scores";
  if (values == null || typeof values.length !== "number") {
    throw new StatsInputError(`The ${named} must be a list of numbers.`);
  }
  if (values.length < min) {
    throw new StatsInputError(`At least ${min} ${named} are needed (got ${values.length}).`);
  }
  assertFiniteScores(values, label);
}

function capitalise(text: string): string {
  return text.length === 0 ? text : text[0].toUpperCase() + text.slice(1);
}
