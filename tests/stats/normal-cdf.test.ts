import { describe, expect, it } from "vitest";
import { normalCdf, normalQuantile } from "@/lib/stats";
import { expectDp, expectRelClose } from "./close";

describe("normalCdf", () => {
  it("Φ(1.959964) = 0.975, Φ(1.644854) = 0.95, Φ(2.575829) = 0.995, Φ(1.281552) = 0.90", () => {
    // Normal quantiles z_0.025, z_0.05, z_0.005, z_0.10 of METHODS.md §1.2 [C]; the full-precision
    // quantiles were computed with SciPy 1.17.1 stats.norm.ppf during this work.
    expectRelClose(normalCdf(1.959963984540054), 0.975, 1e-12);
    expectRelClose(normalCdf(1.6448536269514722), 0.95, 1e-12);
    expectRelClose(normalCdf(2.5758293035489004), 0.995, 1e-12);
    expectRelClose(normalCdf(1.2815515655446004), 0.9, 1e-12);
    expectDp(normalCdf(1.959964), 0.975, 6);
  });

  it("Φ(1) = 0.8413447461 (Abramowitz & Stegun table 26.1)", () => {
    // Abramowitz & Stegun 1964, Table 26.1, 10 dp (from memory); mpmath 1.3.0 ncdf(1) at 40 digits
    // gives 0.84134474606854294858, computed during this work.
    expectDp(normalCdf(1), 0.8413447461, 10);
    expectRelClose(normalCdf(1), 0.84134474606854294858, 1e-12);
  });

  it("matches 40-digit mpmath values in the tails", () => {
    // mpmath 1.3.0 ncdf, computed during this work
    expectRelClose(normalCdf(-3), 0.0013498980316300945267, 1e-12);
    expectRelClose(normalCdf(2.5), 0.99379033467422386483, 1e-12);
    expectRelClose(normalCdf(-6), 9.865876450376981407e-10, 1e-9);
  });

  it("is ½ at 0, symmetric, and 0 or 1 at the infinities", () => {
    // Properties of any symmetric distribution function: Φ(−x) = 1 − Φ(x)
    expect(normalCdf(0)).toBe(0.5);
    for (const x of [0.1, 0.674, 1.5, 2.2, 3.7]) expect(normalCdf(-x)).toBeCloseTo(1 - normalCdf(x), 15);
    expect(normalCdf(-Infinity)).toBe(0);
    expect(normalCdf(Infinity)).toBe(1);
    expect(normalCdf(NaN)).toBeNaN();
  });

  it("inverts normalQuantile", () => {
    // Φ(Φ⁻¹(p)) = p by definition
    for (const p of [0.001, 0.05, 0.25, 0.5, 0.8, 0.975, 0.999]) expectRelClose(normalCdf(normalQuantile(p)), p, 1e-12);
  });
});
