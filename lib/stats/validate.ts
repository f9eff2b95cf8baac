/**
 * Input guards shared by the statistics functions. Each throws a
 * {@link StatsInputError} whose message a coach can act on, so the UI never has
 * to translate NaN or a stack trace.
 */
import { StatsInputError } from "./errors";

/** Formats a number for an error message without a wall of digits. */
function show(value: number): string {
  return Number.isFinite(value) ? String(Number(value.toPrecision(6))) : String(value);
}

/** A finite number, or throw naming `what` (e.g. "The typical error"). */
export function assertFinite(value: number, what: string): void {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new StatsInputError(`${what} must be a number (got ${String(value)}).`);
  }
}

/** A finite number that is zero or more. */
export function assertNonNegative(value: number, what: string): void {
  assertFinite(value, what);
  if (value < 0) throw new StatsInputError(`${what} cannot be negative (got ${show(value)}).`);
}

/** A finite number above zero. */
export function assertPositive(value: number, what: string): void {
  assertFinite(value, what);
  if (value <= 0) throw new StatsInputError(`${what} must be above zero (got ${show(value)}).`);
}

/** A finite number of at least `min`. */
export function assertAtLeast(value: number, min: number, what: string): void {
  assertFinite(value, what);
  if (value < min) throw new StatsInputError(`${what} must be at least ${min} (got ${show(value)}).`);
}

/** A probability strictly between 0 and 1, e.g. a confidence level, alpha or power. */
export function assertProbability(value: number, what: string): void {
  if (typeof value !== "number" || !(value > 0 && value < 1)) {
    throw new StatsInputError(
      `${what} must be between 0 and 1, e.g. 0.9 for 90% (got ${String(value)}).`,
    );
  }
}

/** A confidence level in (0, 1). */
export function assertConfidence(confidence: number): void {
  assertProbability(confidence, "The confidence level");
}

/** Degrees of freedom: above zero, or Infinity for the normal limit. */
export function assertDegreesOfFreedom(df: number, what = "The degrees of freedom"): void {
  if (typeof df !== "number" || Number.isNaN(df) || df <= 0) {
    throw new StatsInputError(`${what} must be above zero (got ${String(df)}).`);
  }
}

/**
 * Two aligned score lists of equal length with at least two pairs, all finite.
 * `labels` names the lists in messages, e.g. ["Pre", "post"].
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

/** Every entry finite; names the first bad entry by its 1-based position. */
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

/** At least `min` finite scores; `label` (may be "") names them, e.g. "baseline". */
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
