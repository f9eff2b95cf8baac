import { studentTQuantile } from "./distributions";
import { noncentralTCdf } from "./noncentral-t";
import { assertAtLeast, assertFinite, assertPositive, assertProbability } from "./validate";

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
 * Power of a t-test: the chance it rejects when the true difference is `delta`.
 *
 * 1 − β = P(T' > t_crit) [+ P(T' < −t_crit) when strict and two-sided], with
 * T' ~ noncentral t(ν, √(n/g)·Δ/σ), ν = g(n − 1), g = 2 for two samples else 1.
 * Exact under normality; the model of R's `power.t.test`. R's default
 * (strict = FALSE) leaves out the wrong-tail term of a two-sided test, so its
 * help-page values (e.g. power 0.8689528) are reproduced with `strict: false`;
 * the difference is ~2e-7 in power near 80–90%.
 *
 * @param options n, delta, sd, alpha, design, alternative, strict
 * @returns the power, between 0 and 1
 * @throws {StatsInputError} when n is below 2 or not a number, delta is not a
 * finite number, sd is not above zero, or alpha is not strictly between 0 and 1
 * @example
 * // R: power.t.test(n = 20, delta = 1)$power = 0.8689528
 * tTestPower({ n: 20, delta: 1, design: "two-sample", strict: false }); // => 0.86895280…
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
 * Power of the two-sided paired t-test of a squad's pre/post change.
 *
 * {@link tTestPower} with df = n − 1 and noncentrality √n·Δ/σ_d, wrong-tail
 * rejections included (METHODS.md §6). With σ_d = √2·TE when athletes respond
 * alike, this is the chance a squad of n detects a true change of one SWC.
 *
 * @param input n athletes, sdDiff (SD of change scores), delta, alpha (0.05)
 * @returns the power, between 0 and 1
 * @throws {StatsInputError} when n is below 2, sdDiff or delta is not above
 * zero, or alpha is not strictly between 0 and 1
 * @example
 * // SciPy 1.17.1 stats.nct: 0.8030968566327219
 * pairedPower({ n: 10, sdDiff: 1, delta: 1 }); // => 0.80309685…
 */
export function pairedPower({ n, sdDiff, delta, alpha = 0.05 }: PairedPowerInput): number {
  assertPositive(sdDiff, "The SD of the change scores");
  assertPositive(delta, "The change to detect");
  return tTestPower({ n, delta, sd: sdDiff, alpha, design: "paired" });
}
