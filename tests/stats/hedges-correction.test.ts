import { describe, expect, it } from "vitest";
import { hedgesCorrection } from "@/lib/stats";
import { expectDp, expectRelClose } from "./close";

// J = 1 − 3/(4·df − 1), Lakens (2013), Front Psychol 4:863 (METHODS.md §5).
describe("hedgesCorrection", () => {
  it("turns Lakens's d_s 1.12588 on 18 df into g_s 1.07831", () => {
    // Lakens 2013 movie ratings, two independent groups of 10 (METHODS.md §1.4 [S][C])
    expectDp(1.12588 * hedgesCorrection(18), 1.07831, 5);
  });

  it("equals Lakens's two-group form 1 − 3/(4(n1 + n2) − 9) with df = n1 + n2 − 2", () => {
    // Lakens 2013 writes J with group sizes (METHODS.md §5 [M]); the two forms are the same algebra
    for (const [n1, n2] of [
      [10, 10],
      [6, 9],
      [20, 35],
    ]) {
      expectRelClose(hedgesCorrection(n1 + n2 - 2), 1 - 3 / (4 * (n1 + n2) - 9), 1e-15);
    }
  });

  it("gives J(9) = 0.914286, within 0.001 of the exact Γ-ratio 0.913875", () => {
    // METHODS.md §5 [C]: approximation 0.914286, exact Γ(df/2)/(√(df/2)·Γ((df−1)/2)) = 0.913875
    expectDp(hedgesCorrection(9), 0.914286, 6);
    expect(Math.abs(hedgesCorrection(9) - 0.913875)).toBeLessThan(0.001);
  });

  it("corrects Lakens's paired d_av 1.128696 to 1.03195 (df 9) and 1.08101 (df 18)", () => {
    // METHODS.md §5 [C]. 1.128696 × J(18) is 1.0810049, which METHODS prints as 1.08101 (rounded
    // twice); checked to the 4 dp that both roundings agree on.
    expectDp(1.128696 * hedgesCorrection(9), 1.03195, 5);
    expectDp(1.128696 * hedgesCorrection(18), 1.08101, 4);
  });

  it("shrinks d by less as df grows, and never enlarges it", () => {
    // Property of the formula: J < 1 and J → 1 as df → ∞ (Lakens 2013). At df = 1 both this form
    // and the exact Γ-ratio (Γ(0) is infinite) give 0.
    expect(hedgesCorrection(1)).toBe(0);
    let previous = 0;
    for (const df of [2, 5, 9, 18, 39, 100, 1000]) {
      const j = hedgesCorrection(df);
      expect(j).toBeLessThan(1);
      expect(j).toBeGreaterThan(previous);
      previous = j;
    }
    expect(1 - hedgesCorrection(1e6)).toBeLessThan(1e-6);
  });
});
