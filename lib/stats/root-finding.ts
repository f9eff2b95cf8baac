/**
 * Root finding for the sample-size solvers, which need power(n) = target to
 * many digits from a function with no cheap derivative.
 */
export interface RootOptions {
  /** Absolute tolerance on x (default 1e-10). */
  tolerance?: number;
  /** Give up after this many iterations (default 200). */
  maxIterations?: number;
}

/**
 * A root of a continuous function on an interval where it changes sign, by
 * Brent's method.
 *
 * Source: Brent (1973), Algorithms for Minimization without Derivatives,
 * ch. 4, the `zeroin` procedure; R's `uniroot` is the same algorithm.
 * Bisection guarantees that the bracket [lower, upper] keeps shrinking;
 * inverse quadratic or secant steps are taken only while they shrink it fast
 * enough, so convergence is superlinear on smooth functions like power curves.
 *
 * Stops when the bracket is narrower than about `tolerance`; after
 * `maxIterations` it returns its best estimate so far rather than throwing.
 *
 * @param f continuous function of one variable
 * @param lower one end of the bracket
 * @param upper the other end; f(lower) and f(upper) must differ in sign
 * @param options `tolerance` on x (default 1e-10), `maxIterations` (default 200)
 * @returns x with f(x) ≈ 0, within `tolerance`
 * @throws {RangeError} when f(lower) and f(upper) have the same sign (no root
 * is bracketed). Not a StatsInputError: only code inside lib/stats calls it,
 * so this is a programming error, never a coach's input.
 * @example
 * findRoot((x) => x * x - 2, 0, 2); // => 1.4142135623731364 (√2 = 1.4142135623730951)
 */
export function findRoot(f: (x: number) => number, lower: number, upper: number, options: RootOptions = {}): number {
  const tolerance = options.tolerance ?? 1e-10;
  const maxIterations = options.maxIterations ?? 200;
  let a = lower,
    b = upper;
  let fa = f(a),
    fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0) throw new RangeError("findRoot: the interval does not bracket a root.");
  let c = a,
    fc = fa,
    d = b - a,
    e = d;
  for (let i = 0; i < maxIterations; i++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + tolerance / 2;
    const m = (c - b) / 2;
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number, q: number;
      if (a === c) {
        p = 2 * m * s; // secant
        q = 1 - s;
      } else {
        const r = fb / fc; // inverse quadratic interpolation
        const t = fa / fc;
        p = s * (2 * m * t * (t - r) - (b - a) * (r - 1));
        q = (t - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
  }
  return b;
}
