import { normalQuantile, studentTQuantile } from "./distributions";
import { StatsInputError } from "./errors";
import { type TTestPowerOptions, tTestPower } from "./power";
import { findRoot } from "./root-finding";
import { assertPositive, assertProbability } from "./validate";

export interface SampleSizeInput {
  sdDiff: number;
  delta: number;
  alpha?: number;
  power?: number;
}

export interface SampleSizeResult {
  /** Athletes to test: the exact solution rounded up (at least 2). */
  n: number;
  /** Real-valued solution of power(n) = target, like R's uniroot in power.t.test. */
  exactN: number;
  /** Power actually reached with `n` athletes. */
  achievedPower: number;
  /** Normal-approximation n = ((z_{1−α/2} + z_{power})·σ_d/Δ)², for comparison. */
  normalApproxN: number;
}

/**
 * Athletes needed for a two-sided paired t-test to reach `power` for a true
 * change `delta` (e.g. the SWC).
 *
 * Solves exact power(n) = target (see `pairedPower`) by Brent's method,
 * as R's `power.t.test(type = "paired")` does with `uniroot`; the normal
 * approximation n ≈ ((z_{1−α/2} + z_{1−β})·σ_d/Δ)² is reported beside it
 * (METHODS.md §6). A paired test needs at least 2 athletes, so `exactN` is 2
 * when 2 already suffice.
 *
 * @param input sdDiff (SD of change scores), delta, alpha (0.05), power (0.8)
 * @returns whole and exact n, achieved power, and the normal approximation
 * @throws {StatsInputError} when sdDiff or delta is not above zero, alpha or
 * power is not strictly between 0 and 1, or the change is too small for any
 * realistic squad (more than 1e9 athletes)
 * @example
 * // METHODS.md §6: d_z 0.5 at 80% power needs 33.37 → 34 athletes
 * pairedSampleSize({ sdDiff: 1, delta: 0.5 }).n; // => 34
 */
export function pairedSampleSize(input: SampleSizeInput): SampleSizeResult {
  const { sdDiff, delta, alpha = 0.05, power = 0.8 } = input;
  assertPositive(sdDiff, "The SD of the change scores");
  assertPositive(delta, "The change to detect");
  assertProbability(alpha, "The significance level (alpha)");
  assertProbability(power, "The power");
  return solveSampleSize((n) => tTestPower({ n, delta, sd: sdDiff, alpha }), {
    power,
    normalApproxN: (((normalQuantile(1 - alpha / 2) + normalQuantile(power)) * sdDiff) / delta) ** 2,
  });
}

/**
 * Sample size for any {@link tTestPower} design (paired, one-sample,
 * two-sample per group; one- or two-sided).
 *
 * Solves power(n) = target by Brent's method, as R's `power.t.test` does;
 * exposed so R's help-page examples (two-sample, one-sided) check the same
 * solver the paired planner uses.
 *
 * @param options the {@link TTestPowerOptions} without n, plus power (0.8)
 * @returns whole and exact n, achieved power, and the normal approximation
 * @throws {StatsInputError} when power is not strictly between 0 and 1, delta
 * or sd is not above zero, alpha is not strictly between 0 and 1, or the
 * change is too small for any realistic squad (more than 1e9 athletes)
 * @example
 * // R: power.t.test(power = .90, delta = 1)$n = 22.02110
 * tTestSampleSize({ delta: 1, power: 0.9, design: "two-sample", strict: false }).exactN; // => 22.021095…
 */
export function tTestSampleSize(options: Omit<TTestPowerOptions, "n"> & { power?: number }): SampleSizeResult {
  const { power = 0.8, ...rest } = options;
  assertProbability(power, "The power");
  assertPositive(rest.delta, "The change to detect");
  const sd = rest.sd ?? 1;
  const alpha = rest.alpha ?? 0.05;
  const sides = (rest.alternative ?? "two-sided") === "two-sided" ? 2 : 1;
  const groups = rest.design === "two-sample" ? 2 : 1;
  const z = normalQuantile(1 - alpha / sides) + normalQuantile(power);
  return solveSampleSize((n) => tTestPower({ ...rest, n }), {
    power,
    normalApproxN: groups * ((z * sd) / rest.delta) ** 2,
  });
}

function solveSampleSize(
  powerAt: (n: number) => number,
  { power, normalApproxN }: { power: number; normalApproxN: number },
): SampleSizeResult {
  const gap = (n: number) => powerAt(n) - power;
  if (gap(2) >= 0) return { n: 2, exactN: 2, achievedPower: powerAt(2), normalApproxN };
  // The t-test always needs more athletes than the normal approximation; grow from there.
  let upper = Math.max(4, 2 * normalApproxN + 4);
  while (gap(upper) < 0) {
    upper *= 2;
    if (upper > 1e9) {
      throw new StatsInputError("The change to detect is too small for any realistic number of athletes.");
    }
  }
  const exactN = findRoot(gap, 2, upper, { tolerance: 1e-9 });
  const n = Math.ceil(exactN - 1e-9);
  return { n, exactN, achievedPower: powerAt(n), normalApproxN };
}

export interface PrecisionInput {
  sdDiff: number;
  /** Wanted half-width of the confidence interval for the mean change. */
  halfWidth: number;
  confidence?: number;
}

/**
 * Athletes needed for the interval of the squad's mean change to be no wider
 * than ± `halfWidth`: planning for precision rather than for a p-value.
 *
 * The smallest n with t_{1−α/2, n−1}·σ_d/√n ≤ w (METHODS.md §6, precision
 * planning). The normal answer (z·σ_d/w)² is a lower bound, since t > z, so
 * the search steps up from it.
 *
 * @param input sdDiff (SD of change scores), halfWidth, confidence (0.95)
 * @returns the number of athletes, at least 2
 * @throws {StatsInputError} when sdDiff or halfWidth is not above zero, or
 * confidence is not strictly between 0 and 1
 * @example
 * // CMJ: TE 1.5 cm so σ_d = 2.12132 cm; 95% half-width ≤ SWC 1 cm (METHODS.md §6)
 * precisionSampleSize({ sdDiff: 2.12132, halfWidth: 1 }); // => 20
 */
export function precisionSampleSize({ sdDiff, halfWidth, confidence = 0.95 }: PrecisionInput): number {
  assertPositive(sdDiff, "The SD of the change scores");
  assertPositive(halfWidth, "The interval half-width");
  assertProbability(confidence, "The confidence level");
  const p = 1 - (1 - confidence) / 2;
  const fits = (n: number) => (studentTQuantile(p, n - 1) * sdDiff) / Math.sqrt(n) <= halfWidth;
  let n = Math.max(2, Math.floor(((normalQuantile(p) * sdDiff) / halfWidth) ** 2));
  while (!fits(n)) n = n < 1e6 ? n + 1 : n * 2;
  return n;
}
