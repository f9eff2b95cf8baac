import { trialsToDetect } from "./trials";
import { assertNonNegative, assertPositive } from "./validate";

/** Sensitivity codes; words for people live in `lib/words/stats.ts`. */
export type SensitivityRating = "detects" | "borderline" | "blind";

export interface Sensitivity {
  rating: SensitivityRating;
  /** TE / SWC. */
  ratio: number;
  /** Trials to average per test day so that TE/√k < SWC. */
  trialsNeeded: number;
}

/**
 * Upper end of "detects" and lower end of "blind" (our convention): the band
 * around 1 stands for "about equal", where averaging repeated trials decides.
 */
export const SENSITIVITY_CUTOFFS = { detects: 0.8, blind: 1.2 } as const;

/**
 * Whether a test can see the smallest worthwhile change: its noise (typical
 * error, TE) against the signal (SWC).
 *
 * Comparing TE with the SWC is common practice in sport science, usually
 * credited to Hopkins (2004, "How to interpret changes in an athletic
 * performance test", Sportscience 8:1–7); the exact wording of the rule in that
 * source is not confirmed. Duthie et al. (2006, JSCR 20:246–251) give a 10 m
 * sprint whose TE (≈ 0.02 s) is twice its SWC (≈ 0.01 s).
 *
 * The ratings and their cut-offs are our own convention: TE/SWC below 0.8
 * "detects", 0.8 to 1.2 "borderline", above 1.2 "blind". `trialsNeeded` is
 * {@link trialsToDetect}.
 *
 * @param typicalError the test's typical error, zero or more
 * @param swc the smallest worthwhile change, above zero
 * @returns rating code, TE/SWC ratio and trials needed
 * @throws {StatsInputError} when the typical error is negative or not a
 * number, or the SWC is not above zero
 * @example
 * // 10 m sprint, Duthie et al. (2006): TE 0.02 s, SWC 0.01 s
 * sensitivity(0.02, 0.01); // => { rating: "blind", ratio: 2, trialsNeeded: 5 }
 */
export function sensitivity(typicalError: number, swc: number): Sensitivity {
  assertNonNegative(typicalError, "The typical error");
  assertPositive(swc, "The smallest worthwhile change");
  const ratio = typicalError / swc;
  return { rating: rate(ratio), ratio, trialsNeeded: trialsToDetect(typicalError, swc) };
}

function rate(ratio: number): SensitivityRating {
  // The 1e-12 slack reads decimal inputs at a cut-off as typed (0.08/0.1 is 0.7999999999999999).
  if (ratio < SENSITIVITY_CUTOFFS.detects * (1 - 1e-12)) return "detects";
  if (ratio <= SENSITIVITY_CUTOFFS.blind * (1 + 1e-12)) return "borderline";
  return "blind";
}
