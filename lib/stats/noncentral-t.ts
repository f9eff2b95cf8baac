/**
 * Noncentral t distribution, our own rather than `jStat.noncentralt.cdf`.
 *
 * jStat sums the Poisson-mixture series from term 0 for at least 200 terms,
 * calling its incomplete beta twice per term. Against a 40-digit mpmath
 * evaluation of the same series (378 points, df 1–1000, δ −2 to 40) it is
 * accurate to 6e-9 for |δ| ≤ 20, enough for the R check values, but it returns
 * ~0 instead of 0.5–0.95 at δ = 30 and 40 (the series starts at e^{−δ²/2} and
 * stops before reaching its bulk), and each call costs ~270 µs while
 * sample-size root finding calls it dozens of times. This version agrees with
 * mpmath to 2e-10 on all 378 points and takes ~3 µs.
 */

import { normalCdf } from "./distributions";
import { betaRecurrenceTerm, regularizedBeta } from "./incomplete-beta";
import { jStat } from "./jstat";

const ERROR_BOUND = 1e-15;
const MAX_STEPS = 100000;

/**
 * Cumulative distribution function of the noncentral t, P(T ≤ t) for
 * T ~ t'(df, δ): the power of a t-test is one minus it at the critical value.
 *
 * Source: the series of Lenth (1989, Applied Statistics 38:185–189, algorithm
 * AS 243), summed outward from its largest term as in Benton & Krishnamoorthy
 * (2003, Computational Statistics & Data Analysis 43:249–267). For t ≥ 0, with
 * x = t²/(t² + df) and λ = δ²/2,
 *
 *   P(T ≤ t) = Φ(−δ) + ½ Σ_{j≥0} [ p_j I_x(j + ½, df/2) + q_j I_x(j + 1, df/2) ],
 *   p_j = e^{−λ} λ^j / j!,   q_j = δ e^{−λ} λ^j / (√2 Γ(j + 3/2)),
 *
 * and P(T ≤ t; df, δ) = 1 − P(T ≤ −t; df, −δ) for t < 0. Only two incomplete
 * beta values are evaluated (at j = ⌊λ⌋); the rest follow from the recurrence
 * I_x(a + 1, b) = I_x(a, b) − x^a(1 − x)^b / (a·B(a, b)). Summation stops
 * when a geometric bound on the rest of the series falls below 1e-15.
 *
 * Does not throw: a NaN argument gives NaN; df must be above zero.
 *
 * @param t point at which to evaluate the CDF
 * @param df degrees of freedom, above zero
 * @param ncp noncentrality δ, e.g. √n·Δ/σ_d for a paired test
 * @returns P(T ≤ t), clamped to [0, 1]
 * @example
 * // Two-sample t, n = 20 per group, Δ = σ: t_crit = 2.024394 on 38 df, δ = √10
 * noncentralTCdf(2.024394164, 38, Math.sqrt(10)); // => 0.1310471983… (power ≈ 0.869)
 */
export function noncentralTCdf(t: number, df: number, ncp: number): number {
  if (Number.isNaN(t) || Number.isNaN(df) || Number.isNaN(ncp)) return NaN;
  if (t < 0) return clampProbability(1 - upperHalfCdf(-t, df, -ncp));
  return clampProbability(upperHalfCdf(t, df, ncp));
}

/** P(T ≤ t) for t ≥ 0. */
function upperHalfCdf(t: number, df: number, ncp: number): number {
  if (t === Infinity) return 1;
  const base = normalCdf(-ncp);
  if (t === 0) return base;
  const x = (t * t) / (t * t + df);
  const b = df / 2;
  const lambda = (ncp * ncp) / 2;
  if (lambda === 0) return base + 0.5 * regularizedBeta(x, 0.5, b);
  return base + 0.5 * mixtureSum(x, b, lambda, ncp);
}

/** Σ_j [p_j I_x(j + ½, b) + q_j I_x(j + 1, b)], summed outward from j = ⌊λ⌋. */
function mixtureSum(x: number, b: number, lambda: number, ncp: number): number {
  const k = Math.floor(lambda);
  const logPoisson = -lambda + k * Math.log(lambda);
  const pK = Math.exp(logPoisson - jStat.gammaln(k + 1));
  const qK = (ncp / Math.SQRT2) * Math.exp(logPoisson - jStat.gammaln(k + 1.5));
  const iPK = regularizedBeta(x, k + 0.5, b);
  const iQK = regularizedBeta(x, k + 1, b);
  const ePK = betaRecurrenceTerm(x, k + 0.5, b);
  const eQK = betaRecurrenceTerm(x, k + 1, b);

  let sum = pK * iPK + qK * iQK;

  // Forward: j = k + 1, k + 2, …; I_x falls as j grows.
  let p = pK,
    q = qK,
    iP = iPK,
    iQ = iQK,
    eP = ePK,
    eQ = eQK;
  for (let j = k + 1; j <= k + MAX_STEPS; j++) {
    const aP = j - 0.5; // a of the previous P term
    const aQ = j; // a of the previous Q term
    iP -= eP;
    iQ -= eQ;
    eP *= (x * (aP + b)) / (aP + 1);
    eQ *= (x * (aQ + b)) / (aQ + 1);
    p *= lambda / j;
    q *= lambda / (j + 0.5);
    sum += p * iP + q * iQ;
    if (iP <= 0 && iQ <= 0) break;
    // Past the mode the weights shrink by at least r = λ/(j + 1) per step, and
    // I_x only falls, so the rest of the series is below a geometric tail.
    const rP = lambda / (j + 1);
    const rQ = lambda / (j + 1.5);
    const rest = (p * rP * Math.max(iP, 0)) / (1 - rP) + (Math.abs(q) * rQ * Math.max(iQ, 0)) / (1 - rQ);
    if (rest < ERROR_BOUND) break;
  }

  // Backward: j = k − 1, …, 0; here I_x ≤ 1 and the weights shrink by j/λ per step.
  p = pK;
  q = qK;
  iP = iPK;
  iQ = iQK;
  eP = ePK;
  eQ = eQK;
  for (let j = k - 1; j >= 0; j--) {
    const aP = j + 0.5;
    const aQ = j + 1;
    // Step the recurrence term from a + 1 down to a before using it.
    eP *= (aP + 1) / (x * (aP + b));
    eQ *= (aQ + 1) / (x * (aQ + b));
    iP += eP;
    iQ += eQ;
    p *= (j + 1) / lambda;
    q *= (j + 1.5) / lambda;
    sum += p * iP + q * iQ;
    const rP = j / lambda;
    const rQ = (j + 0.5) / lambda;
    if (rQ < 1 && (p * rP) / (1 - rP) + (Math.abs(q) * rQ) / (1 - rQ) < ERROR_BOUND) break;
  }
  return sum;
}

function clampProbability(value: number): number {
  return value < 0 ? 0 : Math.min(value, 1);
}
