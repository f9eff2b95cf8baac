/**
 * Words people read for the codes `lib/stats` returns: verdicts, test
 * sensitivity and magnitude bands.
 *
 * Kept out of the statistics so that wording can change (or be translated)
 * without touching checked numbers, and so that no statistic depends on how it
 * is phrased. No magnitude-based-inference wording anywhere (METHODS.md §4.5):
 * verdicts are the interval reading of PRODUCT.md §5.
 */
import type { Magnitude, Sensitivity, SensitivityRating, Verdict } from "@/lib/stats";

/** Display name of each verdict (PRODUCT.md §5). */
export const VERDICT_LABELS: Record<Verdict, string> = {
  "clear-gain": "Clear gain",
  gain: "Gain",
  steady: "Steady",
  decline: "Decline",
  "clear-decline": "Clear decline",
  inconclusive: "Inconclusive",
};

/**
 * Display name of a verdict code.
 *
 * @example
 * verdictLabel("clear-gain"); // => "Clear gain"
 */
export function verdictLabel(verdict: Verdict): string {
  return VERDICT_LABELS[verdict];
}

/**
 * Short name of each sensitivity rating. Deliberately not the "good / OK /
 * marginal" words of the trade, whose source is unconfirmed (METHODS.md §4.3).
 */
export const SENSITIVITY_LABELS: Record<SensitivityRating, string> = {
  detects: "Sees the SWC",
  borderline: "Needs repeated trials",
  blind: "Noise hides the SWC",
};

/**
 * One or two sentences telling a coach what a sensitivity result means for
 * testing, with the TE/SWC ratio and, where it helps, the trials to average.
 *
 * @example
 * explainSensitivity({ rating: "blind", ratio: 2, trialsNeeded: 5 });
 * // => "The typical error is 2.00 times the smallest worthwhile change, so test noise can hide
 * //     or fake a worthwhile change. Averaging 5 trials per test day brings the noise below the SWC."
 */
export function explainSensitivity({ rating, ratio, trialsNeeded }: Sensitivity): string {
  const r = ratio.toFixed(2);
  const average = `Averaging ${trialsNeeded} trials per test day brings the noise below the SWC.`;
  switch (rating) {
    case "detects":
      return `The typical error is ${r} times the smallest worthwhile change, so a single retest can show a worthwhile change.`;
    case "borderline":
      return `The typical error (${r} × SWC) is about as large as the smallest worthwhile change, so one trial per test day is not enough to tell them apart. ${average}`;
    case "blind":
      return `The typical error is ${r} times the smallest worthwhile change, so test noise can hide or fake a worthwhile change. ${average}`;
  }
}

/** Display name of each magnitude band (Hopkins et al. 2009 scale). */
export const MAGNITUDE_LABELS: Record<Magnitude, string> = {
  trivial: "Trivial",
  small: "Small",
  moderate: "Moderate",
  large: "Large",
  "very large": "Very large",
  "extremely large": "Extremely large",
};
