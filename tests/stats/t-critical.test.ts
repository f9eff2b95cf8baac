import { describe, expect, it } from "vitest";
import { StatsInputError, studentTQuantile, studentTUpperTail, tCritical, zCritical } from "@/lib/stats";
import { expectDp, expectRelClose } from "./close";

// NIST/SEMATECH e-Handbook of Statistical Methods §1.3.6.7.2, critical values of
// Student's t, as reproduced in METHODS.md §1.2 (3 dp). Columns: df, t_0.025 (95%),
// t_0.05 (90%), t_0.005 (99%).
const NIST: Array<[number, number, number, number]> = [
  [1, 12.706, 6.314, 63.657],
  [2, 4.303, 2.92, 9.925],
  [3, 3.182, 2.353, 5.841],
  [4, 2.776, 2.132, 4.604],
  [5, 2.571, 2.015, 4.032],
  [7, 2.365, 1.895, 3.499],
  [9, 2.262, 1.833, 3.25],
  [10, 2.228, 1.812, 3.169],
  [19, 2.093, 1.729, 2.861],
  [29, 2.045, 1.699, 2.756],
  [30, 2.042, 1.697, 2.75],
  [60, 2.0, 1.671, 2.66],
  [100, 1.984, 1.66, 2.626],
  [Infinity, 1.96, 1.645, 2.576],
];

describe("tCritical", () => {
  it.each(NIST)("matches the NIST table to 3 dp for df = %s", (df, t95, t90, t99) => {
    // NIST/SEMATECH e-Handbook §1.3.6.7.2 (METHODS.md §1.2)
    expectDp(tCritical(0.95, df), t95, 3);
    expectDp(tCritical(0.9, df), t90, 3);
    expectDp(tCritical(0.99, df), t99, 3);
  });

  it("matches R qt() / SciPy t.ppf to the digits shown", () => {
    // computed with R 4.2.2 qt() and SciPy 1.17.1, METHODS.md §1.2
    const cases: Array<[number, number, number, number]> = [
      // confidence, df, value, decimals shown
      [0.95, 1, 12.7062, 4],
      [0.9, 1, 6.31375, 5],
      [0.95, 2, 4.30265, 5],
      [0.9, 2, 2.91999, 5],
      [0.95, 5, 2.57058, 5],
      [0.9, 5, 2.01505, 5],
      [0.95, 9, 2.26216, 5],
      [0.9, 9, 1.83311, 5],
      [0.95, 10, 2.22814, 5],
      [0.9, 10, 1.81246, 5],
      [0.95, 19, 2.09302, 5],
      [0.9, 19, 1.72913, 5],
      [0.95, 29, 2.04523, 5],
      [0.9, 29, 1.69913, 5],
      [0.95, 30, 2.04227, 5],
      [0.9, 30, 1.69726, 5],
      [0.95, 60, 2.0003, 5],
      [0.9, 60, 1.67065, 5],
      [0.95, 100, 1.98397, 5],
      [0.9, 100, 1.66023, 5],
      [0.95, 120, 1.97993, 5],
      [0.9, 120, 1.65765, 5],
      [0.99, 120, 2.617, 3],
    ];
    for (const [confidence, df, value, dp] of cases) expectDp(tCritical(confidence, df), value, dp);
  });

  it("gives the normal quantiles for df = Infinity", () => {
    // computed with R 4.2.2 qnorm(), METHODS.md §1.2
    expectDp(tCritical(0.95, Infinity), 1.959964, 6);
    expectDp(tCritical(0.9, Infinity), 1.644854, 6);
    expectDp(tCritical(0.99, Infinity), 2.575829, 6);
    expectDp(tCritical(0.8, Infinity), 1.281552, 6);
    expectDp(zCritical(0.95), 1.959964, 6);
  });

  it("gives the 50/75/90/95% multipliers used for individual intervals", () => {
    // computed with R 4.2.2, METHODS.md §1.2 ("Other quantiles used below")
    const z = [0.6745, 1.1503, 1.6449, 1.96];
    const t19 = [0.6876, 1.1866, 1.7291, 2.093];
    [0.5, 0.75, 0.9, 0.95].forEach((c, i) => {
      expectDp(tCritical(c, Infinity), z[i], 4);
      expectDp(tCritical(c, 19), t19[i], 4);
    });
  });

  it("approaches z as df grows (df = 1e7 agrees with z to 1e-6)", () => {
    // Property: t_p(df) → z_p; the gap is about (z³ + z)/(4·df), 2.4e-7 at 95% for df = 1e7.
    for (const c of [0.5, 0.8, 0.9, 0.95, 0.99, 0.999]) {
      const z = tCritical(c, Infinity);
      const t = tCritical(c, 1e7);
      expect(t).toBeGreaterThan(z);
      expect(t - z).toBeLessThan(1e-6);
      // monotone in df
      expect(tCritical(c, 1e3)).toBeGreaterThan(tCritical(c, 1e4));
      expect(tCritical(c, 1e4)).toBeGreaterThan(t);
    }
    // Far past jStat's accurate range (it is 0.15% off at df = 1e8):
    expect(tCritical(0.95, 1e10) - tCritical(0.95, Infinity)).toBeLessThan(1e-9);
  });

  it("is accurate across the switch to the Cornish-Fisher series at df = 1000", () => {
    // computed with SciPy 1.17.1 stats.t.ppf (during development)
    expectRelClose(studentTQuantile(0.975, 999), 1.9623414611334493, 1e-10);
    expectRelClose(studentTQuantile(0.975, 1000), 1.9623390808264083, 1e-10);
    expectRelClose(studentTQuantile(0.95, 50), 1.6759050251630967, 1e-10);
  });

  it("rejects a confidence outside (0, 1) and df ≤ 0", () => {
    for (const c of [0, 1, -0.5, 1.5, NaN]) expect(() => tCritical(c, 10)).toThrow(StatsInputError);
    expect(() => tCritical(0.95, 0)).toThrow(StatsInputError);
    expect(() => tCritical(0.95, -3)).toThrow(StatsInputError);
    expect(() => tCritical(0.95, NaN)).toThrow(StatsInputError);
    expect(() => tCritical(95, 10)).toThrow(/between 0 and 1/);
  });
});

describe("studentTUpperTail", () => {
  it("gives the sleep-data p-values", () => {
    // R 4.2.2 t.test on datasets::sleep, METHODS.md §1.3: two-sided p 0.002832890197, one-sided 0.0014164
    expectRelClose(2 * studentTUpperTail(4.062127683, 9), 0.002832890197, 1e-9);
    expectDp(studentTUpperTail(4.062127683, 9), 0.0014164, 7);
  });

  it("stays accurate for large df, where jStat's t CDF drifts", () => {
    // computed with SciPy 1.17.1 stats.t.sf (during development); jStat.studentt.cdf is 0.5% off here
    expectRelClose(studentTUpperTail(0.1, 1e6), 0.4601721727460216, 1e-7);
    expectRelClose(studentTUpperTail(2, 1e4), 0.022763630330717714, 1e-7);
  });

  it("is symmetric: P(T ≥ −t) = 1 − P(T ≥ t)", () => {
    for (const df of [1, 4.5, 30, 1e5]) {
      expect(studentTUpperTail(-1.3, df)).toBeCloseTo(1 - studentTUpperTail(1.3, df), 14);
      expect(studentTUpperTail(0, df)).toBeCloseTo(0.5, 14);
    }
  });
});
