import jstatPkg from "jstat";
import { describe, expect, it } from "vitest";
import { noncentralTCdf, studentTUpperTail } from "@/lib/stats";
import { expectRelClose } from "./close";

// Reference values: the AS 243 Poisson-mixture series evaluated at 40 digits with
// mpmath 1.3.0 (betainc, ncdf), during development, and confirmed to 1e-16 by direct
// numerical integration of the definition T = (Z + δ)/√(V/df) (mpmath quad) and by
// SciPy 1.17.1 stats.nct.
const REFERENCE: Array<[number, number, number, number]> = [
  [2.024394164, 38, Math.sqrt(10), 0.1310471983265167],
  [-2.024394164, 38, Math.sqrt(10), 2.2603186262801545e-7],
  [1.5, 9, 0.5, 0.81735974339311096],
  [3.0, 4.5, 2.8, 0.50251114689806281],
  [-1.0, 19, -2.0, 0.84138500679981731],
  [32, 100, 30, 0.78026253515307338],
  [42, 1000, 40, 0.92669771026605116],
  [0.5, 30, 0.0, 0.68963849755743636],
  [2.1, 38, Math.sqrt(10), 0.14771338654815395],
];

describe("noncentralTCdf", () => {
  it.each(REFERENCE)("P(T ≤ %s; df %s, δ %s) to 1e-9 absolute", (t, df, ncp, expected) => {
    // mpmath 40-digit series and direct integration (see above)
    expect(Math.abs(noncentralTCdf(t, df, ncp) - expected)).toBeLessThan(1e-9);
  });

  it("keeps relative accuracy in the small lower tail used by two-sided power", () => {
    // mpmath 40-digit series: 2.2603186262801545e-7
    expectRelClose(noncentralTCdf(-2.024394164, 38, Math.sqrt(10)), 2.2603186262801545e-7, 1e-6);
  });

  it("reduces to the central t when δ = 0", () => {
    for (const [t, df] of [
      [1.3, 5],
      [-2, 12],
      [0.2, 100],
    ]) {
      expect(noncentralTCdf(t, df, 0)).toBeCloseTo(1 - studentTUpperTail(t, df), 12);
    }
  });

  it("satisfies P(T ≤ t; δ) = 1 − P(T ≤ −t; −δ) and is monotone in t", () => {
    let previous = 0;
    for (let t = -6; t <= 12; t += 0.5) {
      const v = noncentralTCdf(t, 15, 2.5);
      expect(v).toBeCloseTo(1 - noncentralTCdf(-t, 15, -2.5), 12);
      expect(v).toBeGreaterThanOrEqual(previous);
      previous = v;
    }
  });

  it("is right where jStat's own noncentral t fails (δ = 30)", () => {
    // jStat 1.9.6 noncentralt.cdf returns ~2e-40 here (its series starts at e^{−δ²/2});
    // the mpmath value is 0.78026253515307338.
    const { jStat } = jstatPkg;
    expect(jStat.noncentralt.cdf(32, 100, 30)).toBeLessThan(1e-30);
    expect(noncentralTCdf(32, 100, 30)).toBeCloseTo(0.78026253515307338, 9);
  });
});
