import jstatPkg from "jstat";
import { describe, expect, it } from "vitest";
import { betaRecurrenceTerm, regularizedBeta } from "@/lib/stats/incomplete-beta";
import { expectRelClose } from "./close";

// regularizedBeta is internal to lib/stats (the t tail and the noncentral t use it), so it is
// imported from its file. The result is limited to ~1e-10 absolute by jStat's log-gamma.
const ABS = 1e-10;

describe("regularizedBeta: identities that follow from the definition I_x(a, b) = B_x(a, b)/B(a, b)", () => {
  it("I_x(a, 1) = x^a", () => {
    for (const a of [0.5, 1, 2.5, 7, 30]) {
      for (const x of [0.05, 0.3, 0.5, 0.9]) expect(Math.abs(regularizedBeta(x, a, 1) - x ** a)).toBeLessThan(ABS);
    }
  });

  it("I_x(1, b) = 1 − (1 − x)^b", () => {
    for (const b of [0.5, 1, 4.5, 12]) {
      for (const x of [0.05, 0.3, 0.5, 0.9])
        expect(Math.abs(regularizedBeta(x, 1, b) - (1 - (1 - x) ** b))).toBeLessThan(ABS);
    }
  });

  it("I_½(a, a) = ½ and I_x(a, b) = 1 − I_{1−x}(b, a)", () => {
    // Symmetry of the beta distribution (Abramowitz & Stegun 1964, §26.5; from memory)
    for (const a of [0.5, 2, 7, 40, 500]) expect(Math.abs(regularizedBeta(0.5, a, a) - 0.5)).toBeLessThan(ABS);
    for (const [x, a, b] of [
      [0.2, 3, 5],
      [0.7, 4.5, 0.5],
      [0.45, 50, 60],
    ]) {
      expect(Math.abs(regularizedBeta(x, a, b) - (1 - regularizedBeta(1 - x, b, a)))).toBeLessThan(ABS);
    }
  });

  it("I_p(k, n − k + 1) = P(Binomial(n, p) ≥ k)", () => {
    // Abramowitz & Stegun 1964, 26.5.24 (equation number from memory)
    const binomialAtLeast = (k: number, n: number, p: number) => {
      let sum = 0;
      for (let j = k; j <= n; j++) {
        let choose = 1;
        for (let i = 1; i <= j; i++) choose = (choose * (n - j + i)) / i;
        sum += choose * p ** j * (1 - p) ** (n - j);
      }
      return sum;
    };
    expect(Math.abs(regularizedBeta(0.5, 2, 3) - 11 / 16)).toBeLessThan(ABS);
    expect(Math.abs(regularizedBeta(0.2, 3, 5) - 0.148032)).toBeLessThan(ABS);
    for (const [k, n, p] of [
      [3, 10, 0.25],
      [7, 12, 0.6],
      [1, 20, 0.01],
      [15, 30, 0.5],
    ]) {
      expect(Math.abs(regularizedBeta(p, k, n - k + 1) - binomialAtLeast(k, n, p))).toBeLessThan(ABS);
    }
  });

  it("gives the two-sided p of Student's sleep data through the t relation", () => {
    // P(|T| ≥ t) = I_{ν/(ν+t²)}(ν/2, ½); R t.test on datasets::sleep, p = 0.002832890197 (METHODS.md §1.3)
    const t = 4.062127683;
    expectRelClose(regularizedBeta(9 / (9 + t * t), 4.5, 0.5), 0.002832890197, 1e-9);
  });

  it("returns 0 and 1 outside (0, 1)", () => {
    expect(regularizedBeta(0, 2, 3)).toBe(0);
    expect(regularizedBeta(-0.5, 2, 3)).toBe(0);
    expect(regularizedBeta(1, 2, 3)).toBe(1);
    expect(regularizedBeta(1.5, 2, 3)).toBe(1);
  });
});

describe("regularizedBeta: independent values", () => {
  it("matches 40-digit mpmath values to 1e-10", () => {
    // mpmath 1.3.0 betainc(a, b, 0, x, regularized=True), computed during this work
    const cases: Array<[number, number, number, number]> = [
      [0.45, 50, 60, 0.46423529143060362867],
      [0.01, 2, 30, 0.038389514595235451897],
      [0.9, 0.5, 0.5, 0.79516723530086657191],
      [0.3, 2.5, 7.25, 0.6604822735819072218],
      [0.7, 4.5, 0.5, 0.081126188845840615415],
      [0.1, 0.5, 10, 0.84835909036529009135],
    ];
    for (const [x, a, b, expected] of cases) expect(Math.abs(regularizedBeta(x, a, b) - expected)).toBeLessThan(ABS);
  });

  it("keeps relative accuracy far in the tail, at a = 1e5", () => {
    // mpmath 1.3.0: I_0.999(1e5, ½) = 1.9865718783973843e-45 (the t tail at very large df)
    expectRelClose(regularizedBeta(0.999, 1e5, 0.5), 1.9865718783973843e-45, 1e-9);
  });

  it("agrees with jStat.ibeta where jStat is precise (small a and b)", () => {
    // jStat 1.9.6 stops its continued fraction at 3e-7 per step; for small shape parameters its
    // result is good to ~3e-8, so agreement is checked to 1e-7.
    const { jStat } = jstatPkg;
    for (const [x, a, b] of [
      [0.2, 3, 5],
      [0.5, 2, 3],
      [0.35, 1.5, 2.5],
      [0.8, 4, 2],
      [0.6, 0.5, 0.5],
    ]) {
      expect(Math.abs(regularizedBeta(x, a, b) - jStat.ibeta(x, a, b))).toBeLessThan(1e-7);
    }
  });
});

describe("betaRecurrenceTerm", () => {
  it("is the step I_x(a, b) − I_x(a + 1, b)", () => {
    // The recurrence of DLMF §8.17(iv) (section from memory); at x = ½, a = 2, b = 3 it is 11/16 − 1/2
    expect(Math.abs(betaRecurrenceTerm(0.5, 2, 3) - 3 / 16)).toBeLessThan(ABS);
    for (const [x, a, b] of [
      [0.2, 3, 5],
      [0.7, 4.5, 0.5],
      [0.45, 50, 60],
    ]) {
      const step = regularizedBeta(x, a, b) - regularizedBeta(x, a + 1, b);
      expect(Math.abs(betaRecurrenceTerm(x, a, b) - step)).toBeLessThan(ABS);
    }
    expect(betaRecurrenceTerm(0, 2, 3)).toBe(0);
    expect(betaRecurrenceTerm(1, 2, 3)).toBe(0);
  });
});
