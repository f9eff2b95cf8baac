/**
 * Verdicts: where an interval for the change sits against the SWC band.
 *
 * Our own scheme (PRODUCT.md §5). With the interval oriented so that positive
 * means better and the band [−SWC, +SWC], the rules are tried in this order:
 *
 * | verdict        | rule                                   |
 * |----------------|----------------------------------------|
 * | steady         | −SWC ≤ lower and upper ≤ +SWC           |
 * | clear-gain     | lower > +SWC                            |
 * | clear-decline  | upper < −SWC                            |
 * | gain           | lower > 0 (part of it inside the band)  |
 * | decline        | upper < 0 (part of it inside the band)  |
 * | inconclusive   | otherwise (crosses 0 and leaves the band) |
 *
 * This is plain interval reasoning, the logic of equivalence (two one-sided
 * tests; Lakens 2017, SPPS 8:355–362) and minimal-effect tests read off one
 * interval. It attaches no probabilities to the verdicts.
 */
import { StatsInputError } from "./errors";
import { assertFinite, assertNonNegative } from "./validate";

export const VERDICTS = [
  "clear-gain",
  "gain",
  "steady",
  "decline",
  "clear-decline",
  "inconclusive",
] as const;

export type Verdict = (typeof VERDICTS)[number];

const LABELS: Record<Verdict, string> = {
  "clear-gain": "Clear gain",
  gain: "Gain",
  steady: "Steady",
  decline: "Decline",
  "clear-decline": "Clear decline",
  inconclusive: "Inconclusive",
};

/**
 * Human label for a verdict.
 *
 * @example
 * verdictLabel("clear-gain"); // "Clear gain"
 */
export function verdictLabel(verdict: Verdict): string {
  return LABELS[verdict];
}

export interface Interval {
  lower: number;
  upper: number;
}

/**
 * Classifies an interval already oriented so that positive is better.
 *
 * @example
 * classifyChange({ lower: 1.5, upper: 3.5 }, 0.8); // "clear-gain"
 * classifyChange({ lower: 0.05, upper: 4.9 }, 0.8); // "gain"
 * classifyChange({ lower: -0.3, upper: 5.3 }, 0.8); // "inconclusive"
 */
export function classifyChange({ lower, upper }: Interval, swc: number): Verdict {
  assertFinite(lower, "The lower end of the interval");
  assertFinite(upper, "The upper end of the interval");
  assertNonNegative(swc, "The smallest worthwhile change");
  if (lower > upper) {
    throw new StatsInputError(
      `The interval's lower end (${lower}) is above its upper end (${upper}).`,
    );
  }
  if (lower >= -swc && upper <= swc) return "steady";
  if (lower > swc) return "clear-gain";
  if (upper < -swc) return "clear-decline";
  if (lower > 0) return "gain";
  if (upper < 0) return "decline";
  return "inconclusive";
}

/**
 * Re-expresses an interval so that positive means better. For lower-is-better
 * tests (sprint times) the interval is negated and its ends swapped, so a
 * faster time becomes a gain.
 *
 * @example
 * orientInterval(-0.12, 0.02, false); // { lower: -0.02, upper: 0.12 }
 */
export function orientInterval(lower: number, upper: number, higherIsBetter: boolean): Interval {
  // 0 − x rather than −x so that a zero end stays +0, not −0.
  return higherIsBetter ? { lower, upper } : { lower: 0 - upper, upper: 0 - lower };
}
