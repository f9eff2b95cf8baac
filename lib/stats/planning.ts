/**
 * Planning a pre/post study: power of the paired t-test, athletes needed, and
 * trials needed to see the smallest worthwhile change.
 *
 * Power is exact under normality: the paired t statistic is noncentral t with
 * df = n − 1 and noncentrality √n·Δ/σ_d (the model of R's
 * `power.t.test(type = "paired")`). For a two-sided test the exact power also
 * counts rejections in the wrong tail, P(T < −t_crit), which R adds only with
 * `strict = TRUE`. Its default (strict = FALSE) drops that term; the R
 * help-page values (e.g. power 0.8689528, n 22.02110) are reproduced with
 * `strict: false`. The difference is ~2e-7 in power near 80–90%.
 */
import { findRoot } from "./root-finding";
import { noncentralTCdf } from "./noncentral-t";
import { normalQuantile, studentTQuantile } from "./distributions";
import { StatsInputError } from "./errors";
import { assertAtLeast, assertFinite, assertNonNegative, assertPositive, assertProbability } from "./validate";

export type TTestDesign = "paired" | "one-sample" | "two-sample";

export interface TTestPowerOptions {
  /** Athletes (paired, one-sample) or athletes per group (two-sample); may be fractional. */
  n: number;
  /** True difference to detect, in score units. */
  delta: number;
  /** SD of the change scores (paired) or of scores (two-sample). Default 1. */
  sd?: number;
  /** Significance level. Default 0.05. */
  alpha?: number;
  design?: TTestDesign;
  alternative?: "two-sided" | "one-sided";
  /** Count the wrong-tail rejections of a two-sided test. Default true. */
  strict?: boolean;
}

/**
 * Power of a t-test, 1 − β = P(T' > t_crit) [+ P(T' < −t_crit) when strict and two-sided],
 * T' ~ noncentral t(ν, √(n/g)·Δ/σ), ν = g(n − 1), g = 2 for two samples else 1.
 *
 * @example
 * tTestPower({ n: 20, delta: 1, design: "two-sample", strict: false }); // 0.8689528
 */
export function tTestPower(options: TTestPowerOptions): number {
  const { n, delta, sd = 1, alpha = 0.05, design = "paired" } = options;
  const twoSided = (options.alternative ?? "two-sided") === "two-sided";
  const strict = options.strict ?? true;
  assertAtLeast(n, 2, "The number of athletes");
  assertFinite(delta, "The change to detect");
  assertPositive(sd, "The SD of the change scores");
  assertProbability(alpha, "The significance level (alpha)");
  const groups = design === "two-sample" ? 2 : 1;
  const df = groups * (n - 1);
  const ncp = (Math.sqrt(n / groups) * delta) / sd;
  const critical = studentTQuantile(1 - alpha / (twoSided ? 2 : 1), df);
  let power = 1 - noncentralTCdf(critical, df, ncp);
  if (twoSided && strict) power += noncentralTCdf(-critical, df, ncp);
  return Math.min(1, Math.max(0, power));
}

export interface PairedPowerInput {
  n: number;
  sdDiff: number;
  delta: number;
  alpha?: number;
}

/**
 * Exact power of the two-sided paired t-test for a true mean change `delta`
 * when change scores have SD `sdDiff` (wrong-tail rejections included).
 *
 * @example
 * pairedPower({ n: 38, sdDiff: 2.12132, delta: 1 }); // ≈ 0.81 (CMJ: TE 1.5 cm, SWC 1 cm)
 */
export function pairedPower({ n, sdDiff, delta, alpha = 0.05 }: PairedPowerInput): number {
  assertPositive(sdDiff, "The SD of the change scores");
  assertPositive(delta, "The change to detect");
  return tTestPower({ n, delta, sd: sdDiff, alpha, design: "paired" });
}

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
 * change `delta` (e.g. the SWC), solving exact power(n) = target by Brent's
 * method. A paired test needs at least 2 athletes, so `exactN` is reported as
 * 2 when 2 already suffice.
 *
 * @example
 * pairedSampleSize({ sdDiff: 1, delta: 0.5 }); // { n: 34, exactN: 33.367…, … }
 */
export function pairedSampleSize(input: SampleSizeInput): SampleSizeResult {
  const { sdDiff, delta, alpha = 0.05, power = 0.8 } = input;
  assertPositive(sdDiff, "The SD of the change scores");
  assertPositive(delta, "The change to detect");
  assertProbability(alpha, "The significance level (alpha)");
  assertProbability(power, "The power");
  return solveSampleSize((n) => tTestPower({ n, delta, sd: sdDiff, alpha }), {
    power,
    normalApproxN: ((normalQuantile(1 - alpha / 2) + normalQuantile(power)) * sdDiff / delta) ** 2,
  });
}

/**
 * Sample size for any `tTestPower` design; exposed so R's help-page examples
 * (two-sample, one-sided) can be checked with the same solver.
 *
 * @example
 * tTestSampleSize({ delta: 1, power: 0.9, design: "two-sample", strict: false }).exactN; // 22.02110
 */
export function tTestSampleSize(
  options: Omit<TTestPowerOptions, "n"> & { power?: number },
): SampleSizeResult {
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
 * Smallest n with t_{1−α/2, n−1}·σ_d/√n ≤ w: athletes needed for the
 * interval of the mean change to be no wider than ± `halfWidth`
 * (METHODS.md §6, precision planning).
 *
 * @example
 * precisionSampleSize({ sdDiff: 2.12132, halfWidth: 1, confidence: 0.95 }); // 20
 */
export function precisionSampleSize({ sdDiff, halfWidth, confidence = 0.95 }: PrecisionInput): number {
  assertPositive(sdDiff, "The SD of the change scores");
  assertPositive(halfWidth, "The interval half-width");
  assertProbability(confidence, "The confidence level");
  const p = 1 - (1 - confidence) / 2;
  const fits = (n: number) => (studentTQuantile(p, n - 1) * sdDiff) / Math.sqrt(n) <= halfWidth;
  // The normal answer is a lower bound (t > z); step up from it.
  let n = Math.max(2, Math.floor(((normalQuantile(p) * sdDiff) / halfWidth) ** 2));
  while (!fits(n)) n = n < 1e6 ? n + 1 : n * 2;
  return n;
}

/**
 * Trials to average on each test day so the typical error of the mean falls
 * below the SWC: the smallest whole k with TE/√k < SWC.
 *
 * @example
 * trialsToDetect(0.02, 0.01); // 5   (10 m sprint: TE 0.02 s, SWC 0.01 s)
 */
export function trialsToDetect(typicalError: number, swc: number): number {
  assertNonNegative(typicalError, "The typical error");
  assertPositive(swc, "The smallest worthwhile change");
  // Equality is not "below": read 0.3 and 0.1 as typed (in binary, 0.3/0.1 is
  // 2.9999999999999996), so shave a negligible 1e-12 off the target.
  const target = swc * (1 - 1e-12);
  let k = Math.max(1, Math.floor((typicalError / swc) ** 2));
  while (k > 1 && typicalError / Math.sqrt(k - 1) < target) k--;
  while (!(typicalError / Math.sqrt(k) < target)) k++;
  return k;
}
