import { describe, expect, it } from "vitest";
import { orientInterval, pairedChange, StatsInputError, sampleSd } from "@/lib/stats";
import { expectDp, expectRelClose } from "./close";

// Student's sleep data, R datasets::sleep (Cushny & Peebles 1905; Student 1908), METHODS.md §1.3
const SLEEP_G1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
const SLEEP_G2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];

// Lakens (2013) Front Psychol 4:863 movie ratings, METHODS.md §1.4
const MOVIE_1 = [9, 7, 8, 9, 8, 9, 9, 10, 9, 9];
const MOVIE_2 = [9, 6, 7, 8, 7, 9, 8, 8, 8, 7];

describe("pairedChange: Student's sleep data", () => {
  const r95 = pairedChange(SLEEP_G1, SLEEP_G2, { confidence: 0.95 });

  it("reproduces R's paired t.test (g2 − g1)", () => {
    // R 4.2.2 t.test(..., paired = TRUE) and SciPy ttest_rel, METHODS.md §1.3 [C]
    expect(r95.n).toBe(10);
    expect(r95.df).toBe(9);
    expectDp(r95.meanDiff, 1.58, 12);
    expectRelClose(r95.t, 4.062127683, 1e-9);
    expectRelClose(r95.p, 0.002832890197, 1e-9);
    expectDp(r95.ciLower, 0.7001142, 7);
    expectDp(r95.ciUpper, 2.4598858, 7);
    expectDp(r95.sdDiff, 1.2299955, 7);
    expectDp(r95.standardError, 0.3889587, 7);
  });

  it("gives d_z and the Hedges-corrected g_z", () => {
    // METHODS.md §1.3 / §5 [C]: d_z = 1.284558; g_z = d_z·(1 − 3/(4·9 − 1)) computed from it
    expectDp(r95.effectSizeDz, 1.284558, 6);
    expectRelClose(r95.hedgesGz, 1.2845575626 * (1 - 3 / 35), 1e-9);
  });

  it("gives the 90% (default) and 99% intervals", () => {
    // METHODS.md §1.3 [C]
    const r90 = pairedChange(SLEEP_G1, SLEEP_G2);
    expect(r90.confidence).toBe(0.9);
    expectDp(r90.ciLower, 0.86699, 5);
    expectDp(r90.ciUpper, 2.29301, 5);
    const r99 = pairedChange(SLEEP_G1, SLEEP_G2, { confidence: 0.99 });
    expectDp(r99.ciLower, 0.31595, 5);
    expectDp(r99.ciUpper, 2.84405, 5);
  });

  it("reports the group means and the baseline SD", () => {
    // METHODS.md §1.3 / §5 [C]: SD1 = 1.78901; means from the data (0.75 and 2.33)
    expectDp(r95.meanPre, 0.75, 12);
    expectDp(r95.meanPost, 2.33, 12);
    expectDp(r95.baselineSd, 1.78901, 5);
  });

  it("flips sign when the arguments are swapped (R's order g1 − g2)", () => {
    // R's help-page call t.test(g1, g2, paired = TRUE): t = −4.0621, CI (−2.4598858, −0.7001142), METHODS.md §1.3
    const r = pairedChange(SLEEP_G2, SLEEP_G1, { confidence: 0.95 });
    expectRelClose(r.t, -4.062127683, 1e-9);
    expectDp(r.ciLower, -2.4598858, 7);
    expectDp(r.ciUpper, -0.7001142, 7);
    expectRelClose(r.p, 0.002832890197, 1e-9);
  });

  it("95% half-width is 0.87989 h", () => {
    // METHODS.md §6 [C]
    expectDp(r95.ciUpper - r95.meanDiff, 0.87989, 5);
  });
});

describe("pairedChange: Lakens (2013) movie data", () => {
  const r = pairedChange(MOVIE_2, MOVIE_1, { confidence: 0.95 });
  it("matches the published paired test and d_z", () => {
    // Lakens 2013: t(9) = 4.74, p = .001, d_z = 1.50 [S]; 4.743416 and CI computed, METHODS.md §1.4 [C]
    expectDp(r.meanDiff, 1.0, 12);
    expectDp(r.sdDiff, 0.6666667, 7);
    expectDp(r.t, 4.743416, 6);
    expectDp(r.p, 0.001054, 6);
    expectDp(r.ciLower, 0.5230954, 7);
    expectDp(r.ciUpper, 1.4769046, 7);
    expectDp(r.effectSizeDz, 1.5, 12);
    // SD of movie 2 = 0.9486833, METHODS.md §1.4 [C]
    expectDp(r.baselineSd, 0.9486833, 7);
  });
});

describe("pairedChange: properties", () => {
  it("the interval is symmetric about the mean change", () => {
    // Property: d̄ ± t·SE
    for (const confidence of [0.5, 0.8, 0.9, 0.95, 0.99]) {
      const r = pairedChange(SLEEP_G1, SLEEP_G2, { confidence });
      expect(r.meanDiff - r.ciLower).toBeCloseTo(r.ciUpper - r.meanDiff, 12);
      expect(r.ciUpper - r.meanDiff).toBeCloseTo(r.tCritical * r.standardError, 12);
    }
  });

  it("wider confidence gives a wider interval", () => {
    const w = (c: number) => {
      const r = pairedChange(SLEEP_G1, SLEEP_G2, { confidence: c });
      return r.ciUpper - r.ciLower;
    };
    expect(w(0.8)).toBeLessThan(w(0.9));
    expect(w(0.9)).toBeLessThan(w(0.95));
  });

  it("gives null t, p and effect sizes when every athlete changes by the same amount", () => {
    const r = pairedChange([10, 12, 15], [11, 13, 16]);
    expect(r.sdDiff).toBe(0);
    expect(r.standardError).toBe(0);
    expect(r.t).toBeNull();
    expect(r.p).toBeNull();
    expect(r.effectSizeDz).toBeNull();
    expect(r.hedgesGz).toBeNull();
    expect(r.ciLower).toBe(1);
    expect(r.ciUpper).toBe(1);
    // no change at all
    const none = pairedChange([5, 6, 7], [5, 6, 7]);
    expect(none.t).toBeNull();
    expect(none.meanDiff).toBe(0);
  });

  it("treats changes equal up to float rounding (1.1→1.2, 2.2→2.3, …) as identical", () => {
    const pre = [1.1, 2.2, 3.3, 4.4];
    const post = [1.2, 2.3, 3.4, 4.5];
    const r = pairedChange(pre, post);
    expect(r.sdDiff).toBe(0);
    expect(r.t).toBeNull();
    expectDp(r.meanDiff, 0.1, 12);
  });

  it("does not snap a genuinely small spread to zero", () => {
    const r = pairedChange([100, 100, 100], [100.01, 100.02, 100.03]);
    expect(r.sdDiff).toBeGreaterThan(0);
    expect(r.t).not.toBeNull();
  });

  it("works on the minimum of two pairs, where Hedges' J is 0", () => {
    // J = 1 − 3/(4·1 − 1) = 0 for df = 1 (Lakens 2013 approximation)
    const r = pairedChange([1, 2], [2, 4]);
    expect(r.df).toBe(1);
    expect(r.hedgesGz).toBe(0);
    expect(r.p).not.toBeNull();
  });

  it("the one-pass shifted sums match a two-pass SD, even far from zero with an outlying first score", () => {
    // Property: agreement with the two-pass sample SD (n − 1) of the differences and of pre.
    const pre = [1e6 + 900, 1e6 + 1.5, 1e6 + 2.25, 1e6 + 0.75, 1e6 + 3, 1e6 + 1];
    const post = pre.map((v, i) => v + 0.5 + 0.01 * i * i);
    const diffs = post.map((v, i) => v - pre[i]);
    const r = pairedChange(pre, post);
    expectRelClose(r.sdDiff, sampleSd(diffs), 1e-9);
    expectRelClose(r.baselineSd, sampleSd(pre), 1e-12);
    expectRelClose(r.meanDiff, diffs.reduce((a, b) => a + b, 0) / diffs.length, 1e-12);
  });

  it("accepts typed arrays", () => {
    const r = pairedChange(Float64Array.from(SLEEP_G1), Float64Array.from(SLEEP_G2), { confidence: 0.95 });
    expectRelClose(r.t, 4.062127683, 1e-9);
  });

  it("the squad interval oriented for a lower-is-better test", () => {
    // Sprint times: a fall in time is a gain, so the oriented interval is the negated, swapped one.
    const r = pairedChange([3.1, 3.2, 3.05, 3.3], [3.0, 3.15, 3.0, 3.2]);
    const o = orientInterval(r.ciLower, r.ciUpper, false);
    expect(o.lower).toBeCloseTo(-r.ciUpper, 15);
    expect(o.upper).toBeCloseTo(-r.ciLower, 15);
    expect(o.lower).toBeGreaterThan(0);
  });
});

describe("pairedChange: input errors", () => {
  it("names unequal lengths", () => {
    expect(() => pairedChange([1, 2, 3, 4, 5, 6, 7, 8, 9, 10], [1, 2, 3, 4, 5, 6, 7, 8, 9])).toThrow(
      new StatsInputError("Pre and post need the same number of scores (got 10 and 9)."),
    );
  });
  it("needs at least two pairs", () => {
    expect(() => pairedChange([1], [2])).toThrow(StatsInputError);
    expect(() => pairedChange([], [])).toThrow(/At least 2 athletes/);
  });
  it("rejects non-finite scores, naming the position", () => {
    expect(() => pairedChange([NaN, 2, 3], [1, 2, 3])).toThrow("Pre score 1 is not a number (got NaN).");
    expect(() => pairedChange([1, 2, 3], [1, 2, -Infinity])).toThrow("Post score 3 is not a number (got -Infinity).");
    expect(() => pairedChange([1, 2, 3], [1, 2, undefined as unknown as number])).toThrow(StatsInputError);
    expect(() => pairedChange([1, 2, NaN], [1, 2, 3])).toThrow("Pre score 3 is not a number (got NaN).");
    expect(() => pairedChange([1, 2, 3], [1, Infinity, 3])).toThrow("Post score 2 is not a number (got Infinity).");
    expect(() => pairedChange([1, 2, 3], [1, null as unknown as number, 3])).toThrow(StatsInputError);
    expect(() => pairedChange([1, 2, 3], [1, "2" as unknown as number, 3])).toThrow(StatsInputError);
  });
  it("rejects scores too large to sum", () => {
    expect(() => pairedChange([1e308, -1e308], [0, 0])).toThrow("The scores are too large to analyse.");
  });
  it("rejects a confidence outside (0, 1)", () => {
    for (const confidence of [0, 1, 90, -0.1, NaN]) {
      expect(() => pairedChange([1, 2, 3], [2, 3, 5], { confidence })).toThrow(StatsInputError);
    }
  });
  it("is a StatsInputError with the right name", () => {
    try {
      pairedChange([1, 2], [1]);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(StatsInputError);
      expect(e).toBeInstanceOf(Error);
      expect((e as Error).name).toBe("StatsInputError");
    }
  });
});
