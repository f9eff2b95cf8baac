/**
 * Can a test see the smallest worthwhile change? Compares the noise (typical
 * error, TE) with the signal (SWC).
 *
 * Comparing TE with the SWC is common practice in sport science, usually
 * credited to Hopkins (2004, "How to interpret changes in an athletic
 * performance test", Sportscience 8:1–7); the exact wording of the rule in that
 * source is not confirmed. Duthie et al. (2006, JSCR 20:246–251) give a 10 m
 * sprint whose TE (≈ 0.02 s) is twice its SWC (≈ 0.01 s).
 *
 * The ratings and their cut-offs are our own convention: TE/SWC below 0.8
 * "detects", 0.8 to 1.2 "borderline", above 1.2 "blind". The band around 1
 * stands for "about equal", where averaging repeated trials decides it.
 *
 * @example
 * sensitivity(0.02, 0.01).rating; // "blind"
 */
import { trialsToDetect } from "./planning";
import { assertNonNegative, assertPositive } from "./validate";

export type SensitivityRating = "detects" | "borderline" | "blind";

export interface Sensitivity {
  rating: SensitivityRating;
  /** TE / SWC. */
  ratio: number;
  label: string;
  explanation: string;
  /** Trials to average per test day so that TE/√k < SWC. */
  trialsNeeded: number;
}

/** Upper end of "detects" and lower end of "blind" (our convention). */
export const SENSITIVITY_CUTOFFS = { detects: 0.8, blind: 1.2 } as const;

const LABELS: Record<SensitivityRating, string> = {
  detects: "Sees the SWC",
  borderline: "Needs repeated trials",
  blind: "Noise hides the SWC",
};

export function sensitivity(typicalError: number, swc: number): Sensitivity {
  assertNonNegative(typicalError, "The typical error");
  assertPositive(swc, "The smallest worthwhile change");
  const ratio = typicalError / swc;
  const rating = rate(ratio);
  const trialsNeeded = trialsToDetect(typicalError, swc);
  return { rating, ratio, label: LABELS[rating], explanation: explain(rating, ratio, trialsNeeded), trialsNeeded };
}

function rate(ratio: number): SensitivityRating {
  // The 1e-12 slack reads decimal inputs at a cut-off as typed (0.08/0.1 is 0.7999999999999999).
  if (ratio < SENSITIVITY_CUTOFFS.detects * (1 - 1e-12)) return "detects";
  if (ratio <= SENSITIVITY_CUTOFFS.blind * (1 + 1e-12)) return "borderline";
  return "blind";
}

function explain(rating: SensitivityRating, ratio: number, trials: number): string {
  const r = ratio.toFixed(2);
  const average = `Averaging ${trials} trials per test day brings the noise below the SWC.`;
  switch (rating) {
    case "detects":
      return `The typical error is ${r} times the smallest worthwhile change, so a single retest can show a worthwhile change.`;
    case "borderline":
      return `The typical error (${r} × SWC) is about as large as the smallest worthwhile change, so one trial per test day is not enough to tell them apart. ${average}`;
    case "blind":
      return `The typical error is ${r} times the smallest worthwhile change, so test noise can hide or fake a worthwhile change. ${average}`;
  }
}
