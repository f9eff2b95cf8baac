import { describe, it } from "vitest";
import { chiSquareQuantile, normalQuantile } from "@/lib/stats";
import { expectDp, expectRelClose } from "./close";

// METHODS.md §3.2 [C; R qchisq and SciPy chi2.ppf]: 95% limits of a typical error.
// Columns: ν, χ²_0.025, χ²_0.975, lower factor √(ν/χ²_0.975), upper factor √(ν/χ²_0.025).
const METHODS_TABLE: Array<[number, number, number, number, number]> = [
  [7, 1.68987, 16.01276, 0.66117, 2.03527],
  [9, 2.70039, 19.02277, 0.68784, 1.82561],
  [16, 6.90766, 28.84535, 0.74477, 1.52193],
  [19, 8.90652, 32.85233, 0.76049, 1.46057],
  [29, 16.04707, 45.72229, 0.79641, 1.34432],
];

describe("chiSquareQuantile", () => {
  it.each(METHODS_TABLE)("ν = %s: quantiles and TE factors to 5 dp", (df, lo, hi, lowerFactor, upperFactor) => {
    // METHODS.md §3.2 [C]
    expectDp(chiSquareQuantile(0.025, df), lo, 5);
    expectDp(chiSquareQuantile(0.975, df), hi, 5);
    expectDp(Math.sqrt(df / chiSquareQuantile(0.975, df)), lowerFactor, 5);
    expectDp(Math.sqrt(df / chiSquareQuantile(0.025, df)), upperFactor, 5);
  });

  it("matches SciPy chi2.ppf to 1e-9", () => {
    // computed with SciPy 1.17.1 stats.chi2.ppf during this work
    expectRelClose(chiSquareQuantile(0.025, 16), 6.907664353497003, 1e-9);
    expectRelClose(chiSquareQuantile(0.975, 16), 28.845350723404753, 1e-9);
    expectRelClose(chiSquareQuantile(0.975, 29), 45.72228580417452, 1e-9);
    expectRelClose(chiSquareQuantile(0.05, 1), 0.003932140000019522, 1e-9);
  });

  it("matches printed chi-square tables", () => {
    // NIST/SEMATECH e-Handbook §1.3.6.7.4, upper critical values of chi-square, 3 dp (from memory)
    expectDp(chiSquareQuantile(0.95, 1), 3.841, 3);
    expectDp(chiSquareQuantile(0.95, 10), 18.307, 3);
  });

  it("has the closed form −2·ln(1 − p) with 2 df", () => {
    // χ² on 2 df is the exponential distribution with mean 2 (any statistics handbook)
    for (const p of [0.025, 0.1, 0.5, 0.9, 0.975]) expectRelClose(chiSquareQuantile(p, 2), -2 * Math.log1p(-p), 1e-9);
  });

  it("equals z² on 1 df", () => {
    // χ² on 1 df is the square of a standard normal: χ²_p(1) = z²_{(1+p)/2}
    for (const p of [0.5, 0.9, 0.95, 0.99])
      expectRelClose(chiSquareQuantile(p, 1), normalQuantile((1 + p) / 2) ** 2, 1e-9);
  });
});
