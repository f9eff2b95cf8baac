import { describe, expect, it } from "vitest";
import { mean, StatsInputError, sampleSd, sampleVariance } from "@/lib/stats";

describe("mean / sampleVariance / sampleSd", () => {
  it("use the n − 1 divisor", () => {
    // Textbook example: 2,4,4,4,5,5,7,9 has population SD 2 and sample variance 32/7.
    expect(mean([2, 4, 4, 4, 5, 5, 7, 9])).toBe(5);
    expect(sampleVariance([2, 4, 4, 4, 5, 5, 7, 9])).toBeCloseTo(32 / 7, 14);
    expect(sampleSd([2, 4, 4, 4, 5, 5, 7, 9])).toBeCloseTo(Math.sqrt(32 / 7), 14);
  });

  it("sleep data group 1 and 2 SDs", () => {
    // METHODS.md §1.3 / §5 [C]: SD1 = 1.78901, SD2 = 2.00225
    expect(sampleSd([0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0])).toBeCloseTo(1.78901, 5);
    expect(sampleSd([1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4])).toBeCloseTo(2.00225, 5);
  });

  it("keep their digits far from zero (two-pass)", () => {
    expect(sampleVariance([1e9 + 4, 1e9 + 7, 1e9 + 13, 1e9 + 16])).toBeCloseTo(30, 6);
  });

  it("reject empty, too-short and non-finite input", () => {
    expect(() => mean([])).toThrow(StatsInputError);
    expect(() => sampleSd([1])).toThrow("At least 2 scores are needed (got 1).");
    expect(() => sampleSd([1, NaN])).toThrow("Score 2 is not a number (got NaN).");
  });
});
