import type { Direction, TrialRule } from "@/lib/domain";

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
  return rule === "best" ? best : sum / count;
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
