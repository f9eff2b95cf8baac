import { describe, expect, it } from "vitest";
import {
  iccFromMeanSquares,
  minimalDetectableChange,
  StatsInputError,
  smallestWorthwhileChange,
  swcFromCv,
  testRetest,
  twoWayMeanSquares,
  typicalErrorLimits,
} from "@/lib/stats";
import { expectDp } from "./close";

// Shrout & Fleiss (1979) Table 2, 6 targets × 4 judges, METHODS.md §3.4
const SHROUT_FLEISS = [
  [9, 2, 5, 8],
  [6, 1, 3, 2],
  [8, 4, 6, 8],
  [7, 1, 2, 6],
  [10, 5, 6, 9],
  [6, 2, 4, 7],
];

// Bland & Altman (1986) Wright peak-flow meter, first and second readings, METHODS.md §3.5
const WRIGHT_1 = [494, 395, 516, 434, 476, 557, 413, 442, 650, 433, 417, 656, 267, 478, 178, 423, 427];
const WRIGHT_2 = [490, 397, 512, 401, 470, 611, 415, 431, 638, 429, 420, 633, 275, 492, 165, 372, 421];

// Weir (2005) dataset A, METHODS.md §3.6
const WEIR_1 = [146, 148, 170, 90, 157, 156, 176, 205];
const WEIR_2 = [140, 152, 152, 99, 145, 153, 167, 218];

describe("twoWayMeanSquares + iccFromMeanSquares: Shrout & Fleiss (1979), k = 4", () => {
  const ms = twoWayMeanSquares(SHROUT_FLEISS);
  const icc = iccFromMeanSquares(ms);

  it("gives the mean squares", () => {
    // METHODS.md §3.4 [C]
    expect(ms.n).toBe(6);
    expect(ms.k).toBe(4);
    expectDp(ms.msr, 11.2417, 4);
    expectDp(ms.msc, 32.4861, 4);
    expectDp(ms.mse, 1.0194, 4);
    expectDp(ms.msw, 6.2639, 4);
    expect(ms.dfError).toBe(15);
  });

  it("gives ICC(2,1) and ICC(3,1)", () => {
    // METHODS.md §3.4 [C]; published 0.29 [S] and 0.71 [M]
    expectDp(icc.icc21, 0.2898, 4);
    expectDp(icc.icc31, 0.7148, 4);
  });

  it("gives their 95% limits (F method; Satterthwaite v = 4.785 for ICC(2,1))", () => {
    // METHODS.md §3.4 [C], 3 dp
    expectDp(icc.icc31Lower, 0.342, 3);
    expectDp(icc.icc31Upper, 0.946, 3);
    expectDp(icc.icc21Lower, 0.019, 3);
    expectDp(icc.icc21Upper, 0.761, 3);
    expectDp(icc.icc21Df, 4.785, 3);
  });
});

describe("testRetest: Bland & Altman (1986) Wright meter", () => {
  const r = testRetest(WRIGHT_1, WRIGHT_2);

  it("gives change in mean and typical error with chi-square limits", () => {
    // METHODS.md §3.5 [C]
    expect(r.n).toBe(17);
    expect(r.df).toBe(16);
    expectDp(r.changeInMean, -4.9412, 4);
    expectDp(r.typicalError, 15.3612, 4);
    expectDp(r.typicalError * Math.SQRT2, 21.724, 4); // SD_d 21.7240
    expectDp(r.typicalErrorLower, 11.4406, 4);
    expectDp(r.typicalErrorUpper, 23.3787, 4);
  });

  it("gives the 90% limits", () => {
    // METHODS.md §3.5 [C]
    const r90 = testRetest(WRIGHT_1, WRIGHT_2, { confidence: 0.9 });
    expectDp(r90.typicalErrorLower, 11.9823, 4);
    expectDp(r90.typicalErrorUpper, 21.7763, 4);
  });

  it("gives the log CV", () => {
    // METHODS.md §3.5 [C]: s = 0.0345151, 100(e^s − 1) = 3.5118%
    expectDp(r.cvPercent, 3.5118, 4);
  });

  it("gives ICC(3,1) and ICC(2,1) with 95% limits", () => {
    // METHODS.md §3.5 [C]
    expectDp(r.icc31, 0.983, 4);
    expectDp(r.icc31Lower, 0.9539, 4);
    expectDp(r.icc31Upper, 0.9938, 4);
    expectDp(r.icc21, 0.9832, 4);
    expectDp(r.icc21Lower, 0.9552, 4);
    expectDp(r.icc21Upper, 0.9938, 4);
  });

  it("TE equals √MSE of the two-way ANOVA for k = 2", () => {
    // METHODS.md §3.1: "For k = 2 this equals SD_d/√2 exactly"
    expect(Math.sqrt(r.meanSquares.mse)).toBeCloseTo(r.typicalError, 10);
  });
});

describe("testRetest: Weir (2005) dataset A", () => {
  const r = testRetest(WEIR_1, WEIR_2);

  it("gives TE, its 95% limits and the change in mean", () => {
    // METHODS.md §3.6 [C]; Weir's SEM 7.6 [S]
    expectDp(r.changeInMean, -2.75, 12);
    expectDp(r.typicalError, 7.55693, 5);
    expectDp(r.typicalErrorLower, 4.9964, 4);
    expectDp(r.typicalErrorUpper, 15.3804, 4);
    expectDp(r.typicalError, 7.6, 1);
  });

  it("gives the mean squares", () => {
    // METHODS.md §3.6 [C]
    expectDp(r.meanSquares.msr, 2098.536, 3);
    expectDp(r.meanSquares.msc, 30.25, 10);
    expectDp(r.meanSquares.mse, 57.107, 3);
  });

  it("gives the CV and the ICCs with limits", () => {
    // METHODS.md §3.6 [C]
    expectDp(r.cvPercent, 5.1616, 4);
    expectDp(r.icc21, 0.95, 4);
    expectDp(r.icc31, 0.947, 4);
    expectDp(r.icc31Lower, 0.7607, 4);
    expectDp(r.icc31Upper, 0.9892, 4);
    expectDp(r.icc21Lower, 0.787, 4);
    expectDp(r.icc21Upper, 0.9896, 4);
  });

  it("gives SWC from the trial-1 SD and the MDC95", () => {
    // METHODS.md §2 [C]: trial-1 SD 32.77194 → SWC_0.2 = 6.55439, SWC_0.3 = 9.83158, SWC_0.5 = 16.38597
    expectDp(smallestWorthwhileChange(WEIR_1), 6.55439, 5);
    expectDp(smallestWorthwhileChange(WEIR_1, 0.3), 9.83158, 5);
    expectDp(smallestWorthwhileChange(WEIR_1, 0.5), 16.38597, 5);
    // METHODS.md §3.6 gives MDC95 = 1.96·√2·TE = 20.9467, with z rounded to 1.96.
    // We use the exact z = 1.959964, which gives 20.94635 (computed with SciPy 1.17.1).
    expectDp(minimalDetectableChange(r.typicalError), 20.94635, 5);
    expectDp(1.96 * Math.SQRT2 * r.typicalError, 20.9467, 4);
    expect(Math.abs(minimalDetectableChange(r.typicalError) - 20.9467)).toBeLessThan(5e-4);
  });
});

describe("testRetest: properties and edge cases", () => {
  it("gives null CV when any score is zero or negative", () => {
    expect(testRetest([1, 2, 0], [1.1, 2.1, 0.2]).cvPercent).toBeNull();
    expect(testRetest([-1, 2, 3], [1.1, 2.1, 3.2]).cvPercent).toBeNull();
  });

  it("ICCs for k = 3 trials agree with k = 2 machinery and stay within [−1, 1]", () => {
    const rows = WEIR_1.map((v, i) => [v, WEIR_2[i], (v + WEIR_2[i]) / 2 + (i % 2 ? 3 : -3)]);
    const ms = twoWayMeanSquares(rows);
    expect(ms.k).toBe(3);
    expect(ms.dfError).toBe(14);
    const icc = iccFromMeanSquares(ms);
    for (const v of [icc.icc31, icc.icc21, icc.icc31Lower, icc.icc31Upper, icc.icc21Lower, icc.icc21Upper]) {
      expect(v).not.toBeNull();
      expect(Math.abs(v as number)).toBeLessThanOrEqual(1);
    }
    expect(icc.icc31Lower!).toBeLessThan(icc.icc31!);
    expect(icc.icc31Upper!).toBeGreaterThan(icc.icc31!);
  });

  it("gives nulls instead of NaN when every score is identical", () => {
    const r = testRetest([5, 5, 5], [5, 5, 5]);
    expect(r.typicalError).toBe(0);
    expect(r.icc31).toBeNull();
    expect(r.icc21).toBeNull();
    expect(r.icc31Lower).toBeNull();
    expect(r.cvPercent).toBe(0);
  });

  it("typicalErrorLimits matches the chi-square factor table", () => {
    // METHODS.md §3.2 [C], 95% factors for ν = 7, 9, 19, 29
    const factors: Array<[number, number, number]> = [
      [7, 0.66117, 2.03527],
      [9, 0.68784, 1.82561],
      [16, 0.74477, 1.52193],
      [19, 0.76049, 1.46057],
      [29, 0.79641, 1.34432],
    ];
    for (const [df, lo, hi] of factors) {
      const l = typicalErrorLimits(1, df);
      expectDp(l.lower, lo, 5);
      expectDp(l.upper, hi, 5);
    }
  });

  it("rejects bad input", () => {
    expect(() => testRetest([1, 2, 3], [1, 2])).toThrow(
      "Trial 1 and trial 2 need the same number of scores (got 3 and 2).",
    );
    expect(() => testRetest([1], [1])).toThrow(StatsInputError);
    expect(() => testRetest([1, NaN], [1, 2])).toThrow("Trial 1 score 2 is not a number (got NaN).");
    expect(() => testRetest([1, 2], [1, 2], { confidence: 1 })).toThrow(StatsInputError);
    expect(() => twoWayMeanSquares([[1, 2], [3]])).toThrow(/same number of trials/);
    expect(() => twoWayMeanSquares([[1], [3]])).toThrow(/At least 2 trials/);
    expect(() => twoWayMeanSquares([[1, 2]])).toThrow(/At least 2 athletes/);
    expect(() =>
      twoWayMeanSquares([
        [1, 2],
        [3, NaN],
      ]),
    ).toThrow("Athlete 2 score 2 is not a number (got NaN).");
    expect(() => typicalErrorLimits(-1, 10)).toThrow(StatsInputError);
    expect(() => iccFromMeanSquares(twoWayMeanSquares(SHROUT_FLEISS), { confidence: 0 })).toThrow(StatsInputError);
  });
});

// 0.2 × between-athlete SD is common practice for team sports (Hopkins 2004, Sportscience 8:1–7);
// 0.3 × CV for solo sports is Hopkins 2004, about half the CV Hopkins, Hawley & Burke 1999 (METHODS.md §2).
describe("smallestWorthwhileChange and swcFromCv", () => {
  it("uses the sample SD (n − 1)", () => {
    // Sample SD of 2,4,4,4,5,5,7,9 is √(32/7) = 2.13809 (population SD would be 2)
    expect(smallestWorthwhileChange([2, 4, 4, 4, 5, 5, 7, 9])).toBeCloseTo(0.2 * Math.sqrt(32 / 7), 12);
  });

  it("0.3 × CV and 0.5 × CV of a 3.10 s sprint", () => {
    // METHODS.md §2 [C]: CV 1.0% → 0.3 × CV = 0.0093 s; 0.5 × CV = 0.5% of 3.10 s = 0.0155 s
    expectDp(swcFromCv(3.1, 1.0), 0.0093, 10);
    expectDp(swcFromCv(3.1, 1.0, 0.5), 0.0155, 10);
  });

  it("rejects bad input", () => {
    expect(() => smallestWorthwhileChange([5])).toThrow(/At least 2 baseline scores/);
    expect(() => smallestWorthwhileChange([1, NaN])).toThrow("Baseline score 2 is not a number (got NaN).");
    expect(() => smallestWorthwhileChange([1, 2], -0.2)).toThrow(StatsInputError);
    expect(() => swcFromCv(3.1, -1)).toThrow(StatsInputError);
    expect(() => swcFromCv(0, 1)).toThrow(StatsInputError);
    expect(() => swcFromCv(3.1, 1, 0)).toThrow(StatsInputError);
  });
});
