/**
 * Brent's method for a root of a continuous function on a bracketing interval
 * (Brent 1973, "Algorithms for Minimization without Derivatives", ch. 4, the
 * `zeroin` procedure; R's `uniroot` is the same algorithm).
 *
 * Bisection guarantees progress; inverse quadratic or secant steps are taken
 * only while they shrink the bracket fast enough, so convergence is
 * superlinear on smooth functions like power curves.
 *
 * @example
 * findRoot((x) => x * x - 2, 0, 2); // 1.4142135623730951
 */
export interface RootOptions {
  /** Absolute tolerance on x (default 1e-10). */
  tolerance?: number;
  /** Give up after this many iterations (default 200). */
  maxIterations?: number;
}

export function findRoot(
  f: (x: number) => number,
  lower: number,
  upper: number,
  options: RootOptions = {},
): number {
  const tolerance = options.tolerance ?? 1e-10;
  const maxIterations = options.maxIterations ?? 200;
  let a = lower, b = upper;
  let fa = f(a), fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0) throw new RangeError("findRoot: the interval does not bracket a root.");
  let c = a, fc = fa, d = b - a, e = d;
  for (let i = 0; i < maxIterations; i++) {
    if (fb * fc > 0) { c = a; fc = fa; d = b - a; e = d; }
    if (Math.abs(fc) < Math.abs(fb)) { a = b; b = c; c = a; fa = fb; fb = fc; fc = fa; }
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
      if (p > 0) q = -q; else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m; e = m;
      }
    } else {
      d = m; e = m;
    }
    a = b; fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
  }
  return b;
}
