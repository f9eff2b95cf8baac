import { describe, expect, it } from "vitest";
import { fQuantile, tCritical } from "@/lib/stats";
import { expectDp, expectRelClose } from "./close";

// jStat's F quantile is accurate to < 6e-8 relative (measured during development, see
// lib/stats/distributions.ts), so full-precision checks use 1e-7.
describe("fQuantile", () => {
  it("matches printed F tables", () => {
    // NIST/SEMATECH e-Handbook §1.3.6.7.3, upper critical values of F, 3 dp (from memory):
    // 5% table F(5, 10) = 3.326 and F(1, 10) = 4.965; 1% table F(2, 20) = 5.849.
    expectDp(fQuantile(0.95, 5, 10), 3.326, 3);
    expectDp(fQuantile(0.95, 1, 10), 4.965, 3);
    expectDp(fQuantile(0.99, 2, 20), 5.849, 3);
    // Printed α = 0.025 F tables, F(5, 15) = 3.576 (from memory).
    expectDp(fQuantile(0.975, 5, 15), 3.576, 3);
  });

  it("matches R qf() / SciPy f.ppf to 1e-7", () => {
    // computed with SciPy 1.17.1 stats.f.ppf during this work
    expectRelClose(fQuantile(0.95, 5, 10), 3.3258345304130104, 1e-7);
    expectRelClose(fQuantile(0.975, 5, 15), 3.5764153492790607, 1e-7);
    expectRelClose(fQuantile(0.975, 15, 5), 6.427728167078779, 1e-7);
    expectRelClose(fQuantile(0.95, 1, 10), 4.964602743730711, 1e-7);
    expectRelClose(fQuantile(0.99, 2, 20), 5.848931924611135, 1e-7);
    // The df of the ICC(3,1) limits for Weir (2005) dataset A (n 8, k 2) and Shrout & Fleiss
    // (1979) Table 2 (n 6, k 4: 5 and 15 df above), METHODS.md §3.4 and §3.6
    expectRelClose(fQuantile(0.975, 7, 7), 4.994909219063237, 1e-7);
  });

  it("takes the fractional Satterthwaite df of the ICC(2,1) limits", () => {
    // Shrout & Fleiss Table 2 gives v = 4.785 (METHODS.md §3.4); SciPy 1.17.1 f.ppf, during this work
    expectRelClose(fQuantile(0.975, 5, 4.785), 7.498880528274082, 1e-7);
  });

  it("satisfies F_p(1, ν) = t²_{(1+p)/2}(ν) and F_p(a, b) = 1/F_{1−p}(b, a)", () => {
    // Standard relations between t and F and between the two tails of F (any statistics handbook)
    expectRelClose(fQuantile(0.95, 1, 10), tCritical(0.95, 10) ** 2, 1e-7);
    expectRelClose(fQuantile(0.99, 1, 19), tCritical(0.99, 19) ** 2, 1e-7);
    expectRelClose(fQuantile(0.025, 5, 15), 1 / fQuantile(0.975, 15, 5), 1e-7);
    // SciPy 1.17.1 f.ppf(0.025, 5, 15), during this work
    expectRelClose(fQuantile(0.025, 5, 15), 0.15557596307848703, 1e-7);
  });

  it("rises with p and gives the ends of the support at p = 0 and 1", () => {
    expect(fQuantile(0.9, 4, 12)).toBeLessThan(fQuantile(0.95, 4, 12));
    expect(fQuantile(0.95, 4, 12)).toBeLessThan(fQuantile(0.99, 4, 12));
    expect(fQuantile(0, 5, 10)).toBe(0);
    expect(fQuantile(1, 5, 10)).toBe(Infinity);
  });
});
