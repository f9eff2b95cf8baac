import { StatsInputError } from "./errors";
import { assertFinite, assertNonNegative } from "./validate";

/**
 * Verdict codes, best to worst, then the undecided one. Words for people live
 * in `lib/words/stats.ts`, so the statistics stay free of display text.
 */
export const VERDICTS = ["clear-gain", "gain", "steady", "decline", "clear-decline", "inconclusive"] as const;

export type Verdict = (typeof VERDICTS)[number];

export interface Interval {
  lower: number;
  upper: number;
}

/**
 * Verdict for an interval of change, read against the SWC band.
 *
 * Our own scheme (PRODUCT.md §5). With the interval oriented so that positive
 * means better and the band [−SWC, +SWC], the rules are tried in this order:
 *
 * | verdict        | rule                                      |
 * |----------------|-------------------------------------------|
 * | steady         | −SWC ≤ lower and upper ≤ +SWC              |
 * | clear-gain     | lower > +SWC                               |
 * | clear-decline  | upper < −SWC                               |
 * | gain           | lower > 0 (part of it inside the band)     |
 * | decline        | upper < 0 (part of it inside the band)     |
 * | inconclusive   | otherwise (crosses 0 and leaves the band)  |
 *
 * This is plain interval reasoning, the logic of equivalence (two one-sided
 * tests; Lakens 2017, SPPS 8:355–362) and minimal-effect tests read off one
 * interval. It attaches no probabilities to the verdicts.
 *
 * @param interval the interval, positive = better (see {@link orientInterval})
 * @param swc the smallest worthwhile change, zero or more
 * @returns a verdict code from {@link VERDICTS}
 * @throws {StatsInputError} when an end of the interval is not a finite
 * number, the lower end is above the upper end, or `swc` is negative or not a
 * number
 * @example
 * classifyChange({ lower: 1.5, upper: 3.5 }, 0.8); // => "clear-gain"
 * classifyChange({ lower: 0.05, upper: 4.9 }, 0.8); // => "gain"
 * classifyChange({ lower: -0.3, upper: 5.3 }, 0.8); // => "inconclusive"
 */
export function classifyChange({ lower, upper }: Interval, swc: number): Verdict {
  assertFinite(lower, "The lower end of the interval");
  assertFinite(upper, "The upper end of the interval");
  assertNonNegative(swc, "The smallest worthwhile change");
  if (lower > upper) {
    throw new StatsInputError(`The interval's lower end (${lower}) is above its upper end (${upper}).`);
  }
  if (lower >= -swc && upper <= swc) return "steady";
  if (lower > swc) return "clear-gain";
  if (upper < -swc) return "clear-decline";
  if (lower > 0) return "gain";
  if (upper < 0) return "decline";
  return "inconclusive";
}

/**
 * Re-expresses an interval so that positive means better.
 *
 * For lower-is-better tests (sprint times) the interval is negated and its
 * ends swapped, so a faster time becomes a gain: [a, b] → [−b, −a]
 * (METHODS.md §1.1, direction; R and SciPy compute post − pre whatever the
 * test's direction).
 *
 * Does not throw: it only negates, and {@link classifyChange} checks the result.
 *
 * @param lower lower end, in the raw post − pre direction
 * @param upper upper end, in the raw post − pre direction
 * @param higherIsBetter false for times and other lower-is-better scores
 * @returns the interval with positive = better
 * @example
 * // 20 m sprint, 90% interval of post − pre (METHODS.md §4.4)
 * orientInterval(-0.12211, 0.02211, false); // => { lower: -0.02211, upper: 0.12211 }
 */
export function orientInterval(lower: number, upper: number, higherIsBetter: boolean): Interval {
  // 0 − x rather than −x so that a zero end stays +0, not −0.
  return higherIsBetter ? { lower, upper } : { lower: 0 - upper, upper: 0 - lower };
}
