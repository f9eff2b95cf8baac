/**
 * Minimal typings for the parts of jStat 1.9 that `lib/stats` uses.
 *
 * jStat ships no types. Its CommonJS build sets `module.exports` to the jStat
 * function, which also carries itself as the `.jStat` property, so the default
 * import (as produced by vitest, tsx and Next's bundler) is that object.
 */
declare module "jstat" {
  interface JStatStudentT {
    cdf(x: number, dof: number): number;
    inv(p: number, dof: number): number;
  }
  interface JStatNormal {
    cdf(x: number, mean: number, sd: number): number;
    inv(p: number, mean: number, sd: number): number;
  }
  interface JStatChiSquare {
    cdf(x: number, dof: number): number;
    inv(p: number, dof: number): number;
  }
  interface JStatCentralF {
    cdf(x: number, df1: number, df2: number): number;
    inv(p: number, df1: number, df2: number): number;
  }
  interface JStatNoncentralT {
    cdf(x: number, dof: number, ncp: number): number;
  }
  export interface JStatStatic {
    studentt: JStatStudentT;
    normal: JStatNormal;
    chisquare: JStatChiSquare;
    centralF: JStatCentralF;
    noncentralt: JStatNoncentralT;
    /** ln Γ(x) (Lanczos approximation, Numerical Recipes form). */
    gammaln(x: number): number;
    /** ln B(a, b). */
    betaln(a: number, b: number): number;
    /** Regularized incomplete beta I_x(a, b). */
    ibeta(x: number, a: number, b: number): number;
  }
  const jstatPkg: JStatStatic & { jStat: JStatStatic };
  export default jstatPkg;
}
