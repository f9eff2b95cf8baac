import type { Direction, TrialRule } from "@/lib/domain";

/**
 * The largest magnitude a trial score may have. No unit of strength and conditioning testing
 * gets near it (a 1RM in grams, a distance in millimetres stay far below), and ten trials of it
 * sum to 1e10: a mean can never overflow. One rule for the Session sheet and the import.
 */
export const MAX_TRIAL_MAGNITUDE = 1e9;

/** A score Changewise stores exactly as given: finite and within ±MAX_TRIAL_MAGNITUDE. */
export const isStorableTrial = (value: number) => Number.isFinite(value) && Math.abs(value) <= MAX_TRIAL_MAGNITUDE;

export const TRIAL_RANGE_TEXT = "between -1000000000 and 1000000000";

/**
 * Reduces a set of trials to the athlete's score for the session.
 * "best" respects the test's direction (the highest jump, the fastest sprint);
 * "mean" averages the trials that were recorded. Empty slots are ignored.
 *
 * @example reduceTrials([2.31, null, 2.27], "best", "lower") // 2.27
 */
export function reduceTrials(trials: readonly (number | null)[], rule: TrialRule, direction: Direction): number | null {
  let count = 0;
  let sum = 0;
  let best = direction === "higher" ? -Infinity : Infinity;
  for (const value of trials) {
    if (value === null || !Number.isFinite(value)) continue;
    count++;
    sum += value;
    best = direction === "higher" ? Math.max(best, value) : Math.min(best, value);
  }
  if (count === 0) return null;
  if (rule === "best") return best;
  const mean = sum / count;
  if (Number.isFinite(mean)) return mean;
  // Only scores stored before the magnitude limit can overflow the sum; dividing first keeps
  // the mean finite (each term is at most MAX_VALUE / count) without changing ordinary means.
  let scaled = 0;
  for (const value of trials) if (value !== null && Number.isFinite(value)) scaled += value / count;
  return scaled;
}

/** Range of the recorded trials (max − min): a quick look at within-athlete spread. */
export function trialSpread(trials: readonly (number | null)[]): number | null {
  let min = Infinity;
  let max = -Infinity;
  let count = 0;
  for (const value of trials) {
    if (value === null || !Number.isFinite(value)) continue;
    count++;
    min = Math.min(min, value);
    max = Math.max(max, value);
  }
  return count < 2 ? null : max - min;
}

/** Trailing empty slots carry no information; keeping them would make equal results look different. */
export function trimTrials(trials: readonly (number | null)[]): (number | null)[] {
  let end = trials.length;
  while (end > 0 && trials[end - 1] === null) end--;
  return trials.slice(0, end);
}
