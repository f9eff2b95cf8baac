import { describe, expect, it } from "vitest";
import { pairedPower, pairedSampleSize, precisionSampleSize, StatsInputError, tTestSampleSize } from "@/lib/stats";
import { expectDp, expectRelClose } from "./close";

describe("tTestSampleSize: R power.t.test help-page examples (two-sample, sd 1, sig.level 0.05)", () => {
  // R's power.t.test defaults to strict = FALSE, which leaves out the wrong-tail term of a
  // two-sided test; these values are reproduced with strict: false.
  it("power.t.test(power = .90, delta = 1)$n = 22.02110", () => {
    // R 4.2.2, METHODS.md §6 [C]. R's uniroot tolerance is ~1e-4, so compare to the 5 dp printed.
    const r = tTestSampleSize({ delta: 1, power: 0.9, design: "two-sample", strict: false });
    expectDp(r.exactN, 22.0211, 4);
    expect(r.n).toBe(23);
  });

  it("power.t.test(power = .90, delta = 1, alternative = 'one.sided')$n = 17.84713", () => {
    // R 4.2.2, METHODS.md §6 [C]
    const r = tTestSampleSize({ delta: 1, power: 0.9, design: "two-sample", alternative: "one-sided" });
    expectDp(r.exactN, 17.84713, 4);
  });
});

describe("pairedSampleSize: paired table by d_z (σ_d = 1, α 0.05 two-sided)", () => {
  // METHODS.md §6 [C; exact noncentral t]: 80% power
  const table: Array<[number, number, number, number]> = [
    // d_z, exact n (2 dp), ceiling, normal approximation (2 dp)
    [0.2, 198.15, 199, 196.22],
    [0.3, 89.15, 90, 87.21],
    [0.5, 33.37, 34, 31.4],
    [0.8, 14.3, 15, 12.26],
    [1.0, 9.94, 10, 7.85],
  ];
  it.each(table)("d_z %s → n %s (%s)", (dz, exact, ceiling, normal) => {
    const r = pairedSampleSize({ sdDiff: 1, delta: dz });
    expectDp(r.exactN, exact, 2);
    expect(r.n).toBe(ceiling);
    expectDp(r.normalApproxN, normal, 2);
    expect(r.achievedPower).toBeGreaterThanOrEqual(0.8);
  });

  it("90% power: d_z 0.5 → 43.996, d_z 1.0 → 12.585", () => {
    // METHODS.md §6 [C]. The exact root is 43.99548 (43.99550 without the wrong tail); 43.996
    // reflects R's uniroot tolerance (~1e-4), so that value is checked to ±1e-3.
    const half = pairedSampleSize({ sdDiff: 1, delta: 0.5, power: 0.9 });
    expect(Math.abs(half.exactN - 43.996)).toBeLessThan(1e-3);
    expect(half.n).toBe(44);
    expectDp(pairedSampleSize({ sdDiff: 1, delta: 1, power: 0.9 }).exactN, 12.585, 3);
  });

  it("agrees with an independent SciPy solution to 1e-8", () => {
    // computed with SciPy 1.17.1 (stats.nct, brentq; wrong tail included), during development.
    // The matching power check, pairedPower(n 10, Δ/σ_d 1) = 0.8030968566327219, is in power.test.ts.
    expectRelClose(pairedSampleSize({ sdDiff: 1, delta: 0.5 }).exactN, 33.367128953330834, 1e-9);
    expectRelClose(pairedSampleSize({ sdDiff: 1, delta: 0.5, power: 0.9 }).exactN, 43.99548090674633, 1e-9);
  });

  it("power at the solution equals the target", () => {
    const r = pairedSampleSize({ sdDiff: 2, delta: 1.3, power: 0.85, alpha: 0.1 });
    expect(pairedPower({ n: r.exactN, sdDiff: 2, delta: 1.3, alpha: 0.1 })).toBeCloseTo(0.85, 9);
    expect(r.n).toBe(Math.ceil(r.exactN));
  });

  it("reports 2 athletes when even 2 reach the power", () => {
    const r = pairedSampleSize({ sdDiff: 1, delta: 50 });
    expect(r.n).toBe(2);
    expect(r.exactN).toBe(2);
  });
});

describe("CMJ planning example (TE 1.5 cm → σ_d = √2·1.5 = 2.12132 cm; SWC 1.0 cm)", () => {
  const sdDiff = Math.SQRT2 * 1.5;
  it("80% power: n = 37.29 → 38 (normal approximation 35.32)", () => {
    // METHODS.md §6 [C]
    const r = pairedSampleSize({ sdDiff, delta: 1 });
    expectDp(r.exactN, 37.29, 2);
    expect(r.n).toBe(38);
    expectDp(r.normalApproxN, 35.32, 2);
  });

  it("precision: 95% half-width ≤ SWC needs 20; 90% needs 15; ≤ 0.5·σ_d needs 18", () => {
    // METHODS.md §6 [C]
    expect(precisionSampleSize({ sdDiff, halfWidth: 1 })).toBe(20);
    expect(precisionSampleSize({ sdDiff, halfWidth: 1, confidence: 0.9 })).toBe(15);
    expect(precisionSampleSize({ sdDiff: 1, halfWidth: 0.5 })).toBe(18);
  });
});

describe("sample size: input errors", () => {
  it("rejects non-positive sdDiff/delta and alpha/power outside (0, 1)", () => {
    expect(() => pairedSampleSize({ sdDiff: 0, delta: 1 })).toThrow(
      "The SD of the change scores must be above zero (got 0).",
    );
    expect(() => pairedSampleSize({ sdDiff: -1, delta: 1 })).toThrow(StatsInputError);
    expect(() => pairedSampleSize({ sdDiff: 1, delta: 0 })).toThrow(StatsInputError);
    expect(() => pairedSampleSize({ sdDiff: 1, delta: -0.5 })).toThrow(StatsInputError);
    expect(() => pairedSampleSize({ sdDiff: 1, delta: 1, power: 1 })).toThrow(StatsInputError);
    expect(() => pairedSampleSize({ sdDiff: 1, delta: 1, power: 0 })).toThrow(StatsInputError);
    expect(() => pairedSampleSize({ sdDiff: 1, delta: 1, alpha: 0 })).toThrow(StatsInputError);
    expect(() => pairedSampleSize({ sdDiff: 1, delta: 1, alpha: 1.5 })).toThrow(StatsInputError);
    expect(() => pairedSampleSize({ sdDiff: NaN, delta: 1 })).toThrow(StatsInputError);
    expect(() => precisionSampleSize({ sdDiff: 1, halfWidth: 0 })).toThrow(StatsInputError);
    expect(() => precisionSampleSize({ sdDiff: 1, halfWidth: 1, confidence: 1 })).toThrow(StatsInputError);
  });
});
